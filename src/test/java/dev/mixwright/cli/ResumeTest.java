package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.runfolder.ColumnLogReader;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunLock;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code mixwright resume} in this JVM: stopped and damaged runs continue to the uninterrupted optimum. */
class ResumeTest {
  static final Path STARTER = Path.of("src/test/resources/fixed-demand/heatpump-starter.yaml");
  static double uninterrupted;

  @TempDir Path dir;

  @BeforeAll
  static void solveOnce(@TempDir Path d) throws Exception {
    CliRun r = CliRun.of("solve", STARTER.toString(), "--out", d.resolve("full").toString());
    assertEquals(0, r.code(), r.toString());
    uninterrupted = result(d.resolve("full")).path("objective").asDouble();
  }

  static JsonNode result(Path run) throws Exception {
    return Json.pretty().readTree(run.resolve("result.json").toFile());
  }

  static void assertSameObjective(double expected, Path run) throws Exception {
    JsonNode res = result(run);
    assertEquals("optimal", res.path("status").asText());
    assertEquals(expected, res.path("objective").asDouble(), 1e-6 * Math.abs(expected));
  }

  @Test
  void aRunStoppedByItsIterationLimitResumesToTheSameOptimum() throws Exception {
    Path run = dir.resolve("run");
    CliRun first = CliRun.of("solve", STARTER.toString(), "--out", run.toString(), "--max-iterations", "1");
    assertEquals(1, first.code(), first.toString());
    assertEquals("stopped", result(run).path("status").asText());
    CliRun again = CliRun.of("resume", run.toString());
    assertEquals(0, again.code(), again.toString());
    assertTrue(again.out().contains("session 2"), again.out());
    assertSameObjective(uninterrupted, run);
    assertEquals(2, result(run).path("sessions").asInt());

    // One column log across both sessions: no column twice, sessions in order, rounds never go back.
    List<JsonNode> lines = ColumnLogReader.read(run.resolve("columns.jsonl")).lines();
    Set<String> seen = new HashSet<>();
    int lastSession = 0;
    int lastIteration = 0;
    for (JsonNode n : lines) {
      assertTrue(seen.add(n.path("segment").asText() + n.path("options")), "duplicate column " + n);
      assertTrue(n.path("session").asInt() >= lastSession);
      assertTrue(n.path("iteration").asInt() >= lastIteration);
      lastSession = n.path("session").asInt();
      lastIteration = n.path("iteration").asInt();
    }
    assertEquals(2, lastSession);

    CliRun done = CliRun.of("resume", run.toString());
    assertEquals(0, done.code(), done.toString());
    assertTrue(done.out().contains("already optimal"), done.out());
  }

  @Test
  void aResumeKeepsEverySettingTheRunWasStartedWith() throws Exception {
    // Resume once rebuilt the loop without --smoothing and --retire-after (run.json had no field
    // for them), so the second session ran with the defaults.
    Path run = dir.resolve("run");
    CliRun first = CliRun.of("solve", STARTER.toString(), "--out", run.toString(), "--max-iterations", "1",
        "--smoothing", "0.4", "--retire-after", "3", "--per-round", "4", "--heuristic-first");
    assertEquals(1, first.code(), first.toString());
    CliRun again = CliRun.of("resume", run.toString());
    assertEquals(0, again.code(), again.toString());
    assertSameObjective(uninterrupted, run);
    JsonNode settings = Json.pretty().readTree(run.resolve("run.json").toFile()).path("settings");
    assertEquals(0.4, settings.path("smoothing").asDouble(-1), settings.toString());
    assertEquals(3, settings.path("retireAfter").asInt(-1), settings.toString());
    assertEquals(4, settings.path("perRound").asInt(-1), settings.toString());
    assertTrue(settings.path("heuristicFirst").asBoolean(false), settings.toString());
  }

  @Test
  void aTornColumnLogAndATruncatedSnapshotStillResumeToTheSameOptimum() throws Exception {
    Path run = dir.resolve("run");
    assertEquals(1, CliRun.of("solve", STARTER.toString(), "--out", run.toString(), "--max-iterations", "2").code());
    Path log = run.resolve("columns.jsonl");
    byte[] b = Files.readAllBytes(log);
    Files.write(log, Arrays.copyOf(b, b.length - 25)); // the last line cut, as by kill -9 mid-write
    Path state = run.resolve("state.json");
    byte[] s = Files.readAllBytes(state);
    Files.write(state, Arrays.copyOf(s, s.length / 2));
    Files.delete(run.resolve("result.json")); // a crash leaves none
    CliRun r = CliRun.of("resume", run.toString());
    assertEquals(0, r.code(), r.toString());
    assertTrue(r.err().contains("torn last line"), r.err());
    assertTrue(r.err().contains("state.json is damaged"), r.err());
    assertSameObjective(uninterrupted, run);
    assertEquals(0, ColumnLogReader.read(log).droppedTornLines(), "the torn line was cut before appending");
  }

