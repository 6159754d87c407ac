package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

/** What every pricer checks and computes the same way, so that their answers compare bit for bit. */
final class QueryChecks {
  private QueryChecks() {}

  /** Rejects a query no pricer can answer: weights of the wrong length, NaN or +∞ figures. */
  static void check(VariantSpace space, PricingQuery q) {
    double[] w = q.weight();
    if (w == null || w.length != space.totalChoices()) {
      throw new IllegalArgumentException(
          "pricing query: weight has "
              + (w == null ? "no entries" : w.length + " entries")
              + " but the space has "
              + space.totalChoices()
              + " choices; build it with ReducedCosts.weights");
    }
    for (int f = 0; f < w.length; f++) {
      if (Double.isNaN(w[f]) || w[f] == Double.POSITIVE_INFINITY) {
        throw new IllegalArgumentException(
            "pricing query: weight[" + f + "] is " + w[f] + "; use a finite number, or -Infinity to forbid the choice");
      }
    }
    if (!Double.isFinite(q.constant())) {
      throw new IllegalArgumentException("pricing query: constant is " + q.constant() + "; it must be finite");
    }
    if (Double.isNaN(q.threshold())) {
      throw new IllegalArgumentException("pricing query: threshold is NaN; use a number or -Infinity");
    }
  }

  /** A choice may be used when its weight is finite and no single-group rule removes it. */
  static boolean usable(VariantSpace space, double[] w, int flat) {
    return w[flat] != Double.NEGATIVE_INFINITY && space.allowed(flat);
  }

  /** The score in group order: every pricer reports it this way, whatever order it searched in. */
  static double score(int[] offset, double[] w, double constant, int[] v) {
    double s = constant;
    for (int g = 0; g < v.length; g++) {
      s += w[offset[g] + v[g]];
    }
    return s;
  }

  /**
   * The outcome as PricingOutcome documents it. A complete search proves the best found (or, when
   * nothing beats the threshold, the threshold). An incomplete one proves the largest of the
   * threshold, the best found and the bound of what it left unexplored, because every pruned part
   * was pruned at or below the threshold or the k-th best found.
   */
  static PricingOutcome outcome(TopK top, double threshold, boolean exact, double openBound, long nodes) {
    var found = top.sorted();
    double best = found.isEmpty() ? Double.NEGATIVE_INFINITY : found.get(0).reducedCost();
    double ub;
    if (exact) {
      ub = found.isEmpty() ? threshold : best;
    } else {
      ub = Math.max(threshold, Math.max(best, openBound));
    }
    return new PricingOutcome(found, ub, exact, nodes);
  }
}
