package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.runfolder.ColumnLog;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.PortfolioLog;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunLock;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.StringJoiner;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Damaged run folders, through the commands that read them: every run file cut short at each class
 * of offset and given random byte flips (seeded, printed). No command may fault (exit 3), and one that
 * answers (exit 0) must give the answer of the undamaged folder.
 */
class DamagedRunFolderTest {
  static final String STARTER = "catalogs/heatpump-starter.yaml";
  @TempDir static Path tmp;
  static Path base;
  static String segment;
  static String variant;

  @BeforeAll
  static void solveStarter() throws IOException {
    base = tmp.resolve("base");
    CliRun solve = CliRun.of("solve", STARTER, "--out", base.toString());
    assertEquals(0, solve.code(), solve::toString);
    JsonNode offer = Json.compact().readTree(Files.readString(base.resolve(RunFolder.RESULT))).path("offers").get(0);
    segment = offer.path("segment").asText();
    StringJoiner v = new StringJoiner(",");
    offer.path("options").fields().forEachRemaining(e -> v.add(e.getKey() + "=" + e.getValue().asText()));
    variant = v.toString();
  }

  /** The three reading commands on a folder at {@code dir}. */
  private record Answers(CliRun report, String page, CliRun explain, CliRun resume, double objective) {}

  private static Answers ask(Path dir) throws IOException {
    Path page = tmp.resolve("page.html");
    Files.deleteIfExists(page);
    CliRun report = CliRun.of("report", dir.toString(), "--out", page.toString());
    String html = Files.exists(page) ? Files.readString(page) : null;
    CliRun explain = CliRun.of("explain", dir.toString(), "--segment", segment, "--variant", variant, "--json");
    CliRun resume = CliRun.of("resume", dir.toString());
    double objective = Double.NaN;
    try {
      objective = Json.compact().readTree(Files.readString(dir.resolve(RunFolder.RESULT))).path("objective").asDouble();
    } catch (IOException e) {
      // left as NaN: the resume must then have refused
    }
    return new Answers(report, html, explain, resume, objective);
  }

  private static Path fresh(String name) throws IOException {
    Path dir = tmp.resolve(name);
    if (Files.exists(dir)) {
      try (var s = Files.list(dir)) {
        for (Path p : s.toList()) {
          Files.delete(p);
        }
      }
    }
    Files.createDirectories(dir);
    try (var s = Files.list(base)) {
      for (Path p : s.toList()) {
        if (!p.getFileName().toString().equals(RunFolder.LOCK)) {
          Files.copy(p, dir.resolve(p.getFileName()));
        }
      }
    }
    return dir;
  }

  @Test
  void everyDamagedRunFileIsRefusedInWordsOrReadRight() throws IOException {
    Answers clean = ask(fresh("trial"));
    assertEquals(0, clean.report().code(), clean.report()::toString);
    assertEquals(0, clean.explain().code(), clean.explain()::toString);
    assertEquals(0, clean.resume().code(), clean.resume()::toString);
    List<String> files = new ArrayList<>(List.of(RunFolder.MANIFEST, RunFolder.SNAPSHOT, RunFolder.RESULT,
        RunFolder.CATALOG_COPY, ColumnLog.FILE));
    if (Files.exists(base.resolve(PortfolioLog.FILE))) {
      files.add(PortfolioLog.FILE);
    }
    long seed = 0x15_0000L;
    Random rnd = new Random(seed);
    int trials = 0;
    int refused = 0;
    for (String file : files) {
      byte[] whole = Files.readAllBytes(base.resolve(file));
      int n = whole.length;
      List<String> damages = new ArrayList<>();
      for (int cut : new int[] {0, 1, n / 3, n / 2, n - 2, n - 1}) {
        damages.add("cut:" + cut);
      }
      for (int i = 0; i < 5; i++) {
        damages.add("flip:" + rnd.nextInt(n) + ":" + (1 + rnd.nextInt(255)));
      }
      for (String d : damages) {
        Path dir = fresh("trial");
        String[] p = d.split(":");
        byte[] bytes = whole.clone();
        if (p[0].equals("cut")) {
          bytes = java.util.Arrays.copyOf(bytes, Integer.parseInt(p[1]));
        } else {
          int at = Integer.parseInt(p[1]);
          bytes[at] = (byte) (bytes[at] ^ Integer.parseInt(p[2]));
        }
        Files.write(dir.resolve(file), bytes);
        Answers a = ask(dir);
        String at = "seed " + seed + ", " + file + " " + d + ": ";
        trials++;
        for (CliRun r : List.of(a.report(), a.explain(), a.resume())) {
          assertNotEquals(3, r.code(), () -> at + r);
          assertTrue(r.code() != 2 || r.err().contains("mixwright: "), () -> at + "refused without words: " + r);
          if (r.code() == 2) {
            refused++;
          }
        }
        if (a.report().code() == 0) {
          assertEquals(clean.page(), a.page(), at + "report answered with a different page");
        }
        if (a.explain().code() == 0) {
          assertEquals(clean.explain().out(), a.explain().out(), at + "explain answered differently");
        }
        if (a.resume().code() == 0) {
          assertEquals(clean.objective(), a.objective(), 1e-9 * Math.abs(clean.objective()),
              at + "resume ended at another objective");
        }
      }
    }
    System.out.println("damaged run files: " + trials + " trials, " + refused + " refusals (exit 2), seed " + seed);
  }

