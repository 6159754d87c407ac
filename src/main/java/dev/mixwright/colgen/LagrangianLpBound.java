package dev.mixwright.colgen;

import java.util.Arrays;

/**
 * An upper bound on the full LP's optimum for any resource prices y ≥ 0, not only for the
 * restricted master's optimal duals — the bound to use with smoothed duals, where the Lasdon-type
 * bound does not hold.
 *
 * <pre>
 *   UB(y) = Σ_r y_r·capacity_r + Σ_s K_s(y)
 *   K_s(y) = max { Σ_j e_j x_j + t0_s·x_out : Σ_j x_j + x_out ≤ demand_s, 0 ≤ x_j ≤ u_j, x_out ≥ 0 }
 *          = min_{t ≥ t0_s} [ demand_s·t + Σ_j u_j·max(0, e_j − t) ]          (LP duality)
 *   e_j = m_j − a_j·y over the master's columns j of segment s;  t0_s ≥ max(0, e of every other column of s)
 * </pre>
 *
 * Lagrangian relaxation of the resource rows (Geoffrion 1974, "Lagrangean relaxation for integer
 * programming", Mathematical Programming Study 2; in column generation: Lübbecke &amp; Desrosiers
 * 2005, Operations Research 53(6), section 2.1): for fixed y the relaxed LP splits by segment into
 * continuous knapsacks, each filled greedily by e_j; every column outside the master is covered by
 * the item of value t0_s without a bound, which is why t0_s may be any upper bound on their e. At
 * optimal duals of the full LP the bound equals its optimum. O(n log n) for n master columns.
 */
public final class LagrangianLpBound {
  private final double[] capacity;
  private final double[] demand;

  public LagrangianLpBound(double[] capacity, double[] demand) {
    this.capacity = capacity.clone();
    this.demand = demand.clone();
  }

  /**
   * UB(y).
   *
   * @param y resource prices, each ≥ 0
   * @param segment per column, its segment
   * @param margin per column, m_j
   * @param use per column, a_j (aligned with the capacities)
   * @param upper per column, its current bound u_j (0 for a retired column, which then must be
   *     covered by t0 like any column outside the master)
   * @param n how many of the columns to take (the arrays may be longer)
   * @param outside per segment, an upper bound on e = m − a·y over the segment's other columns
   *     ({@code Double.NEGATIVE_INFINITY} when there are none)
   */
  public double bound(double[] y, int[] segment, double[] margin, double[][] use, double[] upper, int n,
      double[] outside) {
    double v = 0;
    for (int r = 0; r < capacity.length; r++) {
      if (!(y[r] >= 0)) {
        throw new IllegalArgumentException("resource price " + r + " is " + y[r] + "; it must be >= 0");
      }
      v += y[r] * capacity[r];
    }
    int segs = demand.length;
    double[] t0 = new double[segs];
    int[] count = new int[segs];
    for (int s = 0; s < segs; s++) {
      t0[s] = Math.max(0.0, outside[s]);
    }
    double[] e = new double[n];
    for (int j = 0; j < n; j++) {
      double x = margin[j];
      double[] a = use[j];
      for (int r = 0; r < a.length; r++) {
        x -= a[r] * y[r];
      }
      e[j] = x;
      if (x > t0[segment[j]] && upper[j] > 0) {
        count[segment[j]]++;
      }
    }
    // Items per segment, best e first: split by segment into one array, then one sort per segment.
    int[] start = new int[segs + 1];
    for (int s = 0; s < segs; s++) {
      start[s + 1] = start[s] + count[s];
    }
    int[] fill = Arrays.copyOf(start, segs);
    int[] item = new int[start[segs]];
    for (int j = 0; j < n; j++) {
      int s = segment[j];
      if (e[j] > t0[s] && upper[j] > 0) {
        item[fill[s]++] = j;
      }
    }
    for (int s = 0; s < segs; s++) {
      int from = start[s];
      int to = start[s + 1];
      Integer[] order = new Integer[to - from];
      for (int i = from; i < to; i++) {
        order[i - from] = item[i];
      }
      Arrays.sort(order, (p, q) -> Double.compare(e[q], e[p]));
      double room = demand[s];
      double k = 0;
      for (int idx : order) {
        if (room <= 0) {
          break;
        }
        double take = Math.min(room, upper[idx]);
        k += e[idx] * take;
        room -= take;
      }
      k += Math.max(0.0, room) * t0[s];
      v += k;
    }
    return v;
  }
}
