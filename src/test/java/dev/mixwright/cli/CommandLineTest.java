package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.mixwright.run.Catalogs;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The commands end to end, through picocli with captured output, on the small demo catalog. */
class CommandLineTest {
  static final Path STARTER = Paths.get("src/test/resources/fixed-demand", "heatpump-starter.yaml");
  static final ObjectMapper JSON = new ObjectMapper();

  @TempDir static Path shared;
  static Path run;
  static CliRun solved;

  @BeforeAll
  static void solveOnce() {
    run = shared.resolve("starter");
    solved = CliRun.of("solve", STARTER.toString(), "--out", run.toString());
  }

  @Test
  void solveWritesTheRunFiles() throws IOException {
    assertEquals(0, solved.code(), solved.err());
    JsonNode r = JSON.readTree(run.resolve("result.json").toFile());
    assertEquals("optimal", r.get("status").asText());
    for (String f : List.of("objective", "bound", "gap", "iterations", "columnsGenerated",
        "buildableVariants", "elapsedMs", "offers", "resources", "segments")) {
      assertTrue(r.has(f), "result.json lacks " + f);
    }
    assertTrue(r.get("gap").asDouble() <= 1e-6);
    // every line of the column log is a column counted, the seed columns included
    assertEquals(Files.readAllLines(run.resolve("columns.jsonl")).size(), r.get("columnsGenerated").asInt());
    assertTrue(solved.out().contains("V01 "), "the summary names variants by code: " + solved.out());
    // Counted by the demo author by brute force (catalog header comment).
    assertEquals("2244", r.get("buildableVariants").asText());
    assertTrue(r.get("bound").asDouble() >= r.get("objective").asDouble() - 1e-6);
    double sum = 0;
    for (JsonNode o : r.get("offers")) {
      sum += o.get("quantity").asDouble() * o.get("unitMargin").asDouble();
    }
    assertEquals(r.get("objective").asDouble(), sum, 1e-6 * Math.abs(sum));
    List<String> lines = Files.readAllLines(run.resolve("columns.jsonl"));
    assertFalse(lines.isEmpty());
    for (String line : lines) {
      JsonNode n = JSON.readTree(line);
      for (String f : List.of("iteration", "segment", "options", "reducedCost", "objectiveAfter", "boundAfter", "elapsedMs")) {
        assertTrue(n.has(f), "columns.jsonl line lacks " + f + ": " + line);
      }
    }
    assertEquals(r.get("columnsInMaster").asInt(), lines.size());
    assertTrue(Files.isRegularFile(run.resolve("catalog.json")));
  }

  /** explain's reduced cost recomputed by hand from result.json's shadow prices and the catalog. */
  @Test
  void explainReproducesReducedCostFromResultJson() throws IOException {
    JsonNode r = JSON.readTree(run.resolve("result.json").toFile());
    // capacity=c5 (3300-2280), compressor=rotary (450-370), refrigerant=r32 (0), casing=powder
    // (180-115), controller=wifi (190-95), tank none; uses from the catalog file.
    String variant = "capacity=c5,compressor=rotary,refrigerant=r32,casing=powder,controller=wifi";
    CliRun e = CliRun.of("explain", run.toString(), "--segment", "retrofit", "--variant", variant, "--json");
    assertEquals(0, e.code(), e.err());
    JsonNode x = JSON.readTree(e.out());
    double margin = (3300 - 2280) + (450 - 370) + 0 + (180 - 115) + (190 - 95);
    assertEquals(margin, x.get("margin").asDouble(), 1e-9);
    double pi = 0;
    JsonNode uses = x.get("uses");
    for (JsonNode res : r.get("resources")) {
      double charge = uses.get(res.get("id").asText()).asDouble() * res.get("shadowPrice").asDouble();
      assertEquals(charge, x.get("charges").get(res.get("id").asText()).asDouble(), 1e-9);
      pi += charge;
    }
    double mu = 0;
    for (JsonNode s : r.get("segments")) {
      if (s.get("id").asText().equals("retrofit")) {
        mu = s.get("shadowPrice").asDouble();
      }
    }
    assertEquals(mu, x.get("segmentCharge").asDouble(), 1e-12);
    assertEquals(margin - pi - mu, x.get("reducedCost").asDouble(), 1e-9);
    // The demo catalog's uses for this variant: assembly 2.6+0.3+0.1, testbench 0.45, inverter 1.
    assertEquals(3.0, uses.get("assembly").asDouble(), 1e-12);
    assertEquals(0.45, uses.get("testbench").asDouble(), 1e-12);
    assertEquals(1.0, uses.get("inverter").asDouble(), 1e-12);
  }

