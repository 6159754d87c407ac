package dev.mixwright.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.engine.Engine;
import dev.mixwright.engine.Engines;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.ThreadPoolEngine;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.portfolio.ScenarioStage;
import dev.mixwright.run.PortfolioPlan;
import dev.mixwright.run.PricerChoice;
import dev.mixwright.run.RunSession;
import dev.mixwright.run.ScenarioSetPlan;
import dev.mixwright.run.ScenarioWork;
import dev.mixwright.runfolder.Json;
import dev.mixwright.scenario.ScenarioSet;
import dev.mixwright.scenario.ScenarioSets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A range across a scenario set on a Spark cluster of two executor JVMs on this machine
 * ({@code local-cluster[2,1,1024]}) against the same solve on the thread pool: the same range,
 * regrets and hold-out figures apart from timings; and a hold-out point that fails once is retried
 * without losing or doubling a scenario.
 */
class SparkScenarioSetTest extends OnLocalCluster {
  static final Path SMALL = Path.of("catalogs/ventilation-small.yaml");
  static final String SET = """
      scenarios:
        - {id: base, weight: 2}
        - {id: fans-short, weight: 1, change: {resources: {fans: {capacity: "-30%"}}}}
        - {id: houses-boom, weight: 1, change: {segments: {houses: {demand: "+40%"}}}}
      """;
  /** Three points of twenty scenarios or fewer, so that point 1 fails once and two remain. */
  static final String HOLD_OUT = """
      draws: {count: 45, seed: 11}
      vary:
        resources: {fans: {capacity: {triangular: {low: "-40%", high: "+10%"}}}}
        segments: {flats: {demand: {normal: {sd: "20%"}}}}
      """;

  @TempDir Path dir;

  private JsonNode portfolio(String engine, Path set, Path hold) throws Exception {
    Path out = dir.resolve(engine);
    RunSession.SolveRequest r = new RunSession.SolveRequest(SMALL, Optional.empty(), out, false,
        SolveSettings.defaults(), PricerChoice.BNB, new PortfolioPlan(true, PortfolioSettings.defaults()));
    new RunSession(new AtomicBoolean(), new RunSession.Watcher() {})
        .solve(r, new ScenarioSetPlan(set, ScenarioStage.Aim.MEAN, Optional.of(hold), engine));
    return withoutTimes(Json.pretty().readTree(out.resolve("result.json").toFile()).path("portfolio"));
  }

  @Test
  void aScenarioSetOnTwoExecutorsGivesTheThreadPoolsRangeRegretsAndHoldOut() throws Exception {
    Path set = Files.writeString(dir.resolve("set.yaml"), SET);
    Path hold = Files.writeString(dir.resolve("hold.yaml"), HOLD_OUT);
    JsonNode local = portfolio(Engines.LOCAL, set, hold);
    JsonNode onSpark = portfolio("spark", set, hold);
    assertEquals(3, local.path("scenarios").size(), local.toString());
    assertEquals(45, local.path("holdOut").path("scenarios").asInt(), local.toString());
    assertTrue(local.path("holdOut").path("mean").isNumber(), local.toString());
    assertEquals(local.path("scenarios"), onSpark.path("scenarios"), "value, best alone and regret per scenario");
    for (String f : new String[] {"mean", "p5", "p95", "lotsMissed"}) {
      assertEquals(local.path("holdOut").path(f), onSpark.path("holdOut").path(f), "holdOut." + f);
    }
    assertEquals(local, onSpark, "the whole portfolio section apart from timings");
    assertTrue(spark.getExecutorMemoryStatus().size() >= 3, "driver and two executors");
  }

  @Test
  void aHoldOutPointThatFailsOnceIsRetriedAndEachScenarioCountedOnce() throws Exception {
    Catalog c = CatalogLoader.load(SMALL);
    ScenarioSet hold = ScenarioSets.load(Files.writeString(dir.resolve("hold.yaml"), HOLD_OUT), c);
    // two variants written out by their choice indices (airflow, exchanger, filter, control):
    // a250 counter f7 humidity, and a350 enthalpy f7 app
    List<int[]> range = List.of(new int[] {1, 1, 1, 1}, new int[] {2, 2, 1, 2});
    Job check = ScenarioWork.evaluations(c, hold, range);
    Job failing = new Job(FailsFirstAttempt.Scenarios.class.getName(), check.shared(), check.points());
    assertEquals(3, check.size());

    double[][] expected = values(new ThreadPoolEngine(1), check, new int[check.size()], new ArrayList<>());
    int[] timesDone = new int[check.size()];
    List<Integer> failedPoints = new ArrayList<>();
    double[][] got = values(new SparkEngine(), failing, timesDone, failedPoints);

    assertEquals(List.of(FailsFirstAttempt.POINT), failedPoints, "the one failure on purpose was heard");
    assertEquals("[1, 1, 1]", Arrays.toString(timesDone), "every point done exactly once");
    assertEquals(45, Arrays.stream(got).mapToInt(v -> v.length).sum(), "every scenario, once");
    assertTrue(Arrays.stream(expected).flatMapToDouble(Arrays::stream).anyMatch(Double::isFinite),
        "some draws can sell the range");
    assertEquals(Arrays.deepToString(expected), Arrays.deepToString(got));
  }

  private static double[][] values(Engine engine, Job job, int[] timesDone, List<Integer> failed)
      throws Engine.JobFailed {
    return Arrays.stream(results(engine, job, timesDone, failed)).map(ScenarioWork::values).toArray(double[][]::new);
  }

  /** The node with every {@code elapsedMs} left out, at any depth. */
  private static JsonNode withoutTimes(JsonNode n) {
    if (n instanceof ObjectNode o) {
      o.remove("elapsedMs");
    }
    n.forEach(SparkScenarioSetTest::withoutTimes);
    return n;
  }
}
