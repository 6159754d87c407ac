package dev.mixwright.master;

/** The check every solver wrapper here runs on a returned point before anything reads its duals. */
final class Rows {
  /** Slack allowed on a row, relative to the size of its right-hand side (at least 1). */
  static final double FEASIBILITY_TOLERANCE = 1e-6;

  private Rows() {}

  /** True when every row's use stays within its right-hand side, up to the scaled tolerance. */
  static boolean within(double[] use, double[] rhs) {
    for (int i = 0; i < use.length; i++) {
      if (use[i] > rhs[i] + FEASIBILITY_TOLERANCE * Math.max(1.0, Math.abs(rhs[i]))) {
        return false;
      }
    }
    return true;
  }
}