  @Test
  void everyOfferHasZeroOrPositiveReducedCostAndOutsideColumnsDoNotPay() throws IOException {
    JsonNode r = JSON.readTree(run.resolve("result.json").toFile());
    for (JsonNode o : r.get("offers")) {
      assertTrue(o.get("reducedCost").asDouble() >= -1e-6, o.toString());
    }
  }

  @Test
  void explainTextSaysWhenItWouldEnter() {
    CliRun e = CliRun.of("explain", run.toString(), "--segment", "quiet", "--variant",
        "capacity=c5,compressor=scroll,refrigerant=r32,casing=acoustic,controller=basic");
    assertEquals(0, e.code(), e.err());
    assertTrue(e.out().contains("reduced cost"), e.out());
    assertTrue(e.out().contains("would enter if its price rose by more than"), e.out());
  }

  @Test
  void explainFindsThePriceCutAtWhichAnOfferLeaves() throws IOException {
    JsonNode r = JSON.readTree(run.resolve("result.json").toFile());
    JsonNode offer = r.get("offers").get(0);
    StringBuilder v = new StringBuilder();
    offer.get("options").fields().forEachRemaining(f -> v.append(v.length() == 0 ? "" : ",")
        .append(f.getKey()).append('=').append(f.getValue().asText()));
    CliRun e = CliRun.of("explain", run.toString(), "--segment", offer.get("segment").asText(),
        "--variant", v.toString(), "--leave-price", "--json");
    assertEquals(0, e.code(), e.err());
    JsonNode x = JSON.readTree(e.out());
    double cut = x.get("priceCutToLeave").asDouble();
    assertTrue(cut >= 0 && cut <= offer.get("unitMargin").asDouble() + 1, e.out());
    assertTrue(x.get("resolves").asInt() > 1, e.out());
  }

  @Test
  void explainNamesTheRuleOrAcceptsThatBlocksAVariant() {
    CliRun e = CliRun.of("explain", run.toString(), "--segment", "quiet", "--variant",
        "capacity=c5,compressor=rotary,refrigerant=r32,casing=galv,controller=basic");
    assertEquals(0, e.code(), e.err());
    assertTrue(e.out().contains("does not accept casing=galv"), e.out());
  }

  @Test
  void explainRejectsUnknownOptionWithTheChoices() {
    CliRun e = CliRun.of("explain", run.toString(), "--segment", "quiet", "--variant", "capacity=c99");
    assertEquals(2, e.code());
    assertTrue(e.err().contains("group 'capacity' has no option 'c99'"), e.err());
    assertFalse(e.err().contains("Exception"), e.err());
  }

  @Test
  void explainRejectsUnknownSegment() {
    CliRun e = CliRun.of("explain", run.toString(), "--segment", "nobody", "--variant", "capacity=c5");
    assertEquals(2, e.code());
    assertTrue(e.err().contains("no segment 'nobody'"), e.err());
  }

  @Test
  void logShowsTheColumnsAsATable() throws IOException {
    CliRun l = CliRun.of("log", run.toString());
    assertEquals(0, l.code(), l.err());
    int lines = Files.readAllLines(run.resolve("columns.jsonl")).size();
    assertTrue(l.out().contains(lines + " columns"), l.out());
    assertTrue(l.out().contains("reduced cost") && l.out().contains("bound after"), l.out());
  }

  /** The code on a summary row, and the LP total units printed on it. */
  private record SummaryRow(String code, String total) {}

  /**
   * The matrix rows of the summary: the code, then the row's LP total (the last column but one), from
   * the block of the table that holds the units (a wide table comes in blocks of group columns).
   */
  private static List<SummaryRow> summaryRows(String out) {
    List<SummaryRow> rows = new java.util.ArrayList<>();
    boolean units = false;
    for (String line : out.split("\n")) {
      String t = line.strip();
      if (t.startsWith("variant ")) {
        units = t.contains("LP total");
      } else if (units && t.matches("V[0-9]+\\s{2,}.*")) {
        String[] cells = t.split("\\s{2,}");
        rows.add(new SummaryRow(cells[0], cells[cells.length - 2]));
      } else if (!t.matches("V[0-9]+\\s{2,}.*")) {
        units = false;
      }
    }
    return rows;
  }

