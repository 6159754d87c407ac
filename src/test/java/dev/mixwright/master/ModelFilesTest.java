package dev.mixwright.master;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.ortools.modelbuilder.ModelBuilder;
import com.google.ortools.modelbuilder.ModelSolver;
import com.google.ortools.modelbuilder.SolveStatus;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.export.ExportRuns;
import dev.mixwright.export.ModelExport;
import dev.mixwright.export.RunData;
import dev.mixwright.portfolio.PortfolioStatus;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The exported MPS files read back by OR-Tools' own MPS reader and solved again: the master gives the
 * run's LP objective, the portfolio MIP the run's portfolio value.
 */
class ModelFilesTest {
  @TempDir Path dir;

  private static double solve(String mps, String solverId) {
    Natives.load();
    ModelBuilder model = new ModelBuilder();
    assertTrue(model.importFromMpsString(mps), "OR-Tools reads the file back");
    ModelSolver solver = new ModelSolver(solverId);
    assertEquals(SolveStatus.OPTIMAL, solver.solve(model));
    return solver.getObjectiveValue();
  }

  @Test
  void theMastersOptimumIsTheRunsObjectiveAndThePortfoliosItsValue() throws Exception {
    Path run = ExportRuns.solve(dir, ExportRuns.FORMULA_NAMES);
    RunData data = RunData.read(run);
    assertEquals(RunStatus.OPTIMAL, data.result().status());
    List<Path> files = ModelExport.write(data, dir.resolve("mps"));
    assertEquals(List.of("master.mps", "portfolio.mps"), files.stream().map(p -> p.getFileName().toString()).toList());

    double z = solve(Files.readString(files.get(0)), "glop");
    double objective = data.result().objective();
    assertEquals(objective, z, 1e-6 * Math.max(1, Math.abs(objective)));

    var p = data.result().portfolio();
    assertEquals(PortfolioStatus.PROVEN, p.status());
    double v = solve(Files.readString(files.get(1)), "scip");
    // the file's pool holds the chosen portfolio (so >= its value) and lies in the whole space (so <= the proven optimum)
    assertEquals(p.value(), v, 1e-6 * Math.max(1, Math.abs(p.value())));
  }
}
