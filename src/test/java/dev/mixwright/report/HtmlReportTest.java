package dev.mixwright.report;

import dev.mixwright.runfolder.SealedJson;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.cli.Main;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.runfolder.Json;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HtmlReportTest {
  @TempDir static Path tmp;
  static Path run;
  static JsonNode result;

  @BeforeAll
  static void solveStarter() throws Exception {
    run = tmp.resolve("starter");
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    // the fixed-demand copy of the starter: this page has an integer portfolio (ChoosingViewsTest and
    // ChoosingRunCommandsTest draw pages of segments that choose)
    int code = Main.run(new String[] {"solve", "src/test/resources/fixed-demand/heatpump-starter.yaml", "--out",
        run.toString()},
        new PrintWriter(out), new PrintWriter(err));
    assertEquals(0, code, () -> out + "\n" + err);
    result = Json.pretty().readTree(run.resolve(ResultWriter.FILE).toFile());
  }

  @Test
  void pageOfASolvedRunPutsTheBusinessFirstAndTheSolverLast() throws Exception {
    Path page = run.resolve("page.html");
    HtmlReport.write(run, page);
    String html = Files.readString(page);
    assertTrue(html.startsWith("<!DOCTYPE html>"));
    int last = -1;
    for (String id : new String[] {"headline", "range", "against", "resources", "prices", "segments", "solver"}) {
      int at = html.indexOf("<h2 id=\"" + id + "\"");
      assertTrue(at > last, "section " + id + " in its place");
      last = at;
    }
    // the inputs: file, SHA-256, scenario, date, version
    JsonNode cat = result.get("catalog");
    assertTrue(html.contains(escapedOnce(cat.get("name").asText())), "catalog name shown");
    assertTrue(html.contains(cat.get("sha256").asText()));
    assertTrue(html.contains(escapedOnce(cat.get("file").asText())));
    assertTrue(html.contains("scenario: <b>none (the catalog as written)</b>"));
    assertTrue(html.contains("run started: <b>20"));
    assertTrue(html.contains("page drawn by: <b>mixwright "));
    assertFalse(html.contains("class=\"warn\""), "an optimal run with its portfolio needs no warning");

    // headline: the margin the integer stage itself wrote for its variants, less the one-off costs,
    // is the portfolio's value
    JsonNode p = result.get("portfolio");
    double margin = 0;
    for (JsonNode v : p.get("variants")) {
      margin += v.get("margin").asDouble();
    }
    assertEquals(p.get("value").asDouble(), margin - p.get("introductionCosts").asDouble()
        - p.get("toolingCosts").asDouble(), 1e-6 * Math.abs(margin));
    String headline = html.substring(html.indexOf("id=\"headline\""), html.indexOf("id=\"range\""));
    assertTrue(headline.contains(Figures.money(margin) + " <small>EUR</small>"), "margin card");
    assertTrue(headline.contains(Figures.money(p.get("value").asDouble()) + " <small>EUR</small>"), "value card");
    assertTrue(headline.contains(Figures.money(p.get("introductionCosts").asDouble())), "introduction costs apart");
    assertTrue(headline.contains("tooling costs"));
    for (JsonNode s : result.get("segments")) {
      assertTrue(headline.contains(">" + s.get("id").asText() + "<"), "units of segment " + s.get("id"));
    }

    // codes and labels, never group=option strings
    RunResult rr = RunResult.read(run);
    VariantCodes codes = VariantCodes.of(rr);
    for (RunResult.PortfolioVariant v : rr.portfolio().variants()) {
      assertTrue(html.contains("<td class=\"code\">" + codes.code(v.options()) + "</td>"), "matrix row of a variant");
    }
    assertTrue(html.contains("Heating capacity class"), "group labels of the catalog");
    // six labelled groups do not fit beside the figures at the page's width: each variant's choices
    // fold into a line of their own, every choice of the matrix kept
    String options = html.substring(html.indexOf("Options of each variant"));
    MatrixView m = MatrixView.of(rr, HtmlReport.read(run).catalog());
    for (MatrixView.Row row : m.rows()) {
      String line = options.substring(options.indexOf("<td class=\"code\">" + row.code() + "</td>"));
      line = line.substring(0, line.indexOf("</tr>"));
      for (int g = 0; g < m.groups().size(); g++) {
        assertTrue(line.contains(HtmlReport.escape(m.groups().get(g).head()) + "</span> "
            + HtmlReport.escape(row.cells().get(g))), row.code() + " " + m.groups().get(g).head());
      }
    }
    assertFalse(html.contains("capacity="), "no group=option text where labels exist");

    // the portfolio against the LP plan, in money
    String against = html.substring(html.indexOf("id=\"against\""), html.indexOf("id=\"resources\""));
    assertTrue(against.contains(Figures.money(result.get("objective").asDouble() - p.get("value").asDouble())));
    assertTrue(against.contains(p.get("status").asText().equals("proven") ? "Proven the best range" : "Not proven"));
    // shadow prices have a chart of their own; the convergence chart is the page's only SVG
    assertEquals(1, count(html, "<svg"));
    assertTrue(html.substring(html.indexOf("id=\"prices\"")).contains("does not limit the plan")
        || result.get("resources").findValues("shadowPrice").stream().allMatch(n -> n.asDouble() > 0));
    assertSelfContained(html);
  }

  @Test
  void theRangeToBuildStaysWithinCapacityAndItsAttachRatesAddUp() throws Exception {
    HtmlReport.Inputs in = HtmlReport.read(run);
    assertTrue(in.catalog() != null && in.manifest() != null);
    dev.mixwright.space.VariantSpace space = new dev.mixwright.space.VariantSpace(in.catalog());
    PlanFigures range = PlanFigures.portfolio(in.result(), space);
    double[] use = range.resourceUse(space);
    for (int i = 0; i < use.length; i++) {
      double cap = in.catalog().resources().get(i).capacity();
      assertTrue(use[i] <= cap * (1 + 1e-9) + 1e-6, "resource " + i + " used " + use[i] + " of " + cap);
    }
    // margin through the catalog equals the integer stage's own margins
    double margin = 0;
    for (RunResult.PortfolioVariant v : in.result().portfolio().variants()) {
      margin += v.margin();
    }
    assertEquals(margin, range.margin(), 1e-6 * Math.abs(margin));
    assertEquals(range.revenue() - range.margin(), range.cost(), 1e-6);
    java.util.Map<String, Double> perGroup = new java.util.LinkedHashMap<>();
    range.attachRates().forEach(a -> perGroup.merge(a.group(), a.share(), Double::sum));
    perGroup.forEach((g, sum) -> assertEquals(1.0, sum, 1e-9, "attach rates of " + g));
  }

  @Test
  void aStoppedOrInfeasibleRunIsWarnedAboutAtTheTop() {
    for (RunStatus status : new RunStatus[] {RunStatus.STOPPED, RunStatus.INFEASIBLE}) {
      RunResult r = new RunResult(status, "time limit", 900, 1000.0, 0.1, 2, 3, 3, "12", null, null, null, 10,
          new RunResult.CatalogRef("tiny", "tiny.yaml", "ab", "EUR", "year"), "bnb", List.of(),
          List.of(new RunResult.ResourceRow("line", 10, 5, 0.0, false)),
          List.of(new RunResult.SegmentRow("s", 8, 0, 0.0)), List.of(), null, null, null);
      String html = HtmlReport.render(r);
      int warn = html.indexOf("class=\"warn\"");
      assertTrue(warn > 0 && warn < html.indexOf("<h2"), status + ": a warning above every section");
      assertTrue(html.substring(warn).startsWith(status == RunStatus.STOPPED
          ? "class=\"warn\">This run stopped before it finished (time limit)"
          : "class=\"warn\">No plan meets"));
    }
  }

  @Test
  void stringsFromTheRunAreEscapedAndNullBoundsSkipped() throws Exception {
    Path crafted = tmp.resolve("crafted");
    Files.createDirectories(crafted);
    String json = """
        {"status":"stopped","objective":1234.5,"bound":null,"gap":null,"iterations":2,"buildableVariants":"12",
         "catalog":{"name":"Tom & Jerry's <b>range</b>","currency":"EUR"},
         "offers":[{"segment":"s<1>","options":{"colour":"<script>alert(1)</script>","extra":"none"},
                    "quantity":5,"unitMargin":10,"reducedCost":0}],
         "resources":[{"id":"line\\"A\\"","capacity":10,"used":5,"shadowPrice":0,"binding":false}],
         "segments":[{"id":"s<1>","demand":8,"sold":5,"shadowPrice":0}],
         "rounds":[{"iteration":1,"objective":1000,"bound":null,"gap":null,"columns":1,"added":1,"elapsedMs":3},
                   {"iteration":2,"objective":1234.5,"bound":1500,"gap":0.2,"columns":2,"added":0,"elapsedMs":5}]}
        """;
    // sealed as a run writes it: the page is made only from a result.json that passes its checksum
    Files.writeString(crafted.resolve(ResultWriter.FILE), SealedJson.seal(json));
    HtmlReport.write(crafted, crafted.resolve(HtmlReport.FILE));
    String html = Files.readString(crafted.resolve(HtmlReport.FILE));
    assertFalse(html.contains("<script"), "a choice name must not become markup");
    assertFalse(html.contains("<b>range"));
    assertFalse(html.contains("s<1>"));
    assertTrue(html.contains("&lt;script&gt;alert(1)&lt;/script&gt;"));
    assertTrue(html.contains("Tom &amp; Jerry&#39;s &lt;b&gt;range&lt;/b&gt;"));
    assertTrue(html.contains("line&quot;A&quot;"));
    // two short groups fit beside the figures: they stay columns of the one table
    assertTrue(html.contains("<th>colour</th>") && !html.contains("Options of each variant"));
    assertTrue(html.contains("1,234.50"));
    assertTrue(html.contains("scenario: <b>not recorded</b>"), "no run.json in the folder");
    assertFalse(html.contains("id=\"against\""), "no portfolio in the run, none on the page");
    assertEquals(1, count(html, "<svg"));
    // the bound exists in round 2 only: the dashed series has one point, the objective two
    assertEquals(3, count(html, "<circle"));
    assertSelfContained(html);
  }

  @Test
  void ticksCoverTheRangeInRoundSteps() {
    double[] t = HtmlReport.ticks(26_727_105, 32_320_000, 5);
    assertTrue(t[0] <= 26_727_105 && t[t.length - 1] >= 32_320_000);
    double step = t[1] - t[0];
    // by hand: (32,320,000 - 26,727,105) / 5 = 1.12M a step, and the next of 1, 2, 5 x 10^k above it is 2M
    assertEquals(2_000_000, step, 1e-6);
    assertEquals(26_000_000, t[0], 1e-6);
    assertEquals(34_000_000, t[t.length - 1], 1e-6);
    for (int i = 1; i < t.length; i++) {
      assertEquals(step, t[i] - t[i - 1], 1e-6);
    }
    double[] flat = HtmlReport.ticks(5, 5, 5);
    assertTrue(flat[0] < 5 && flat[flat.length - 1] > 5, "a flat series still gets an axis around it");
  }

  static void assertSelfContained(String html) {
    String low = html.toLowerCase(Locale.ROOT);
    assertFalse(low.contains("<script"), "no script at all");
    assertFalse(low.contains("http"), "no link to a network resource");
    assertFalse(low.contains("<link"));
    assertFalse(low.contains("url("));
    assertFalse(low.contains("@import"));
  }

  private static String escapedOnce(String s) {
    return HtmlReport.escape(s);
  }

  static int count(String s, String needle) {
    int n = 0;
    for (int i = s.indexOf(needle); i >= 0; i = s.indexOf(needle, i + 1)) {
      n++;
    }
    return n;
  }
}
