package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.colgen.RunStatus;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The report and the comparison of runs with a segment that chooses, on results made by hand: two
 * offers of attraction 1.5 and 0.5 to 1,000 buyers (logit sales 1000·1.5/3 = 500 and 1000·0.5/3 ≈
 * 166.67, 333.33 stay out) and a fixed segment beside them.
 */
class ChoosingViewsTest {
  private static Map<String, String> variant(String hull, String oars) {
    Map<String, String> m = new LinkedHashMap<>();
    m.put("hull", hull);
    m.put("oars", oars);
    return m;
  }

  static RunResult result(double w1, double w2) {
    double buyers = 1000;
    double d = 1 + w1 + w2;
    double q1 = buyers * w1 / d;
    double q2 = buyers * w2 / d;
    List<RunResult.Offer> offers = List.of(
        new RunResult.Offer("clubs", variant("shell@4300", "carbon"), q1, 1800, 0, false, q1 * 1800, 4950.0,
            q1 / buyers, w1),
        new RunResult.Offer("clubs", variant("skiff", "wood"), q2, 1000, 0, false, q2 * 1000, 2700.0, q2 / buyers, w2),
        new RunResult.Offer("hire", variant("skiff", "wood"), 60, 1000, 0, true, 60000));
    List<RunResult.SegmentRow> segs = List.of(
        new RunResult.SegmentRow("clubs", buyers, q1 + q2, 950.0, buyers, buyers / d),
        new RunResult.SegmentRow("hire", 120, 60, 0.0));
    return new RunResult(RunStatus.OPTIMAL, "", q1 * 1800 + q2 * 1000 + 60000, null, null, 3, 4, 6, "14", null, null, null, 10,
        new RunResult.CatalogRef("boats", "boats.yaml", "ab", "EUR", "year"), "bnb", offers,
        List.of(new RunResult.ResourceRow("layup", 5200, 100, 0.0, false)), segs, List.of(), null, null, null);
  }

  @Test
  void theReportShowsSharesStayingOutPricePointsAndWhoTakesFromWhom() throws Exception {
    RunResult r = result(1.5, 0.5);
    String html = HtmlReport.render(r);
    assertTrue(html.contains("Buyers choose among the offers (multinomial logit)"), "the segment is said to choose");
    assertTrue(html.contains("stay out (buy none of these)"));
    assertTrue(html.contains(">50.0%<"), "share of the first offer, 1.5/3");
    assertTrue(html.contains(">16.7%<"), "share of the second offer, 0.5/3");
    assertTrue(html.contains(">33.3%<"), "staying out, 1/3");
    assertTrue(html.contains("Price points chosen"));
    assertTrue(html.contains("hull <b>shell@4300</b> 500 units"), "no catalog.json: the choice id stands in for its label");
    // Offer 1 takes from offer 2 what offer 2 would gain without it (multinomial logit, Train,
    // Discrete Choice Methods with Simulation, ch. 3): 1000·0.5/1.5 − 1000·0.5/3 = 166.67, and from
    // staying out 1000/1.5 − 1000/3 = 333.33; buyers are shown in whole units, 167 and 333.
    assertTrue(html.contains(">167<"), "offer 1 takes 167 from offer 2");
    assertTrue(html.contains(">333<"), "offer 1 takes 333 from staying out");
    // Offer 2 takes from offer 1: 1000·1.5/2.5 − 500 = 100, and from staying out 1000/2.5 − 1000/3 = 66.67.
    assertTrue(html.contains(">100<"), "offer 2 takes 100 from offer 1");
    assertTrue(html.contains(">67<"), "offer 2 takes 67 from staying out");
    assertFalse(html.contains("<script"));
    // the fixed segment keeps its plain table
    assertTrue(html.contains("demand 120, sold 60"));
  }

  @Test
  void theComparisonListsBuyersStayingOutAndShares() {
    ObjectNode c = RunComparison.compare(result(1.5, 0.5), result(1.0, 1.0), null, null);
    JsonNode seg = c.path("choosing").get(0);
    assertEquals("clubs", seg.path("id").asText());
    assertEquals(1000 / 3.0, seg.path("stayOut").path("a").asDouble(), 1e-9);
    assertEquals(1000 / 3.0, seg.path("stayOut").path("b").asDouble(), 1e-9);
    assertEquals(2000 / 3.0, seg.path("sold").path("b").asDouble(), 1e-9);
    JsonNode first = seg.path("offers").get(0);
    assertEquals("hull=shell@4300,oars=carbon", RunComparison.variant(first.path("options")));
    assertEquals(0.5, first.path("shareA").asDouble(), 1e-12);
    assertEquals(1 / 3.0, first.path("shareB").asDouble(), 1e-12);
    assertEquals(1, c.path("choosing").size(), "the fixed segment is not listed among those that choose");
  }

  @Test
  void choiceFieldsSurviveTheFile() throws Exception {
    RunResult r = result(1.5, 0.5);
    RunResult back = RunResult.parse(r.toJson(), "test");
    assertEquals(r, back);
    String json = r.toJson();
    assertTrue(json.contains("\"stayOut\""));
    assertTrue(json.contains("\"attraction\""));
    assertEquals(1, json.split("\"buyers\"", -1).length - 1, "buyers only on the choosing segment");
    assertTrue(String.format(Locale.ROOT, "%s", back.segments().get(1).chooses()).equals("false"));
  }
}
