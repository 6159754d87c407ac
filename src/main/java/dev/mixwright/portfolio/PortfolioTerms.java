package dev.mixwright.portfolio;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.colgen.ValueBound;
import dev.mixwright.space.VariantSpace;

/**
 * The integer stage's figures, aligned with the space: F = {@code introductionCost} per distinct
 * variant, L = {@code minLot} (all segments together), the variant limit K, per-segment column
 * bound u_s = maxShare_s·demand_s and demand D_s, per-resource capacity b_r, and a tooling cost per
 * flat choice (0 when the catalog has none; paid once if any offered variant uses the choice), and
 * whether sales must be whole units. {@code gapFloor}: differences below it are round-off for these
 * figures ({@link ValueBound#floorOf}), the floor of the stage's gap as of the LP stage's.
 *
 * <p>{@link #variantCap()} is the limit the bounds may use: K, tightened to ⌊Σ_s D_s / L⌋ when L &gt;
 * 0, because every offered variant sells at least L and all of them together sell at most Σ_s D_s.
 */
public record PortfolioTerms(
    double introductionCost,
    int maxVariants,
    double minLot,
    double[] columnBound,
    double[] demand,
    double[] capacity,
    double[] choiceCost,
    boolean wholeUnits,
    double gapFloor) {

  /** No limit on the number of variants. */
  public static final int UNLIMITED = Integer.MAX_VALUE;

  public PortfolioTerms {
    columnBound = columnBound.clone();
    demand = demand.clone();
    capacity = capacity.clone();
    choiceCost = choiceCost.clone();
  }

  public static PortfolioTerms of(VariantSpace space) {
    Catalog c = space.catalog();
    PortfolioSpec p = c.portfolio().orElseThrow(() -> new IllegalArgumentException("the catalog has no portfolio section"));
    int ns = space.segmentCount();
    double[] u = new double[ns];
    double[] d = new double[ns];
    for (int s = 0; s < ns; s++) {
      u[s] = c.segments().get(s).columnBound();
      d[s] = c.segments().get(s).demand();
    }
    double[] b = new double[space.resourceCount()];
    for (int r = 0; r < b.length; r++) {
      b[r] = c.resources().get(r).capacity();
    }
    double[] tooling = new double[space.totalChoices()];
    for (int g = 0; g < space.groupCount(); g++) {
      var options = c.groups().get(g).options();
      for (int k = 0; k < options.size(); k++) {
        tooling[space.offset(g) + k] = options.get(k).tooling();
      }
    }
    return new PortfolioTerms(p.introductionCost(), p.maxVariants(), p.minLot(), u, d, b, tooling, p.wholeUnits(),
        ValueBound.floorOf(space));
  }

  public int segmentCount() {
    return demand.length;
  }

  /** The variant limit the bounds use (see the class comment), {@link #UNLIMITED} for none. */
  public int variantCap() {
    long cap = maxVariants;
    if (minLot > 0) {
      double total = 0;
      for (double x : demand) {
        total += x;
      }
      // the small slack keeps a cap such as 60000/200 = 300 from becoming 299 by round-off
      double byLots = Math.floor(total / minLot * (1 + 1e-12));
      cap = (long) Math.min(cap, Math.min(byLots, (double) UNLIMITED));
    }
    return (int) cap;
  }

  /** π·b + μ·D: what the rows' capacities and demands are worth at prices π, μ (the Lagrangian constant). */
  public double rowValue(double[] pi, double[] mu) {
    double v = 0;
    for (int r = 0; r < pi.length; r++) {
      v += pi[r] * capacity[r];
    }
    for (int s = 0; s < mu.length; s++) {
      v += mu[s] * demand[s];
    }
    return v;
  }

  /** True when some choice carries a tooling cost. */
  public boolean hasTooling() {
    for (double x : choiceCost) {
      if (x > 0) {
        return true;
      }
    }
    return false;
  }

  /** Tooling of the choices of v taken alone: a lower bound on what any portfolio holding v pays for them. */
  public double toolingOf(VariantSpace space, int[] v) {
    double t = 0;
    for (int g = 0; g < v.length; g++) {
      t += choiceCost[space.offset(g) + v[g]];
    }
    return t;
  }
}