  @Test
  void aSweepNeverOverwritesASolveRun() throws IOException {
    Path dir = fresh("solve-then-sweep");
    String before = Files.readString(dir.resolve(RunFolder.CATALOG_COPY));
    CliRun sweep = CliRun.of("sweep", "--no-portfolio", STARTER, "--grid", "resources.testbench.capacity=8000..9000:1000",
        "--out", dir.toString());
    assertEquals(2, sweep.code(), sweep::toString);
    assertTrue(sweep.err().contains("holds a solve run"), sweep::toString);
    assertEquals(before, Files.readString(dir.resolve(RunFolder.CATALOG_COPY)));
    CliRun explain = CliRun.of("explain", dir.toString(), "--segment", segment, "--variant", variant);
    assertEquals(0, explain.code(), explain::toString);
  }

  @Test
  void aLinkWhereARunFileGoesIsRefusedAndItsTargetKept() throws IOException {
    Path dir = fresh("linked");
    Path target = tmp.resolve("precious.txt");
    Files.writeString(target, "keep me");
    Files.createSymbolicLink(dir.resolve(RunFolder.LOCK), target);
    CliRun resume = CliRun.of("resume", dir.toString());
    assertEquals(2, resume.code(), resume::toString);
    assertTrue(resume.err().contains("symbolic link"), resume::toString);
    CliRun solve = CliRun.of("solve", STARTER, "--out", dir.toString(), "--replace");
    assertEquals(2, solve.code(), solve::toString);
    assertEquals("keep me", Files.readString(target));
  }

  @Test
  void reportOnARunStillRunningSaysSo() throws IOException {
    Path dir = fresh("running");
    try (RunLock held = RunLock.acquire(new RunFolder(dir))) {
      CliRun r = CliRun.of("report", dir.toString());
      assertEquals(2, r.code(), r::toString);
      assertTrue(r.err().contains("still running"), r::toString);
    }
    assertEquals(0, CliRun.of("report", dir.toString()).code());
  }

  /**
   * catalog.json changed after the run (one price digit): resume names catalog.json, not an option
   * table the starter does not even have, and export refuses it rather than show other figures.
   */
  @Test
  void aChangedCatalogCopyIsNamedByResumeAndRefusedByExport() throws IOException {
    Path dir = fresh("copy");
    Path copy = dir.resolve(RunFolder.CATALOG_COPY);
    String text = Files.readString(copy);
    assertTrue(text.contains("5100"), "the starter's 12 kW unit is listed at 5100");
    Files.writeString(copy, text.replaceFirst("5100", "6100"));
    CliRun resume = CliRun.of("resume", dir.toString());
    assertEquals(ExitCodes.BAD_INPUT, resume.code(), resume::toString);
    assertTrue(resume.err().contains(RunFolder.CATALOG_COPY + " in "), resume::toString);
    assertTrue(!resume.err().contains("option table"), resume::toString);
    CliRun export = CliRun.of("export", dir.toString(), "--format", "text");
    assertEquals(ExitCodes.BAD_INPUT, export.code(), export::toString);
    assertTrue(export.err().contains("is damaged"), export::toString);
  }
}
