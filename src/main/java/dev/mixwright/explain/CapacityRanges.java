package dev.mixwright.explain;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.colgen.Column;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.function.Function;

/**
 * The capacity range over which a resource's shadow price holds, found by re-solving the whole
 * problem — column generation over the whole variant space — at other capacities, not by ranging
 * one basis: a capacity outside the basis's range can bring in variants that were never columns,
 * which a one-basis range cannot see.
 *
 * <p>The LP optimum z(b) as a function of one capacity b is concave and piecewise linear, and the
 * shadow price π(b) is a supergradient: z(b') ≤ z(b) + π(b)(b' − b). The price π0 at b0 holds on the
 * linear piece through b0. Its ends are found by the intersection method for such functions
 * (Eisner &amp; Severance 1976, J. ACM 23(4) — recalled from memory): with the supporting lines at
 * b0 and at a far capacity c, solve at their crossing t. If z(t) lies on the line at b0, t is the
 * end of the piece (z meets both lines there, so the piece beyond runs with c's slope); otherwise
 * the end lies between b0 and t, and t takes c's place. Each re-solve adds a new supporting line, so
 * the search takes at most one solve per piece between b0 and c, plus one for c; far capacities
 * are 0 below, and above, a capacity no plan can use up (there the price is 0).
 */
public final class CapacityRanges {
  /** The most re-solves for one end of one range; reached only on curves with very many pieces. */
  public static final int MAX_SOLVES_PER_END = 40;

  /** The value curve at one capacity: the optimum there and the shadow price of the resource. */
  public record Point(double capacity, double objective, double price) {}

  /** Solves the whole problem at another capacity of the resource. */
  @FunctionalInterface
  public interface Solver {
    Point at(double capacity);
  }

  /**
   * The price {@code price} at {@code capacity} holds for capacities in [{@code low}, {@code high}]
   * ({@code high} is +∞ when the price is 0: capacity beyond the need is worth nothing). Below {@code
   * low} the curve rises at {@code priceBelow}, above {@code high} at {@code priceAbove} (NaN when
   * there is no such side). {@code exact} is false when an end's search hit {@link
   * #MAX_SOLVES_PER_END}; the range is then a sure inner part of the true one.
   */
  public record Range(String resource, double capacity, double price, double low, double high,
      double priceBelow, double priceAbove, int solves, boolean exact) {}

  private final double priceTolerance;
  private final double objectiveTolerance;

  /**
   * @param priceTolerance prices closer than this (relative to max(1, |price|)) are one price
   * @param objectiveTolerance objectives closer than this (relative to max(1, |z|)) are one value;
   *     must exceed the solves' own error (their gap target)
   */
  public CapacityRanges(double priceTolerance, double objectiveTolerance) {
    this.priceTolerance = priceTolerance;
    this.objectiveTolerance = objectiveTolerance;
  }

  /**
   * The range of the price at {@code p0}; {@code unusable} is a capacity at or above which the
   * resource cannot bind (its price there is 0).
   */
  public Range find(String resource, Point p0, double unusable, Solver solver) {
    int[] solves = {0};
    Solver counted = b -> {
      solves[0]++;
      return solver.at(b);
    };
    boolean exact = true;
    double high;
    double above;
    if (samePrice(p0.price(), 0)) {
      high = Double.POSITIVE_INFINITY;
      above = Double.NaN;
    } else {
      Point far = counted.at(Math.max(unusable, p0.capacity()) * 1.01 + 1);
      End e = end(p0, far, counted);
      high = e.at;
      above = e.beyond;
      exact &= e.exact;
    }
    double low;
    double below;
    if (p0.capacity() <= 0) {
      low = 0;
      below = Double.NaN;
    } else {
      Point zero = counted.at(0);
      if (samePrice(zero.price(), p0.price())) {
        low = 0;
        below = Double.NaN;
      } else {
        End e = end(p0, zero, counted);
        low = e.at;
        below = e.beyond;
        exact &= e.exact;
      }
    }
    return new Range(resource, p0.capacity(), p0.price(), low, high, below, above, solves[0], exact);
  }

  private record End(double at, double beyond, boolean exact) {}

