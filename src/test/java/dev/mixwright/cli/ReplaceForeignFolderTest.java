package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.runfolder.RunFolder;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code --replace} into a folder that holds other things but no run (a mistyped --out: a home
 * folder, /etc) is refused in words with exit 2, before any run file or lock is written there.
 */
class ReplaceForeignFolderTest {
  private static final String STARTER = "catalogs/heatpump-starter.yaml";

  @TempDir Path tmp;

  private Path foreignFolder() throws Exception {
    Path dir = Files.createDirectories(tmp.resolve("home"));
    Files.writeString(dir.resolve("thesis.tex"), "years of work");
    return dir;
  }

  private static void assertUntouched(Path dir) throws Exception {
    assertEquals("years of work", Files.readString(dir.resolve("thesis.tex")));
    for (String f : RunFolder.RUN_FILES) {
      assertFalse(Files.exists(dir.resolve(f)), f + " was written into a folder that holds no run");
    }
  }

  @Test
  void solveReplaceRefusesAFolderThatHoldsNoRun() throws Exception {
    Path dir = foreignFolder();
    CliRun r = CliRun.of("solve", STARTER, "--out", dir.toString(), "--replace", "--no-portfolio", "--no-progress");
    assertEquals(ExitCodes.BAD_INPUT, r.code(), r.toString());
    assertTrue(r.err().contains("does not look like a run folder"), r.toString());
    assertFalse(r.err().contains("Exception"), r.toString());
    assertUntouched(dir);
  }

  @Test
  void sweepReplaceRefusesAFolderThatHoldsNoRun() throws Exception {
    Path dir = foreignFolder();
    CliRun r = CliRun.of("sweep", STARTER, "--grid", "options.capacity.c14.price=+0,+1200", "--out", dir.toString(),
        "--replace", "--no-progress");
    assertEquals(ExitCodes.BAD_INPUT, r.code(), r.toString());
    assertTrue(r.err().contains("does not look like a run folder"), r.toString());
    assertUntouched(dir);
  }

  @Test
  void solveReplaceStillReplacesARunAndKeepsTheFilesBesideIt() throws Exception {
    Path dir = tmp.resolve("run");
    CliRun first = CliRun.of("solve", STARTER, "--out", dir.toString(), "--no-portfolio", "--no-progress");
    assertEquals(ExitCodes.OK, first.code(), first.toString());
    Files.writeString(dir.resolve("notes.txt"), "mine");
    CliRun again = CliRun.of("solve", STARTER, "--out", dir.toString(), "--replace", "--no-portfolio",
        "--no-progress");
    assertEquals(ExitCodes.OK, again.code(), again.toString());
    assertEquals("mine", Files.readString(dir.resolve("notes.txt")));
    assertTrue(Files.exists(dir.resolve(RunFolder.RESULT)));
  }
}
