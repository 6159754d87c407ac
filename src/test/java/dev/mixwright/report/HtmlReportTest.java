package dev.mixwright.report;

import dev.mixwright.runfolder.SealedJson;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.cli.Main;
import dev.mixwright.runfolder.Json;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
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
  void pageOfASolvedRunHoldsItsFigures() throws Exception {
    Path page = run.resolve("page.html");
    HtmlReport.write(run, page);
    assertTrue(Files.isRegularFile(page));
    String html = Files.readString(page);
    assertTrue(html.startsWith("<!DOCTYPE html>"));
    assertTrue(html.contains(String.format(Locale.ROOT, "%,.2f", result.get("objective").asDouble())), "objective shown");
    assertTrue(html.contains(escapedOnce(result.get("catalog").get("name").asText())), "catalog name shown");
    // convergence, resources, segments; the starter catalog has a portfolio section but no chart for it
    assertEquals(3, count(html, "<svg"));
    for (JsonNode r : result.get("resources")) {
      assertTrue(html.contains(">" + r.get("id").asText() + "<"), "resource " + r.get("id"));
    }
    for (JsonNode s : result.get("segments")) {
      assertTrue(html.contains("Segment " + s.get("id").asText()), "segment " + s.get("id"));
    }
    assertTrue(result.get("portfolio").isObject(), "the starter catalog has an integer stage");
    assertTrue(html.contains("Integer portfolio"));
    assertTrue(html.contains(HtmlReport.money(result.get("portfolio").get("value").asDouble())));
    assertEquals(result.get("offers").size() + result.get("portfolio").get("variants").size(), count(html, "<code>"),
        "one row per LP offer and per portfolio variant");
    assertSelfContained(html);
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
    assertTrue(html.contains("colour=&lt;script&gt;alert(1)&lt;/script&gt;"));
    assertTrue(html.contains("Tom &amp; Jerry&#39;s &lt;b&gt;range&lt;/b&gt;"));
    assertTrue(html.contains("line&quot;A&quot;"));
    assertFalse(html.contains("extra=none"), "optional groups at none are left out");
    assertTrue(html.contains("1,234.50"));
    assertFalse(html.contains("Integer portfolio"), "no portfolio in the run, none on the page");
    assertEquals(3, count(html, "<svg"));
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