  /**
   * explain VNN names the variant the summary's row VNN shows: the LP units result.json gives that
   * variant are the row's total; the log names each column of result.json's variants by that code.
   */
  @Test
  void explainAndLogUseTheSummaryCodes() throws IOException {
    JsonNode r = JSON.readTree(run.resolve("result.json").toFile());
    List<SummaryRow> rows = summaryRows(solved.out());
    assertTrue(rows.size() >= 3, solved.out());
    java.util.Map<String, JsonNode> optionsOf = new java.util.HashMap<>();
    for (SummaryRow row : rows) {
      CliRun e = CliRun.of("explain", run.toString(), row.code(), "--json");
      assertEquals(0, e.code(), e::toString);
      JsonNode x = JSON.readTree(e.out());
      assertEquals(row.code(), x.get("code").asText());
      JsonNode options = x.get("options");
      optionsOf.put(row.code(), options);
      double units = 0;
      for (JsonNode o : r.get("offers")) {
        if (o.get("options").equals(options)) {
          units += o.get("quantity").asDouble();
        }
      }
      assertEquals(row.total(), units == 0 ? "-" : dev.mixwright.report.Figures.units(units), row.code());
      CliRun same = CliRun.of("explain", run.toString(), "--variant", row.code().toLowerCase(java.util.Locale.ROOT));
      assertEquals(0, same.code(), same::toString);
      assertTrue(same.out().startsWith("variant " + row.code() + ": "), same.out());
    }
    CliRun l = CliRun.of("log", run.toString());
    assertEquals(0, l.code(), l::toString);
    List<String> columns = Files.readAllLines(run.resolve("columns.jsonl"));
    List<String> logRows = new java.util.ArrayList<>();
    String columnPart = l.out().substring(0, l.out().indexOf("\n" + columns.size() + " columns"));
    for (String line : columnPart.split("\n")) {
      if (line.startsWith("  ") && !line.startsWith("  segment")) {
        logRows.add(line);
      }
    }
    assertEquals(columns.size(), logRows.size(), l.out());
    int coded = 0;
    for (int i = 0; i < columns.size(); i++) {
      String name = logRows.get(i).split("\\s{2,}")[3];
      JsonNode options = JSON.readTree(columns.get(i)).get("options");
      if (optionsOf.containsKey(name)) {
        coded++;
        assertEquals(optionsOf.get(name), options, logRows.get(i));
      }
      assertTrue(logRows.get(i).length() <= 100, "a log line fits 100 columns: " + logRows.get(i));
    }
    assertTrue(coded >= rows.size() / 2, l.out());
  }

  @Test
  void anUnknownCodeIsRefusedWithTheRunsCodes() {
    CliRun e = CliRun.of("explain", run.toString(), "V99");
    assertEquals(2, e.code(), e::toString);
    assertTrue(e.err().contains("no variant V99") && e.err().contains("V01, V02"), e.err());
    assertFalse(e.err().contains("Exception"), e.err());
    CliRun twice = CliRun.of("explain", run.toString(), "V01", "--variant", "V02");
    assertEquals(2, twice.code(), twice::toString);
  }

  @Test
  void theLogsAndExplainSpeakPlainWords() {
    CliRun.assertPlain(solved.out());
    CliRun p = CliRun.of("log", run.toString(), "--portfolio");
    assertEquals(0, p.code(), p::toString);
    assertTrue(p.out().contains("upper limit") && p.out().contains("better range"), p.out());
    CliRun.assertPlain(p.out());
    CliRun l = CliRun.of("log", run.toString());
    CliRun.assertPlain(l.out());
    CliRun e = CliRun.of("explain", run.toString(), "V02");
    assertEquals(0, e.code(), e::toString);
    CliRun.assertPlain(e.out());
    CliRun out = CliRun.of("explain", run.toString(), "--segment", "quiet", "--variant",
        "capacity=c5,compressor=scroll,refrigerant=r32,casing=acoustic,controller=basic");
    CliRun.assertPlain(out.out());
  }

