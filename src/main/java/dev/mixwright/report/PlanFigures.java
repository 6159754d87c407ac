package dev.mixwright.report;

import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The business figures of one plan of a run, the LP plan or the integer portfolio, as a planner reads
 * them: revenue, cost and margin, units by segment, the attach rate of each option and the use of each
 * resource. A plan is a list of {@link Line}s (a variant sold in a segment), so both plans are summed
 * by the same code.
 *
 * <p>The LP plan's lines are result.json's offers as written. A portfolio variant's sales per segment
 * are priced and costed through the run's catalog (catalog.json) when the folder has one; without it
 * a line takes the price of the LP offer of the same variant and segment, and its share of the
 * variant's margin by units, and a figure that cannot be known is NaN, shown as "—".
 */
public record PlanFigures(List<Line> lines, List<String> segments, double introduction, double tooling,
    double discontinue) {

  public PlanFigures {
    lines = List.copyOf(lines);
    segments = List.copyOf(segments);
  }

  /** A variant sold in a segment: units, the margin of those units, the price a unit (NaN when unknown). */
  public record Line(Map<String, String> options, String segment, double units, double margin, double price) {}

  /** The LP plan: its offers, no fixed costs. */
  public static PlanFigures lp(RunResult r) {
    List<Line> lines = new ArrayList<>();
    for (RunResult.Offer o : r.offers()) {
      lines.add(new Line(o.options(), o.segment(), o.quantity(), o.contribution(),
          o.price() == null ? Double.NaN : o.price()));
    }
    return new PlanFigures(lines, segmentIds(r), 0, 0, 0);
  }

  /**
   * The integer portfolio of {@code r} (which must have one); {@code space}, the run's catalog
   * compiled, may be null.
   */
  public static PlanFigures portfolio(RunResult r, VariantSpace space) {
    RunResult.Portfolio p = r.portfolio();
    List<Line> lines = new ArrayList<>();
    for (RunResult.PortfolioVariant v : p.variants()) {
      int[] choices = parse(space, v.options());
      for (Map.Entry<String, Double> e : v.sales().entrySet()) {
        double q = e.getValue();
        int s = space == null ? -1 : space.catalog().segmentIndex(e.getKey());
        double price;
        double margin;
        if (choices != null && s >= 0) {
          price = space.price(choices, s);
          margin = q * space.margin(choices, s);
        } else {
          price = offerPrice(r, v.options(), e.getKey());
          margin = v.units() > 0 ? v.margin() * q / v.units() : 0;
        }
        lines.add(new Line(v.options(), e.getKey(), q, margin, price));
      }
    }
    return new PlanFigures(lines, segmentIds(r), p.introductionCosts(), p.toolingCosts(),
        p.discontinueCosts() == null ? 0 : p.discontinueCosts());
  }

  public double revenue() {
    return sum(l -> l.units() * l.price());
  }

  /** Margin of the units sold, before introduction, tooling and discontinue costs. */
  public double margin() {
    return sum(Line::margin);
  }

  /** What the units sold cost to make: revenue less margin. */
  public double cost() {
    return revenue() - margin();
  }

  /** The one-off costs of the range: introduction, tooling and discontinuing. */
  public double fixedCosts() {
    return introduction + tooling + discontinue;
  }

  /** Margin less the one-off costs: the LP objective, or the portfolio's value. */
  public double net() {
    return margin() - fixedCosts();
  }

  /** Units sold in each segment, aligned with {@link #segments}. */
  public double[] soldBySegment() {
    double[] s = new double[segments.size()];
    for (Line l : lines) {
      int i = segments.indexOf(l.segment());
      if (i >= 0) {
        s[i] += l.units();
      }
    }
    return s;
  }

  public double units() {
    return sum(Line::units);
  }

  private double sum(java.util.function.ToDoubleFunction<Line> f) {
    double s = 0;
    for (Line l : lines) {
      s += f.applyAsDouble(l);
    }
    return s;
  }

  /** Units and margin of each variant (by {@link VariantCodes#key}), all segments together, in first-seen order. */
  public Map<String, double[]> byVariant() {
    Map<String, double[]> m = new LinkedHashMap<>();
    for (Line l : lines) {
      double[] a = m.computeIfAbsent(VariantCodes.key(l.options()), k -> new double[2]);
      a[0] += l.units();
      a[1] += l.margin();
    }
    return m;
  }

  /** An option's attach rate: the share of all units sold that carry it. */
  public record Attach(String group, String choice, double units, double share) {}

  /**
   * The attach rate of every choice the plan sells, groups in the order of the variants' maps and
   * choices by units, largest first. A price point counts as its option ({@code wifi@190} and {@code
   * wifi@240} are one option at two prices).
   */
  public List<Attach> attachRates() {
    Map<String, Map<String, Double>> byGroup = new LinkedHashMap<>();
    double total = units();
    for (Line l : lines) {
      l.options().forEach((g, c) -> {
        int at = c.indexOf('@');
        byGroup.computeIfAbsent(g, k -> new LinkedHashMap<>()).merge(at < 0 ? c : c.substring(0, at), l.units(),
            Double::sum);
      });
    }
    List<Attach> out = new ArrayList<>();
    byGroup.forEach((g, m) -> m.entrySet().stream()
        .sorted((a, b) -> Double.compare(b.getValue(), a.getValue()))
        .forEach(e -> out.add(new Attach(g, e.getKey(), e.getValue(), total > 0 ? e.getValue() / total : 0))));
    return out;
  }

  /**
   * Each resource's use by the plan, aligned with the catalog's resources; null without the compiled
   * catalog or when a variant does not read in it.
   */
  public double[] resourceUse(VariantSpace space) {
    if (space == null) {
      return null;
    }
    double[] use = new double[space.resourceCount()];
    for (Line l : lines) {
      int[] v = parse(space, l.options());
      if (v == null) {
        return null;
      }
      double[] u = space.use(v);
      for (int i = 0; i < use.length; i++) {
        use[i] += u[i] * l.units();
      }
    }
    return use;
  }

  /** The variant in the compiled catalog, or null (no catalog, or a variant of another catalog). */
  private static int[] parse(VariantSpace space, Map<String, String> options) {
    if (space == null) {
      return null;
    }
    try {
      return space.parse(options);
    } catch (IllegalArgumentException e) {
      return null;
    }
  }

  private static double offerPrice(RunResult r, Map<String, String> options, String segment) {
    for (RunResult.Offer o : r.offers()) {
      if (o.segment().equals(segment) && o.options().equals(options) && o.price() != null) {
        return o.price();
      }
    }
    return Double.NaN;
  }

  private static List<String> segmentIds(RunResult r) {
    List<String> ids = new ArrayList<>();
    r.segments().forEach(s -> ids.add(s.id()));
    return ids;
  }
}
