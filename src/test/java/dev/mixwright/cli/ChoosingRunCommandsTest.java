package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.report.Figures;
import dev.mixwright.runfolder.Json;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * explain, log, report, compare and sweep on a run of the demo starter catalog, whose segments
 * retrofit and quiet choose by multinomial logit beside the fixed segment newbuild.
 */
class ChoosingRunCommandsTest {
  static final String STARTER = "catalogs/heatpump-starter.yaml";
  @TempDir static Path tmp;
  static Path run;
  static JsonNode result;

  @BeforeAll
  static void solve() throws Exception {
    run = tmp.resolve("starter");
    CliRun s = CliRun.of("solve", STARTER, "--out", run.toString());
    assertEquals(0, s.code(), s::toString);
    result = Json.pretty().readTree(run.resolve("result.json").toFile());
  }

  private static JsonNode firstOffer(String segment) {
    for (JsonNode o : result.path("offers")) {
      if (o.path("segment").asText().equals(segment)) {
        return o;
      }
    }
    throw new AssertionError("no offer in " + segment);
  }

  private static String variant(JsonNode options) {
    StringBuilder sb = new StringBuilder();
    options.fields().forEachRemaining(e -> sb.append(sb.length() == 0 ? "" : ",").append(e.getKey()).append('=')
        .append(e.getValue().asText()));
    return sb.toString();
  }

  @Test
  void explainOfAnOfferedVariantGivesItsShareAndWhoseBuyersItTakes() throws Exception {
    JsonNode offer = firstOffer("retrofit");
    CliRun e = CliRun.of("explain", run.toString(), "--segment", "retrofit", "--variant", variant(offer.path("options")),
        "--json");
    assertEquals(0, e.code(), e::toString);
    JsonNode n = Json.pretty().readTree(e.out());
    JsonNode c = n.path("choice");
    assertTrue(c.path("offered").asBoolean());
    assertEquals(offer.path("attraction").asDouble(), c.path("attraction").asDouble(), 1e-9);
    assertEquals(offer.path("price").asDouble(), c.path("price").asDouble(), 1e-9);
    assertEquals(offer.path("share").asDouble(), c.path("planShare").asDouble(), 1e-12);
    // what it sells is what the others and staying out lose (the logit's proportional substitution)
    double taken = c.path("fromStayingOut").asDouble();
    for (JsonNode t : c.path("takes")) {
      taken += t.path("taken").asDouble();
    }
    assertEquals(c.path("logitSales").asDouble(), taken, 1e-6 * c.path("logitSales").asDouble());
    CliRun text = CliRun.of("explain", run.toString(), "--segment", "retrofit", "--variant",
        variant(offer.path("options")));
    assertTrue(text.out().contains("chooses by multinomial logit"), text::toString);
    assertTrue(text.out().contains("from staying out"), text::toString);
    assertTrue(text.out().contains("buyers of retrofit"), text::toString);
  }

  @Test
  void aForbiddenVariantIsNeverSaidToEnterAtAHigherPrice() {
    // c16 is outside retrofit's accepts
    CliRun e = CliRun.of("explain", run.toString(), "--segment", "retrofit", "--variant",
        "capacity=c16,compressor=evi,refrigerant=r290,casing=powder,controller=gridready,tank=t300");
    assertEquals(0, e.code(), e::toString);
    assertTrue(e.out().contains("does not accept capacity=c16"), e::toString);
    assertFalse(e.out().contains("would enter"), e::toString);
    assertTrue(e.out().contains("no price puts it there"), e::toString);
  }

  @Test
  void logShowsThePricePointsOfChoosingColumns() {
    CliRun l = CliRun.of("log", run.toString(), "--segment", "retrofit", "--full");
    assertEquals(0, l.code(), l::toString);
    assertTrue(l.out().contains("capacity=c"), l::toString);
    assertTrue(l.out().contains("columns in segment retrofit"), l::toString);
    boolean pricePoint = false;
    for (JsonNode o : result.path("offers")) {
      pricePoint |= variant(o.path("options")).contains("@");
    }
    assertTrue(pricePoint, "the demo plan sells a price point");
    assertTrue(CliRun.of("log", run.toString(), "--full").out().contains("@"));
  }

