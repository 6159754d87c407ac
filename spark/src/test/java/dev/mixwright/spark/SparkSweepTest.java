package dev.mixwright.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.engine.Engines;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.ThreadPoolEngine;
import dev.mixwright.catalog.TableReach;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.run.PortfolioPlan;
import dev.mixwright.run.PricerChoice;
import dev.mixwright.run.SweepRun;
import dev.mixwright.run.SweepWork;
import dev.mixwright.runfolder.Json;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.Scenarios;
import dev.mixwright.scenario.SweepPlan;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Sweeps on a Spark cluster of two executor JVMs on this machine ({@code local-cluster[2,1,1024]}),
 * against the same sweeps on the thread pool: the same table apart from timings, and a task that
 * fails once is retried without losing or doubling a point.
 */
class SparkSweepTest extends OnLocalCluster {
  static final String STARTER = "catalogs/heatpump-starter.yaml";
  static final List<String> GRID = List.of("resources.testbench.capacity=8000..11000:1000",
      "rules.propane-clearance=on,off");
  static final int CHAIN = 3;
  /** A comma outside double quotes: where a CSV line splits into cells (names hold quoted commas). */
  static final String CELL = ",(?=(?:[^\"]*\"[^\"]*\")*[^\"]*$)";

  @TempDir Path dir;

  private SweepRun.Request request(Path out, String engine) {
    return new SweepRun.Request(Path.of(STARTER), Optional.empty(), GRID, List.of(), out,
        SolveSettings.defaults(), PricerChoice.BNB, true, false, engine, CHAIN,
        new PortfolioPlan(false, PortfolioSettings.defaults()),
        TableReach.CATALOG_FOLDER);
  }

  @Test
  void aSweepOnTwoExecutorsWritesTheThreadPoolsTable() throws Exception {
    Path local = dir.resolve("local");
    Path onSpark = dir.resolve("spark");
    SweepRun.Outcome a = SweepRun.run(request(local, Engines.LOCAL), new AtomicBoolean(), new SweepRun.Watcher() {});
    SweepRun.Outcome b = SweepRun.run(request(onSpark, "spark"), new AtomicBoolean(), new SweepRun.Watcher() {});
    assertTrue(a.complete() && b.complete());
    assertEquals(8, b.solvedNow());
    assertEquals(withoutTimes(Json.pretty().readTree(local.resolve("sweep.json").toFile())),
        withoutTimes(Json.pretty().readTree(onSpark.resolve("sweep.json").toFile())));
    assertEquals(csvWithoutTimes(local.resolve("sweep.csv")), csvWithoutTimes(onSpark.resolve("sweep.csv")));
    // The chains really ran side by side on both executors, not all in the driver.
    assertTrue(spark.getExecutorMemoryStatus().size() >= 3, "driver and two executors");
  }

  @Test
  void aPointThatFailsOnceIsRetriedAndCountedOnce() throws Exception {
    Catalog c = CatalogLoader.load(Path.of(STARTER));
    SweepPlan plan = Scenarios.grid(GRID, Scenario.none(), List.of(), c);
    Job sweep = SweepWork.job(c, plan, SolveSettings.defaults(), PricerChoice.BNB, true, null, CHAIN, Set.of());
    Job failing = new Job(FailsFirstAttempt.class.getName(), sweep.shared(), sweep.points());

    byte[][] expected = results(new ThreadPoolEngine(1), sweep, new int[sweep.size()], new ArrayList<>());
    int[] timesDone = new int[sweep.size()];
    List<Integer> failedPoints = new ArrayList<>();
    byte[][] got = results(new SparkEngine(), failing, timesDone, failedPoints);

    assertEquals(List.of(FailsFirstAttempt.POINT), failedPoints, "the one failure on purpose was heard");
    int[] once = new int[sweep.size()];
    Arrays.fill(once, 1);
    assertEquals(Arrays.toString(once), Arrays.toString(timesDone), "every point done exactly once");
    for (int p = 0; p < sweep.size(); p++) {
      assertEquals(rowsWithoutTimes(expected[p]), rowsWithoutTimes(got[p]), "point " + p);
    }
  }

  private static List<JsonNode> rowsWithoutTimes(byte[] result) {
    List<JsonNode> rows = new ArrayList<>();
    for (ObjectNode n : SweepWork.rows(result)) {
      n.remove("elapsedMs");
      rows.add(n);
    }
    return rows;
  }

  private static JsonNode withoutTimes(JsonNode table) {
    table.path("rows").forEach(r -> ((ObjectNode) r).remove("elapsedMs"));
    return table;
  }

  /** The CSV with its elapsedMs column left out. */
  private static List<String> csvWithoutTimes(Path csv) throws Exception {
    List<String> lines = Files.readAllLines(csv);
    int col = Arrays.asList(lines.get(0).split(CELL, -1)).indexOf("elapsedMs");
    List<String> out = new ArrayList<>();
    for (String line : lines) {
      List<String> cells = new ArrayList<>(Arrays.asList(line.split(CELL, -1)));
      cells.remove(col);
      out.add(String.join(",", cells));
    }
    return out;
  }
}