  @Test
  void logDropsATornLastLine(@TempDir Path dir) throws IOException {
    List<String> lines = Files.readAllLines(run.resolve("columns.jsonl"));
    String torn = String.join("\n", lines) + "\n" + lines.get(0).substring(0, 20);
    Files.writeString(dir.resolve("columns.jsonl"), torn);
    CliRun l = CliRun.of("log", dir.toString());
    assertEquals(0, l.code(), l.err());
    assertTrue(l.out().contains(lines.size() + " columns; 1 torn last line dropped"), l.out());
  }

  @Test
  void solveRefusesToOverwriteARun() {
    CliRun again = CliRun.of("solve", STARTER.toString(), "--out", run.toString());
    assertEquals(2, again.code());
    assertTrue(again.err().contains("already holds a run") && again.err().contains("--replace"), again.err());
  }

  @Test
  void iterationLimitStopsWithExitOneAndAValidBound(@TempDir Path dir) throws IOException {
    Path out = dir.resolve("r");
    CliRun s = CliRun.of("solve", Paths.get("src/test/resources/fixed-demand", "heatpump-range.yaml").toString(), "--out",
        out.toString(), "--max-iterations", "2");
    assertEquals(1, s.code(), s.err());
    JsonNode r = JSON.readTree(out.resolve("result.json").toFile());
    assertEquals("stopped", r.get("status").asText());
    assertTrue(r.get("stopReason").asText().contains("iteration limit"));
    assertTrue(r.get("bound").asDouble() > r.get("objective").asDouble());
    // issue 10: "an alternative optimum" only on an optimal run; a stopped run's columns outside the
    // plan are explained at its last shadow prices, and it says so
    java.util.Set<String> offered = new java.util.HashSet<>();
    r.get("offers").forEach(o -> offered.add(o.get("segment").asText() + o.get("options")));
    int explained = 0;
    for (String line : Files.readAllLines(out.resolve("columns.jsonl"))) {
      JsonNode c = JSON.readTree(line);
      if (explained == 6 || offered.contains(c.get("segment").asText() + c.get("options"))) {
        continue;
      }
      StringBuilder v = new StringBuilder();
      c.get("options").fields().forEachRemaining(f -> v.append(v.length() == 0 ? "" : ",").append(f.getKey()).append('=')
          .append(f.getValue().asText()));
      CliRun e = CliRun.of("explain", out.toString(), "--segment", c.get("segment").asText(), "--variant", v.toString());
      assertEquals(0, e.code(), e::toString);
      assertFalse(e.out().contains("alternative optimum"), e.out());
      assertTrue(e.out().contains("the run ended stopped"), e.out());
      explained++;
    }
    assertTrue(explained > 0, "the stopped run has columns outside its plan");
  }

  @Test
  void integerStageWaitsForTheLpAndResumeRunsIt(@TempDir Path dir) throws IOException {
    Path out = dir.resolve("r");
    CliRun s = CliRun.of("solve", STARTER.toString(), "--out", out.toString(), "--max-iterations", "1");
    assertEquals(1, s.code(), s.err());
    JsonNode r = JSON.readTree(out.resolve("result.json").toFile());
    assertEquals("stopped", r.get("status").asText());
    assertFalse(r.has("portfolio"), "no integer stage on an unfinished LP");
    assertTrue(r.get("portfolioPending").asText().contains("resume"));
    assertTrue(s.out().contains("integer portfolio   not run"), s.out());
    CliRun again = CliRun.of("resume", out.toString());
    assertEquals(0, again.code(), again.err());
    JsonNode done = JSON.readTree(out.resolve("result.json").toFile());
    assertEquals("optimal", done.get("status").asText());
    JsonNode p = done.get("portfolio");
    assertTrue(p != null && p.get("value").asDouble() > 0, done.toString());
    assertTrue(p.get("bound").asDouble() >= p.get("value").asDouble() - 1e-6);
  }

  @Test
  void helpTextsKeepTheirTablesAndOneLineSummaries() {
    CliRun sweep = CliRun.of("sweep", "--help");
    assertTrue(sweep.out().contains("\n  rules.ID=on,off                            a rule switched\n"), sweep.out());
    assertTrue(sweep.out().contains("\n  options.GROUP.OPTION.cost=-10%..+10%:10%   changes in percent\n"), sweep.out());
    CliRun main = CliRun.of("--help");
    String bench = main.out().substring(main.out().indexOf("  bench "));
    assertTrue(bench.substring(0, bench.indexOf("  report ")).trim().endsWith("listed."), main.out());
  }