  @Test
  void reportHoldsTheShareTableOfEachChoosingSegment() throws Exception {
    CliRun r = CliRun.of("report", run.toString());
    assertEquals(0, r.code(), r::toString);
    String html = Files.readString(run.resolve("report.html"));
    assertEquals(2, html.split("stay out \\(buy none of these\\)", -1).length - 1, "retrofit and quiet");
    assertTrue(html.contains("Who takes buyers from whom"));
    assertTrue(html.contains("Price points chosen"));
    assertFalse(html.contains("<script"));
    // the range on sale today: each of its rows in the range table says whether it is kept or dropped
    JsonNode p = result.path("portfolio");
    String table = html.substring(html.indexOf("id=\"range\""), html.indexOf("</table>", html.indexOf("id=\"range\"")));
    assertEquals(p.path("kept").size(), table.split("on sale today, kept", -1).length - 1, "kept rows");
    assertEquals(p.path("dropped").size(), table.split("on sale today, dropped", -1).length - 1, "dropped rows");
    assertTrue(p.path("dropped").size() > 0, "the starter drops part of today's range");
  }

  @Test
  void compareListsBuyersStayingOutAndShares() throws Exception {
    Path dearer = tmp.resolve("dearer");
    Path scenario = tmp.resolve("dearer.yaml");
    Files.writeString(scenario, "options: {capacity.c14: {price: \"+400\"}}\n");
    CliRun s = CliRun.of("solve", STARTER, "--scenario", scenario.toString(), "--out", dearer.toString());
    assertEquals(0, s.code(), s::toString);
    CliRun c = CliRun.of("compare", run.toString(), dearer.toString());
    assertEquals(0, c.code(), c::toString);
    assertTrue(c.out().contains("segments that choose"), c::toString);
    assertTrue(c.out().contains("stay out"), c::toString);
    assertTrue(c.out().contains("share"), c::toString);
    JsonNode j = Json.pretty().readTree(CliRun.of("compare", run.toString(), dearer.toString(), "--json").out());
    assertEquals(2, j.path("choosing").size());
    // a share is written as every share a person reads (Figures.share), its pair from the JSON
    JsonNode moved = null;
    for (JsonNode seg : j.path("choosing")) {
      for (JsonNode o : seg.path("offers")) {
        if (moved == null && Math.abs(o.path("shareA").asDouble() - o.path("shareB").asDouble()) > 5e-4) {
          moved = o;
        }
      }
    }
    assertTrue(moved != null, j::toString);
    String pair = Figures.share(moved.path("shareA").asDouble()) + " -> "
        + String.format("%6s", Figures.share(moved.path("shareB").asDouble()));
    assertTrue(c.out().lines().anyMatch(l -> l.strip().startsWith("share") && l.contains(pair)), pair + "\n" + c);
  }

  @Test
  void aPriceSweepIsACurveWithItsBestPointMarked() throws Exception {
    Path out = tmp.resolve("sweep");
    CliRun s = CliRun.of("sweep", "--no-portfolio", STARTER, "--grid", "options.capacity.c14.price=+0,+1200,+2400", "--out",
        out.toString());
    assertEquals(0, s.code(), s::toString);
    assertTrue(s.err().contains("best price of the sweep"), s::toString);
    JsonNode rows = Json.pretty().readTree(out.resolve("sweep.json").toFile()).path("rows");
    int best = -1;
    double top = Double.NEGATIVE_INFINITY;
    for (JsonNode r : rows) {
      if (r.path("objective").asDouble() > top) {
        top = r.path("objective").asDouble();
        best = r.path("index").asInt();
      }
    }
    for (JsonNode r : rows) {
      assertEquals(r.path("index").asInt() == best, r.path("best").asBoolean(), r::toString);
    }
    assertTrue(Files.readString(out.resolve("sweep.csv")).lines().findFirst().orElseThrow().endsWith(",best,problem"));
    // the table a person reads writes shadow prices as Figures.price, the CSV as plain numbers
    for (JsonNode r : rows) {
      r.path("resources").fields().forEachRemaining(e -> {
        double p = e.getValue().path("shadowPrice").asDouble();
        if (p > 1e-9) {
          assertTrue(s.out().contains(e.getKey() + " " + Figures.price(p)), s::toString);
        }
      });
    }
  }
}
