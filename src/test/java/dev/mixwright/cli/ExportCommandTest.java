package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.export.ExportRuns;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The export command: its files, the matrix on the screen, and bad input said in words with exit 2. */
class ExportCommandTest {
  @TempDir Path dir;

  @Test
  void writesEachFormatAndPrintsTheMatrix() throws Exception {
    Path run = ExportRuns.solve(dir, ExportRuns.FORMULA_NAMES);
    Path out = dir.resolve("out");
    for (String format : new String[] {"csv", "xlsx", "mps"}) {
      CliRun r = CliRun.of("export", run.toString(), "--format", format, "--out", out.toString());
      assertEquals(0, r.code(), r.err());
    }
    for (String f : new String[] {"offers.csv", "portfolio.csv", "resources.csv", "segments.csv", "matrix.csv",
        "plan.xlsx", "master.mps", "portfolio.mps"}) {
      assertTrue(Files.isRegularFile(out.resolve(f)), f);
    }
    CliRun text = CliRun.of("export", run.toString(), "--format", "text");
    assertEquals(0, text.code(), text.err());
    assertTrue(text.out().contains("V01"), text.out());
    assertTrue(text.out().lines().anyMatch(l -> l.startsWith("variant")), text.out());
  }

  @Test
  void badInputIsSaidInWords() {
    CliRun nope = CliRun.of("export", dir.toString(), "--format", "pdf", "--out", dir.resolve("o").toString());
    assertEquals(2, nope.code());
    assertTrue(nope.err().contains("csv, xlsx, mps or text"), nope.err());
    CliRun noOut = CliRun.of("export", dir.toString(), "--format", "csv");
    assertEquals(2, noOut.code());
    assertTrue(noOut.err().contains("--out"), noOut.err());
    CliRun notARun = CliRun.of("export", dir.toString(), "--format", "csv", "--out", dir.resolve("o").toString());
    assertEquals(2, notARun.code());
    assertTrue(notARun.err().contains("result.json"), notARun.err());
    assertFalse(notARun.err().contains("at dev.mixwright"), notARun.err());
  }
}
