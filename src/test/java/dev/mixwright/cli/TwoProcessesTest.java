package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Two processes on one run folder: while {@code solve} runs in a child JVM, a second process (this
 * one) that would write the folder — {@code resume}, {@code solve --replace} — refuses in words naming
 * the process, and changes nothing; {@code report} says the run is still running. Once the child is
 * killed with SIGKILL, the operating system has dropped its lock and the folder can be resumed.
 */
class TwoProcessesTest {
  private static final String RANGE = "catalogs/heatpump-range.yaml";

  @TempDir Path tmp;

  @Test
  void aSecondProcessRefusesInWordsWhileTheFirstRuns() throws Exception {
    Path run = tmp.resolve("run");
    // the integer stage of the range runs until its limit, long enough to try everything below
    ChildJvm child = ChildJvm.start(tmp.resolve("logs"), "solve", "solve", RANGE, "--out", run.toString(),
        "--portfolio-time-limit", "120s");
    try {
      assertTrue(child.awaitFile(run.resolve("run.json"), 120_000), "the child never began:\n" + child.transcript());
      String pid = Long.toString(child.process.pid());

      CliRun resume = CliRun.of("resume", run.toString());
      assertEquals(2, resume.code(), resume.toString());
      assertTrue(resume.err().contains("another mixwright process is working on") && resume.err().contains(pid),
          resume.toString());

      CliRun replace = CliRun.of("solve", RANGE, "--out", run.toString(), "--replace");
      assertEquals(2, replace.code(), replace.toString());
      assertTrue(replace.err().contains("another mixwright process is working on"), replace.toString());
      assertTrue(Files.isRegularFile(run.resolve("run.json")), "solve --replace removed the running run's files");

      CliRun report = CliRun.of("report", run.toString());
      assertEquals(2, report.code(), report.toString());
      assertTrue(report.err().contains("still running"), report.toString());
      assertTrue(child.process.isAlive(), "the child ended before every second process was tried; the test"
          + " proved nothing:\n" + child.transcript());
    } finally {
      child.process.destroyForcibly().waitFor();
    }
    // SIGKILL: no handler runs, the lock goes with the process
    CliRun after = CliRun.of("resume", run.toString(), "--no-portfolio", "--time-limit", "1s");
    assertFalse(after.err().contains("another mixwright process"), after.toString());
    assertTrue(after.code() == 0 || after.code() == 1, after.toString());
  }
}
