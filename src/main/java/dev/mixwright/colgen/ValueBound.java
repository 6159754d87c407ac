package dev.mixwright.colgen;

import dev.mixwright.space.VariantSpace;

/**
 * A value reached and an upper bound on the best value attainable, with the relative gap between
 * them: the one gap definition both stages stop on and report. {@code floor} is the size below
 * which a difference is round-off for the catalog at hand (see {@link #floorOf}); 0 when unknown.
 */
public record ValueBound(double value, double bound, double floor) {

  /**
   * Differences below this share of the catalog's largest attainable figure (Σ_s demand_s times the
   * largest margin a variant can have) are round-off, not a gap: GLOP's tolerances are 1e-9
   * relative and a margin sums one figure per group.
   */
  static final double ROUND_OFF = 1e-9;

  public ValueBound(double value, double bound) {
    this(value, bound, 0.0);
  }

  public double gap() {
    return gap(value, bound, floor);
  }

  /**
   * Whether the bound meets the value within the relative gap {@code target}: the one rule by which
   * both stages call a result optimal or proven. The 1e-9 share forgives the last bits of round-off
   * in a bound pruned at exactly {@link #slack}.
   */
  public boolean within(double target) {
    return gap() <= target * (1 + 1e-9);
  }

  /**
   * How far above {@code value} a bound may lie and still be {@link #within} {@code target}:
   * target × max(|value|, floor). A search that prunes every part whose bound lies at most this far
   * above its incumbent can call the incumbent proven by the same rule as the LP stage, since then
   * (bound − value) / max(|value|, |bound|, floor) ≤ target. Never an absolute 1: with figures far
   * below 1 that pruned at half the optimum.
   */
  public static double slack(double value, double target, double floor) {
    return target * Math.max(Math.abs(value), Math.max(0.0, floor));
  }

  /** {@link #gap(double, double, double)} without a catalog floor. */
  public static double gap(double value, double bound) {
    return gap(value, bound, 0.0);
  }

  /**
   * (bound − value) / max(|value|, |bound|, floor), at least 0; +∞ without a finite bound; 0 when
   * they are equal. Relative to the larger of the two figures, so a gap never shrinks because the
   * figures are small (a fixed absolute 1 in the denominator did: margins below 1 then stopped
   * "optimal" at half the optimum), and never exceeds 1 for non-negative figures. The floor keeps
   * round-off between two figures near 0 from reading as a gap of 100 %.
   */
  public static double gap(double value, double bound, double floor) {
    if (!Double.isFinite(bound) || Double.isNaN(value)) {
      return Double.POSITIVE_INFINITY;
    }
    double diff = bound - value;
    if (!(diff > 0)) {
      return 0.0;
    }
    double scale = Math.max(Math.max(Math.abs(value), Math.abs(bound)), Math.max(0.0, floor));
    return diff / scale;
  }

  /**
   * The round-off floor of a catalog's figures: {@link #ROUND_OFF} × Σ_s demand_s × Σ_g the largest
   * |margin| of group g, the scale of any objective the LP can reach, so a floor far below every gap
   * that matters. O(choices + segments).
   */
  public static double floorOf(VariantSpace space) {
    double perUnit = 0;
    for (int g = 0; g < space.groupCount(); g++) {
      double m = 0;
      for (int k = 0; k < space.choiceCount(g); k++) {
        m = Math.max(m, Math.abs(space.choiceMargin(space.offset(g) + k)));
      }
      perUnit += m;
    }
    double demand = 0;
    for (var s : space.catalog().segments()) {
      demand += Math.abs(s.demand());
    }
    double f = ROUND_OFF * demand * perUnit;
    return Double.isFinite(f) ? f : 0.0;
  }
}
