package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ReportCommandTest {
  @TempDir static Path tmp;
  static Path run;

  @BeforeAll
  static void solveStarter() {
    run = tmp.resolve("starter");
    CliRun solve = CliRun.of("solve", "src/test/resources/fixed-demand/heatpump-starter.yaml", "--out", run.toString());
    assertEquals(0, solve.code(), solve::toString);
  }

  @Test
  void writesIntoTheRunFolderByDefault() throws Exception {
    CliRun r = CliRun.of("report", run.toString());
    assertEquals(0, r.code(), r::toString);
    Path page = run.resolve("report.html");
    assertTrue(Files.isRegularFile(page));
    assertTrue(r.out().contains(page.toString()));
    String html = Files.readString(page);
    assertEquals(1, html.split("<svg", -1).length - 1, "the convergence chart; the other charts are bars of HTML");
    assertFalse(html.contains("http"));
    // the permissions of any new file (0644 under umask 022), as an export's: the page is made to be handed on
    Path probe = Files.writeString(tmp.resolve("probe"), "x");
    assertEquals(Files.getPosixFilePermissions(probe), Files.getPosixFilePermissions(page));
  }

  @Test
  void writesWhereOutSays() {
    Path target = tmp.resolve("elsewhere/page.html");
    CliRun r = CliRun.of("report", run.toString(), "--out", target.toString());
    assertEquals(0, r.code(), r::toString);
    assertTrue(Files.isRegularFile(target));
  }

  @Test
  void folderWithoutResultIsBadInput() throws Exception {
    Path empty = Files.createDirectories(tmp.resolve("empty"));
    CliRun r = CliRun.of("report", empty.toString());
    assertEquals(2, r.code(), r::toString);
    assertTrue(r.err().contains("no result.json"), r::toString);
    assertFalse(r.err().contains("Exception"), r::toString);
    assertFalse(Files.exists(empty.resolve("report.html")));
  }

  @Test
  void brokenResultIsBadInput() throws Exception {
    Path broken = Files.createDirectories(tmp.resolve("broken"));
    Files.writeString(broken.resolve("result.json"), "{\"status\": ");
    CliRun r = CliRun.of("report", broken.toString());
    assertEquals(2, r.code(), r::toString);
    assertTrue(r.err().contains("result.json in " + broken + " is damaged"), r::toString);
  }

  @Test
  void logOfASegmentTheRunDoesNotHaveListsItsSegments() {
    CliRun typo = CliRun.of("log", run.toString(), "--segment", "retrofti");
    assertEquals(2, typo.code(), typo::toString);
    assertTrue(typo.err().contains("--segment retrofti: the run has no such segment; its segments are retrofit,"),
        typo::toString);
    CliRun ok = CliRun.of("log", run.toString(), "--segment", "retrofit");
    assertEquals(0, ok.code(), ok::toString);
    assertTrue(ok.out().contains("columns in segment retrofit"), ok::toString);
  }
}
