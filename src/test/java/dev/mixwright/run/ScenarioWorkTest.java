package dev.mixwright.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.MasterColumns;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.ThreadPoolEngine;
import dev.mixwright.portfolio.ScenarioStage;
import dev.mixwright.report.RunResult;
import dev.mixwright.scenario.ScenarioSet;
import dev.mixwright.scenario.ScenarioSets;
import dev.mixwright.space.VariantSpace;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The per-scenario work of a scenario set on an engine: the hold-out values are the fixed-range LPs of
 * the scenarios' catalogs as the driver applies them, in the set's order, whatever the number of
 * threads; and the figures of a check follow from the values by hand.
 */
class ScenarioWorkTest {
  static final Path STARTER = Path.of("src/test/resources/fixed-demand/heatpump-starter.yaml");

  @TempDir Path dir;

  @Test
  void holdOutValuesAreEachScenariosFixedRangeLpInTheSetsOrder() throws Exception {
    Catalog c = CatalogLoader.load(STARTER);
    Path f = dir.resolve("hold.yaml");
    Files.writeString(f, """
        draws: {count: 21, seed: 5}
        vary: {resources: {testbench: {capacity: {triangular: {low: "-40%", high: "+10%"}}}}}
        """);
    ScenarioSet set = ScenarioSets.load(f, c);
    VariantSpace space = new VariantSpace(c);
    // any range will do: the variants the LP plan sells, whose lots some draws cannot meet
    MasterColumns lp = new ColumnGeneration(space, PricerChoice.BNB.create(space), null, SolveSettings.defaults(),
        StopCriterion.never(), System.nanoTime()).run().master();
    Map<String, int[]> sold = new LinkedHashMap<>();
    IntStream.range(0, lp.columns().size()).filter(j -> lp.x()[j] > 1e-9)
        .forEach(j -> sold.putIfAbsent(Arrays.toString(lp.columns().get(j).choices()), lp.columns().get(j).choices()));
    List<int[]> range = List.copyOf(sold.values());
    assertTrue(!range.isEmpty(), "the LP plan sells something");

    double[] expected = set.catalogs(c).stream()
        .mapToDouble(k -> ScenarioStage.valueOf(new VariantSpace(k), range).orElse(Double.NaN)).toArray();
    assertTrue(Arrays.stream(expected).anyMatch(Double::isFinite), "some draws can sell the range");
    Job job = ScenarioWork.evaluations(c, set, range);
    assertEquals(2, job.size(), "21 scenarios in points of " + ScenarioWork.EVALUATIONS_PER_POINT);
    for (int threads : new int[] {1, 2}) {
      Optional<List<byte[]>> got = ScenarioSetStep.onEngine(new ThreadPoolEngine(threads), job, "hold-out",
          () -> false, new RunSession.Watcher() {});
      double[] values = got.orElseThrow().stream().map(ScenarioWork::values).flatMapToDouble(Arrays::stream)
          .toArray();
      assertEquals(Arrays.toString(expected), Arrays.toString(values), threads + " threads");
    }
  }

  @Test
  void theFiguresOfACheckLeaveOutScenariosThatMissTheLots() {
    // by hand: kept 5, 1, 3, 2 with weight 0.2 each (total 0.8); mean 11/4; sorted 1 2 3 5 with
    // cumulative 0.2 0.4 0.6 0.8: 5 % of 0.8 is reached at 1, 95 % (0.76) only at 5
    RunResult.HoldOut h = ScenarioSetStep.holdOut(new double[] {5, 1, Double.NaN, 3, 2},
        new double[] {0.2, 0.2, 0.2, 0.2, 0.2}, Path.of("hold.yaml"), 0);
    assertEquals(5, h.scenarios());
    assertEquals(1, h.lotsMissed());
    assertEquals(2.75, h.mean(), 1e-12);
    assertEquals(1, h.p5(), 0);
    assertEquals(5, h.p95(), 0);
  }
}
