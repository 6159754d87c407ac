package dev.mixwright.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.Sweep;
import dev.mixwright.engine.Engine;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.ThreadPoolEngine;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.report.SweepTable;
import dev.mixwright.runfolder.Json;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.Scenarios;
import dev.mixwright.scenario.SweepPlan;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

class SweepWorkTest {
  static final Path STARTER = Path.of("catalogs/heatpump-starter.yaml");
  static final Path SMALL = Path.of("catalogs/ventilation-small.yaml");

  @Test
  void chainsAreCutFromTheWholeOrderBeforeDonePointsLeave() {
    List<Integer> order = List.of(0, 1, 2, 3, 4, 5, 6, 7, 8, 9);
    List<String> got = SweepWork.chains(order, 4, Set.of(1, 5, 4, 6, 7)).stream().map(Arrays::toString).toList();
    // [0 1 2 3] [4 5 6 7] [8 9], less the done ones; the middle chain is left empty and dropped
    assertEquals(List.of("[0, 2, 3]", "[8, 9]"), got);
    assertEquals(List.of("[0, 1, 2, 3, 4, 5, 6, 7, 8, 9]"),
        SweepWork.chains(order, 0, Set.of()).stream().map(Arrays::toString).toList());
  }

  /** Rows by index without their timings, from a job run on the thread pool of {@code threads}. */
  private static Map<Integer, JsonNode> onThreads(Job job, int threads) throws Engine.JobFailed {
    Map<Integer, JsonNode> rows = new TreeMap<>();
    new ThreadPoolEngine(threads).run(job, (point, result, millis) -> SweepWork.rows(result).forEach(n -> {
      n.remove("elapsedMs");
      if (n.path("portfolio").isObject()) {
        ((ObjectNode) n.get("portfolio")).remove("elapsedMs");
      }
      rows.put(n.path("index").asInt(), n);
    }), () -> false);
    return rows;
  }

  @Test
  void oneChainOnTheEngineIsTheSweepAsItWasSolvedBefore() throws Exception {
    Catalog c = CatalogLoader.load(STARTER);
    SweepPlan plan = Scenarios.grid(List.of("resources.testbench.capacity=8000..11000:1000",
        "rules.propane-clearance=on,off"), Scenario.none(), List.of(), c);
    SolveSettings settings = SolveSettings.defaults();
    Map<Integer, JsonNode> before = new TreeMap<>();
    SweepTable table = new SweepTable(plan, c, Json.compact().createObjectNode());
    new Sweep(c, plan, PricerChoice.BNB::create, settings, true).run(Set.of(), () -> false, new Sweep.Listener() {
      @Override
      public void solved(Sweep.Row row) {
        ObjectNode n = table.add(row);
        n.remove("elapsedMs");
        before.put(n.path("index").asInt(), n);
      }
    });
    Job whole = SweepWork.job(c, plan, settings, PricerChoice.BNB, true, null, 0, Set.of());
    assertEquals(1, whole.size());
    assertEquals(before, onThreads(whole, 2));
  }

  @Test
  void chainsGiveTheSameRowsOnOneThreadOrMany() throws Exception {
    Catalog c = CatalogLoader.load(SMALL);
    SweepPlan plan = Scenarios.grid(List.of("resources.assembly.capacity=9000..15000:2000",
        "resources.fans.capacity=7000,9000"), Scenario.none(), List.of(), c);
    Job job = SweepWork.job(c, plan, SolveSettings.defaults(), PricerChoice.BNB, true,
        PortfolioSettings.defaults(), 3, Set.of(2));
    assertEquals(3, job.size(), "7 points left in chains of at most 3");
    Map<Integer, JsonNode> one = onThreads(job, 1);
    assertEquals(7, one.size());
    assertEquals(one, onThreads(job, 3));
    List<String> statuses = new ArrayList<>();
    one.values().forEach(n -> statuses.add(n.path("portfolio").path("status").asText()));
    // small enough for the integer stage to prove its range at every point
    assertTrue(statuses.stream().allMatch("proven"::equals), statuses.toString());
  }
}
