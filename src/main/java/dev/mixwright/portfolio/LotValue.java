package dev.mixwright.portfolio;

/**
 * The best a variant can earn per unit of introduction at given reduced costs: with d_s its reduced
 * cost in segment s (−∞ where it has no column), u_s the column bound and L the minimum lot,
 *
 * <pre>
 *   g(d) = max { Σ_s d_s x_s : 0 ≤ x_s ≤ u_s, Σ_s x_s ≥ L }      (−∞ when Σ_{s alive} u_s &lt; L)
 * </pre>
 *
 * a continuous knapsack with a covering row, solved greedily: every segment of positive d_s at its
 * bound, then, if that sells less than L, the least bad of the others until L is reached (an
 * exchange argument shows the greedy order is optimal). O(S log S) with S segments, here an insertion
 * sort because S is small. g is nondecreasing in every d_s (the feasible set does not depend on d)
 * and in every u_s (a larger bound only widens the feasible set), which is what makes optimistic
 * per-segment reduced costs and caps give an optimistic g.
 */
public final class LotValue {
  private LotValue() {}

  /**
   * @param d reduced costs per segment, {@code Double.NEGATIVE_INFINITY} where the variant has no column
   * @param idx scratch of length ≥ d.length
   */
  public static double best(double[] d, double[] u, double minLot, int[] idx) {
    return best(d, 0, d.length, u, minLot, idx);
  }

  /**
   * g of the {@code n} reduced costs {@code d[from .. from + n)} (one scenario's segments in a
   * stacked vector), {@code u[s]} the bound of {@code d[from + s]}.
   */
  public static double best(double[] d, int from, int n, double[] u, double minLot, int[] idx) {
    double value = 0;
    double sold = 0;
    int rest = 0;
    boolean any = false;
    for (int s = 0; s < n; s++) {
      double ds = d[from + s];
      if (ds == Double.NEGATIVE_INFINITY) {
        continue;
      }
      any = true;
      if (ds > 0) {
        value += u[s] * ds;
        sold += u[s];
      } else {
        int p = rest++;
        while (p > 0 && d[from + idx[p - 1]] < ds) {
          idx[p] = idx[p - 1];
          p--;
        }
        idx[p] = s;
      }
    }
    if (!any) {
      return Double.NEGATIVE_INFINITY; // no segment buys it: it can never be offered usefully
    }
    if (sold >= minLot) {
      return value;
    }
    double need = minLot - sold;
    for (int i = 0; i < rest; i++) {
      int s = idx[i];
      double take = Math.min(u[s], need);
      value += take * d[from + s];
      need -= take;
      if (need <= 0) {
        return value;
      }
    }
    return Double.NEGATIVE_INFINITY;
  }

  public static double best(double[] d, double[] u, double minLot) {
    return best(d, u, minLot, new int[d.length]);
  }
}
