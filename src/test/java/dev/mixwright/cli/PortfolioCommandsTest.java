package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.run.Catalogs;
import dev.mixwright.runfolder.Json;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The integer stage through the command line, on the hand-checked catalog of
 * {@code HandCheckedPortfolioTest} (invented data): a (margin 20) only in north (demand 80), b
 * (margin 15) only in south (demand 50), 100 hours; F = 100 gives both, 1,900 − 200 = 1,700.
 */
class PortfolioCommandsTest {
  private static final String CATALOG = Catalogs.HAND_PORTFOLIO;

  @TempDir Path dir;


  private Path solve(String f, String... extra) throws Exception {
    Path cat = dir.resolve("hand-" + f + ".yaml");
    Files.writeString(cat, CATALOG.formatted(f));
    Path runDir = dir.resolve("run-" + f);
    CliRun r = CliRun.solve(cat, runDir, extra);
    assertEquals(0, r.code(), r.err());
    return runDir;
  }

  @Test
  void solveWritesThePortfolioAndPrintsIt() throws Exception {
    Path runDir = solve("100");
    JsonNode p = Json.pretty().readTree(runDir.resolve("result.json").toFile()).get("portfolio");
    assertEquals("proven", p.get("status").asText());
    assertEquals(1700, p.get("value").asDouble(), 1e-6);
    assertEquals(1700, p.get("bound").asDouble(), 1e-6);
    assertTrue(p.get("gap").asDouble() < 1e-9);
    assertEquals(200, p.get("introductionCosts").asDouble(), 1e-9);
    assertEquals(2, p.get("variants").size());
    JsonNode first = p.get("variants").get(0);
    assertEquals("a", first.get("options").get("model").asText());
    assertEquals(80, first.get("sales").get("north").asDouble(), 1e-6);
    assertTrue(Files.isRegularFile(runDir.resolve("portfolio.jsonl")));

    // the integer stage's progress lines, asked for although stderr is no terminal, speak plain words
    CliRun shown = CliRun.of("solve", dir.resolve("hand-100.yaml").toString(), "--out", dir.resolve("shown").toString(),
        "--progress");
    assertEquals(0, shown.code(), shown.err());
    assertTrue(shown.err().contains("better range") && shown.err().contains("upper limit"), shown.err());
    CliRun.assertPlain(shown.err());
    CliRun.assertPlain(shown.out());
    CliRun log = CliRun.of("log", runDir.toString(), "--portfolio");
    assertEquals(0, log.code(), log.err());
    assertTrue(log.out().contains("choosing the range"), log.out());
    assertTrue(log.out().contains("better range"), log.out());
    assertTrue(log.out().contains("proven"), log.out());
  }

  @Test
  void explainSaysWhyAVariantIsInOrOut() throws Exception {
    Path both = solve("100");
    CliRun in = CliRun.of("explain", both.toString(), "--segment", "south", "--variant", "model=b");
    assertEquals(0, in.code(), in.err());
    assertTrue(in.out().contains("in it: sells south 20"), in.out());
    // F = 800: a alone (1,600 − 800); b earns at most 50·15 = 750 < 800 at any prices that matter
    Path one = solve("800");
    CliRun out = CliRun.of("explain", one.toString(), "--segment", "south", "--variant", "model=b", "--json");
    assertEquals(0, out.code(), out.err());
    JsonNode p = Json.pretty().readTree(out.out()).get("portfolio");
    assertFalse(p.get("offered").asBoolean());
    assertTrue(p.get("ruledOut").asBoolean(), out.out());
    assertTrue(p.get("boundWithIt").asDouble() <= p.get("portfolioValue").asDouble() + 1e-6, out.out());
  }

  @Test
  void theStageCanBeSkippedAndBadOptionsAreNamed() throws Exception {
    Path runDir = solve("100", "--no-portfolio");
    assertFalse(Json.pretty().readTree(runDir.resolve("result.json").toFile()).has("portfolio"));
    Path cat = dir.resolve("hand-100.yaml");
    CliRun bad = CliRun.of("solve", cat.toString(), "--out", dir.resolve("x").toString(), "--mip-solver", "glpk");
    assertEquals(2, bad.code());
    assertTrue(bad.err().contains("--mip-solver") && bad.err().contains("scip"), bad.err());
    CliRun badTime = CliRun.of("solve", cat.toString(), "--out", dir.resolve("y").toString(), "--portfolio-time-limit", "soon");
    assertEquals(2, badTime.code());
    assertTrue(badTime.err().contains("--portfolio-time-limit"), badTime.err());
  }
}