  @Test
  void checkDescribesAValidCatalog() {
    CliRun c = CliRun.of("check", STARTER.toString());
    assertEquals(0, c.code(), c.err());
    assertTrue(c.out().contains("buildable variants: 2244"), c.out());
  }

  @Test
  void checkNamesTheExactPathOfABadField(@TempDir Path dir) throws IOException {
    String text = Files.readString(STARTER).replace("capacity: 9500", "capacity: -9500");
    Path bad = dir.resolve("bad.yaml");
    Files.writeString(bad, text);
    CliRun c = CliRun.of("check", bad.toString());
    assertEquals(2, c.code());
    assertTrue(c.err().contains("resources[1].capacity"), c.err());
    assertFalse(c.err().contains("at dev.mixwright"), "no stack trace: " + c.err());
  }

  @Test
  void missingCatalogFileIsBadInput(@TempDir Path dir) {
    CliRun c = CliRun.of("solve", dir.resolve("nope.yaml").toString(), "--out", dir.resolve("r").toString());
    assertEquals(2, c.code());
    assertTrue(c.err().contains("no catalog file"), c.err());
  }

  @Test
  void badOptionValuesAreBadInput(@TempDir Path dir) {
    CliRun t = CliRun.of("solve", STARTER.toString(), "--out", dir.resolve("a").toString(), "--time-limit", "soon");
    assertEquals(2, t.code());
    assertTrue(t.err().contains("--time-limit") && t.err().contains("90s"), t.err());
    CliRun p = CliRun.of("solve", STARTER.toString(), "--out", dir.resolve("b").toString(), "--pricer", "magic");
    assertEquals(2, p.code());
    assertTrue(p.err().contains("unknown pricer 'magic'"), p.err());
    CliRun u = CliRun.of("solve", STARTER.toString());
    assertEquals(2, u.code());
    assertTrue(u.err().contains("--out"), u.err());
  }

  @Test
  void noBuildableVariantIsInfeasibleWithTheRulesNamed(@TempDir Path dir) throws IOException {
    String yaml = Catalogs.NOTHING_BUILDABLE;
    Path f = dir.resolve("clash.yaml");
    Files.writeString(f, yaml);
    CliRun s = CliRun.of("solve", f.toString(), "--out", dir.resolve("r").toString());
    assertEquals(1, s.code(), s.err());
    JsonNode r = JSON.readTree(dir.resolve("r").resolve("result.json").toFile());
    assertEquals("infeasible", r.get("status").asText());
    assertTrue(r.get("stopReason").asText().contains("rules[0]") && r.get("stopReason").asText().contains("rules[1]"),
        r.get("stopReason").asText());
    CliRun c = CliRun.of("check", f.toString());
    assertEquals(2, c.code(), "nothing buildable is bad input for check");
    assertTrue(c.out().contains("rules[0]") && c.out().contains("rules[1]"), c.out());
    assertFalse(c.out().contains("valid"), c.out());
    assertTrue(c.err().contains("rules: ") && c.err().contains("rules[0]"), c.err());
  }

  @Test
  void checkRefusesASegmentWhoseAcceptsLeavesNoBuildableVariant(@TempDir Path dir) throws IOException {
    Path f = dir.resolve("narrow.yaml");
    // the clash catalog with one of its two rules gone: body b is still unbuildable, and 'picky' takes only b
    Files.writeString(f, Catalogs.NOTHING_BUILDABLE.replace("- {id: no-a, forbid: {body: [a], trim: [x]}}", "")
        .replace("segments: [{id: all, demand: 10}]",
            "segments: [{id: all, demand: 10}, {id: picky, demand: 5, accepts: {body: [b]}}]"));
    CliRun c = CliRun.of("check", f.toString());
    assertEquals(2, c.code(), c.out() + c.err());
    assertTrue(c.err().contains("segments[1].accepts") && c.err().contains("picky"), c.err());
    assertFalse(c.err().contains("at dev.mixwright"), c.err());
    CliRun j = CliRun.of("check", "--json", f.toString());
    assertEquals(2, j.code());
    assertTrue(j.out().contains("\"valid\" : false"), j.out());
  }
}