  @Test
  void aChangedCatalogIsRefusedUnlessRepricedAndThenMatchesAFreshSolveOfIt() throws Exception {
    Path cat = dir.resolve("starter.yaml");
    Files.copy(STARTER, cat);
    Path run = dir.resolve("run");
    assertEquals(1, CliRun.of("solve", cat.toString(), "--out", run.toString(), "--max-iterations", "1").code());
    Files.writeString(cat, Files.readString(cat).replace("capacity: 9500}", "capacity: 8200}"));

    CliRun refused = CliRun.of("resume", run.toString());
    assertEquals(2, refused.code(), refused.toString());
    assertTrue(refused.err().contains("changed since the run began"), refused.err());
    assertTrue(refused.err().contains("--reprice"), refused.err());

    CliRun fresh = CliRun.of("solve", cat.toString(), "--out", dir.resolve("fresh").toString());
    assertEquals(0, fresh.code(), fresh.toString());
    double changed = result(dir.resolve("fresh")).path("objective").asDouble();
    assertTrue(Math.abs(changed - uninterrupted) > 1, "the edit changes the optimum");

    CliRun repriced = CliRun.of("resume", run.toString(), "--reprice");
    assertEquals(0, repriced.code(), repriced.toString());
    assertSameObjective(changed, run);
    JsonNode manifest = Json.pretty().readTree(run.resolve("run.json").toFile());
    assertTrue(manifest.path("sessions").get(1).path("note").asText().startsWith("re-priced"));
    // Now the run is of the new catalog: a plain resume has nothing to object to.
    assertEquals(0, CliRun.of("resume", run.toString()).code());
  }

  @Test
  void aChangedOptionTableIsRefusedThoughTheCatalogFileIsTheSame() throws Exception {
    Files.copy(Path.of("src/test/resources/fixed-demand/heatpump-range.yaml"), dir.resolve("range.yaml"));
    Files.copy(Path.of("src/test/resources/fixed-demand/heatpump-range-casings.csv"), dir.resolve("heatpump-range-casings.csv"));
    Path run = dir.resolve("run");
    assertEquals(1, CliRun.of("solve", dir.resolve("range.yaml").toString(), "--out", run.toString(),
        "--max-iterations", "1").code());
    Path csv = dir.resolve("heatpump-range-casings.csv");
    List<String> rows = Files.readAllLines(csv);
    String edited = rows.get(1).replaceFirst(",(\\d+),", ",1$1,"); // one price or cost up by a leading 1
    assertTrue(!edited.equals(rows.get(1)));
    rows.set(1, edited);
    Files.write(csv, rows);
    CliRun r = CliRun.of("resume", run.toString());
    assertEquals(2, r.code(), r.toString());
    assertTrue(r.err().contains("option table"), r.err());
  }

  @Test
  void aFolderInUseByAnotherProcessIsRefused() throws Exception {
    Path run = dir.resolve("run");
    assertEquals(1, CliRun.of("solve", STARTER.toString(), "--out", run.toString(), "--max-iterations", "1").code());
    try (RunLock held = RunLock.acquire(new RunFolder(run))) {
      CliRun r = CliRun.of("resume", run.toString());
      assertEquals(2, r.code(), r.toString());
      assertTrue(r.err().contains("another mixwright process"), r.err());
    }
  }

  @Test
  void aFolderWithoutAManifestIsRefusedInWords() throws Exception {
    Files.createDirectories(dir.resolve("empty"));
    CliRun r = CliRun.of("resume", dir.resolve("empty").toString());
    assertEquals(2, r.code(), r.toString());
    assertTrue(r.err().contains("no run.json"), r.err());
    assertTrue(r.err().contains("never started"), r.err());
    assertTrue(r.err().contains("mixwright solve CATALOG --out " + dir.resolve("empty")), r.err());
    // A solve cut off after it copied the catalog but before run.json: solving again needs --replace.
    Files.writeString(dir.resolve("empty").resolve("catalog.json"), "{}");
    CliRun left = CliRun.of("resume", dir.resolve("empty").toString());
    assertEquals(2, left.code(), left.toString());
    assertTrue(left.err().contains("--replace"), left.err());
    CliRun none = CliRun.of("resume", dir.resolve("nowhere").toString());
    assertEquals(2, none.code(), none.toString());
  }

  @Test
  void aSecondSolveIntoTheFolderPointsAtResume() throws Exception {
    Path run = dir.resolve("run");
    assertEquals(1, CliRun.of("solve", STARTER.toString(), "--out", run.toString(), "--max-iterations", "1").code());
    CliRun r = CliRun.of("solve", STARTER.toString(), "--out", run.toString());
    assertEquals(2, r.code());
    assertTrue(r.err().contains("mixwright resume"), r.err());
  }
}
