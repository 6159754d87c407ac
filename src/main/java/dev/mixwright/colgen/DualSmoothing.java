package dev.mixwright.colgen;

/**
 * Wentges smoothing (Wentges 1997, ITOR 4(2)): price at α·y_best + (1 − α)·π_RM, where y_best, the
 * stability centre, gave the best Lagrangian bound so far; with the mispricing safeguard of Pessoa,
 * Sadykov, Uchoa &amp; Vanderbeck 2018 (INFORMS JOC 30(2)): after k mispricings in a row
 * α_k = max(0, 1 − (k+1)(1 − α)), so α_k reaches 0 — the master's own duals, plain column
 * generation, which terminates. O(rows) per point.
 */
final class DualSmoothing {
  private final double weight;
  private double[] centerPi;
  private double[] centerMu;
  private double centerBound = Double.POSITIVE_INFINITY;

  /** @param weight Wentges's α, 0 for none */
  DualSmoothing(double weight) {
    this.weight = weight;
  }

  /** The weight on the centre after {@code mispricings} mispricings in a row; 0 without a centre. */
  double alpha(int mispricings) {
    return centerPi == null ? 0 : Math.max(0, 1 - (mispricings + 1) * (1 - weight));
  }

  /** The resource prices to price at. */
  double[] resourcePoint(double alpha, double[] pi) {
    return mix(alpha, centerPi, pi);
  }

  /** The segment prices to price at. */
  double[] segmentPoint(double alpha, double[] mu) {
    return mix(alpha, centerMu, mu);
  }

  /** The point (y, ν) proved {@code lagrangian}: it becomes the centre when that is the best bound so far. */
  void offer(double lagrangian, double[] y, double[] nu) {
    if (weight > 0 && lagrangian < centerBound) {
      centerBound = lagrangian;
      centerPi = y;
      centerMu = nu;
    }
  }

  /** α·center + (1 − α)·current, or current itself when there is no centre or α is 0. */
  private static double[] mix(double alpha, double[] center, double[] current) {
    if (center == null || alpha == 0) {
      return current;
    }
    double[] y = new double[current.length];
    for (int i = 0; i < y.length; i++) {
      y[i] = Math.max(0.0, alpha * center[i] + (1 - alpha) * current[i]);
    }
    return y;
  }
}
