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

  /** The usable choices (indices within the group) of group g, ascending. */
  static int[] usableChoices(VariantSpace space, double[] w, int g) {
    int base = space.offset(g);
    int[] list = new int[space.choiceCount(g)];
    int n = 0;
    for (int c = 0; c < list.length; c++) {
      if (usable(space, w, base + c)) {
        list[n++] = c;
      }
    }
    return java.util.Arrays.copyOf(list, n);
  }

  /** The score in group order: every pricer reports it this way, whatever order it searched in. */
  static double score(int[] offset, double[] w, double constant, int[] v) {
    double s = constant;
    for (int g = 0; g < v.length; g++) {
      s += w[offset[g] + v[g]];
    }
    return s;
  }

  /** The outcome of a search that kept its k best in {@code top}: see {@link PricingOutcome#of}. */
  static PricingOutcome outcome(TopK top, double threshold, boolean exact, double openBound, long nodes) {
    return PricingOutcome.of(top.sorted(), top.k(), threshold, exact, openBound, nodes);
  }
}
