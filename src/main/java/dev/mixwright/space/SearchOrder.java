package dev.mixwright.space;

/**
 * The order in which the depth-first searches over a space (the pricers of the LP and of the
 * portfolio stage) assign the groups, and the groups of a rule sorted by that order.
 */
public final class SearchOrder {
  private SearchOrder() {}

  /**
   * Search order, once per space: repeatedly the group sharing the most nogoods with the groups
   * already placed (so forward checking fires early), then the one in most nogoods, then the one
   * whose margins spread widest (a wrong choice there costs most); unconstrained groups come last,
   * where the bound is exact.
   */
  public static int[] of(VariantSpace space) {
    int groups = space.groupCount();
    int[] degree = new int[groups];
    double[] spread = new double[groups];
    for (int g = 0; g < groups; g++) {
      degree[g] = space.nogoodsOf(g).length;
      double lo = Double.POSITIVE_INFINITY;
      double hi = Double.NEGATIVE_INFINITY;
      for (int c = 0; c < space.choiceCount(g); c++) {
        int f = space.offset(g) + c;
        if (space.allowed(f)) {
          lo = Math.min(lo, space.choiceMargin(f));
          hi = Math.max(hi, space.choiceMargin(f));
        }
      }
      spread[g] = hi >= lo ? hi - lo : 0;
    }
    Nogood[] nogoods = space.nogoods();
    int[] links = new int[groups];
    boolean[] placed = new boolean[groups];
    int[] order = new int[groups];
    for (int d = 0; d < groups; d++) {
      int best = -1;
      for (int g = 0; g < groups; g++) {
        if (placed[g]) {
          continue;
        }
        if (best < 0
            || links[g] > links[best]
            || links[g] == links[best]
                && (degree[g] > degree[best] || degree[g] == degree[best] && spread[g] > spread[best])) {
          best = g;
        }
      }
      order[d] = best;
      placed[best] = true;
      for (int n : space.nogoodsOf(best)) {
        for (int h : nogoods[n].groups()) {
          if (!placed[h]) {
            links[h]++;
          }
        }
      }
    }
    return order;
  }


  /** The groups sorted by their depth in a search order ({@code depthOf[g]}), as a new array. */
  public static int[] byDepth(int[] groups, int[] depthOf) {
    int[] gs = groups.clone();
    for (int i = 1; i < gs.length; i++) {
      int x = gs[i];
      int j = i - 1;
      while (j >= 0 && depthOf[gs[j]] > depthOf[x]) {
        gs[j + 1] = gs[j];
        j--;
      }
      gs[j + 1] = x;
    }
    return gs;
  }
}
