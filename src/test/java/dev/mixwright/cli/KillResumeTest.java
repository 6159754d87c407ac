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
import dev.mixwright.report.PortfolioPending;
import dev.mixwright.runfolder.PortfolioLog;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
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
        .run().result().value();
  }

  private static String[] solve(Path run) {
    return new String[] {"solve", RANGE.toString(), "--out", run.toString(), "--pricer", "cpsat", "--no-progress",
        "--no-portfolio"}; // the LP stage is what these tests kill; the integer stage has its own test below
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
    // 8 solves and 2 resumes killed here, and 10 kills landed inside the integer stage (plus those of
    // its chains' LP stages) in the test of both stages below: 20 and more SIGKILLs in all
    for (int point = 0; point < 8; point++) {
      Path run = dir.resolve("run" + point);
      ChildJvm child = ChildJvm.start(dir, "solve" + point, solve(run));
      assertTrue(child.awaitFile(run.resolve(RunFolder.MANIFEST), 60_000), child.transcript());
      // Anywhere from the first instant of the run to past its usual end (then the kill may miss).
      Thread.sleep(rnd.nextInt(4000));
      child.process.destroyForcibly();
      child.waitFor(30);
      assertNothingDurableLost(run);
      if (point == 1 || point == 5) {
        // The resume itself killed too: the log must stay continuous across several sessions.
        ChildJvm again = ChildJvm.start(dir, "resume" + point, "resume", run.toString(), "--no-progress", "--no-portfolio");
        Thread.sleep(1500 + rnd.nextInt(2500));
        again.process.destroyForcibly();
        again.waitFor(30);
        assertNothingDurableLost(run);
      }
      CliRun resumed = CliRun.of("resume", run.toString(), "--no-progress", "--no-portfolio");
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
    CliRun resumed = CliRun.of("resume", run.toString(), "--no-progress", "--no-portfolio");
    assertEquals(0, resumed.code(), resumed.toString());
    assertEquals(uninterrupted, ResumeTest.result(run).path("objective").asDouble(), 1e-6 * uninterrupted);
  }

  /**
   * Kills during both stages of a run with a portfolio section: a small generated catalog whose
   * integer stage takes a few seconds and proves its portfolio. Three chains, each a solve and
   * resumes killed one after another (two chains begin with a kill in the LP stage), 10 kills inside
   * the integer stage in all, each chain finished by a resume that must reach the uninterrupted LP
   * objective and a portfolio with a valid bound, proven to the same value where the uninterrupted
   * run proves it. Kill moments are drawn within the stage's duration in the uninterrupted run,
   * counted from when the stage is seen to begin (portfolio.jsonl appears, or the resume says so).
   */
  @Test
  void killedAtRandomMomentsOfBothStagesTheResumedRunWritesItsPortfolio() throws Exception {
    long seed = System.nanoTime();
    Random rnd = new Random(seed);
    System.out.println("KillResumeTest portfolio kills: seed " + seed);
    Path cat = dir.resolve("small.yaml");
    CliRun gen = CliRun.of("generate", "--groups", "8", "--options", "4", "--resources", "5", "--segments", "3",
        "--rules", "12", "--seed", "11", "--out", cat.toString());
    assertEquals(0, gen.code(), gen.toString());
    Files.writeString(cat, Files.readString(cat) + "portfolio:\n  introductionCost: 50000\n  maxVariants: 4\n"
        + "  minLot: 200\n");
    Path full = dir.resolve("full");
    CliRun once = CliRun.of("solve", cat.toString(), "--out", full.toString(), "--no-progress");
    assertEquals(0, once.code(), once.toString());
    JsonNode ref = ResumeTest.result(full);
    double lp = ref.path("objective").asDouble();
    JsonNode refPortfolio = ref.path("portfolio");
    assertTrue(refPortfolio.isObject(), once.toString());
    long lpMs = ref.path("elapsedMs").asLong() - refPortfolio.path("elapsedMs").asLong();
    long stageMs = Math.max(200, refPortfolio.path("elapsedMs").asLong());
    System.out.println("uninterrupted: LP stage " + lpMs + " ms, integer stage " + stageMs + " ms, portfolio "
        + refPortfolio.path("status").asText() + " " + refPortfolio.path("value").asDouble());

    int stageKills = 0;
    int lpKills = 0;
    for (int chain = 0; stageKills < 10 && chain < 6; chain++) {
      String why = "seed " + seed + ", chain " + chain;
      Path run = dir.resolve("chain" + chain);
      ChildJvm child = ChildJvm.start(dir, "c" + chain + "-solve", "solve", cat.toString(), "--out", run.toString(),
          "--no-progress");
      boolean lpKill = chain % 2 == 0;
      if (lpKill) {
        assertTrue(child.awaitFile(run.resolve(RunFolder.MANIFEST), 60_000), child.transcript());
        Thread.sleep(rnd.nextInt((int) Math.max(1, Math.min(lpMs, 5000))));
      } else {
        assertTrue(child.awaitFile(run.resolve(PortfolioLog.FILE), 120_000), child.transcript());
        Thread.sleep(rnd.nextInt(window(stageMs)));
      }
      Kill first = kill(child, run, why);
      lpKills += lpKill && first == Kill.IN_LP ? 1 : 0;
      stageKills += first == Kill.IN_STAGE ? 1 : 0;
      // resumes killed in their integer stage, until 4 landed in this chain or one finished the run
      for (int landed = first == Kill.IN_STAGE ? 1 : 0; landed < 4 && first != Kill.MISSED && stageKills < 10; ) {
        ChildJvm again = ChildJvm.start(dir, "c" + chain + "-resume" + landed, "resume", run.toString(),
            "--no-progress");
        assertTrue(again.awaitText(List.of("continuing the integer stage", "starts afresh"), 120_000),
            why + "\n" + again.transcript());
        Thread.sleep(rnd.nextInt(window(stageMs)));
        Kill k = kill(again, run, why);
        if (k != Kill.IN_STAGE) {
          break;
        }
        landed++;
        stageKills++;
      }
      CliRun last = CliRun.of("resume", run.toString(), "--no-progress");
      assertEquals(0, last.code(), why + "\n" + last);
      JsonNode res = ResumeTest.result(run);
      assertEquals("optimal", res.path("status").asText(), why);
      assertEquals(lp, res.path("objective").asDouble(), 1e-6 * Math.abs(lp), why);
      JsonNode p = res.path("portfolio");
      assertTrue(p.isObject(), why + "\n" + last);
      assertTrue(res.path("portfolioPending").isMissingNode(), why);
      assertTrue(p.path("bound").asDouble() >= p.path("value").asDouble() - 1e-9 * Math.abs(lp), why);
      // the uninterrupted bound holds for the whole space, so no resumed portfolio may beat it
      assertTrue(p.path("value").asDouble() <= refPortfolio.path("bound").asDouble() * (1 + 1e-9), why);
      if ("proven".equals(refPortfolio.path("status").asText())) {
        assertEquals("proven", p.path("status").asText(), why + "\n" + p);
        assertEquals(refPortfolio.path("value").asDouble(), p.path("value").asDouble(),
            1e-6 * Math.abs(refPortfolio.path("value").asDouble()), why);
      }
    }
    System.out.println("kills landed: " + lpKills + " in the LP stage, " + stageKills + " in the integer stage");
    assertEquals(10, stageKills, "seed " + seed + ": too few kills landed in the integer stage");
  }

  /** Where a kill landed: in the LP stage, in the integer stage, or after the run had ended. */
  private enum Kill { IN_LP, IN_STAGE, MISSED }

  /** Kill moments within the first 60 % of the uninterrupted stage: a resumed stage, warm-started, can be shorter. */
  private static int window(long stageMs) {
    return (int) Math.max(1, stageMs * 6 / 10);
  }

  /**
   * Kills the child if it still runs and says where the kill landed (in the integer stage when
   * result.json marks the portfolio pending as running). Whatever the moment, result.json never
   * shows a finished run without its portfolio.
   */
  private static Kill kill(ChildJvm child, Path run, String why) throws Exception {
    boolean alive = child.process.isAlive();
    child.process.destroyForcibly();
    child.waitFor(30);
    assertNothingDurableLost(run);
    JsonNode res = Files.exists(run.resolve(RunFolder.RESULT)) ? ResumeTest.result(run) : null;
    if (res != null && !res.path("portfolio").isObject()) {
      assertTrue(res.path("portfolioPending").isTextual(), why + ": result.json without portfolio or pending\n" + res);
    }
    // a kill that lands after the run wrote its final result.json (while the JVM still ends) misses too:
    // there is nothing left to resume, and a resume says so instead of continuing a stage
    boolean finished = res != null && res.path("portfolio").isObject() && !res.path("portfolioPending").isTextual();
    if (!alive || finished) {
      return Kill.MISSED;
    }
    return res != null && PortfolioPending.RUNNING.equals(res.path("portfolioPending").asText()) ? Kill.IN_STAGE
        : Kill.IN_LP;
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
