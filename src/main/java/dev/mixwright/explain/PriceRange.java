package dev.mixwright.explain;

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
 * How far the price of one column (a variant in one segment) may fall before the plan stops selling
 * it, found by re-solving over the whole space rather than read off one basis: a lower price frees
 * resources for other variants, some of which may not be in the master yet, so only new pricing
 * rounds can tell.
 *
 * <p>The quantity of a column in an optimal LP plan does not fall when its own objective coefficient
 * rises (parametric LP in one cost coefficient; common practice), so bisection on the price cut
 * brackets the point where it reaches zero. Each step is one column generation warm-started from
 * every column found so far, with the column's margin lowered by the cut; the column stays in the
 * master, and pricing, which skips master columns, never sees its old margin. Cost: about
 * log2(1/tolerance) + 2 re-solves.
 */
public final class PriceRange {
  /** The cut in price per unit beyond which the column leaves the plan; {@code solves} re-solves. */
  public record Leave(double cut, double newMargin, int solves) {}

  private static final int MAX_SOLVES = 60;

  private final VariantSpace space;
  private final Function<VariantSpace, Pricer> pricer;
  private final SolveSettings settings;
  private final List<Column> pool = new ArrayList<>();
  private final List<Set<VariantKey>> inPool = new ArrayList<>();
  private int solves;

  /** @param pricer makes the exact pricer of each re-solve's space */
  public PriceRange(VariantSpace space, Function<VariantSpace, Pricer> pricer, SolveSettings settings,
      List<Column> warmStart) {
    this.space = space;
    this.pricer = pricer;
    this.settings = settings;
    for (int s = 0; s < space.segmentCount(); s++) {
      inPool.add(new HashSet<>());
    }
    warmStart.forEach(this::remember);
  }

  private void remember(Column c) {
    if (inPool.get(c.segment()).add(space.key(c.choices()))) {
      pool.add(c);
    }
  }

  /**
   * @param v the variant, {@code s} its segment
   * @param tolerance relative precision of the cut (of the column's margin)
   * @return the cut, or throws IllegalArgumentException when the plan does not sell the column now
   */
  public Leave leave(int[] v, int s, double tolerance) {
    double margin = space.margin(v, s);
    solves = 0;
    if (quantity(v, s, 0.0) <= eps()) {
      throw new IllegalArgumentException("the plan does not sell this variant in this segment");
    }
    // At a margin of zero or less a column adds nothing; one unit below zero it surely leaves.
    double lo = 0;
    double hi = Math.max(margin, 0) + Math.max(1.0, 1e-3 * Math.abs(margin));
    while (quantity(v, s, hi) > eps()) {
      lo = hi;
      hi *= 2;
      if (solves > MAX_SOLVES / 2) {
        throw new IllegalStateException("no price cut up to " + hi + " makes the column leave");
      }
    }
    double step = tolerance * Math.max(1.0, Math.abs(margin));
    while (hi - lo > step && solves < MAX_SOLVES) {
      double mid = 0.5 * (lo + hi);
      if (quantity(v, s, mid) > eps()) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    return new Leave(hi, margin - hi, solves);
  }

  private double eps() {
    return 1e-7;
  }

  /** Quantity of column (v, s) in an optimal plan over the whole space with its margin cut. */
  private double quantity(int[] v, int s, double cut) {
    solves++;
    double upper = space.catalog().segments().get(s).columnBound();
    Column changed = new Column(s, v.clone(), space.margin(v, s) - cut, space.use(v), upper, 0, 0.0);
    List<Column> warm = new ArrayList<>();
    warm.add(changed); // first, so that it wins over the unchanged copy in the pool
    warm.addAll(pool);
    SolveOutcome out = new ColumnGeneration(space, pricer.apply(space), null, settings,
        StopCriterion.never(), System.nanoTime()).run(warm);
    if (out.status() != RunStatus.OPTIMAL) {
      throw new IllegalStateException("a re-solve ended " + out.status().word() + " (" + out.stopReason() + ")");
    }
    VariantKey key = space.key(v);
    double x = 0;
    for (int j = 0; j < out.master().columns().size(); j++) {
      Column c = out.master().columns().get(j);
      if (c.segment() == s && space.key(c.choices()).equals(key)) {
        x = out.master().x()[j];
      } else {
        remember(c);
      }
    }
    return x;
  }
}
