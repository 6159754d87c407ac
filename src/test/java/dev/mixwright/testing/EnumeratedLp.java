package dev.mixwright.testing;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Segment;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.apache.commons.math3.exception.TooManyIterationsException;
import org.apache.commons.math3.optim.MaxIter;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.linear.LinearConstraint;
import org.apache.commons.math3.optim.linear.LinearConstraintSet;
import org.apache.commons.math3.optim.linear.LinearObjectiveFunction;
import org.apache.commons.math3.optim.linear.NonNegativeConstraint;
import org.apache.commons.math3.optim.linear.PivotSelectionRule;
import org.apache.commons.math3.optim.linear.Relationship;
import org.apache.commons.math3.optim.linear.SimplexSolver;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;

/**
 * Independent reference for the master LP over the whole variant space, for tests only.
 *
 * <p>Every buildable (variant, segment) column is listed by an odometer over the choices, filtered
 * with {@link VariantSpace#isColumn}, and the full LP of PRODUCT.md is written out with every bound
 * as an explicit row:
 *
 * <pre>
 *   max  Σ_j m_j x_j
 *   s.t. Σ_j a_rj x_j ≤ capacity_r     (π_r)
 *        Σ_{j in s} x_j ≤ demand_s      (μ_s)
 *        x_j ≤ u_j = maxShare_s·demand_s (w_j)
 *        x ≥ 0
 * </pre>
 *
 * <p>It is solved with Apache Commons Math 3.6.1 {@code SimplexSolver} (dense tableau) — no code
 * shared with the GLOP master. Commons Math gives no duals, so the dual LP {@code min b·π + D·μ +
 * u·w s.t. a_j·π + μ_s(j) + w_j ≥ m_j, π, μ, w ≥ 0} is solved the same way. A primal point is kept
 * only if it satisfies every row, and the dual value is recomputed from (π, μ) with the best w, so
 * max primal ≤ z_LP ≤ min dual whatever the solver did; the answer is accepted only when the two
 * meet (strong duality), otherwise {@link #solve} throws, since a reference that disagrees with
 * itself proves nothing.
 *
 * <p>Cost: n columns ≤ S·Π_g choices; each tableau is about (R + S + n) × (2n + R + S) doubles and a
 * pivot touches all of it (measured: about 1.3 s at 880 columns, 0.1 s at 280), so this is meant
 * for a few hundred columns; {@link #MAX_COLUMNS} stops runaway sizes.
 */
public final class EnumeratedLp {
  /** Dense tableaus grow as n²; above this one solve would take minutes. */
  public static final int MAX_COLUMNS = 3000;

  private static final double STRONG_DUALITY_TOLERANCE = 1e-7;
  private static final double FEASIBILITY_TOLERANCE = 1e-7;

  /**
   * Dantzig's rule first; Bland's when it fails. Measured: with Bland's rule Commons Math 3.6.1
   * stopped at a feasible but non-optimal vertex of the Dakota dual at table price 35.001 (dual
   * value 280.0056 against 280.0016), while Dantzig's rule solved it.
   */
  private static final PivotSelectionRule[] RULES = {
    PivotSelectionRule.DANTZIG, PivotSelectionRule.BLAND
  };

  private EnumeratedLp() {}

  /** One column of the full master: variant {@code choices} sold in {@code segment}. */
  public record Column(
      int[] choices, VariantKey key, int segment, double margin, double[] use, double upper) {}

