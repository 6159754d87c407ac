package dev.mixwright.report;

import dev.mixwright.explain.Substitution;
import dev.mixwright.runfolder.AtomicFiles;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * One self-contained HTML page for a finished run, drawn from its result.json alone: inline CSS and
 * inline SVG, no script and nothing fetched, so that the file can be mailed or archived as it is.
 * Every string taken from the run passes through {@link #escape} before it reaches the page.
 */
public final class HtmlReport {
  /** The file name written into the run folder when no other target is given. */
  public static final String FILE = "report.html";

  private static final String INK = "#1f2a37";
  private static final String MUTED = "#64748b";
  private static final String GRID = "#e2e8f0";
  private static final String TEAL = "#0f8b8d";
  private static final String AMBER = "#d98e04";
  private static final String TRACK = "#edf1f5";

  /** Offers with a row and a column of their own in a substitution table; the rest are summed. */
  private static final int SUBSTITUTION_MAX = 8;

  private HtmlReport() {}

  /** Reads RUN_DIR/result.json, renders it and writes the page atomically to {@code target}. */
  public static void write(Path runDir, Path target) throws IOException {
    AtomicFiles.write(target, render(RunResult.read(runDir)));
  }

  /** The page for one result. Missing optional parts (bound, portfolio) are left out, not invented. */
  public static String render(RunResult r) {
    StringBuilder h = new StringBuilder(32_768);
    RunResult.CatalogRef cat = r.catalog();
    String name = cat == null || cat.name() == null ? "unnamed catalog" : cat.name();
    String currency = cat == null || cat.currency() == null ? "" : cat.currency();
    h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
        .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
        .append("<title>").append(escape(name)).append(" — mixwright run</title>\n")
        .append("<style>\n").append(css()).append("</style>\n</head>\n<body>\n<main>\n");
    header(h, r, name, currency);
    String pending = PortfolioPending.line(r);
    if (pending != null) {
      h.append("<p class=\"note\">").append(escape(pending)).append("</p>\n");
    }
    convergence(h, r.rounds());
    resources(h, r.resources(), currency);
    segments(h, r, currency);
    if (r.portfolio() != null) {
      portfolio(h, r.portfolio(), r.segments(), currency);
      regret(h, r.portfolio(), currency);
    }
    h.append("</main>\n</body>\n</html>\n");
    return h.toString();
  }

  private static String css() {
    return "body{margin:0;background:#f8fafc;color:" + INK + ";font:15px/1.45 system-ui,-apple-system,'Segoe UI',sans-serif}\n"
        + "main{max-width:980px;margin:0 auto;padding:24px 28px 48px}\n"
        + "h1{font-size:24px;margin:0 0 4px}h2{font-size:18px;margin:32px 0 10px;border-bottom:2px solid " + TEAL + ";padding-bottom:4px}\n"
        + "h3{font-size:15px;margin:18px 0 6px}\n"
        + ".note{color:" + MUTED + ";font-size:13px;margin:4px 0 14px}\n"
        + ".facts{display:flex;flex-wrap:wrap;gap:10px;margin:12px 0}\n"
        + ".fact{background:#fff;border:1px solid " + GRID + ";border-radius:6px;padding:8px 12px;min-width:120px}\n"
        + ".fact b{display:block;font-size:12px;font-weight:600;color:" + MUTED + ";text-transform:uppercase;letter-spacing:.04em}\n"
        + ".fact span{font-size:17px;font-variant-numeric:tabular-nums}\n"
        + "table{border-collapse:collapse;background:#fff;width:100%;font-size:14px;margin:4px 0 8px}\n"
        + "th,td{border-bottom:1px solid " + GRID + ";padding:5px 8px;text-align:left;vertical-align:top}\n"
        + "th{background:#f1f5f9;font-weight:600}td.n,th.n{text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap}\n"
        + "code{font:13px ui-monospace,Menlo,Consolas,monospace}\n"
        + "svg{display:block;background:#fff;border:1px solid " + GRID + ";border-radius:6px;max-width:100%;height:auto}\n"
        + "svg text{font:12px system-ui,sans-serif;fill:" + INK + "}\n"
        + ".tag{display:inline-block;background:" + AMBER + ";color:#fff;border-radius:4px;padding:0 6px;font-size:12px}\n";
  }

  private static void header(StringBuilder h, RunResult r, String name, String currency) {
    h.append("<h1>").append(escape(name)).append("</h1>\n");
    h.append("<p class=\"note\">Planning estimates only: these figures are as good as the margins, demands"
        + " and capacities written in the catalog, and no better.</p>\n");
    h.append("<div class=\"facts\">\n");
    fact(h, "status", escape(r.status() == null ? "unknown" : r.status().word()));
    fact(h, "objective", money(r.objective()) + unit(currency));
    fact(h, "bound", money(r.bound()) + unit(currency));
    fact(h, "gap", percent(r.gap()));
    fact(h, "rounds", escape(String.valueOf(r.iterations())));
    fact(h, "buildable variants", escape(r.buildableVariants() == null ? "—" : r.buildableVariants()));
    h.append("</div>\n");
  }

  private static void fact(StringBuilder h, String label, String html) {
    h.append("<div class=\"fact\"><b>").append(label).append("</b><span>").append(html).append("</span></div>\n");
  }

  private static String unit(String currency) {
    return currency.isEmpty() ? "" : " " + escape(currency);
  }

  // ---- convergence ------------------------------------------------------------------------------

  private static void convergence(StringBuilder h, List<RunResult.Round> rounds) {
    h.append("<h2>Convergence</h2>\n");
    List<double[]> obj = new ArrayList<>();
    List<double[]> bnd = new ArrayList<>();
    for (RunResult.Round n : rounds) {
      double it = n.iteration();
      obj.add(new double[] {it, n.objective()});
      // early rounds may have no valid bound yet: those points are skipped, not drawn at zero
      if (n.bound() != null) {
        bnd.add(new double[] {it, n.bound()});
      }
    }
    h.append("<p class=\"note\">Master LP objective (a plan that can be carried out) and the bound on the"
        + " best possible objective, after each round of column generation.</p>\n");
    int w = 760;
    int ht = 300;
    int left = 110;
    int right = 20;
    int top = 20;
    int bottom = 46;
    h.append(svgOpen(w, ht, "Objective and bound per round"));
    if (obj.isEmpty() && bnd.isEmpty()) {
      h.append(text(w / 2.0, ht / 2.0, "middle", "no rounds recorded")).append("</svg>\n");
      return;
    }
    double xMin = Double.POSITIVE_INFINITY;
    double xMax = Double.NEGATIVE_INFINITY;
    double yMin = Double.POSITIVE_INFINITY;
    double yMax = Double.NEGATIVE_INFINITY;
    for (List<double[]> s : List.of(obj, bnd)) {
      for (double[] p : s) {
        xMin = Math.min(xMin, p[0]);
        xMax = Math.max(xMax, p[0]);
        yMin = Math.min(yMin, p[1]);
        yMax = Math.max(yMax, p[1]);
      }
    }
    // a little room either side so that the first and last points do not sit on the frame
    double xPad = xMax == xMin ? 1 : (xMax - xMin) * 0.04;
    xMin -= xPad;
    xMax += xPad;
    double[] yt = ticks(yMin, yMax, 5);
    double y0 = yt[0];
    double y1 = yt[yt.length - 1];
    double pw = w - left - right;
    double ph = ht - top - bottom;
    double fx0 = xMin;
    double fx1 = xMax;
    java.util.function.DoubleUnaryOperator sx = x -> left + (x - fx0) / (fx1 - fx0) * pw;
    java.util.function.DoubleUnaryOperator sy = y -> top + ph - (y - y0) / (y1 - y0) * ph;
    for (double t : yt) {
      double y = sy.applyAsDouble(t);
      h.append(line(left, y, left + pw, y, GRID, 1));
      h.append(text(left - 8, y + 4, "end", compact(t)));
    }
    int[] xt = intTicks(xMin, xMax, 10);
    for (int t : xt) {
      double x = sx.applyAsDouble(t);
      h.append(line(x, top + ph, x, top + ph + 5, MUTED, 1));
      h.append(text(x, top + ph + 18, "middle", String.valueOf(t)));
    }
    h.append(line(left, top, left, top + ph, MUTED, 1)).append(line(left, top + ph, left + pw, top + ph, MUTED, 1));
    h.append(text(left + pw / 2, ht - 8, "middle", "round"));
    series(h, bnd, sx, sy, AMBER, true);
    series(h, obj, sx, sy, TEAL, false);
    double lx = left + pw - 230;
    h.append(line(lx, top + 10, lx + 24, top + 10, TEAL, 2.5)).append(text(lx + 30, top + 14, "start", "objective"));
    h.append("<line x1=\"").append(f(lx + 110)).append("\" y1=\"").append(f(top + 10)).append("\" x2=\"")
        .append(f(lx + 134)).append("\" y2=\"").append(f(top + 10)).append("\" stroke=\"").append(AMBER)
        .append("\" stroke-width=\"2.5\" stroke-dasharray=\"6 4\"/>\n");
    h.append(text(lx + 140, top + 14, "start", "bound"));
    h.append("</svg>\n");
  }

  private static void series(StringBuilder h, List<double[]> pts, java.util.function.DoubleUnaryOperator sx,
      java.util.function.DoubleUnaryOperator sy, String colour, boolean dashed) {
    if (pts.isEmpty()) {
      return;
    }
    StringBuilder d = new StringBuilder();
    for (double[] p : pts) {
      d.append(d.length() == 0 ? "" : " ").append(f(sx.applyAsDouble(p[0]))).append(',').append(f(sy.applyAsDouble(p[1])));
    }
    h.append("<polyline fill=\"none\" stroke=\"").append(colour).append("\" stroke-width=\"2.5\"")
        .append(dashed ? " stroke-dasharray=\"6 4\"" : "").append(" points=\"").append(d).append("\"/>\n");
    for (double[] p : pts) {
      h.append("<circle cx=\"").append(f(sx.applyAsDouble(p[0]))).append("\" cy=\"").append(f(sy.applyAsDouble(p[1])))
          .append("\" r=\"3.5\" fill=\"").append(colour).append("\"><title>round ").append((long) p[0]).append(": ")
          .append(money(p[1])).append("</title></circle>\n");
    }
  }

  /**
   * Axis ticks at 1, 2 or 5 times a power of ten that cover [lo, hi] in about {@code want} steps
   * (common practice for chart axes).
   */
  static double[] ticks(double lo, double hi, int want) {
    if (!(hi > lo)) {
      double pad = lo == 0 ? 1 : Math.abs(lo) * 0.05;
      lo -= pad;
      hi += pad;
    }
    double raw = (hi - lo) / want;
    double mag = Math.pow(10, Math.floor(Math.log10(raw)));
    double step = raw / mag <= 1 ? mag : raw / mag <= 2 ? 2 * mag : raw / mag <= 5 ? 5 * mag : 10 * mag;
    double start = Math.floor(lo / step) * step;
    double end = Math.ceil(hi / step) * step;
    int n = (int) Math.round((end - start) / step) + 1;
    double[] t = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = start + i * step;
    }
    return t;
  }

  private static int[] intTicks(double lo, double hi, int max) {
    int a = (int) Math.ceil(lo);
    int b = (int) Math.floor(hi);
    int step = Math.max(1, (int) Math.ceil((b - a + 1) / (double) max));
    List<Integer> t = new ArrayList<>();
    for (int i = a; i <= b; i += step) {
      t.add(i);
    }
    return t.stream().mapToInt(Integer::intValue).toArray();
  }

  // ---- resources --------------------------------------------------------------------------------

  private static void resources(StringBuilder h, List<RunResult.ResourceRow> res, String currency) {
    h.append("<h2>Resources</h2>\n<p class=\"note\">Capacity used by the plan, each bar scaled to its own capacity."
        + " The shadow price is what one more unit of capacity would add to the objective;"
        + " binding resources are used to the full and drawn in amber.</p>\n");
    int rowH = 44;
    int w = 760;
    int labelW = 150;
    int barW = 300;
    int ht = Math.max(1, res.size()) * rowH + 16;
    h.append(svgOpen(w, ht, "Resource use against capacity"));
    int i = 0;
    for (RunResult.ResourceRow r : res) {
      double y = 12 + i * rowH;
      double cap = r.capacity();
      double used = r.used();
      boolean binding = r.binding();
      double frac = cap > 0 ? Math.max(0, Math.min(1, used / cap)) : 0;
      h.append(text(labelW - 10, y + 17, "end", r.id()));
      h.append(rect(labelW, y + 4, barW, 18, TRACK));
      h.append(rect(labelW, y + 4, barW * frac, 18, binding ? AMBER : TEAL));
      h.append(text(labelW + barW + 10, y + 12, "start",
          qty(used) + " / " + qty(cap) + (cap > 0 ? String.format(Locale.ROOT, " (%.0f%%)", 100 * used / cap) : "")));
      h.append(text(labelW + barW + 10, y + 28, "start",
          "shadow price " + (r.shadowPrice() == null ? "unknown" : money(r.shadowPrice())) + (currency.isEmpty() ? "" : " " + currency)
              + " a unit" + (binding ? " · binding" : "")));
      i++;
    }
    h.append("</svg>\n");
  }

  // ---- segments ---------------------------------------------------------------------------------

  private static void segments(StringBuilder h, RunResult r, String currency) {
    List<RunResult.SegmentRow> segs = r.segments();
    h.append("<h2>The plan by segment</h2>\n<p class=\"note\">Units sold against demand in each segment;"
        + " the pale part of a bar is demand the plan leaves unserved.</p>\n");
    double maxDemand = 0;
    for (RunResult.SegmentRow s : segs) {
      maxDemand = Math.max(maxDemand, Math.max(s.demand(), s.sold()));
    }
    int rowH = 40;
    int w = 760;
    int labelW = 150;
    int barW = 420;
    int ht = Math.max(1, segs.size()) * rowH + 40;
    h.append(svgOpen(w, ht, "Units sold against demand per segment"));
    int i = 0;
    for (RunResult.SegmentRow s : segs) {
      double y = 12 + i * rowH;
      double demand = s.demand();
      double sold = s.sold();
      double scale = maxDemand > 0 ? barW / maxDemand : 0;
      double soldW = Math.max(0, sold) * scale;
      double restW = Math.max(0, demand - sold) * scale;
      h.append(text(labelW - 10, y + 17, "end", s.id()));
      h.append(rect(labelW, y + 4, soldW, 20, TEAL));
      h.append("<rect x=\"").append(f(labelW + soldW)).append("\" y=\"").append(f(y + 4)).append("\" width=\"")
          .append(f(restW)).append("\" height=\"20\" fill=\"").append(TRACK).append("\" stroke=\"").append(TEAL)
          .append("\" stroke-dasharray=\"3 2\"/>\n");
      h.append(text(labelW + soldW + restW + 10, y + 18, "start", qty(sold) + " of " + qty(demand) + " sold"));
      i++;
    }
    double ly = ht - 16;
    h.append(rect(labelW, ly - 10, 14, 12, TEAL)).append(text(labelW + 20, ly, "start", "sold"));
    h.append(rect(labelW + 80, ly - 10, 14, 12, TRACK)).append(text(labelW + 100, ly, "start", "unserved demand"));
    h.append("</svg>\n");

    Map<String, List<RunResult.Offer>> bySegment = new LinkedHashMap<>();
    for (RunResult.SegmentRow s : segs) {
      bySegment.put(s.id(), new ArrayList<>());
    }
    for (RunResult.Offer o : r.offers()) {
      bySegment.computeIfAbsent(o.segment(), k -> new ArrayList<>()).add(o);
    }
    for (RunResult.SegmentRow s : segs) {
      String id = s.id();
      h.append("<h3>Segment ").append(escape(id)).append("</h3>\n");
      if (s.chooses()) {
        h.append("<p class=\"note\">chooses by multinomial logit: ").append(qty(s.buyers())).append(" buyers, ")
            .append(qty(s.sold())).append(" buy, ").append(qty(s.stayOut() == null ? 0 : s.stayOut()))
            .append(" stay out; shadow price of a buyer ")
            .append(s.shadowPrice() == null ? "unknown" : money(s.shadowPrice())).append(unit(currency)).append("</p>\n");
      } else {
        h.append("<p class=\"note\">demand ").append(qty(s.demand())).append(", sold ")
            .append(qty(s.sold())).append(", shadow price ").append(s.shadowPrice() == null ? "unknown" : money(s.shadowPrice()))
            .append(unit(currency)).append("</p>\n");
      }
      List<RunResult.Offer> offers = bySegment.get(id);
      if (offers.isEmpty()) {
        h.append("<p>No variant is offered in this segment.</p>\n");
        continue;
      }
      if (s.chooses()) {
        choosing(h, s, offers, currency);
        continue;
      }
      h.append("<table>\n<tr><th>variant</th><th class=\"n\">quantity</th><th class=\"n\">unit margin</th></tr>\n");
      for (RunResult.Offer o : offers) {
        h.append("<tr><td><code>").append(escape(variant(o.options()))).append("</code></td><td class=\"n\">")
            .append(qty(o.quantity())).append("</td><td class=\"n\">")
            .append(money(o.unitMargin())).append("</td></tr>\n");
      }
      h.append("</table>\n");
    }
  }

  // ---- segments that choose -------------------------------------------------------------------

  /**
   * A choosing segment: a bar of its buyers split by offer and staying out, the share table (price,
   * attraction, share of the buyers), the price points the plan chose, and the substitution table:
   * the buyers each offer takes from each other one and from staying out, by the logit's
   * proportional substitution (Train, Discrete Choice Methods with Simulation, ch. 3), measured
   * against the plan's offers without it.
   */
  private static void choosing(StringBuilder h, RunResult.SegmentRow s, List<RunResult.Offer> offers, String currency) {
    double buyers = s.buyers();
    double out = s.stayOut() == null ? Math.max(0, buyers - s.sold()) : s.stayOut();
    String[] colours = {TEAL, "#3b82a0", "#6a9f3a", "#8d6cb3", "#c2572f", "#b38b2e", "#4d7c8a"};
    int w = 760;
    int barW = 720;
    h.append(svgOpen(w, 64, "Buyers of " + s.id() + " by offer and staying out"));
    double x = 20;
    for (int i = 0; i < offers.size(); i++) {
      double bw = buyers > 0 ? barW * offers.get(i).quantity() / buyers : 0;
      h.append("<rect x=\"").append(f(x)).append("\" y=\"8\" width=\"").append(f(bw)).append("\" height=\"24\" fill=\"")
          .append(colours[i % colours.length]).append("\" stroke=\"#fff\"><title>")
          .append(escape(variant(offers.get(i).options()))).append(": ").append(pct(offers.get(i).quantity() / buyers))
          .append("</title></rect>\n");
      if (bw > 34) {
        h.append("<text x=\"").append(f(x + bw / 2)).append("\" y=\"25\" text-anchor=\"middle\" style=\"fill:#fff\">")
            .append(i + 1).append("</text>\n");
      }
      x += bw;
    }
    double ow = buyers > 0 ? barW * out / buyers : 0;
    h.append(rect(x, 8, ow, 24, TRACK));
    h.append(text(20, 52, "start", "offers 1–" + offers.size() + " as numbered below; the pale part: "
        + pct(out / buyers) + " stay out"));
    h.append("</svg>\n");

    boolean known = offers.stream().allMatch(o -> o.attraction() != null);
    h.append("<table>\n<tr><th>#</th><th>variant</th><th class=\"n\">price</th><th class=\"n\">attraction</th>"
        + "<th class=\"n\">buyers</th><th class=\"n\">share</th><th class=\"n\">unit margin</th></tr>\n");
    int i = 0;
    for (RunResult.Offer o : offers) {
      i++;
      h.append("<tr><td>").append(i).append("</td><td><code>").append(escape(variant(o.options()))).append("</code></td>")
          .append("<td class=\"n\">").append(o.price() == null ? "—" : money(o.price())).append("</td>")
          .append("<td class=\"n\">").append(o.attraction() == null ? "—" : sig(o.attraction())).append("</td>")
          .append("<td class=\"n\">").append(qty(o.quantity())).append("</td>")
          .append("<td class=\"n\">").append(pct(o.share() != null ? o.share() : o.quantity() / buyers)).append("</td>")
          .append("<td class=\"n\">").append(money(o.unitMargin())).append("</td></tr>\n");
    }
    h.append("<tr><td></td><td>stay out (buy none of these)</td><td></td><td class=\"n\">1</td><td class=\"n\">")
        .append(qty(out)).append("</td><td class=\"n\">").append(pct(out / buyers)).append("</td><td></td></tr>\n");
    h.append("</table>\n");
    pricePoints(h, offers, currency);
    if (!known || offers.size() < 1) {
      return;
    }
    double total = 0;
    for (RunResult.Offer o : offers) {
      total += o.attraction();
    }
    h.append("<p class=\"note\">Who takes buyers from whom: each row is an offer (numbered as above), each cell"
        + " the buyers it takes from the offer of that column (or from staying out), that is, what the column would"
        + " gain if the row's offer were dropped. By the logit every alternative loses the same fraction of its buyers; these are the"
        + " logit's figures, and where a resource binds the plan may sell less.</p>\n");
    int k = Math.min(offers.size(), SUBSTITUTION_MAX);
    boolean cut = k < offers.size();
    h.append("<table>\n<tr><th>offer</th>");
    for (int c = 1; c <= k; c++) {
      h.append("<th class=\"n\">from ").append(c).append("</th>");
    }
    if (cut) {
      h.append("<th class=\"n\">from ").append(k + 1).append("–").append(offers.size()).append("</th>");
    }
    h.append("<th class=\"n\">from staying out</th></tr>\n");
    for (int r = 0; r < k; r++) {
      double wr = offers.get(r).attraction();
      double lost = Substitution.lostFraction(wr, total - wr);
      h.append("<tr><th>").append(r + 1).append("</th>");
      for (int c = 0; c < k; c++) {
        h.append("<td class=\"n\">").append(c == r ? "" : qty(buyers * offers.get(c).attraction() * lost)).append("</td>");
      }
      if (cut) {
        double rest = 0;
        for (int c = k; c < offers.size(); c++) {
          rest += offers.get(c).attraction();
        }
        h.append("<td class=\"n\">").append(qty(buyers * rest * lost)).append("</td>");
      }
      h.append("<td class=\"n\">").append(qty(buyers * lost)).append("</td></tr>\n");
    }
    h.append("</table>\n");
    if (cut) {
      h.append("<p class=\"note\">Rows for offers ").append(k + 1).append("–").append(offers.size())
          .append(" are left out to keep the table readable; <code>mixwright explain</code> gives any one of them.</p>\n");
    }
  }

  /** The price points the plan chose in a segment, with the units sold at each. */
  private static void pricePoints(StringBuilder h, List<RunResult.Offer> offers, String currency) {
    Map<String, Double> sold = new LinkedHashMap<>();
    for (RunResult.Offer o : offers) {
      o.options().forEach((g, c) -> {
        if (c.indexOf('@') > 0) {
          sold.merge(g + "=" + c, o.quantity(), Double::sum);
        }
      });
    }
    if (sold.isEmpty()) {
      return;
    }
    StringBuilder sb = new StringBuilder();
    sold.entrySet().stream().sorted(Map.Entry.comparingByKey()).forEach(e -> sb.append(sb.length() == 0 ? "" : "; ")
        .append("<code>").append(escape(e.getKey())).append("</code> ").append(qty(e.getValue())).append(" units"));
    h.append("<p><b>Price points chosen:</b> ").append(sb).append(" (the price after <code>@</code>"
        + unit(currency) + ")</p>\n");
  }

  // ---- portfolio --------------------------------------------------------------------------------

  private static void portfolio(StringBuilder h, RunResult.Portfolio p, List<RunResult.SegmentRow> segs,
      String currency) {
    h.append("<h2>Integer portfolio</h2>\n<p class=\"note\">Whole variants with their introduction costs and"
        + " minimum lots, chosen from the columns of the LP stage.</p>\n<div class=\"facts\">\n");
    fact(h, "status", escape(p.status() == null ? "unknown" : p.status().word()));
    fact(h, "value", money(p.value()) + unit(currency));
    fact(h, "bound", money(p.bound()) + unit(currency));
    fact(h, "gap", percent(p.gap()));
    fact(h, "introduction costs", money(p.introductionCosts()) + unit(currency));
    h.append("</div>\n");
    List<String> segIds = new ArrayList<>();
    for (RunResult.SegmentRow s : segs) {
      segIds.add(s.id());
    }
    for (RunResult.PortfolioVariant v : p.variants()) {
      v.sales().keySet().forEach(k -> {
        if (!segIds.contains(k)) {
          segIds.add(k);
        }
      });
    }
    if (p.variants().isEmpty()) {
      h.append("<p>No variant is introduced.</p>\n");
      return;
    }
    h.append("<table>\n<tr><th>variant</th>");
    for (String s : segIds) {
      h.append("<th class=\"n\">").append(escape(s)).append("</th>");
    }
    h.append("</tr>\n");
    for (RunResult.PortfolioVariant v : p.variants()) {
      h.append("<tr><td><code>").append(escape(variant(v.options()))).append("</code></td>");
      for (String s : segIds) {
        Double q = v.sales().get(s);
        h.append("<td class=\"n\">").append(q != null && q != 0 ? qty(q) : "").append("</td>");
      }
      h.append("</tr>\n");
    }
    h.append("</table>\n");
  }

  // ---- small pieces -----------------------------------------------------------------------------

  /** A variant as group=choice pairs, optional groups left at none omitted (as the log command shows it). */
  static String variant(Map<String, String> options) {
    StringBuilder sb = new StringBuilder();
    options.forEach((g, c) -> {
      if (!c.equals("none")) {
        sb.append(sb.length() == 0 ? "" : ", ").append(g).append('=').append(c);
      }
    });
    return sb.length() == 0 ? "(every optional group at none)" : sb.toString();
  }

  /** Text made safe for HTML element content and quoted attribute values. */
  public static String escape(String s) {
    StringBuilder sb = new StringBuilder(s.length() + 16);
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      switch (c) {
        case '&' -> sb.append("&amp;");
        case '<' -> sb.append("&lt;");
        case '>' -> sb.append("&gt;");
        case '"' -> sb.append("&quot;");
        case '\'' -> sb.append("&#39;");
        default -> sb.append(c);
      }
    }
    return sb.toString();
  }

  /**
   * A range chosen across a scenario set: per scenario a bar of its regret (what the one range gives
   * up against that scenario's own best range), all bars on one scale, and the hold-out figures.
   */
  private static void regret(StringBuilder h, RunResult.Portfolio p, String currency) {
    if (p.scenarios() == null || p.scenarios().isEmpty()) {
      return;
    }
    String unit = currency.isEmpty() ? "" : " " + currency;
    h.append("<h2>Regret across scenarios</h2>\n<p class=\"note\">One range for every scenario; its value is the "
        + ("worst".equals(p.aim()) ? "worst scenario's" : "weighted mean") + " (" + money(p.value()) + unit
        + "). Each bar is the scenario's regret: its own best range's value less what this range earns there.</p>\n");
    List<RunResult.ScenarioRow> rows = p.scenarios();
    double most = rows.stream().mapToDouble(x -> Math.max(0, x.regret())).max().orElse(0);
    int rowH = 40;
    int w = 760;
    int labelW = 170;
    int barW = 280;
    h.append(svgOpen(w, rows.size() * rowH + 16, "Regret of the range in each scenario"));
    int i = 0;
    for (RunResult.ScenarioRow x : rows) {
      double y = 12 + i++ * rowH;
      double frac = most > 0 ? Math.max(0, x.regret()) / most : 0;
      h.append(text(labelW - 10, y + 13, "end", x.id()));
      h.append(text(labelW - 10, y + 28, "end", "weight " + pct(x.weight())));
      h.append(rect(labelW, y + 4, barW, 18, TRACK));
      h.append(rect(labelW, y + 4, barW * frac, 18, frac >= 0.999 ? AMBER : TEAL));
      h.append(text(labelW + barW + 10, y + 12, "start", "regret " + money(x.regret()) + unit));
      h.append(text(labelW + barW + 10, y + 28, "start", "value " + money(x.value()) + " · best alone "
          + money(x.bestAlone()) + (x.bestAloneStatus().isProven() ? "" : " (heuristic)")));
    }
    h.append("</svg>\n");
    RunResult.HoldOut ho = p.holdOut();
    if (ho != null) {
      h.append("<p class=\"note\">Checked on ").append(ho.scenarios()).append(" scenarios it was not chosen on (")
          .append(escape(ho.source())).append("): mean ").append(money(ho.mean())).append(", 5 % quantile ")
          .append(money(ho.p5())).append(", 95 % quantile ").append(money(ho.p95())).append(escape(unit))
          .append(ho.lotsMissed() > 0 ? "; " + ho.lotsMissed() + " cannot meet a minimum lot" : "").append(".</p>\n");
    }
  }

  private static String svgOpen(int w, int h, String label) {
    return "<svg viewBox=\"0 0 " + w + " " + h + "\" width=\"" + w + "\" height=\"" + h
        + "\" role=\"img\" aria-label=\"" + escape(label) + "\">\n";
  }

  private static String text(double x, double y, String anchor, String s) {
    return "<text x=\"" + f(x) + "\" y=\"" + f(y) + "\" text-anchor=\"" + anchor + "\">" + escape(s) + "</text>\n";
  }

  private static String line(double x1, double y1, double x2, double y2, String colour, double width) {
    return "<line x1=\"" + f(x1) + "\" y1=\"" + f(y1) + "\" x2=\"" + f(x2) + "\" y2=\"" + f(y2) + "\" stroke=\""
        + colour + "\" stroke-width=\"" + f(width) + "\"/>\n";
  }

  private static String rect(double x, double y, double w, double h, String fill) {
    return "<rect x=\"" + f(x) + "\" y=\"" + f(y) + "\" width=\"" + f(Math.max(0, w)) + "\" height=\"" + f(h)
        + "\" fill=\"" + fill + "\"/>\n";
  }

  private static String f(double v) {
    return String.format(Locale.ROOT, "%.1f", v);
  }

  /** Money with thousands separators and cents; the same text a reader finds in the terminal summary. */
  public static String money(double v) {
    return Double.isFinite(v) ? String.format(Locale.ROOT, "%,.2f", v) : "—";
  }

  private static String money(Double n) {
    return n == null ? "—" : money(n.doubleValue());
  }

  private static String qty(double v) {
    if (Math.abs(v - Math.rint(v)) < 1e-6) {
      return String.format(Locale.ROOT, "%,.0f", v);
    }
    return String.format(Locale.ROOT, "%,.2f", v);
  }

  private static String percent(Double n) {
    if (n == null || !Double.isFinite(n)) {
      return "—";
    }
    double g = n;
    if (g == 0) {
      return "0%";
    }
    if (Math.abs(g) < 1e-4) {
      return String.format(Locale.ROOT, "%.1e", g);
    }
    return String.format(Locale.ROOT, "%.3f%%", g * 100);
  }

  private static String pct(double share) {
    return Double.isFinite(share) ? String.format(Locale.ROOT, "%.1f%%", 100 * share) : "—";
  }

  /** An attraction: four significant digits, as small ones matter. */
  private static String sig(double v) {
    return String.format(Locale.ROOT, "%.4g", v);
  }

  /** Axis labels short enough to fit: 29.9M rather than 29,900,000. */
  private static String compact(double v) {
    double a = Math.abs(v);
    if (a >= 1e9) {
      return trim(v / 1e9) + "G";
    }
    if (a >= 1e6) {
      return trim(v / 1e6) + "M";
    }
    if (a >= 1e4) {
      return trim(v / 1e3) + "k";
    }
    return trim(v);
  }

  private static String trim(double v) {
    String s = String.format(Locale.ROOT, "%.3f", v);
    s = s.replaceAll("0+$", "");
    return s.endsWith(".") ? s.substring(0, s.length() - 1) : s;
  }
}
