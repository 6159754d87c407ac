package dev.mixwright.export;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.report.MatrixView;
import dev.mixwright.report.RunResult;
import dev.mixwright.report.VariantCodes;
import dev.mixwright.runfolder.RunFolder;
import java.io.IOException;
import java.nio.file.Path;

/**
 * What an export reads from a run folder: result.json, the catalog as solved (catalog.json; null in a
 * folder without one, then ids stand in for labels), the variant codes and the matrix view.
 */
public record RunData(RunFolder folder, RunResult result, Catalog catalog, VariantCodes codes, MatrixView matrix) {

  public static RunData read(Path runDir) throws IOException, CatalogException {
    RunFolder folder = new RunFolder(runDir);
    RunResult result = RunResult.read(runDir);
    // checked against run.json first: a changed copy would give other labels and figures in silence
    Catalog catalog = folder.solvedCatalog().orElse(null);
    return of(folder, result, catalog);
  }

  public static RunData of(RunFolder folder, RunResult result, Catalog catalog) {
    return new RunData(folder, result, catalog, VariantCodes.of(result), MatrixView.of(result, catalog));
  }
}