  /**
   * The solved full master. {@code x} is aligned with {@code columns}; {@code resourceDual} (π) and
   * {@code segmentDual} (μ) are one optimal solution of the dual LP — duals of a degenerate LP are
   * not unique, so compare another solver's duals through {@link Reference#dualBound}, not entry
   * by entry.
   */
  public record Reference(
      double objective,
      List<Column> columns,
      double[] x,
      double[] resourceDual,
      double[] segmentDual,
      double[] capacity,
      double[] demand) {

    public int columnCount() {
      return columns.size();
    }

    /** d_j = m_j − a_j·π − μ_s(j), computed from this class's own copy of the column data. */
    public double reducedCost(int j, double[] pi, double[] mu) {
      Column c = columns.get(j);
      double d = c.margin() - mu[c.segment()];
      for (int r = 0; r < pi.length; r++) {
        d -= pi[r] * c.use()[r];
      }
      return d;
    }

    /** Index of the column (key, segment), or -1 when that variant is not a column of segment s. */
    public int indexOf(int segment, VariantKey key) {
      for (int j = 0; j < columns.size(); j++) {
        Column c = columns.get(j);
        if (c.segment() == segment && c.key().equals(key)) {
          return j;
        }
      }
      return -1;
    }

    /**
     * Per segment s, the largest reduced cost at (π, μ) over the enumerated columns of s whose key is
     * not in {@code inMaster.get(s)}; {@code Double.NEGATIVE_INFINITY} when every column of s is in
     * it. This is d̄_s of the Lasdon-type bound, computed by brute force.
     */
    public double[] maxReducedCost(double[] pi, double[] mu, List<? extends Set<VariantKey>> inMaster) {
      if (inMaster.size() != demand.length) {
        throw new IllegalArgumentException(
            "inMaster has " + inMaster.size() + " sets, segments " + demand.length);
      }
      double[] best = new double[demand.length];
      Arrays.fill(best, Double.NEGATIVE_INFINITY);
      for (int j = 0; j < columns.size(); j++) {
        Column c = columns.get(j);
        if (!inMaster.get(c.segment()).contains(c.key())) {
          best[c.segment()] = Math.max(best[c.segment()], reducedCost(j, pi, mu));
        }
      }
      return best;
    }

    /**
     * The Lasdon-type bound z_RM + Σ_s demand_s·max(0, d̄_s) (Lasdon 1970; Lübbecke &amp; Desrosiers
     * 2005), with d̄_s from {@link #maxReducedCost}. Valid when (π, μ) are optimal duals of the
     * restricted master whose value is {@code zRm} and whose columns are {@code inMaster}.
     */
    public double lasdonBound(
        double zRm, double[] pi, double[] mu, List<? extends Set<VariantKey>> inMaster) {
      double[] best = maxReducedCost(pi, mu, inMaster);
      double bound = zRm;
      for (int s = 0; s < best.length; s++) {
        bound += demand[s] * Math.max(0.0, best[s]);
      }
      return bound;
    }

    /**
     * Value of the full dual LP at (π, μ) with the best w: b·π + D·μ + Σ_j u_j·max(0, d_j). An upper
     * bound on {@link #objective} for any π, μ ≥ 0 (weak duality), equal to it exactly at optimal
     * duals — the certificate to check another solver's duals with.
     */
    public double dualBound(double[] pi, double[] mu) {
      return dualValue(columns, capacity, demand, pi, mu);
    }

    /**
     * Lagrangian bound for resource prices y ≥ 0 with the segment rows kept: b·y + Σ_s K_s(y), where
     * K_s is the continuous knapsack "Σ x_j ≤ demand_s, 0 ≤ x_j ≤ u_j" filled greedily by m_j − a_j·y
     * (the form in PRODUCT.md). Valid for any y ≥ 0, equal to {@link #objective} at optimal π.
     */
    public double lagrangianBound(double[] y) {
      double v = 0;
      for (int r = 0; r < y.length; r++) {
        v += capacity[r] * y[r];
      }
      double[] zeroMu = new double[demand.length];
      for (int s = 0; s < demand.length; s++) {
        List<double[]> items = new ArrayList<>();
        for (int j = 0; j < columns.size(); j++) {
          if (columns.get(j).segment() == s) {
            double e = reducedCost(j, y, zeroMu);
            if (e > 0) {
              items.add(new double[] {e, columns.get(j).upper()});
            }
          }
        }
        items.sort((a, b) -> Double.compare(b[0], a[0]));
        double room = demand[s];
        for (double[] it : items) {
          if (room <= 0) {
            break;
          }
          double take = Math.min(room, it[1]);
          v += it[0] * take;
          room -= take;
        }
      }
      return v;
    }
  }

