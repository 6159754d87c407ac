package dev.mixwright.report;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.explain.Substitution;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.runfolder.RunFileDamaged;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunManifest;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * One self-contained HTML page for a finished run: inline CSS and inline SVG, no script and nothing
 * fetched, so that the file can be mailed or archived as it is. Business first: the headline figures
 * of the range to build, the range itself (matrix view, contribution, attach rates), the integer
 * portfolio against the LP plan in money, resource use and shadow prices; the solver's convergence
 * chart last. It is drawn from result.json, with labels and prices from catalog.json and the inputs
 * from run.json when the folder has them. Every string taken from the run passes through {@link
 * #escape} before it reaches the page.
 */
public final class HtmlReport {
  /** The file name written into the run folder when no other target is given. */
  public static final String FILE = "report.html";

  private static final String INK = "#20262e";
  private static final String MUTED = "#5d6874";
  private static final String GRID = "#dcdfe3";
  private static final String PLAN = "#2e5e8c";
  private static final String PALE = "#c7d5e3";
  private static final String HOT = "#b5482f";
  private static final String GOOD = "#3d7a4a";

  /** Offers with a row and a column of their own in a substitution table; the rest are summed. */
  private static final int SUBSTITUTION_MAX = 8;

  private HtmlReport() {}

  /**
   * What a page is drawn from: the result, and when the folder has them the catalog as solved (labels,
   * prices and resource use of the portfolio) and the manifest (scenario, date); either may be null.
   */
  public record Inputs(RunResult result, Catalog catalog, RunManifest manifest) {}

  /** Reads the run folder, renders it and writes the page atomically to {@code target}. */
  public static void write(Path runDir, Path target) throws IOException {
    AtomicFiles.write(target, render(read(runDir)).getBytes(java.nio.charset.StandardCharsets.UTF_8), true);
  }

  /**
   * result.json (required), catalog.json and run.json, each left out when the folder lacks it (ids
   * then stand in for labels, and the inputs are "not recorded"). One that is there but damaged is
   * refused in words ({@link RunFileDamaged}), as every command refuses it, rather than drawn
   * without it: a page must not quietly lose what the folder says.
   */
  public static Inputs read(Path runDir) throws IOException {
    RunResult result = RunResult.read(runDir);
    RunFolder folder = new RunFolder(runDir);
    Catalog catalog;
    try {
      catalog = folder.solvedCatalog().orElse(null);
    } catch (CatalogException e) {
      throw new RunFileDamaged(folder.catalogCopy() + " is damaged (" + e.getMessage()
          + ") — solve again with 'mixwright solve --out " + runDir + " --replace'");
    }
    RunManifest manifest = Files.isRegularFile(folder.manifest()) ? RunManifest.read(folder) : null;
    return new Inputs(result, catalog, manifest);
  }

  /** The page of a result alone (no labels, no run.json). */
  public static String render(RunResult r) {
    return render(new Inputs(r, null, null));
  }

  /** The page. Missing optional parts (bound, portfolio, catalog) are left out, not invented. */
  public static String render(Inputs in) {
    Page page = new Page(in);
    return page.draw();
  }

  /** The version of mixwright drawing the page: the jar's, or "development" when run from classes. */
  static String version() {
    String v = HtmlReport.class.getPackage().getImplementationVersion();
    return v == null ? "development" : v;
  }

  /** The width of the page's content at its widest (main's max-width less its padding). */
  static final int PAGE_WIDTH_PX = 1072;

  static String css() {
    return "body{margin:0;background:#f6f5f1;color:" + INK + ";font:15px/1.5 system-ui,-apple-system,'Segoe UI',sans-serif}\n"
        + "main{max-width:1120px;margin:0 auto;padding:20px 24px 56px}\n"
        + "h1{font-size:26px;margin:4px 0 2px}h2{font-size:19px;margin:36px 0 8px;padding:6px 0 4px;border-top:3px solid " + INK + "}\n"
        + "h3{font-size:15px;margin:20px 0 6px}\n"
        + ".inputs{color:" + MUTED + ";font-size:13px;margin:2px 0 12px;display:flex;flex-wrap:wrap;gap:2px 18px}\n"
        + ".inputs span{overflow-wrap:anywhere}\n"
        + ".note{color:" + MUTED + ";font-size:13.5px;margin:4px 0 12px;max-width:860px}\n"
        + "p{max-width:860px}\n"
        + ".warn{background:#fbe9e4;border-left:6px solid " + HOT + ";padding:10px 14px;margin:12px 0;font-weight:500}\n"
        + ".cards{display:grid;grid-template-columns:repeat(auto-fill,minmax(215px,1fr));gap:10px;margin:10px 0 14px}\n"
        + ".card{background:#fff;border:1px solid " + GRID + ";border-radius:4px;padding:8px 12px}\n"
        + ".card b{display:block;font-size:12px;font-weight:600;color:" + MUTED + "}\n"
        + ".card span{display:block;font-size:18px;font-variant-numeric:tabular-nums;white-space:nowrap}\n"
        + ".card small{font-size:12px;color:" + MUTED + "}\n"
        + ".card.main{border-color:" + PLAN + ";box-shadow:inset 0 -4px 0 " + PLAN + "}\n"
        + ".card i{display:block;font-style:normal;font-size:12px;color:" + MUTED + "}\n"
        + ".scroll{overflow-x:auto;margin:4px 0 10px;border:1px solid " + GRID + ";background:#fff}\n"
        + "table{border-collapse:collapse;width:100%;font-size:13.5px}\n"
        + ".scroll table{margin:0}\n"
        + "table.wide td,table.wide th{white-space:nowrap}\n"
        + "table.opts{background:#fff;border:1px solid " + GRID + "}table.opts td{line-height:1.6}\n"
        + ".o{white-space:nowrap;margin-right:10px;display:inline-block}.o .what{font-size:12px}\n"
        + "th,td{border-bottom:1px solid " + GRID + ";padding:5px 8px;text-align:left;vertical-align:top}\n"
        + "th{background:#eceae3;font-weight:600;font-size:12.5px}\n"
        + "td.n,th.n{text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap}\n"
        + "tr.sum td{font-weight:600;border-top:2px solid " + INK + "}\n"
        + ".code{font:600 13px ui-monospace,Menlo,Consolas,monospace;color:" + PLAN + ";white-space:nowrap}\n"
        + ".today{font:400 11px system-ui,sans-serif;color:#6b6458;white-space:nowrap}\n"
        + ".what{color:" + MUTED + "}\n"
        + "code{font:13px ui-monospace,Menlo,Consolas,monospace}\n"
        + ".bars{margin:6px 0 14px;max-width:980px}\n"
        + ".bar{display:grid;grid-template-columns:minmax(110px,200px) minmax(120px,1fr) minmax(190px,auto);"
        + "gap:4px 12px;align-items:center;padding:3px 0}\n"
        + ".bar .l{text-align:right;overflow-wrap:anywhere}\n"
        + ".bar .t{position:relative;height:16px;background:#e9edf1;border-radius:2px}\n"
        + ".bar .t.open{background:repeating-linear-gradient(135deg,#e9edf1 0 6px,#d5dce3 6px 8px)}\n"
        + ".bar .f{position:absolute;left:0;top:0;bottom:0;background:" + PLAN + ";border-radius:2px}\n"
        + ".bar .f.hot{background:" + HOT + "}\n"
        + ".bar .m{position:absolute;top:-3px;bottom:-3px;width:2px;background:" + INK + "}\n"
        + ".bar .v{font-variant-numeric:tabular-nums;font-size:13px}\n"
        + ".grp{font-weight:600;margin:10px 0 2px;font-size:13.5px}\n"
        + ".key{font-size:12.5px;color:" + MUTED + ";margin:2px 0 10px}\n"
        + ".key i{display:inline-block;width:12px;height:10px;margin:0 4px 0 12px;vertical-align:baseline}\n"
        + ".good{color:" + GOOD + "}.hotw{color:" + HOT + "}\n"
        + "svg{display:block;background:#fff;border:1px solid " + GRID + ";max-width:100%;height:auto}\n"
        + "svg text{font:12px system-ui,sans-serif;fill:" + INK + "}\n"
        + "@media (max-width:640px){main{padding:12px 12px 40px}h1{font-size:21px}"
        + ".bar{grid-template-columns:1fr auto;grid-template-areas:'l v' 't t'}.bar .l{grid-area:l;text-align:left;font-weight:600}"
        + ".bar .t{grid-area:t}.bar .v{grid-area:v;text-align:right}.cards{grid-template-columns:1fr 1fr}"
        + ".card span{font-size:15px}.o{white-space:normal}}\n";
  }

  /** One page being drawn: the inputs and what every section shares (codes, matrix, plans, currency). */
  private static final class Page {
    private final StringBuilder h = new StringBuilder(65_536);
    private final RunResult r;
    private final Catalog catalog;
    private final RunManifest manifest;
    private final VariantSpace space;
    private final VariantCodes codes;
    private final MatrixView matrix;
    private final String cur;
    private final PlanFigures lp;
    private final PlanFigures range;

    Page(Inputs in) {
      r = in.result();
      catalog = in.catalog();
      manifest = in.manifest();
      space = catalog == null ? null : new VariantSpace(catalog);
      codes = VariantCodes.of(r);
      matrix = MatrixView.of(r, catalog);
      RunResult.CatalogRef ref = r.catalog();
      cur = ref == null || ref.currency() == null ? "" : " " + ref.currency();
      lp = PlanFigures.lp(r);
      range = r.portfolio() == null ? null : PlanFigures.portfolio(r, space);
    }

    String draw() {
      RunResult.CatalogRef ref = r.catalog();
      String name = ref == null || ref.name() == null ? "unnamed catalog" : ref.name();
      h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
          .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
          .append("<title>").append(escape(name)).append(" — range plan</title>\n")
          .append("<style>\n").append(css()).append("</style>\n</head>\n<body>\n<main>\n");
      h.append("<h1>").append(escape(name)).append("</h1>\n");
      inputs(ref);
      warnings();
      headline();
      plan();
      if (r.portfolio() != null) {
        portfolioAgainstLp(r.portfolio());
        regret(r.portfolio());
      }
      resources();
      shadowPrices();
      segmentsInDetail();
      convergence(h, r.rounds(), cur);
      h.append("</main>\n</body>\n</html>\n");
      return h.toString();
    }

    // ---- top ------------------------------------------------------------------------------------

    private void inputs(RunResult.CatalogRef ref) {
      h.append("<div class=\"inputs\">");
      if (ref != null) {
        item("catalog", ref.file() == null ? "—" : ref.file());
        item("SHA-256", ref.sha256() == null ? "—" : ref.sha256());
      }
      item("scenario", manifest == null ? "not recorded" : manifest.scenario() == null
          ? "none (the catalog as written)" : manifest.scenario().path());
      if (manifest != null) {
        item("run started", manifest.createdAt().replace('T', ' ').replaceAll("\\.\\d+Z$", " UTC"));
        if (manifest.sessions().size() > 1) {
          item("sessions", String.valueOf(manifest.sessions().size()));
        }
      }
      item("page drawn by", "mixwright " + version());
      if (ref != null && ref.period() != null) {
        item("figures per", ref.period());
      }
      h.append("</div>\n<p class=\"note\">Planning estimates: these figures are as good as the prices, costs,"
          + " demands and capacities written in the catalog, and no better.</p>\n");
    }

    private void item(String label, String value) {
      h.append("<span>").append(label).append(": <b>").append(escape(value)).append("</b></span>");
    }

    private void warnings() {
      if (r.status() != null && r.status().isStopped()) {
        warn("This run stopped before it finished" + (r.stopReason().isEmpty() ? "" : " (" + r.stopReason() + ")")
            + ". The plan below is the best found so far; the best possible plan may be worth up to "
            + Figures.money(r.bound() == null ? Double.NaN : r.bound() - r.objective()) + cur
            + " more. Continue it with 'mixwright resume' on its folder before acting on it.");
      } else if (r.status() != null && r.status().isInfeasible()) {
        warn("No plan meets the catalog's demands and capacities" + (r.stopReason().isEmpty() ? ""
            : " (" + r.stopReason() + ")") + ". The figures below are not a plan; 'mixwright check' on the catalog"
            + " names what cannot be met.");
      }
      String pending = PortfolioPending.line(r);
      if (pending != null) {
        warn(pending);
      }
    }

    private void warn(String text) {
      h.append("<p class=\"warn\">").append(escape(text)).append("</p>\n");
    }

    // ---- headline -------------------------------------------------------------------------------

    private void headline() {
      PlanFigures p = range != null ? range : lp;
      h.append("<h2 id=\"headline\">Headline figures</h2>\n<p class=\"note\">").append(range != null
          ? "The range to build: the integer portfolio, whole variants with their introduction costs."
              + (r.portfolio().status() != null && r.portfolio().status().isProven() ? ""
                  : " It is the best range found, not proven the best; see “Range to build against the ideal plan”.")
          : "The LP plan: the best mix of variants over the whole variant space (the catalog has no portfolio"
              + " section, so no introduction costs are counted).").append("</p>\n<div class=\"cards\">\n");
      card("revenue", Figures.money(p.revenue()) + cur, null, false);
      card("cost of the units sold", Figures.money(p.cost()) + cur, null, false);
      card("margin", Figures.money(p.margin()) + cur, "before one-off costs", false);
      if (range != null) {
        card("introduction costs", Figures.money(p.introduction()) + cur, r.portfolio().variants().size()
            + " variants", false);
        card("tooling costs", Figures.money(p.tooling()) + cur, null, false);
        if (r.portfolio().discontinueCosts() != null) {
          card("discontinue costs", Figures.money(p.discontinue()) + cur, null, false);
        }
        card("value after one-off costs", Figures.money(r.portfolio().value()) + cur, null, true);
      } else {
        card("value", Figures.money(r.objective()) + cur, null, true);
      }
      card("units sold", Figures.units(p.units()), null, false);
      h.append("</div>\n");
      unitsBySegment(p);
    }

    /** A headline figure; {@code money}: the currency follows it in small type. */
    private void card(String label, String value, String under, boolean main) {
      boolean money = !cur.isEmpty() && value.endsWith(cur);
      String figure = money ? value.substring(0, value.length() - cur.length()) : value;
      h.append("<div class=\"card").append(main ? " main" : "").append("\"><b>").append(escape(label))
          .append("</b><span>").append(escape(figure)).append(money ? " <small>" + escape(cur.trim()) + "</small>" : "")
          .append("</span>");
      if (under != null) {
        h.append("<i>").append(escape(under)).append("</i>");
      }
      h.append("</div>\n");
    }

    private void unitsBySegment(PlanFigures p) {
      h.append("<h3>Units by segment</h3>\n<div class=\"bars\">\n");
      double[] sold = p.soldBySegment();
      for (int i = 0; i < r.segments().size(); i++) {
        RunResult.SegmentRow s = r.segments().get(i);
        double demand = s.demand();
        double open = Math.max(0, demand - sold[i]);
        String rest = open < 0.5 ? "all served" : Figures.units(open) + (s.chooses() ? " stay out" : " unserved");
        bar(s.id(), demand > 0 ? sold[i] / demand : 0, false, true, -1,
            Figures.units(sold[i]) + " of " + Figures.units(demand) + " · " + rest);
      }
      h.append("</div>\n<p class=\"key\"><i style=\"background:" + PLAN + "\"></i>sold"
          + "<i style=\"background:" + PALE + "\"></i>demand not served (in a segment whose buyers choose: buyers"
          + " who buy none of the range)</p>\n");
    }

    // ---- the plan -------------------------------------------------------------------------------

    /** Today's variants by key: "on sale today, kept" or "…, dropped", so that their rows say why they are there. */
    private Map<String, String> todaysRangeWords() {
      Map<String, String> words = new java.util.HashMap<>();
      RunResult.Portfolio p = r.portfolio();
      if (p != null && p.kept() != null) {
        p.kept().forEach(v -> words.put(VariantCodes.key(v.options()), "on sale today, kept"));
        p.dropped().forEach(v -> words.put(VariantCodes.key(v.options()), "on sale today, dropped"));
      }
      return words;
    }

    private void plan() {
      h.append("<h2 id=\"range\">The range</h2>\n");
      h.append("<p class=\"note\">Each variant has a short code (V01, V02, … by units in the ideal LP plan) used"
          + " everywhere in this page and in <code>mixwright export</code>. Units are per segment in the LP plan;"
          + (range != null ? " the portfolio columns are the range to build." : "") + "</p>\n");
      if (!matrix.shared().isEmpty()) {
        h.append("<p><b>Every variant has:</b> ");
        for (int i = 0; i < matrix.shared().size(); i++) {
          MatrixView.Shared sh = matrix.shared().get(i);
          h.append(i == 0 ? "" : "; ").append(escape(sh.groupHead())).append(" <b>").append(escape(sh.choiceText()))
              .append("</b>");
        }
        h.append("</p>\n");
      }
      Map<String, double[]> lpBy = lp.byVariant();
      Map<String, double[]> rangeBy = range == null ? Map.of() : range.byVariant();
      // the figures first, next to the code, so that a wide catalog's choices scroll and the figures do not
      h.append("<div class=\"scroll\"><table class=\"wide\">\n<tr><th>variant</th>");
      if (range != null) {
        h.append("<th class=\"n\">portfolio units</th><th class=\"n\">portfolio margin").append(cur).append("</th>");
      }
      h.append("<th class=\"n\">LP units</th><th class=\"n\">LP margin").append(cur).append("</th>");
      matrix.segments().forEach(s -> h.append("<th class=\"n\">LP ").append(escape(s)).append("</th>"));
      boolean fold = foldGroups();
      if (!fold) {
        matrix.groups().forEach(g -> h.append("<th>").append(escape(g.head())).append("</th>"));
      }
      h.append("</tr>\n");
      Map<String, String> today = todaysRangeWords();
      for (MatrixView.Row row : matrix.rows()) {
        String was = today.get(VariantCodes.key(row.options()));
        h.append("<tr><td class=\"code\">").append(row.code())
            .append(was == null ? "" : "<br><span class=\"today\">" + was + "</span>").append("</td>");
        if (range != null) {
          double[] p = rangeBy.get(VariantCodes.key(row.options()));
          num(p == null ? "—" : Figures.units(p[0]));
          num(p == null ? "—" : Figures.money(p[1]));
        }
        double[] l = lpBy.get(VariantCodes.key(row.options()));
        num(row.total() == 0 ? "—" : Figures.units(row.total()));
        num(l == null ? "—" : Figures.money(l[1]));
        for (double u : row.units()) {
          num(u == 0 ? "" : Figures.units(u));
        }
        if (!fold) {
          row.cells().forEach(c -> h.append("<td>").append(escape(c)).append("</td>"));
        }
        h.append("</tr>\n");
      }
      h.append("</table></div>\n");
      if (fold) {
        // too many groups for one row of columns: each variant's choices as one paragraph that wraps
        h.append("<h3>Options of each variant</h3>\n<p class=\"note\">The groups in which the variants differ,"
            + " one line per variant (the choices all share are above).</p>\n<table class=\"opts\">\n");
        for (MatrixView.Row row : matrix.rows()) {
          h.append("<tr><td class=\"code\">").append(row.code()).append("</td><td>");
          for (int g = 0; g < matrix.groups().size(); g++) {
            String c = row.cells().get(g);
            if (c.isEmpty()) {
              continue;
            }
            h.append(g == 0 ? "" : " ").append("<span class=\"o\"><span class=\"what\">")
                .append(escape(matrix.groups().get(g).head())).append("</span> ").append(escape(c)).append("</span>");
          }
          h.append("</td></tr>\n");
        }
        h.append("</table>\n");
      }
      attachRates(range != null ? range : lp);
    }

    /**
     * Whether the group columns would make the range's table wider than the page (1,120 px less
     * its padding): then they fold into a table of their own, one wrapping line per variant, rather
     * than a table that scrolls sideways past what a planner can keep in view. The width is
     * estimated from the longest text of each column at about 7.5 px a character, plus the cell's
     * padding, against the figure columns' share.
     */
    private boolean foldGroups() {
      double px = 0;
      // the code, units and money columns: their headings or their widest figures
      px += 4 * 7.5 + 16 + 2 * (14 * 7.5 + 16) + (range != null ? 2 * (20 * 7.5 + 16) : 0);
      for (String seg : matrix.segments()) {
        px += Math.max(seg.length() + 3, 7) * 7.5 + 16;
      }
      for (int g = 0; g < matrix.groups().size(); g++) {
        int chars = matrix.groups().get(g).head().length();
        for (MatrixView.Row row : matrix.rows()) {
          chars = Math.max(chars, row.cells().get(g).length());
        }
        px += chars * 7.5 + 16;
      }
      return px > PAGE_WIDTH_PX;
    }

    private void num(String text) {
      h.append("<td class=\"n\">").append(escape(text)).append("</td>");
    }

    private void attachRates(PlanFigures p) {
      h.append("<h3>Attach rate of each option</h3>\n<p class=\"note\">The share of all units sold")
          .append(range != null ? " in the range to build" : " in the LP plan")
          .append(" that carry the option (a price point counts as its option).</p>\n<div class=\"bars\">\n");
      String lastGroup = null;
      List<PlanFigures.Attach> rates = p.attachRates();
      for (PlanFigures.Attach a : rates) {
        if (rates.stream().filter(b -> b.group().equals(a.group())).count() == 1) {
          continue; // every unit carries it: said once, above the matrix, when the matrix shows more than one variant
        }
        if (!a.group().equals(lastGroup)) {
          h.append("<p class=\"grp\">").append(escape(MatrixView.groupHead(catalog, a.group()))).append("</p>\n");
          lastGroup = a.group();
        }
        bar(MatrixView.choiceText(catalog, a.group(), a.choice()), a.share(), false, false, -1,
            Figures.share(a.share()) + " · " + Figures.units(a.units()) + " units");
      }
      h.append("</div>\n");
    }

    // ---- portfolio against the LP plan ----------------------------------------------------------

    private void portfolioAgainstLp(RunResult.Portfolio p) {
      h.append("<h2 id=\"against\">Range to build against the ideal plan</h2>\n");
      h.append("<p>The LP plan is the ideal: it may sell a little of many variants and pays nothing to bring a"
          + " variant in. The range to build takes whole variants, each paying its introduction cost of ")
          .append(escape(Figures.money(p.terms() == null ? Double.NaN : p.terms().introductionCost()) + cur));
      if (p.terms() != null && p.terms().minLot() > 0) {
        h.append(", each selling at least ").append(Figures.units(p.terms().minLot())).append(" units");
      }
      if (p.terms() != null && p.terms().maxVariants() != null) {
        h.append(", at most ").append(p.terms().maxVariants()).append(" variants");
      }
      h.append(". What that costs against the ideal:</p>\n");
      h.append("<div class=\"scroll\"><table>\n<tr><th></th><th class=\"n\">LP plan (ideal)</th>"
          + "<th class=\"n\">range to build</th><th class=\"n\">difference</th></tr>\n");
      compareRow("variants", lp.byVariant().size(), range.byVariant().size(), false);
      compareRow("units sold", lp.units(), range.units(), false);
      compareRow("revenue" + cur, lp.revenue(), range.revenue(), true);
      compareRow("margin" + cur, lp.margin(), range.margin(), true);
      compareRow("introduction costs" + cur, 0, range.introduction(), true);
      compareRow("tooling costs" + cur, 0, range.tooling(), true);
      if (p.discontinueCosts() != null) {
        compareRow("discontinue costs" + cur, 0, range.discontinue(), true);
      }
      h.append("<tr class=\"sum\"><td>value").append(escape(cur)).append("</td>");
      num(Figures.money(r.objective()));
      num(Figures.money(p.value()));
      num(Figures.signedMoney(p.value() - r.objective()));
      h.append("</tr>\n</table></div>\n");
      double given = r.objective() - p.value();
      h.append("<p>The range to build gives up <b>").append(escape(Figures.money(given) + cur)).append("</b> (")
          .append(escape(Figures.share(r.objective() != 0 ? given / Math.abs(r.objective()) : 0)))
          .append(") of the ideal: ").append(escape(Figures.money(lp.margin() - range.margin()) + cur))
          .append(" of margin from fewer variants and whole lots, and ")
          .append(escape(Figures.money(range.fixedCosts()) + cur)).append(" of one-off costs.</p>\n");
      proof(p);
      rangeChange(p);
    }

    private void compareRow(String label, double a, double b, boolean money) {
      h.append("<tr><td>").append(escape(label)).append("</td>");
      num(money ? Figures.money(a) : Figures.units(a));
      num(money ? Figures.money(b) : Figures.units(b));
      num(money ? Figures.signedMoney(b - a) : (b - a >= 0 ? "+" : "") + Figures.units(b - a));
      h.append("</tr>\n");
    }

    /** Proven or not, in words and in money, and what the planner can do about it. */
    private void proof(RunResult.Portfolio p) {
      double open = p.bound() == null ? Double.NaN : p.bound() - p.value();
      if (p.status() != null && p.status().isProven()) {
        h.append("<p class=\"good\"><b>Proven the best range</b> under these terms: no other choice of"
            + " variants is worth more.</p>\n");
        return;
      }
      h.append("<p class=\"hotw\"><b>Not proven the best.</b> The search for the best range stopped")
          .append(p.reason().isEmpty() ? "" : " (" + escape(StageWords.plain(p.reason())) + ")")
          .append(" before it could rule out every other range. A better range would be worth at most <b>")
          .append(escape(Figures.money(open) + cur)).append("</b> more (")
          .append(escape(Figures.percent(p.gap()))).append(" of this one). If that sum matters, give the search more"
              + " time (<code>--portfolio-time-limit</code>) and solve again; if not, this range is safe to act on.</p>\n");
    }

    /** What to keep, drop and add against the range on sale today, by code. */
    private void rangeChange(RunResult.Portfolio p) {
      if (p.kept() == null) {
        return;
      }
      h.append("<h3>Against the range on sale today</h3>\n<p>");
      if (p.currentRangeValue() == null) {
        h.append("Today's range, kept unchanged, does not meet the catalog's terms.");
      } else {
        double d = p.value() - p.currentRangeValue();
        h.append("Keeping today's range unchanged is worth ").append(escape(Figures.money(p.currentRangeValue()) + cur))
            .append("; the range to build is worth <b>").append(escape(Figures.signedMoney(d) + cur))
            .append("</b> against it, after ").append(escape(Figures.money(range.discontinue()) + cur))
            .append(" of discontinue costs.");
      }
      h.append("</p>\n<div class=\"scroll\"><table>\n<tr><th>decision</th><th>variant</th><th class=\"n\">units</th></tr>\n");
      changeRows("keep", p.kept());
      changeRows("drop", p.dropped());
      changeRows("add", p.added());
      h.append("</table></div>\n");
    }

    private void changeRows(String word, List<RunResult.RangeVariant> list) {
      for (RunResult.RangeVariant v : list) {
        double units = 0;
        if (v.sales() != null) {
          for (double q : v.sales().values()) {
            units += q;
          }
        }
        h.append("<tr><td>").append(word).append("</td><td>").append(variantName(v.options())).append("</td>");
        num(v.sales() == null ? "" : Figures.units(units));
        h.append("</tr>\n");
      }
    }

    // ---- resources and shadow prices ------------------------------------------------------------

    private void resources() {
      double[] rangeUse = range == null ? null : range.resourceUse(space);
      h.append("<h2 id=\"resources\">Resources</h2>\n<p class=\"note\">Capacity used ")
          .append(rangeUse != null ? "by the range to build (bar) and by the ideal LP plan (black mark)"
              : range != null ? "by the ideal LP plan (the run folder has no catalog.json to work out the range's use)"
                  : "by the plan")
          .append("; a resource used to the full is drawn in red.</p>\n<div class=\"bars\">\n");
      for (int i = 0; i < r.resources().size(); i++) {
        RunResult.ResourceRow row = r.resources().get(i);
        double cap = row.capacity();
        double used = rangeUse != null ? rangeUse[catalog.resourceIndex(row.id())] : row.used();
        boolean full = used >= cap * (1 - 1e-7) - 1e-9;
        bar(resourceName(row.id()), cap > 0 ? used / cap : 0, full, false, rangeUse != null && cap > 0 ? row.used() / cap : -1,
            Figures.units(used) + " of " + Figures.units(cap) + unitOf(row.id()) + " (" + Figures.share(cap > 0 ? used / cap : 0) + ")");
      }
      h.append("</div>\n");
    }

    private void shadowPrices() {
      h.append("<h2 id=\"prices\">What more capacity is worth</h2>\n<p class=\"note\">The shadow price of a resource: what one more"
          + " unit of its capacity would add to the value of the ideal LP plan, as long as the plan stays alike."
          + " Zero: the resource does not limit the plan. Worth comparing with what the unit would cost.</p>\n");
      double max = 0;
      for (RunResult.ResourceRow row : r.resources()) {
        max = Math.max(max, row.shadowPrice() == null ? 0 : Math.abs(row.shadowPrice()));
      }
      h.append("<div class=\"bars\">\n");
      for (RunResult.ResourceRow row : r.resources()) {
        Double sp = row.shadowPrice();
        bar(resourceName(row.id()), sp == null || max == 0 ? 0 : Math.abs(sp) / max, false, false, -1,
            sp == null ? "unknown" : Math.abs(sp) < 1e-9 ? "0 · does not limit the plan"
                : Figures.price(sp) + cur + " per " + perUnit(row.id()));
      }
      h.append("</div>\n<h3>Segments</h3>\n<p class=\"note\">The shadow price of a segment: what one more unit of its"
          + " demand (for a segment whose buyers choose: one more buyer) would add to the value.</p>\n");
      h.append("<div class=\"scroll\"><table>\n<tr><th>segment</th><th class=\"n\">shadow price").append(cur)
          .append("</th><th>per</th></tr>\n");
      for (RunResult.SegmentRow s : r.segments()) {
        h.append("<tr><td>").append(escape(segmentName(s.id()))).append("</td>");
        num(s.shadowPrice() == null ? "unknown" : Figures.price(s.shadowPrice()));
        h.append("<td>").append(s.chooses() ? "buyer" : "unit of demand").append("</td></tr>\n");
      }
      h.append("</table></div>\n");
    }

    // ---- segments in detail ---------------------------------------------------------------------

    private void segmentsInDetail() {
      Map<String, List<RunResult.Offer>> bySegment = new LinkedHashMap<>();
      for (RunResult.Offer o : r.offers()) {
        bySegment.computeIfAbsent(o.segment(), k -> new ArrayList<>()).add(o);
      }
      h.append("<h2 id=\"segments\">Segments in detail (LP plan)</h2>\n");
      for (RunResult.SegmentRow s : r.segments()) {
        h.append("<h3>Segment ").append(escape(segmentName(s.id()))).append("</h3>\n");
        List<RunResult.Offer> offers = bySegment.getOrDefault(s.id(), List.of());
        if (s.chooses()) {
          h.append("<p class=\"note\">Buyers choose among the offers (multinomial logit): ")
              .append(Figures.units(s.buyers())).append(" buyers, ").append(Figures.units(s.sold())).append(" buy, ")
              .append(Figures.units(s.stayOut() == null ? 0 : s.stayOut())).append(" stay out.</p>\n");
        } else {
          h.append("<p class=\"note\">demand ").append(Figures.units(s.demand())).append(", sold ")
              .append(Figures.units(s.sold())).append("</p>\n");
        }
        if (offers.isEmpty()) {
          h.append("<p>No variant is offered in this segment.</p>\n");
        } else if (s.chooses()) {
          choosing(s, offers);
        } else {
          h.append("<div class=\"scroll\"><table>\n<tr><th>variant</th><th class=\"n\">units</th>"
              + "<th class=\"n\">unit margin").append(cur).append("</th><th class=\"n\">margin").append(cur)
              .append("</th></tr>\n");
          for (RunResult.Offer o : offers) {
            h.append("<tr><td>").append(variantName(o.options())).append("</td>");
            num(Figures.units(o.quantity()));
            num(Figures.money(o.unitMargin()));
            num(Figures.money(o.contribution()));
            h.append("</tr>\n");
          }
          h.append("</table></div>\n");
        }
      }
    }

    /**
     * A choosing segment: the share table (price, attraction, share of the buyers), the price points
     * the plan chose, and the substitution table: the buyers each offer takes from each other one and
     * from staying out, by the logit's proportional substitution (Train, Discrete Choice Methods with
     * Simulation, ch. 3), measured against the plan's offers without it.
     */
    private void choosing(RunResult.SegmentRow s, List<RunResult.Offer> offers) {
      double buyers = s.buyers();
      double out = s.stayOut() == null ? Math.max(0, buyers - s.sold()) : s.stayOut();
      h.append("<div class=\"scroll\"><table>\n<tr><th>#</th><th>variant</th><th class=\"n\">price").append(cur)
          .append("</th><th class=\"n\">attraction</th><th class=\"n\">buyers</th><th class=\"n\">share</th>"
              + "<th class=\"n\">unit margin").append(cur).append("</th></tr>\n");
      int i = 0;
      for (RunResult.Offer o : offers) {
        i++;
        h.append("<tr><td>").append(i).append("</td><td>").append(variantName(o.options())).append("</td>");
        num(o.price() == null ? "—" : Figures.money(o.price()));
        num(o.attraction() == null ? "—" : Figures.attraction(o.attraction()));
        num(Figures.units(o.quantity()));
        num(Figures.share(o.share() != null ? o.share() : o.quantity() / buyers));
        num(Figures.money(o.unitMargin()));
        h.append("</tr>\n");
      }
      h.append("<tr><td></td><td>stay out (buy none of these)</td><td></td>");
      num("1");
      num(Figures.units(out));
      num(Figures.share(out / buyers));
      h.append("<td></td></tr>\n</table></div>\n");
      pricePoints(offers);
      if (!offers.stream().allMatch(o -> o.attraction() != null)) {
        return;
      }
      substitution(buyers, offers);
    }

    private void substitution(double buyers, List<RunResult.Offer> offers) {
      double total = 0;
      for (RunResult.Offer o : offers) {
        total += o.attraction();
      }
      h.append("<p class=\"note\">Who takes buyers from whom: each row is an offer (numbered as above), each cell"
          + " the buyers it takes from the offer of that column (or from staying out), that is, what the column would"
          + " gain if the row's offer were dropped. By the logit every alternative loses the same fraction of its"
          + " buyers; these are the logit's figures, and where a resource is used to the full the plan may sell"
          + " less.</p>\n");
      int k = Math.min(offers.size(), SUBSTITUTION_MAX);
      boolean cut = k < offers.size();
      h.append("<div class=\"scroll\"><table>\n<tr><th>offer</th>");
      for (int c = 1; c <= k; c++) {
        h.append("<th class=\"n\">from ").append(c).append("</th>");
      }
      if (cut) {
        h.append("<th class=\"n\">from ").append(k + 1).append("–").append(offers.size()).append("</th>");
      }
      h.append("<th class=\"n\">from staying out</th></tr>\n");
      for (int row = 0; row < k; row++) {
        double wr = offers.get(row).attraction();
        double lost = Substitution.lostFraction(wr, total - wr);
        h.append("<tr><th>").append(row + 1).append("</th>");
        for (int c = 0; c < k; c++) {
          num(c == row ? "" : Figures.units(buyers * offers.get(c).attraction() * lost));
        }
        if (cut) {
          double rest = 0;
          for (int c = k; c < offers.size(); c++) {
            rest += offers.get(c).attraction();
          }
          num(Figures.units(buyers * rest * lost));
        }
        num(Figures.units(buyers * lost));
        h.append("</tr>\n");
      }
      h.append("</table></div>\n");
      if (cut) {
        h.append("<p class=\"note\">Rows for offers ").append(k + 1).append("–").append(offers.size())
            .append(" are left out to keep the table readable; <code>mixwright explain</code> gives any one of them.</p>\n");
      }
    }

    /** The price points the plan chose in a segment, with the units sold at each. */
    private void pricePoints(List<RunResult.Offer> offers) {
      Map<String, double[]> sold = new LinkedHashMap<>();
      for (RunResult.Offer o : offers) {
        o.options().forEach((g, c) -> {
          if (c.indexOf('@') > 0) {
            sold.computeIfAbsent(g + "\u0000" + c, k -> new double[1])[0] += o.quantity();
          }
        });
      }
      if (sold.isEmpty()) {
        return;
      }
      StringBuilder sb = new StringBuilder();
      sold.entrySet().stream().sorted(Map.Entry.comparingByKey()).forEach(e -> {
        String[] gc = e.getKey().split("\u0000");
        sb.append(sb.length() == 0 ? "" : "; ").append(escape(MatrixView.groupHead(catalog, gc[0]))).append(" <b>")
            .append(escape(MatrixView.choiceText(catalog, gc[0], gc[1]))).append("</b> ")
            .append(Figures.units(e.getValue()[0])).append(" units");
      });
      h.append("<p><b>Price points chosen:</b> ").append(sb).append(" (the price after @").append(escape(cur))
          .append(")</p>\n");
    }

    // ---- pieces ---------------------------------------------------------------------------------

    /**
     * A range chosen across a scenario set: per scenario a bar of its regret (what the one range gives
     * up against that scenario's own best range), all bars on one scale, and the hold-out figures.
     */
    private void regret(RunResult.Portfolio p) {
      if (p.scenarios() == null || p.scenarios().isEmpty()) {
        return;
      }
      h.append("<h2 id=\"regret\">Regret across scenarios</h2>\n<p class=\"note\">One range for every scenario; its"
          + " value is the " + ("worst".equals(p.aim()) ? "worst scenario's" : "weighted mean") + " ("
          + escape(Figures.money(p.value()) + cur) + "). Each bar is a scenario's regret: its own best range's value"
          + " less what this range earns there.</p>\n<div class=\"bars\">\n");
      double most = p.scenarios().stream().mapToDouble(x -> Math.max(0, x.regret())).max().orElse(0);
      for (RunResult.ScenarioRow x : p.scenarios()) {
        double frac = most > 0 ? Math.max(0, x.regret()) / most : 0;
        bar(x.id() + " (weight " + Figures.share(x.weight()) + ")", frac, frac >= 0.999, false, -1,
            "regret " + Figures.money(x.regret()) + cur + " · value " + Figures.money(x.value()) + " · best alone "
                + Figures.money(x.bestAlone()) + (x.bestAloneStatus().isProven() ? "" : " (not proven)"));
      }
      h.append("</div>\n");
      RunResult.HoldOut ho = p.holdOut();
      if (ho != null) {
        h.append("<p class=\"note\">Checked on ").append(ho.scenarios()).append(" scenarios it was not chosen on (")
            .append(escape(ho.source())).append("): mean ").append(escape(Figures.money(ho.mean()))).append(", 5 % quantile ")
            .append(escape(Figures.money(ho.p5()))).append(", 95 % quantile ").append(escape(Figures.money(ho.p95()) + cur))
            .append(ho.lotsMissed() > 0 ? "; " + ho.lotsMissed() + " cannot meet a minimum lot" : "").append(".</p>\n");
      }
    }

    /**
     * One horizontal bar: label, a track with the filled fraction (clipped to 0..1), an optional
     * mark at another fraction, and the figures as text. {@code open}: the track is the unserved part.
     */
    private void bar(String label, double fraction, boolean hot, boolean open, double mark, String value) {
      double f = Double.isFinite(fraction) ? Math.max(0, Math.min(1, fraction)) : 0;
      h.append("<div class=\"bar\"><span class=\"l\">").append(escape(label)).append("</span><span class=\"t")
          .append(open ? " open" : "").append("\"><span class=\"f").append(hot ? " hot" : "")
          .append("\" style=\"width:").append(pc(f)).append("\"></span>");
      if (mark >= 0) {
        h.append("<span class=\"m\" style=\"left:").append(pc(Math.min(1, mark))).append("\"></span>");
      }
      h.append("</span><span class=\"v\">").append(escape(value)).append("</span></div>\n");
    }

    /** A variant as its code and the labels of the choices in which the run's variants differ. */
    private String variantName(Map<String, String> options) {
      String code = codes.code(options);
      if (code == null) {
        return "<span class=\"what\">" + escape(variant(options)) + "</span>";
      }
      return "<span class=\"code\">" + code + "</span> <span class=\"what\">" + escape(matrix.describe(code))
          + "</span>";
    }

    private String segmentName(String id) {
      int s = catalog == null ? -1 : catalog.segmentIndex(id);
      Segment seg = s < 0 ? null : catalog.segments().get(s);
      return seg == null || seg.label() == null || seg.label().isBlank() ? id : seg.label() + " (" + id + ")";
    }

    private String resourceName(String id) {
      int i = catalog == null ? -1 : catalog.resourceIndex(id);
      Resource res = i < 0 ? null : catalog.resources().get(i);
      return res == null || res.label() == null || res.label().isBlank() ? id : res.label();
    }

    /** "unit", or the resource's unit when the catalog gives one ("h"; "units" reads "unit"). */
    private String perUnit(String id) {
      String u = unitOf(id).trim();
      return u.isEmpty() || u.equals("units") ? "unit" : u;
    }

    /** The resource's unit from the catalog, with a space before it; empty when it gives none. */
    private String unitOf(String id) {
      int i = catalog == null ? -1 : catalog.resourceIndex(id);
      Resource res = i < 0 ? null : catalog.resources().get(i);
      return res == null || res.unit() == null || res.unit().isBlank() ? "" : " " + res.unit();
    }
  }

  private static String pc(double fraction) {
    return String.format(Locale.ROOT, "%.2f%%", 100 * fraction);
  }

  // ---- convergence ------------------------------------------------------------------------------

  private static void convergence(StringBuilder h, List<RunResult.Round> rounds, String cur) {
    h.append("<h2 id=\"solver\">How the solver got there</h2>\n");
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
    h.append("<p class=\"note\">For the record: after each round of column generation, the value of the best"
        + " plan found so far (solid) and the most any plan could be worth (dashed). Where they meet, the LP plan is"
        + " proven the best.</p>\n");
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
    series(h, bnd, sx, sy, HOT, true, cur);
    series(h, obj, sx, sy, PLAN, false, cur);
    double lx = left + pw - 300;
    h.append(line(lx, top + 10, lx + 24, top + 10, PLAN, 2.5)).append(text(lx + 30, top + 14, "start", "best plan so far"));
    h.append("<line x1=\"").append(f(lx + 150)).append("\" y1=\"").append(f(top + 10)).append("\" x2=\"")
        .append(f(lx + 174)).append("\" y2=\"").append(f(top + 10)).append("\" stroke=\"").append(HOT)
        .append("\" stroke-width=\"2.5\" stroke-dasharray=\"6 4\"/>\n");
    h.append(text(lx + 180, top + 14, "start", "most possible"));
    h.append("</svg>\n");
  }

  private static void series(StringBuilder h, List<double[]> pts, java.util.function.DoubleUnaryOperator sx,
      java.util.function.DoubleUnaryOperator sy, String colour, boolean dashed, String cur) {
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
          .append(escape(Figures.money(p[1]) + cur)).append("</title></circle>\n");
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

  private static String f(double v) {
    return String.format(Locale.ROOT, "%.1f", v);
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
