package dev.mixwright.portfolio;

import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioLpSolution;
import java.util.ArrayList;
import java.util.List;

/**
 * Cuts on a segment's demand row for the relaxed portfolio master, against the fixed-charge gap of
 * x ≤ u·y: the relaxation sells a variant at y = x/u of its cap and pays F·y for it, so it fills a
 * segment whose demand is not a whole number of caps with a fractional number of variants.
 *
 * <p>Segment s has demand D and column bound u (every column of s has its cap u_v ≤ u); write D = k·u +
 * r with k = ⌊D/u⌋ and 0 &lt; r &lt; u. For any set C of variants that sell in s, every integer
 * portfolio satisfies
 *
 * <pre>
 *   Σ_{v ∈ C} (x_vs − r·y_v) ≤ (u − r)·k.
 * </pre>
 *
 * Proof: let n = Σ_{v ∈ C} y_v (an integer) and X = Σ_{v ∈ C} x_vs, so X ≤ u·n (x_vs ≤ u_v·y_v ≤ u·y_v)
 * and X ≤ D (the demand row; the other variants' sales are ≥ 0). If n ≤ k, X − r·n ≤ (u − r)·n ≤
 * (u − r)·k. If n ≥ k + 1, X − r·n ≤ D − r·(k + 1) = (u − r)·k. It is the upper edge of the convex hull
 * of {(n, X) : n ∈ ℤ₊, X ≤ min(u·n, D)}, the residual-capacity form of the mixed-integer rounding of
 * X ≤ u·n (from memory: Magnanti, Mirchandani &amp; Vachani 1993, "The convex hull of two core
 * capacitated network design problems", Mathematical Programming 60; the proof above is complete
 * without it).
 *
 * <p>Separation is exact for each segment: the most violated C takes every column with x_vs − r·y_v
 * &gt; 0. A variant outside C has coefficient 0, so pricing is unchanged: a new variant joins no cut,
 * and the relaxation with the cuts, priced to the end, is still a relaxation over the whole space. The
 * cuts enter the Lagrangian bound at their duals γ ≥ 0 ({@link ChoicePrices#of}).
 */
final class SegmentCuts {
  private SegmentCuts() {}

  /** Separation tolerance, relative to the right-hand side. */
  private static final double VIOLATION = 1e-6;

  /**
   * Adds to {@code lp} the most violated cut of each segment at {@code sol}, where block i holds pool
   * variant i; returns how many were added.
   */
  static int separate(PortfolioLp lp, PortfolioLpSolution sol, Pool pool, PortfolioTerms terms) {
    int segments = terms.segmentCount();
    int added = 0;
    for (int s = 0; s < segments; s++) {
      double u = terms.columnBound()[s];
      double demand = terms.demand()[s];
      if (!(u > 0) || !Double.isFinite(demand)) {
        continue;
      }
      double k = Math.floor(demand / u + 1e-12);
      double r = demand - k * u;
      if (r <= 1e-9 * u) {
        continue; // D is a whole number of caps: X ≤ min(u·n, D) has nothing more to give
      }
      double rhs = (u - r) * k;
      double lhs = 0;
      List<Integer> members = new ArrayList<>();
      for (int i = 0; i < sol.y().length; i++) {
        PoolVariant v = pool.get(i);
        for (int e = 0; e < v.segments().length; e++) {
          if (v.segments()[e] == s && v.upper()[e] <= u * (1 + 1e-12)) {
            double gain = sol.x()[i][e] - r * sol.y()[i];
            if (gain > 1e-9 * u) {
              lhs += gain;
              members.add(i);
            }
          }
        }
      }
      if (lhs > rhs + VIOLATION * Math.max(1.0, rhs)) {
        lp.addSegmentCut(s, members.stream().mapToInt(Integer::intValue).toArray(), r, rhs);
        added++;
      }
    }
    return added;
  }
}
