package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.explain.PortfolioExplainer;
import dev.mixwright.explain.PortfolioVerdict;
import dev.mixwright.report.RunResult;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** The integer-portfolio part of {@code explain}: in or out, and why. */
final class PortfolioExplainView {
  private PortfolioExplainView() {}

  /** The verdict for v, or null when the run has no integer portfolio. */
  static PortfolioVerdict verdict(VariantSpace space, int[] v, RunResult result) {
    RunResult.Portfolio p = result.portfolio();
    if (p == null || space.catalog().portfolio().isEmpty()) {
      return null;
    }
    Catalog cat = space.catalog();
    List<int[]> offered = new ArrayList<>();
    List<double[]> sales = new ArrayList<>();
    for (RunResult.PortfolioVariant e : p.variants()) {
      offered.add(space.parse(e.options()));
      sales.add(bySegment(cat, e.sales()));
    }
    double[] pi = new double[cat.resources().size()];
    double[] mu = new double[cat.segments().size()];
    double lambda = 0;
    double at = Double.POSITIVE_INFINITY;
    RunResult.Relaxation rx = p.relaxation();
    if (rx != null) {
      rx.prices().resources().forEach((id, price) -> {
        int r = cat.resourceIndex(id);
        if (r >= 0) {
          pi[r] = price;
        }
      });
      mu = bySegment(cat, rx.prices().segments());
      lambda = rx.variantLimitPrice() == null ? 0 : rx.variantLimitPrice();
      at = rx.boundAtVariantLimitPrice() == null ? Double.POSITIVE_INFINITY : rx.boundAtVariantLimitPrice();
    }
    PortfolioExplainer.Facts f = new PortfolioExplainer.Facts(p.status().isProven(),
        p.value(), offered, sales, pi, mu, lambda, at);
    return new PortfolioExplainer(space).explain(v, f);
  }

  /** Figures keyed by segment id, aligned with the catalog's segments (0 for those not named). */
  private static double[] bySegment(Catalog cat, Map<String, Double> byId) {
    double[] q = new double[cat.segments().size()];
    byId.forEach((id, x) -> {
      int s = cat.segmentIndex(id);
      if (s >= 0) {
        q[s] = x;
      }
    });
    return q;
  }

  static void print(PrintWriter out, VariantSpace space, PortfolioVerdict e) {
    if (e == null) {
      return;
    }
    Catalog cat = space.catalog();
    out.println("  integer portfolio (worth " + Figures.money(e.portfolioValue()) + "):");
    if (e.offered()) {
      StringBuilder sb = new StringBuilder();
      for (int s = 0; s < e.sales().length; s++) {
        if (e.sales()[s] > 0) {
          sb.append(sb.length() == 0 ? "" : ", ").append(cat.segments().get(s).id()).append(' ')
              .append(Figures.units(e.sales()[s]));
        }
      }
      out.println("    in it: sells " + sb + "; margin " + Figures.money(e.margin()) + " against introduction cost "
          + Figures.money(cat.portfolio().get().introductionCost())
          + (e.tooling() > 0 ? " and a share of tooling " + Figures.money(e.tooling()) : ""));
      return;
    }
    boolean anySegment = false;
    for (double d : e.reducedCost()) {
      anySegment |= d != Double.NEGATIVE_INFINITY;
    }
    if (!anySegment) {
      out.println("    not in it: no segment can take it (see above), so it cannot be offered");
      return;
    }
    out.println("    not in it. Per unit, per segment, what it earns above its resources' worth (at the prices of the"
        + " upper limit on any range's value, where a variant may be introduced in part):");
    for (int s = 0; s < e.reducedCost().length; s++) {
      double d = e.reducedCost()[s];
      out.println(String.format(Locale.ROOT, "      %-14s %s", cat.segments().get(s).id(),
          d == Double.NEGATIVE_INFINITY ? "not accepted there" : Figures.signed(d) + " per unit"));
    }
    if (e.lotValue() == Double.NEGATIVE_INFINITY) {
      out.println("    no segment can take its minimum lot of " + Figures.qty(cat.portfolio().get().minLot())
          + " units, so it cannot be offered at all");
      return;
    }
    // a variant on sale today carries −discontinue instead of the introduction cost (issue 10)
    out.println("    its best lot earns " + Figures.money(e.lotValue()) + ", minus "
        + (e.lotValue() - e.psi() == cat.portfolio().get().introductionCost() ? "introduction cost " : "its fixed cost ")
        + Figures.money(e.lotValue() - e.psi()) + " = " + Figures.money(e.psi())
        + (e.tooling() > 0 ? " (and its options' tooling " + Figures.money(e.tooling()) + ")" : ""));
    if (e.ruledOut()) {
      out.println("    so any portfolio holding it is worth at most " + Figures.money(e.boundWith())
          + ", not more than the portfolio found: it cannot be part of a better one");
    } else if (e.proven()) {
      out.println("    a portfolio holding it could be worth up to " + Figures.money(e.boundWith())
          + " by the upper limit, so it was among the candidates of the exact search, which found no better portfolio"
          + " than the one offered");
    } else {
      out.println("    a portfolio holding it could be worth up to " + Figures.money(e.boundWith())
          + " by the upper limit: it is not ruled out, and the run did not prove its portfolio the best");
    }
  }

  static void put(ObjectNode n, VariantSpace space, PortfolioVerdict e) {
    if (e == null) {
      return;
    }
    ObjectNode p = n.putObject("portfolio");
    p.put("offered", e.offered());
    p.put("portfolioValue", e.portfolioValue());
    if (e.offered()) {
      ObjectNode sales = p.putObject("sales");
      for (int s = 0; s < e.sales().length; s++) {
        if (e.sales()[s] > 0) {
          sales.put(space.catalog().segments().get(s).id(), e.sales()[s]);
        }
      }
      p.put("margin", e.margin());
      return;
    }
    ObjectNode d = p.putObject("reducedCosts");
    for (int s = 0; s < e.reducedCost().length; s++) {
      if (e.reducedCost()[s] != Double.NEGATIVE_INFINITY) {
        d.put(space.catalog().segments().get(s).id(), e.reducedCost()[s]);
      }
    }
    putNum(p, "lotValue", e.lotValue());
    putNum(p, "valueAfterIntroduction", e.psi());
    p.put("tooling", e.tooling());
    putNum(p, "boundWithIt", e.boundWith());
    p.put("ruledOut", e.ruledOut());
  }

  private static void putNum(ObjectNode n, String f, double v) {
    if (Double.isFinite(v)) {
      n.put(f, v);
    } else {
      n.putNull(f);
    }
  }
}
