package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Limits;
import java.io.RandomAccessFile;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Scenario and sweep files come from anyone too: beyond the limits that hold for catalogs (size,
 * ordinary files only, line length, figures) they are refused in words, exit 2, before anything is
 * solved or written — and never wait on a pipe or read a device.
 */
class ScenarioLimitsTest {
  private static final String STARTER = "catalogs/heatpump-starter.yaml";

  @TempDir Path tmp;

  private CliRun solveWith(Path scenario) {
    return CliRun.of("solve", STARTER, "--scenario", scenario.toString(), "--out", tmp.resolve("run").toString(),
        "--no-portfolio");
  }

  private CliRun sweepWith(Path sweep) {
    return CliRun.of("sweep", STARTER, "--sweep", sweep.toString(), "--out", tmp.resolve("sweep").toString());
  }

  private void refused(CliRun r, String... words) {
    assertEquals(2, r.code(), r.toString());
    for (String w : words) {
      assertTrue(r.err().contains(w), "'" + w + "' missing:\n" + r);
    }
    assertFalse(r.err().contains("internal fault") || r.err().contains("Exception"), r.toString());
    assertFalse(Files.exists(tmp.resolve("run").resolve("result.json")), "a refused scenario was solved");
  }

  @Test
  void aScenarioFileOverTheSizeLimitIsRefused() throws Exception {
    Path big = tmp.resolve("big.yaml");
    try (RandomAccessFile f = new RandomAccessFile(big.toFile(), "rw")) {
      f.setLength(Limits.MAX_FILE_BYTES + 1);
    }
    refused(solveWith(big), "8 MB");
    refused(sweepWith(big), "8 MB");
  }

  @Test
  void aScenarioThatIsAPipeOrADeviceIsRefusedWithoutWaiting() throws Exception {
    Path zero = Files.createSymbolicLink(tmp.resolve("zero.yaml"), Path.of("/dev/zero"));
    refused(solveWith(zero), "zero.yaml");
    refused(sweepWith(zero), "zero.yaml");
    Path pipe = tmp.resolve("pipe.yaml");
    if (new ProcessBuilder("mkfifo", pipe.toString()).start().waitFor() == 0) {
      refused(solveWith(pipe), "pipe.yaml"); // reading it would wait for a writer forever
      refused(sweepWith(pipe), "pipe.yaml");
    }
  }

  @Test
  void aScenarioWithAnOverlongLineOrAFigureBeyondTheLimitsIsRefusedByPath() throws Exception {
    Path longLine = tmp.resolve("long.yaml");
    Files.writeString(longLine, "format: 1\nname: " + "x".repeat(Limits.MAX_YAML_LINE + 1) + "\n");
    refused(solveWith(longLine), "long.yaml line 2", "at most " + Limits.MAX_YAML_LINE);

    for (String figure : List.of("1e300", "-5", ".inf", ".nan")) {
      Path s = tmp.resolve("cap" + figure + ".yaml");
      Files.writeString(s, "format: 1\nname: odd\nresources: {testbench: {capacity: " + figure + "}}\n");
      refused(solveWith(s), "the scenario file");
    }
    Path sweep = tmp.resolve("sweep.yaml");
    Files.writeString(sweep, "format: 1\nname: odd\ngrid: {resources.testbench.capacity: [8000, 1e300]}\n");
    refused(sweepWith(sweep), "sweep");
  }
}
