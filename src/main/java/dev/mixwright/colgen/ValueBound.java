package dev.mixwright.colgen;

/**
 * A value reached and an upper bound on the best value attainable, with the relative gap between
 * them: the one gap definition both stages stop on and report.
 */
public record ValueBound(double value, double bound) {

  public double gap() {
    return gap(value, bound);
  }

  /**
   * (bound − value) / max(1, |value|), at least 0; +∞ without a finite bound. The max(1, ·) keeps the
   * gap meaningful when the value is near 0 (nothing can be sold).
   */
  public static double gap(double value, double bound) {
    if (!Double.isFinite(bound)) {
      return Double.POSITIVE_INFINITY;
    }
    return Math.max(0.0, bound - value) / Math.max(1.0, Math.abs(value));
  }
}