  /** The end of p0's piece between p0 and {@code c}, whose price differs from p0's. */
  private End end(Point a, Point c, Solver solver) {
    for (int k = 0; k < MAX_SOLVES_PER_END; k++) {
      if (samePrice(a.price(), c.price())) {
        // Both lines support the curve with one slope: it is linear all the way to c.
        return new End(c.capacity(), Double.NaN, true);
      }
      double t = (c.objective() - a.objective() + a.price() * a.capacity() - c.price() * c.capacity())
          / (a.price() - c.price());
      double lo = Math.min(a.capacity(), c.capacity());
      double hi = Math.max(a.capacity(), c.capacity());
      t = Math.max(lo, Math.min(hi, t));
      if (near(t, c.capacity())) {
        return new End(c.capacity(), c.price(), true);
      }
      if (near(t, a.capacity())) {
        return new End(a.capacity(), c.price(), true);
      }
      Point p = solver.at(t);
      double onLine = a.objective() + a.price() * (t - a.capacity());
      if (Math.abs(p.objective() - onLine) <= objectiveTolerance * Math.max(1, Math.abs(onLine))) {
        return new End(t, c.price(), true);
      }
      if (samePrice(p.price(), a.price())) {
        a = p; // only round-off puts it here: z(t) off the line yet the same price
      } else {
        c = p;
      }
    }
    return new End(a.capacity(), Double.NaN, false);
  }

  private boolean samePrice(double x, double y) {
    return Math.abs(x - y) <= priceTolerance * Math.max(1, Math.max(Math.abs(x), Math.abs(y)));
  }

  private static boolean near(double x, double y) {
    return Math.abs(x - y) <= 1e-9 * Math.max(1, Math.abs(y));
  }

  /** A capacity of resource r no plan can use up: demand of all segments times the most any variant uses. */
  public static double unusableCapacity(VariantSpace space, int r) {
    double most = 0;
    for (int g = 0; g < space.groupCount(); g++) {
      double m = 0;
      for (int k = 0; k < space.choiceCount(g); k++) {
        int f = space.offset(g) + k;
        if (space.allowed(f)) {
          m = Math.max(m, space.choiceUse(f, r));
        }
      }
      most += m;
    }
    double demand = 0;
    for (var s : space.catalog().segments()) {
      demand += s.demand();
    }
    return most * demand;
  }

  /**
   * Re-solves by column generation with capacity changed, each solve warm-started from every column
   * found so far (a capacity changes no column's margin, use or bound, so columns carry over as
   * they are).
   */
  public static final class ColumnGenerationSolver implements Solver {
    private final Catalog catalog;
    private final int resource;
    private final Function<VariantSpace, Pricer> pricer;
    private final SolveSettings settings;
    private final List<Column> pool = new ArrayList<>();
    private final List<Set<VariantKey>> keys = new ArrayList<>();
    private final VariantSpace keySpace;

    public ColumnGenerationSolver(Catalog catalog, int resource, Function<VariantSpace, Pricer> pricer,
        SolveSettings settings,
        List<Column> warmStart) {
      this.catalog = catalog;
      this.resource = resource;
      this.pricer = pricer;
      this.settings = settings;
      this.keySpace = new VariantSpace(catalog);
      for (int s = 0; s < catalog.segments().size(); s++) {
        keys.add(new HashSet<>());
      }
      addAll(warmStart);
    }

    private void addAll(List<Column> cols) {
      for (Column c : cols) {
        if (keys.get(c.segment()).add(keySpace.key(c.choices()))) {
          pool.add(c);
        }
      }
    }

    @Override
    public Point at(double capacity) {
      List<Resource> res = new ArrayList<>(catalog.resources());
      Resource old = res.get(resource);
      res.set(resource, new Resource(old.id(), old.label(), old.unit(), capacity));
      Catalog c = new Catalog(catalog.format(), catalog.name(), catalog.currency(), catalog.period(), res,
          catalog.groups(), catalog.rules(), catalog.segments(), catalog.portfolio(), catalog.current(),
          catalog.exclude());
      VariantSpace space = new VariantSpace(c);
      SolveOutcome out = new ColumnGeneration(space, pricer.apply(space), null, settings,
        StopCriterion.never(), System.nanoTime()).run(pool);
      if (out.status() != RunStatus.OPTIMAL) {
        throw new IllegalStateException("the re-solve at capacity " + capacity + " ended " + out.status().word()
            + " (" + out.stopReason() + ")");
      }
      addAll(out.master().columns());
      return new Point(capacity, out.result().value(), out.duals().resource()[resource]);
    }
  }
}
