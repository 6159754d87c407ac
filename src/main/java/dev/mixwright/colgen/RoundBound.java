package dev.mixwright.colgen;

/**
 * What one exact pricing round proves about the LP optimum over the whole space. {@code lagrangian}:
 * the {@link LagrangianLpBound} at the priced point, valid at any prices. {@code lasdon}: the
 * Lasdon-type bound z_RM + Σ_s demand_s · max(0, d̄_s), valid only at the master's optimal duals
 * (α = 0), +∞ otherwise. {@code best}: the least of the valid ones.
 *
 * <p>Only {@code lasdon} may end the run on the gap, so that the duals reported price every column
 * outside the master to within the tolerance. The Lagrangian bound can be tighter at degenerate
 * duals that leave a paying column outside: seen with a column at its upper bound equal to the
 * segment's demand, where μ = 0 left the next variant at d = 132.
 */
record RoundBound(double best, double lasdon, double lagrangian) {
  /** A round whose pricing was not exact proves nothing. */
  static final RoundBound NONE =
      new RoundBound(Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY);

  /** The bounds of a round priced at weight {@code alpha} on the smoothing centre. */
  static RoundBound at(double alpha, double lasdon, double lagrangian) {
    if (alpha != 0) {
      return new RoundBound(lagrangian, Double.POSITIVE_INFINITY, lagrangian);
    }
    return new RoundBound(Math.min(lagrangian, lasdon), lasdon, lagrangian);
  }
}
