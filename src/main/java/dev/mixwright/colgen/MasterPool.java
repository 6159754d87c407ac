package dev.mixwright.colgen;

import dev.mixwright.choice.Logit;
import dev.mixwright.master.MasterSolution;
import dev.mixwright.master.RestrictedMaster;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The restricted master's columns with what the loop needs beside the LP: per segment the keys
 * pricing must skip (the active columns), where each known variant sits, and the figures for the
 * Lagrangian bound on primitive arrays. A retired column keeps its place (bounds 0, so x stays
 * aligned with the columns) and leaves the skip set; found again, it is revived instead of added
 * twice. A column of a choosing segment enters with its attraction row and is never retired: its
 * row's dual β prices it, so it must stay excluded from pricing for as long as the row is there.
 */
final class MasterPool {
  private final VariantSpace space;
  private final RestrictedMaster master;
  private final LoopCounters counters;
  private final List<Column> columns = new ArrayList<>();
  private final List<Set<VariantKey>> active = new ArrayList<>();
  private final List<Map<VariantKey, Integer>> index = new ArrayList<>();
  private int[] segment = new int[64];
  private double[] margin = new double[64];
  private double[][] use = new double[64][];
  private double[] bound = new double[64];
  private int[] idle = new int[64];
  /** w of a choosing segment's column, NaN for a fixed segment's. */
  private double[] attr = new double[64];
  /** Per segment, the indices of its columns (the first {@code ofSegmentCount[s]}). */
  private final int[][] ofSegment;
  private final int[] ofSegmentCount;

  MasterPool(VariantSpace space, RestrictedMaster master, LoopCounters counters) {
    this.space = space;
    this.master = master;
    this.counters = counters;
    for (int s = 0; s < space.segmentCount(); s++) {
      active.add(new HashSet<>());
      index.add(new HashMap<>());
    }
    ofSegment = new int[space.segmentCount()][16];
    ofSegmentCount = new int[space.segmentCount()];
  }

  int size() {
    return columns.size();
  }

  /** Every column in the order it entered, retired ones included. */
  List<Column> columns() {
    return columns;
  }

  /** The keys of segment s's active columns: a live view for exclusion in pricing queries. */
  Set<VariantKey> active(int s) {
    return active.get(s);
  }

  /** Adds the column, or revives it when it was retired; a column already active is ignored. */
  void add(Column c) {
    VariantKey key = space.key(c.choices());
    Integer j = index.get(c.segment()).get(key);
    if (j != null) {
      if (active.get(c.segment()).add(key)) {
        master.setColumnBounds(j, 0, c.upper());
        bound[j] = c.upper();
        idle[j] = 0;
        counters.revived();
      }
      return;
    }
    int n = columns.size();
    if (n == segment.length) {
      grow(2 * n);
    }
    int s = c.segment();
    attr[n] = space.chooses(s) ? attraction(space, c.choices(), s) : Double.NaN;
    if (space.chooses(s)) {
      master.addChoiceColumn(s, c.margin(), c.use(), attr[n]);
    } else {
      master.addColumn(s, c.margin(), c.use(), c.upper());
    }
    columns.add(c);
    segment[n] = c.segment();
    margin[n] = c.margin();
    use[n] = c.use();
    bound[n] = c.upper();
    active.get(c.segment()).add(key);
    index.get(c.segment()).put(key, n);
    if (ofSegmentCount[s] == ofSegment[s].length) {
      ofSegment[s] = Arrays.copyOf(ofSegment[s], 2 * ofSegment[s].length);
    }
    ofSegment[s][ofSegmentCount[s]++] = n;
  }

  /** w_s(v) = exp(u_s(v) − stayOut_s) of a choosing segment s. */
  static double attraction(VariantSpace space, int[] v, int s) {
    return Logit.attraction(space.utility(v, s), space.stayOut(s));
  }

  private void grow(int cap) {
    segment = Arrays.copyOf(segment, cap);
    margin = Arrays.copyOf(margin, cap);
    use = Arrays.copyOf(use, cap);
    bound = Arrays.copyOf(bound, cap);
    idle = Arrays.copyOf(idle, cap);
    attr = Arrays.copyOf(attr, cap);
  }

  /**
   * R* of choosing segment s at resource prices π over its columns here and the candidates given
   * by their r = m − π·a and w ({@link Logit#bestOfferValue}): the revenue per buyer of the best
   * offer set of all of them. O((columns of s + candidates)·priced resources).
   */
  double bestOfferValue(int s, double[] pi, double[] candR, double[] candW) {
    int n = ofSegmentCount[s];
    double[] r = Arrays.copyOf(candR, candR.length + n);
    double[] w = Arrays.copyOf(candW, candW.length + n);
    int k = candR.length;
    int[] priced = new int[pi.length];
    int np = 0;
    for (int q = 0; q < pi.length; q++) {
      if (pi[q] != 0) {
        priced[np++] = q; // few resources bind; a zero price adds nothing to r
      }
    }
    for (int t = 0; t < n; t++) {
      int j = ofSegment[s][t];
      if (bound[j] == 0) {
        continue;
      }
      double v = margin[j];
      double[] a = use[j];
      for (int p = 0; p < np; p++) {
        v -= pi[priced[p]] * a[priced[p]];
      }
      r[k] = v;
      w[k] = attr[j];
      k++;
    }
    return Logit.bestOfferValue(r, w, k);
  }

  /** UB(y) of {@link LagrangianLpBound} over these columns; {@code outside} covers all others. */
  double lagrangianBound(LagrangianLpBound lb, double[] y, double[] outside) {
    return lb.bound(y, segment, margin, use, bound, columns.size(), outside);
  }

  /**
   * Retires columns at zero that do not pay at the current duals and have sat at zero for
   * {@code after} rounds. The solution stays optimal without a re-solve: x is unchanged and fewer
   * columns only drop dual constraints.
   */
  void retireIdle(MasterSolution sol, int after) {
    double[] x = sol.x();
    double[] rc = sol.reducedCost();
    for (int j = 0; j < columns.size(); j++) {
      if (bound[j] == 0 || space.chooses(segment[j])) {
        continue;
      }
      if (x[j] > 0) {
        idle[j] = 0;
      } else if (++idle[j] >= after && rc[j] < 0) {
        Column c = columns.get(j);
        master.setColumnBounds(j, 0, 0);
        bound[j] = 0;
        active.get(c.segment()).remove(space.key(c.choices()));
        counters.retired();
      }
    }
  }
}
