package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.runfolder.Json;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** solve --scenario-set through the command line: result.json's scenarios, the summary, and bad input. */
class ScenarioSetCommandTest {
  static final String STARTER = "src/test/resources/fixed-demand/heatpump-starter.yaml";

  @TempDir Path dir;

  @Test
  void oneRangeAcrossTheSetReportsEachScenarioWithItsRegret() throws Exception {
    Path set = dir.resolve("set.yaml");
    Files.writeString(set, """
        scenarios:
          - {id: base, weight: 3}
          - {id: tight, weight: 1, change: {resources: {testbench: {capacity: "-25%"}}}}
        """);
    Path hold = dir.resolve("hold.yaml");
    Files.writeString(hold, """
        draws: {count: 40, seed: 3}
        vary: {resources: {testbench: {capacity: {triangular: {low: "-30%", high: "+10%"}}}}}
        """);
    Path out = dir.resolve("run");
    CliRun r = CliRun.of("solve", STARTER, "--scenario-set", set.toString(), "--hold-out", hold.toString(),
        "--out", out.toString(), "--portfolio-time-limit", "20s");
    assertEquals(0, r.code(), r.toString());
    JsonNode p = Json.pretty().readTree(out.resolve("result.json").toFile()).path("portfolio");
    assertEquals("mean", p.path("aim").asText());
    JsonNode rows = p.path("scenarios");
    assertEquals(2, rows.size());
    double mean = 0;
    for (JsonNode row : rows) {
      for (String f : new String[] {"id", "weight", "value", "bestAlone", "regret"}) {
        assertTrue(row.has(f), "scenarios[] has " + f + ": " + row);
      }
      assertEquals(row.path("bestAlone").asDouble() - row.path("value").asDouble(), row.path("regret").asDouble(),
          1e-6 * (1 + Math.abs(row.path("bestAlone").asDouble())));
      mean += row.path("weight").asDouble() * row.path("value").asDouble();
    }
    assertEquals(0.75, rows.get(0).path("weight").asDouble(), 1e-12);
    assertEquals(mean, p.path("value").asDouble(), 1e-6 * (1 + Math.abs(mean)));
    assertTrue(p.path("bound").asDouble() >= p.path("value").asDouble() - 1e-6 * Math.abs(mean));
    // the tight scenario cannot earn more than the base with the same range: less test-bench time only
    assertTrue(rows.get(1).path("value").asDouble() <= rows.get(0).path("value").asDouble() + 1e-6 * Math.abs(mean));
    JsonNode h = p.path("holdOut");
    assertEquals(40, h.path("scenarios").asInt());
    assertTrue(h.path("p5").asDouble() <= h.path("mean").asDouble() && h.path("mean").asDouble() <= h.path("p95")
        .asDouble(), h.toString());
    assertTrue(r.out().contains("best alone") && r.out().contains("tight") && r.out().contains("hold-out check"),
        r.out());
    CliRun page = CliRun.of("report", out.toString());
    assertEquals(0, page.code(), page.toString());
    String html = Files.readString(out.resolve("report.html"));
    int at = html.indexOf("Regret across scenarios");
    assertTrue(at > 0 && html.indexOf("<svg", at) > 0 && html.indexOf("tight", at) > 0, "the regret chart");
  }

  @Test
  void badSetsAndStrayOptionsExitTwoWithThePathNamed() throws Exception {
    Path set = dir.resolve("bad.yaml");
    Files.writeString(set, """
        draws: {count: 0, seed: 1}
        vary: {resources: {testbench: {capacity: {normal: {sd: "-5%"}}}}}
        """);
    CliRun r = CliRun.of("solve", STARTER, "--scenario-set", set.toString(), "--out", dir.resolve("x").toString());
    assertEquals(2, r.code(), r.toString());
    assertTrue(r.err().contains("draws.count") && r.err().contains("vary.resources.testbench.capacity.normal.sd"),
        r.err());
    assertFalse(r.err().contains("\tat "), "no stack trace: " + r.err());
    CliRun stray = CliRun.of("solve", STARTER, "--worst-case", "--out", dir.resolve("y").toString());
    assertEquals(2, stray.code(), stray.toString());
    assertTrue(stray.err().contains("--scenario-set"), stray.err());
    CliRun engineAlone = CliRun.of("solve", STARTER, "--engine", "spark", "--out", dir.resolve("z").toString());
    assertEquals(2, engineAlone.code(), engineAlone.toString());
    assertTrue(engineAlone.err().contains("--engine") && engineAlone.err().contains("--scenario-set"),
        engineAlone.err());
    // this jar has no Spark: the engine is refused before anything is solved
    Path fine = Files.writeString(dir.resolve("fine.yaml"), "scenarios:\n  - {id: base, weight: 1}\n");
    CliRun noSpark = CliRun.of("solve", STARTER, "--scenario-set", fine.toString(), "--engine", "spark", "--out",
        dir.resolve("w").toString());
    assertEquals(2, noSpark.code(), noSpark.toString());
    assertTrue(noSpark.err().contains("no engine named 'spark'"), noSpark.err());
    assertFalse(Files.exists(dir.resolve("w").resolve("result.json")), "nothing solved");
  }
}
