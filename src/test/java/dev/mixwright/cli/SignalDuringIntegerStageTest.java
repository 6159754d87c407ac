package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.report.PortfolioPending;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.PortfolioLog;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * SIGTERM during the integer stage, in a child JVM solving the demo range (whose stage runs to its
 * time limit): one signal ends the run as stopped (exit 1) with a readable result.json that holds
 * the best portfolio so far and still owes the stage; a second signal while that is being saved
 * loses nothing already saved. Either way {@code resume} finishes the stage. (SIGINT and SIGTERM in
 * the LP stage: {@link KillResumeTest}.)
 */
class SignalDuringIntegerStageTest {
  private static final String RANGE = "catalogs/heatpump-range.yaml";

  @TempDir Path dir;

  /** A solve whose integer stage cannot end before the signals: its own limit is far away. */
  private ChildJvm solveIntoStage(Path run, String name) throws Exception {
    ChildJvm child = ChildJvm.start(dir, name, "solve", RANGE, "--out", run.toString(), "--portfolio-time-limit",
        "300s");
    // portfolio.jsonl appears when the integer stage begins
    assertTrue(child.awaitFile(run.resolve(PortfolioLog.FILE), 120_000), child.transcript());
    Thread.sleep(500);
    return child;
  }

  private static void signal(ChildJvm child) throws Exception {
    new ProcessBuilder("kill", "-TERM", Long.toString(child.process.pid())).start().waitFor();
  }

  /** result.json reads (its checksum holds) and the run still owes its integer stage. */
  private static RunResult readOwing(Path run, ChildJvm child) throws Exception {
    RunResult r = RunResult.read(run);
    assertEquals("optimal", r.status().word(), child.transcript());
    assertNotNull(r.portfolioPending(), "a stopped stage must leave the run owing it\n" + child.transcript());
    return r;
  }

  /** A resume with a short stage limit finishes the run: its portfolio written, nothing owed. */
  private void resumeFinishes(Path run) throws Exception {
    CliRun resumed = CliRun.of("resume", run.toString(), "--no-progress", "--portfolio-time-limit", "3s");
    assertEquals(ExitCodes.OK, resumed.code(), resumed.toString());
    RunResult r = RunResult.read(run);
    assertNotNull(r.portfolio(), resumed.toString());
    assertEquals(null, r.portfolioPending(), resumed.toString());
  }

  @Test
  void oneSignalInTheIntegerStageStopsTheRunWithItsPortfolioSoFar() throws Exception {
    Path run = dir.resolve("one");
    ChildJvm child = solveIntoStage(run, "one");
    signal(child);
    assertEquals(ExitCodes.STOPPED, child.waitFor(120), child.transcript());
    RunResult r = readOwing(run, child);
    assertEquals(PortfolioPending.INTERRUPTED, r.portfolioPending(), child.transcript());
    assertNotNull(r.portfolio(), "the best portfolio so far is written\n" + child.transcript());
    resumeFinishes(run);
  }

  @Test
  void aSecondSignalWhileTheFirstIsSavedLosesNothingSaved() throws Exception {
    long seed = System.nanoTime();
    Random rnd = new Random(seed);
    Path run = dir.resolve("two");
    ChildJvm child = solveIntoStage(run, "two");
    signal(child);
    assertTrue(child.awaitText(List.of("stopping after the current round"), 60_000), child.transcript());
    // the stage ends within about a tenth of a second of the first signal, and the save follows
    Thread.sleep(rnd.nextInt(300));
    signal(child);
    assertEquals(ExitCodes.STOPPED, child.waitFor(120), "seed " + seed + "\n" + child.transcript());
    readOwing(run, child);
    resumeFinishes(run);
  }
}