  /**
   * For fixed π the dual separates per segment into min over μ_s ≥ 0 of D_s·μ_s + Σ_j u_j·max(0,
   * e_j − μ_s), e_j = m_j − a_j·π: convex and piecewise linear, so its minimum lies at 0 or at one of
   * the e_j. Replacing μ by that minimiser only lowers the dual value. Needed because Commons Math
   * 3.6.1 returned a non-optimal dual vertex (μ = 20 where 0 was optimal, dual 12337 against 5617)
   * on a two-column LP; the polished point met strong duality.
   */
  private static void polishSegmentDuals(List<Column> cols, double[] demand, double[] pi, double[] mu) {
    for (int s = 0; s < demand.length; s++) {
      List<Double> e = new ArrayList<>();
      List<Double> u = new ArrayList<>();
      for (Column c : cols) {
        if (c.segment() == s) {
          double d = c.margin();
          for (int r = 0; r < pi.length; r++) {
            d -= pi[r] * c.use()[r];
          }
          e.add(d);
          u.add(c.upper());
        }
      }
      double bestMu = mu[s];
      double best = segmentDualValue(demand[s], bestMu, e, u);
      List<Double> candidates = new ArrayList<>(e);
      candidates.add(0.0);
      for (double t : candidates) {
        if (t >= 0) {
          double v = segmentDualValue(demand[s], t, e, u);
          if (v < best) {
            best = v;
            bestMu = t;
          }
        }
      }
      mu[s] = bestMu;
    }
  }

  private static double segmentDualValue(double demand, double mu, List<Double> e, List<Double> u) {
    double v = demand * mu;
    for (int j = 0; j < e.size(); j++) {
      v += u.get(j) * Math.max(0.0, e.get(j) - mu);
    }
    return v;
  }

  private static double dualValue(
      List<Column> cols, double[] capacity, double[] demand, double[] pi, double[] mu) {
    double v = 0;
    for (int r = 0; r < pi.length; r++) {
      v += capacity[r] * pi[r];
    }
    for (int s = 0; s < mu.length; s++) {
      v += demand[s] * mu[s];
    }
    for (Column c : cols) {
      double d = c.margin() - mu[c.segment()];
      for (int r = 0; r < pi.length; r++) {
        d -= pi[r] * c.use()[r];
      }
      v += c.upper() * Math.max(0.0, d);
    }
    return v;
  }

