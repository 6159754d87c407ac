package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.WriteFaults;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.function.Predicate;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A run folder on a full disk: writes there fail half-way (injected through {@link WriteFaults},
 * since a test cannot mount a small tmpfs), and the command says so in words naming the file (exit
 * 2, no stack trace), leaves the previous result.json readable and byte for byte as it was, and a
 * resume once the disk has room again reaches the uninterrupted run's objective.
 */
class FullDiskTest {
  private static final String STARTER = "catalogs/heatpump-starter.yaml";

  @TempDir static Path tmp;
  static double uninterrupted;

  @BeforeAll
  static void uninterruptedRun() throws Exception {
    Path full = tmp.resolve("full");
    CliRun r = CliRun.of("solve", STARTER, "--out", full.toString(), "--no-portfolio");
    assertEquals(0, r.code(), r.toString());
    uninterrupted = RunResult.read(full).objective();
  }

  /** A run stopped after one round: it has a result.json, and resume has work left to write. */
  private static Path stoppedRun(String name) {
    Path run = tmp.resolve(name);
    CliRun r = CliRun.of("solve", STARTER, "--out", run.toString(), "--no-portfolio", "--max-iterations", "1");
    assertEquals(1, r.code(), r.toString());
    return run;
  }

  private static void failsInWordsAndKeepsTheResult(Path run, Predicate<Path> full, String failingFile)
      throws Exception {
    byte[] before = Files.readAllBytes(run.resolve("result.json"));
    CliRun r;
    try (AutoCloseable fault = WriteFaults.install(full)) {
      r = CliRun.of("resume", run.toString(), "--no-portfolio");
    }
    assertEquals(2, r.code(), r.toString());
    assertTrue(r.err().startsWith("mixwright: could not write ") && r.err().contains(failingFile)
        && r.err().contains("No space left on device") && r.err().contains("free space"), r.toString());
    assertFalse(r.err().contains("internal fault") || r.err().contains("Exception"), r.toString());
    assertArrayEquals(before, Files.readAllBytes(run.resolve("result.json")), "result.json changed");
    assertEquals("stopped", RunResult.read(run).status().word(), "result.json no longer reads as the stopped run");

    CliRun again = CliRun.of("resume", run.toString(), "--no-portfolio");
    assertEquals(0, again.code(), "resume once there is room again:\n" + again);
    assertEquals(uninterrupted, RunResult.read(run).objective(), 1e-6 * Math.abs(uninterrupted));
  }

  @Test
  void aFullDiskAtTheResultLeavesThePreviousResultWhole() throws Exception {
    Path run = stoppedRun("result-fails");
    failsInWordsAndKeepsTheResult(run, p -> p.getFileName().toString().equals("result.json"), "result.json");
  }

  @Test
  void aFullDiskForEveryRunFileFailsAtTheFirstWrite() throws Exception {
    Path run = stoppedRun("all-fail");
    failsInWordsAndKeepsTheResult(run, p -> p.startsWith(run), run.toString());
  }

  @Test
  void aFullDiskAtTheColumnLogKeepsTheColumnsBefore() throws Exception {
    Path run = stoppedRun("log-fails");
    failsInWordsAndKeepsTheResult(run, p -> p.getFileName().toString().equals("columns.jsonl"), "columns.jsonl");
  }
}
