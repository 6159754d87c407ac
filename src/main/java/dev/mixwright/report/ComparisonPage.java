package dev.mixwright.report;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.runfolder.AtomicFiles;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

/**
 * The comparison of two runs ({@link RunComparison}) as one self-contained HTML page in the style of
 * the run report: the headline figures side by side, the integer portfolios (value, one-off costs,
 * variants added and dropped by code), the catalog figures that differ, the offers that changed, and
 * the shadow prices. Every string from the runs passes through {@link HtmlReport#escape}.
 */
public final class ComparisonPage {
  private ComparisonPage() {}

  /** What the page shows besides the comparison: the two folders, the currency, the runs' matrix views. */
  public record Runs(String labelA, String labelB, String currency, MatrixView matrixA, MatrixView matrixB) {}

  public static void write(Path target, ObjectNode cmp, Runs runs) throws IOException {
    AtomicFiles.write(target, render(cmp, runs).getBytes(StandardCharsets.UTF_8), true);
  }

  public static String render(ObjectNode c, Runs runs) {
    StringBuilder h = new StringBuilder(32_768);
    String cur = runs.currency() == null || runs.currency().isEmpty() ? "" : " " + runs.currency();
    h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
        .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
        .append("<title>Run A against run B</title>\n<style>\n").append(HtmlReport.css())
        .append("</style>\n</head>\n<body>\n<main>\n<h1>Run A against run B</h1>\n<div class=\"inputs\">")
        .append("<span>A: <b>").append(esc(runs.labelA())).append("</b></span><span>B: <b>")
        .append(esc(runs.labelB())).append("</b></span></div>\n");
    JsonNode s = c.path("summary");
    h.append("<h2 id=\"headline\">Headline figures</h2>\n");
    table(h, "", "run A", "run B", "change");
    row(h, "status", s.path("status").path("a").asText(), s.path("status").path("b").asText(), "");
    moneyRow(h, "LP value" + cur, s.path("objective"));
    moneyRow(h, "LP bound" + cur, s.path("bound"));
    JsonNode p = c.path("portfolio");
    if (p.isObject()) {
      row(h, "range to build", text(p.path("status").path("a")), text(p.path("status").path("b")), "");
      moneyRow(h, "range value" + cur, p.path("value"));
      moneyRow(h, "introduction costs" + cur, p.path("introductionCosts"));
      moneyRow(h, "tooling costs" + cur, p.path("toolingCosts"));
      if (!p.path("discontinueCosts").path("a").isNull() || !p.path("discontinueCosts").path("b").isNull()) {
        moneyRow(h, "discontinue costs" + cur, p.path("discontinueCosts"));
      }
      row(h, "variants in the range", count(p.path("variants").path("a")), count(p.path("variants").path("b")), "");
    }
    h.append("</table></div>\n");
    if (p.isObject()) {
      h.append("<h2 id=\"range\">The range to build</h2>\n<p>").append(p.path("inBoth").asInt())
          .append(" variants in both; ").append(p.path("added").size()).append(" added, ")
          .append(p.path("dropped").size()).append(" dropped.</p>\n");
      table(h, "variant", "units A", "units B", "");
      for (String kind : new String[] {"added", "dropped"}) {
        for (JsonNode x : p.path(kind)) {
          row(h, kind + ": " + RunComparison.name(x, runs.matrixA(), runs.matrixB()),
              Figures.units(x.path("unitsA").asDouble()), Figures.units(x.path("unitsB").asDouble()), "");
        }
      }
      h.append("</table></div>\n");
    }
    catalog(h, c);
    JsonNode o = c.path("offers");
    h.append("<h2 id=\"offers\">Offers of the LP plan</h2>\n<p>").append(o.path("new").size()).append(" new, ")
        .append(o.path("dropped").size()).append(" dropped, ").append(o.path("changed").size()).append(" changed, ")
        .append(o.path("unchanged").asInt()).append(" unchanged.</p>\n");
    table(h, "", "segment", "units A", "units B");
    for (String kind : new String[] {"new", "dropped", "changed"}) {
      for (JsonNode x : o.path(kind)) {
        row(h, kind + ": " + RunComparison.name(x, runs.matrixA(), runs.matrixB()), x.path("segment").asText(),
            Figures.units(x.path("quantityA").asDouble()), Figures.units(x.path("quantityB").asDouble()));
      }
    }
    h.append("</table></div>\n");
    shadowPrices(h, "Shadow prices of resources", c.path("resources"), cur);
    shadowPrices(h, "Shadow prices of segments", c.path("segments"), cur);
    h.append("</main>\n</body>\n</html>\n");
    return h.toString();
  }