  /** Every buildable (variant, segment) column, in odometer order of the variants. */
  public static List<Column> columns(VariantSpace space) {
    Catalog catalog = space.catalog();
    int groups = space.groupCount();
    List<Column> out = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      if (space.choiceCount(g) == 0) {
        return out; // a required group without options: nothing is buildable
      }
    }
    int[] v = new int[groups];
    while (true) {
      for (int s = 0; s < space.segmentCount(); s++) {
        if (space.isColumn(v, s)) {
          Segment seg = catalog.segments().get(s);
          out.add(new Column(v.clone(), space.key(v), s, space.margin(v, s), space.use(v),
              seg.columnBound()));
          if (out.size() > MAX_COLUMNS) {
            throw new IllegalArgumentException(
                "more than " + MAX_COLUMNS + " columns: too large for the dense reference LP");
          }
        }
      }
      if (!Odometer.next(space, v)) {
        break;
      }
    }
    return out;
  }

  /** Enumerates, solves the full master and its dual, and cross-checks them. */
  public static Reference solve(VariantSpace space) {
    Catalog catalog = space.catalog();
    int nr = space.resourceCount();
    int ns = space.segmentCount();
    double[] capacity = new double[nr];
    for (int r = 0; r < nr; r++) {
      capacity[r] = catalog.resources().get(r).capacity();
    }
    double[] demand = new double[ns];
    for (int s = 0; s < ns; s++) {
      demand[s] = catalog.segments().get(s).demand();
    }
    List<Column> cols = Collections.unmodifiableList(columns(space));
    int n = cols.size();
    if (n == 0) {
      // Nothing to sell: z = 0, and π = μ = 0 is dual optimal (the dual has no constraints).
      return new Reference(0.0, cols, new double[0], new double[nr], new double[ns], capacity, demand);
    }
    // Primal and dual points are kept only when feasible, so max primal ≤ z_LP ≤ min dual holds
    // whatever the solver did; when the two meet, both are optimal.
    double[] bestX = null;
    double bestZ = Double.NEGATIVE_INFINITY;
    double[] bestPi = null;
    double[] bestMu = null;
    double bestDual = Double.POSITIVE_INFINITY;
    String gap = "";
    for (PivotSelectionRule rule : RULES) {
      double[] x = solvePrimal(cols, capacity, demand, rule);
      if (x != null && feasible(cols, x, capacity, demand)) {
        double z = 0;
        for (int j = 0; j < n; j++) {
          z += cols.get(j).margin() * x[j];
        }
        if (z > bestZ) {
          bestZ = z;
          bestX = x;
        }
      }
      double[] dual = solveDual(cols, capacity, demand, rule);
      if (dual != null) {
        double[] pi = new double[nr];
        double[] mu = new double[ns];
        for (int r = 0; r < nr; r++) {
          pi[r] = Math.max(0.0, dual[r]);
        }
        for (int s = 0; s < ns; s++) {
          mu[s] = Math.max(0.0, dual[nr + s]);
        }
        polishSegmentDuals(cols, demand, pi, mu);
        // With w_j = max(0, d_j) every π, μ ≥ 0 is dual feasible, so this value is a valid bound.
        double dz = dualValue(cols, capacity, demand, pi, mu);
        if (dz < bestDual) {
          bestDual = dz;
          bestPi = pi;
          bestMu = mu;
        }
      }
      if (bestX != null
          && bestDual - bestZ <= STRONG_DUALITY_TOLERANCE * Math.max(1.0, Math.abs(bestZ))) {
        return new Reference(bestZ, cols, bestX, bestPi, bestMu, capacity, demand);
      }
      gap += " " + rule + ": primal " + bestZ + ", dual " + bestDual + ";";
    }
    throw new IllegalStateException("reference LP did not reach strong duality:" + gap);
  }

  private static double[] solvePrimal(
      List<Column> cols, double[] capacity, double[] demand, PivotSelectionRule rule) {
    int n = cols.size();
    double[] m = new double[n];
    for (int j = 0; j < n; j++) {
      m[j] = cols.get(j).margin();
    }
    List<LinearConstraint> rows = new ArrayList<>();
    for (int r = 0; r < capacity.length; r++) {
      double[] a = new double[n];
      for (int j = 0; j < n; j++) {
        a[j] = cols.get(j).use()[r];
      }
      rows.add(new LinearConstraint(a, Relationship.LEQ, capacity[r]));
    }
    for (int s = 0; s < demand.length; s++) {
      double[] a = new double[n];
      for (int j = 0; j < n; j++) {
        a[j] = cols.get(j).segment() == s ? 1.0 : 0.0;
      }
      rows.add(new LinearConstraint(a, Relationship.LEQ, demand[s]));
    }
    for (int j = 0; j < n; j++) {
      double[] a = new double[n];
      a[j] = 1.0;
      rows.add(new LinearConstraint(a, Relationship.LEQ, cols.get(j).upper()));
    }
    return run(new LinearObjectiveFunction(m, 0.0), rows, GoalType.MAXIMIZE, n, rule);
  }

  /**
   * Variables (π_1..π_R, μ_1..μ_S, w_1..w_n), returned in that layout. A resource no column uses, or
   * a segment with no column, has π_r = 0 (μ_s = 0) at every optimum (its cost is ≥ 0 and it appears
   * in no row), so it is left out of the LP: measured, Commons Math 3.6.1 returned a non-optimal
   * point (dual 12337 against 5617) on a two-column LP with such an all-zero variable.
   */
  private static double[] solveDual(
      List<Column> cols, double[] capacity, double[] demand, PivotSelectionRule rule) {
    int n = cols.size();
    int nr = capacity.length;
    int ns = demand.length;
    int[] varOf = new int[nr + ns];
    Arrays.fill(varOf, -1);
    int nv = 0;
    for (int r = 0; r < nr; r++) {
      for (Column col : cols) {
        if (col.use()[r] != 0.0) {
          varOf[r] = nv++;
          break;
        }
      }
    }
    for (int s = 0; s < ns; s++) {
      for (Column col : cols) {
        if (col.segment() == s) {
          varOf[nr + s] = nv++;
          break;
        }
      }
    }
    int first = nv;
    nv += n;
    double[] c = new double[nv];
    for (int r = 0; r < nr; r++) {
      if (varOf[r] >= 0) {
        c[varOf[r]] = capacity[r];
      }
    }
    for (int s = 0; s < ns; s++) {
      if (varOf[nr + s] >= 0) {
        c[varOf[nr + s]] = demand[s];
      }
    }
    for (int j = 0; j < n; j++) {
      c[first + j] = cols.get(j).upper();
    }
    List<LinearConstraint> rows = new ArrayList<>();
    for (int j = 0; j < n; j++) {
      Column col = cols.get(j);
      double[] a = new double[nv];
      for (int r = 0; r < nr; r++) {
        if (varOf[r] >= 0) {
          a[varOf[r]] = col.use()[r];
        }
      }
      a[varOf[nr + col.segment()]] = 1.0;
      a[first + j] = 1.0;
      rows.add(new LinearConstraint(a, Relationship.GEQ, col.margin()));
    }
    double[] p = run(new LinearObjectiveFunction(c, 0.0), rows, GoalType.MINIMIZE, nv, rule);
    if (p == null) {
      return null;
    }
    double[] out = new double[nr + ns + n];
    for (int i = 0; i < nr + ns; i++) {
      out[i] = varOf[i] >= 0 ? p[varOf[i]] : 0.0;
    }
    System.arraycopy(p, first, out, nr + ns, n);
    return out;
  }

  /** The point found, or null when the iteration limit was hit (the next rule gets a try). */
  private static double[] run(
      LinearObjectiveFunction f,
      List<LinearConstraint> rows,
      GoalType goal,
      int vars,
      PivotSelectionRule rule) {
    // The default limit (100 iterations) is far too small for these sizes.
    int maxIter = 50 * (rows.size() + vars) + 1000;
    try {
      PointValuePair p =
          new SimplexSolver()
              .optimize(
                  new MaxIter(maxIter),
                  f,
                  new LinearConstraintSet(rows),
                  goal,
                  new NonNegativeConstraint(true),
                  rule);
      return p.getPoint();
    } catch (TooManyIterationsException e) {
      return null;
    }
  }

  private static boolean feasible(
      List<Column> cols, double[] x, double[] capacity, double[] demand) {
    double[] used = new double[capacity.length];
    double[] sold = new double[demand.length];
    for (int j = 0; j < cols.size(); j++) {
      Column c = cols.get(j);
      double tol = FEASIBILITY_TOLERANCE * Math.max(1.0, c.upper());
      if (x[j] < -tol || x[j] > c.upper() + tol) {
        return false;
      }
      for (int r = 0; r < used.length; r++) {
        used[r] += c.use()[r] * x[j];
      }
      sold[c.segment()] += x[j];
    }
    for (int r = 0; r < used.length; r++) {
      if (used[r] > capacity[r] + FEASIBILITY_TOLERANCE * Math.max(1.0, capacity[r])) {
        return false;
      }
    }
    for (int s = 0; s < sold.length; s++) {
      if (sold[s] > demand[s] + FEASIBILITY_TOLERANCE * Math.max(1.0, demand[s])) {
        return false;
      }
    }
    return true;
  }

  /** Keys of the given columns, one set per segment (for {@link Reference#maxReducedCost}). */
  public static List<Set<VariantKey>> keysBySegment(List<Column> columns, int segments) {
    List<Set<VariantKey>> out = new ArrayList<>();
    for (int s = 0; s < segments; s++) {
      out.add(new HashSet<>());
    }
    for (Column c : columns) {
      out.get(c.segment()).add(c.key());
    }
    return out;
  }
}
