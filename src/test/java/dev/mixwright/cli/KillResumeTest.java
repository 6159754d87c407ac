package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.runfolder.ColumnLogReader;
import dev.mixwright.runfolder.LoopSnapshot;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.space.VariantSpace;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Runs that die: a child JVM solving the range catalog (CP-SAT pricing, a few seconds of rounds) is
 * killed with SIGKILL at random moments, resumed (sometimes killed again while resuming) and must
 * end at the optimum an uninterrupted run finds; SIGTERM and SIGINT must stop it cleanly with exit 1
 * and a resumable folder.
 */
class KillResumeTest {
  static final Path RANGE = Path.of("catalogs/heatpump-range.yaml");
  static double uninterrupted;

  @TempDir Path dir;

  @BeforeAll
  static void solveUninterrupted() throws Exception {
    VariantSpace space = new VariantSpace(CatalogLoader.load(RANGE));
    uninterrupted = new ColumnGeneration(space, BranchAndBoundPricer.withDefaultLimits(space), null, SolveSettings.defaults(), StopCriterion.never(), System.nanoTime())
        .run().objective();
  }

  private static String[] solve(Path run) {
    return new String[] {"solve", RANGE.toString(), "--out", run.toString(), "--pricer", "cpsat", "--no-progress"};
  }

  /** What must hold after any kill: the log reads (a torn tail at most) and holds every column the last snapshot counted. */
  private static void assertNothingDurableLost(Path run) throws Exception {
    RunFolder f = new RunFolder(run);
    if (!Files.exists(f.columnLog())) {
      return;
    }
    ColumnLogReader.Entries e = ColumnLogReader.read(f.columnLog());
    assertTrue(e.droppedTornLines() <= 1);
    LoopSnapshot.Loaded s = LoopSnapshot.read(f);
    if (s.snapshot().isPresent()) {
      // The snapshot of round k is written after the columns of round k-1 reached the log.
      assertTrue(e.lines().size() >= s.snapshot().get().columns(),
          e.lines().size() + " lines in the log, but the snapshot counted " + s.snapshot().get().columns());
    }
  }

  @Test
  void killedAtRandomMomentsAndResumedItEndsAtTheUninterruptedOptimum() throws Exception {
    long seed = System.nanoTime();
    Random rnd = new Random(seed);
    String why = "seed " + seed;
    for (int point = 0; point < 3; point++) {
      Path run = dir.resolve("run" + point);
      ChildJvm child = ChildJvm.start(dir, "solve" + point, solve(run));
      assertTrue(child.awaitFile(run.resolve(RunFolder.MANIFEST), 60_000), child.transcript());
      // Anywhere from the first instant of the run to past its usual end (then the kill may miss).
      Thread.sleep(rnd.nextInt(4000));
      child.process.destroyForcibly();
      child.waitFor(30);
      assertNothingDurableLost(run);
      if (point == 1) {
        // The resume itself killed too: the log must stay continuous across several sessions.
        ChildJvm again = ChildJvm.start(dir, "resume" + point, "resume", run.toString(), "--no-progress");
        Thread.sleep(1500 + rnd.nextInt(2500));
        again.process.destroyForcibly();
        again.waitFor(30);
        assertNothingDurableLost(run);
      }
      CliRun resumed = CliRun.of("resume", run.toString(), "--no-progress");
      assertEquals(0, resumed.code(), why + "\n" + resumed);
      JsonNode res = ResumeTest.result(run);
      assertEquals("optimal", res.path("status").asText(), why);
      assertEquals(uninterrupted, res.path("objective").asDouble(), 1e-6 * uninterrupted, why);
      assertEquals(0, ColumnLogReader.read(run.resolve("columns.jsonl")).droppedTornLines());
    }
  }

  @Test
  void sigtermFinishesTheRoundWritesAStoppedResultExitsOneAndResumes() throws Exception {
    stopsCleanlyOn(null);
  }

  @Test
  void ctrlCFinishesTheRoundWritesAStoppedResultExitsOneAndResumes() throws Exception {
    // A process started with SIGINT ignored (a background job, nohup) passes that on to its
    // children, and the JVM leaves an ignored signal ignored; then there is nothing to test here.
    Assumptions.assumeFalse(sigintIgnoredHere(), "SIGINT is ignored by this test process and its children");
    stopsCleanlyOn("-INT");
  }

  private void stopsCleanlyOn(String killSignal) throws Exception {
    Path run = dir.resolve("run");
    ChildJvm child = ChildJvm.start(dir, "solve", solve(run));
    // After the first round, so the stop lands in the middle of the work.
    assertTrue(child.awaitFile(run.resolve(RunFolder.SNAPSHOT), 60_000), child.transcript());
    if (killSignal == null) {
      child.process.destroy(); // SIGTERM on Unix
    } else {
      new ProcessBuilder("kill", killSignal, Long.toString(child.process.pid())).start().waitFor();
    }
    int code = child.waitFor(60);
    JsonNode res = ResumeTest.result(run);
    assertEquals(1, code, child.transcript());
    assertEquals("stopped", res.path("status").asText());
    assertEquals("interrupted by a signal", res.path("stopReason").asText());
    assertEquals("stopped", LoopSnapshot.read(new RunFolder(run)).snapshot().orElseThrow().status());
    assertTrue(Files.readString(child.err).contains("stopping after the current round"), child.transcript());
    CliRun resumed = CliRun.of("resume", run.toString(), "--no-progress");
    assertEquals(0, resumed.code(), resumed.toString());
    assertEquals(uninterrupted, ResumeTest.result(run).path("objective").asDouble(), 1e-6 * uninterrupted);
  }

  /** Bit 1 (SIGINT is signal 2) of the ignored-signals mask in /proc/self/status; false where there is no /proc. */
  private static boolean sigintIgnoredHere() {
    try {
      for (String line : Files.readAllLines(Path.of("/proc/self/status"))) {
        if (line.startsWith("SigIgn:")) {
          return (Long.parseLong(line.substring(7).trim(), 16) & 2L) != 0;
        }
      }
    } catch (Exception e) {
      // no /proc: assume signals reach the child
    }
    return false;
  }
}