  private static void catalog(StringBuilder h, ObjectNode c) {
    h.append("<h2 id=\"catalog\">Catalog</h2>\n");
    JsonNode cc = c.path("catalogChanges");
    if (c.path("sameCatalog").asBoolean()) {
      h.append("<p>The same catalog.</p>\n");
      return;
    }
    if (!cc.isArray()) {
      h.append("<p>The catalogs differ (one run has no catalog.json to list the figures).</p>\n");
      return;
    }
    h.append("<p>").append(cc.size()).append(cc.size() == 1 ? " figure differs" : " figures differ").append(".</p>\n");
    table(h, "field", "run A", "run B", "");
    for (JsonNode x : cc) {
      row(h, x.path("path").asText(), value(x.path("a")), value(x.path("b")), "");
    }
    h.append("</table></div>\n");
  }

  private static void shadowPrices(StringBuilder h, String title, JsonNode rows, String cur) {
    h.append("<h2>").append(esc(title)).append("</h2>\n");
    table(h, "", "run A" + cur, "run B" + cur, "change");
    for (JsonNode r : rows) {
      JsonNode sp = r.path("shadowPrice");
      row(h, r.path("id").asText(), price(sp.path("a")), price(sp.path("b")),
          sp.has("change") ? Figures.signed(sp.path("change").asDouble()) : "");
    }
    h.append("</table></div>\n");
  }

  /** Opens a table of four columns, the last three right-aligned. */
  private static void table(StringBuilder h, String c1, String c2, String c3, String c4) {
    h.append("<div class=\"scroll\"><table>\n<tr><th>").append(esc(c1)).append("</th><th class=\"n\">").append(esc(c2))
        .append("</th><th class=\"n\">").append(esc(c3)).append("</th><th class=\"n\">").append(esc(c4))
        .append("</th></tr>\n");
  }

  private static void row(StringBuilder h, String c1, String c2, String c3, String c4) {
    h.append("<tr><td>").append(esc(c1)).append("</td><td class=\"n\">").append(esc(c2)).append("</td><td class=\"n\">")
        .append(esc(c3)).append("</td><td class=\"n\">").append(esc(c4)).append("</td></tr>\n");
  }

  private static void moneyRow(StringBuilder h, String label, JsonNode pair) {
    row(h, label, money(pair.path("a")), money(pair.path("b")),
        pair.has("change") ? Figures.signedMoney(pair.path("change").asDouble()) : "");
  }

  private static String money(JsonNode n) {
    return n.isNumber() ? Figures.money(n.asDouble()) : "—";
  }

  private static String price(JsonNode n) {
    return n.isNumber() ? Figures.price(n.asDouble()) : "—";
  }

  private static String count(JsonNode n) {
    return n.isNumber() ? String.valueOf(n.asInt()) : "—";
  }

  private static String value(JsonNode n) {
    return n.isNumber() ? Figures.qty(n.asDouble()) : n.isNull() ? "(none)" : n.asText();
  }

  private static String text(JsonNode n) {
    return n.isNull() || n.isMissingNode() ? "none" : n.asText();
  }

  private static String esc(String s) {
    return HtmlReport.escape(s);
  }
}
