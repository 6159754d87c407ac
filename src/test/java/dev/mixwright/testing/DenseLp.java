package dev.mixwright.testing;

import java.util.ArrayList;
import java.util.List;
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
 * A small dense LP {@code max c·x s.t. A_i·x ≤ b_i or = b_i, x ≥ 0}, solved with Apache Commons
 * Math 3.6.1 {@code SimplexSolver} together with its dual {@code min b·y s.t. Aᵀy ≥ c}, y_i ≥ 0 on
 * ≤ rows and free on = rows.
 * For tests only: the references of the choice model are built on it.
 *
 * <p>Commons Math gives no duals, hence the second solve; and it has pitfalls that {@link
 * EnumeratedLp} measured: the default 100 iterations are far too few, and Bland's rule has stopped
 * at a feasible, non-optimal vertex. So Dantzig's rule goes first and Bland's second, each point is
 * checked against its rows, and an answer is returned only when primal and dual values meet (strong
 * duality); otherwise {@link #solve} throws, since a reference that disagrees with itself proves
 * nothing. Cost: a dense tableau of (rows + cols)², meant for a few hundred variables.
 */
public final class DenseLp {
  private static final double TOLERANCE = 1e-7;
  private static final PivotSelectionRule[] RULES = {
    PivotSelectionRule.DANTZIG, PivotSelectionRule.BLAND
  };

  private final double[] c;
  private final List<double[]> rows = new ArrayList<>();
  private final List<Boolean> equality = new ArrayList<>();
  private final List<Double> rhs = new ArrayList<>();

  /** An LP with {@code c.length} variables and no rows yet. */
  public DenseLp(double[] c) {
    this.c = c.clone();
  }

  public int variables() {
    return c.length;
  }

  /** Adds {@code a·x ≤ b}; returns the row's index (the index of its dual). */
  public int lessOrEqual(double[] a, double b) {
    return add(a, b, false);
  }

  /** Adds {@code a·x = b}; returns the row's index. */
  public int equal(double[] a, double b) {
    return add(a, b, true);
  }

  private int add(double[] a, double b, boolean eq) {
    if (a.length != c.length) {
      throw new IllegalArgumentException("row of " + a.length + " entries for " + c.length + " variables");
    }
    rows.add(a.clone());
    equality.add(eq);
    rhs.add(b);
    return rows.size() - 1;
  }

  /** Optimal value, one optimal x, and one optimal y (aligned with the rows). */
  public record Solution(double objective, double[] x, double[] y) {}

  public Solution solve() {
    int m = rows.size();
    int n = c.length;
    double scale = 1;
    for (double b : rhs) {
      scale = Math.max(scale, Math.abs(b));
    }
    StringBuilder why = new StringBuilder();
    for (PivotSelectionRule rule : RULES) {
      double[] x = primal(rule);
      double[] y = dual(rule);
      if (x == null || y == null || !primalFeasible(x, scale) || !dualFeasible(y)) {
        why.append(String.format(
            " %s: primal %s, dual %s;", rule,
            x == null ? "iteration limit" : primalFeasible(x, scale) ? "feasible" : "infeasible",
            y == null ? "iteration limit" : dualFeasible(y) ? "feasible" : "infeasible"));
        continue;
      }
      double pv = 0;
      for (int j = 0; j < n; j++) {
        pv += c[j] * x[j];
      }
      double dv = 0;
      for (int i = 0; i < m; i++) {
        dv += rhs.get(i) * y[i];
      }
      if (Math.abs(pv - dv) <= TOLERANCE * Math.max(1, Math.abs(pv))) {
        return new Solution(pv, x, y);
      }
      why.append(String.format(" %s: primal %.12g, dual %.12g;", rule, pv, dv));
    }
    throw new IllegalStateException(
        "Commons Math did not solve the reference LP to matching primal and dual values:" + why);
  }

  private double[] primal(PivotSelectionRule rule) {
    List<LinearConstraint> cs = new ArrayList<>();
    for (int i = 0; i < rows.size(); i++) {
      cs.add(new LinearConstraint(rows.get(i), equality.get(i) ? Relationship.EQ : Relationship.LEQ, rhs.get(i)));
    }
    return run(new LinearObjectiveFunction(c, 0), cs, GoalType.MAXIMIZE, rule, true);
  }

  /**
   * The dual with unrestricted variables and explicit y_i ≥ 0 rows for the ≤ rows. Measured: with
   * each free y split into two non-negative parts Commons Math 3.6.1 stopped at a feasible dual
   * vertex of value 99376.44 against the optimum 964.29 (seed 208 of ChoiceReferencesTest).
   */
  private double[] dual(PivotSelectionRule rule) {
    int m = rows.size();
    double[] obj = new double[m];
    for (int i = 0; i < m; i++) {
      obj[i] = rhs.get(i);
    }
    List<LinearConstraint> cs = new ArrayList<>();
    for (int j = 0; j < c.length; j++) {
      double[] a = new double[m];
      for (int i = 0; i < m; i++) {
        a[i] = rows.get(i)[j];
      }
      cs.add(new LinearConstraint(a, Relationship.GEQ, c[j]));
    }
    for (int i = 0; i < m; i++) {
      if (!equality.get(i)) {
        double[] a = new double[m];
        a[i] = 1;
        cs.add(new LinearConstraint(a, Relationship.GEQ, 0));
      }
    }
    return run(new LinearObjectiveFunction(obj, 0), cs, GoalType.MINIMIZE, rule, false);
  }

  private static double[] run(
      LinearObjectiveFunction f,
      List<LinearConstraint> cs,
      GoalType goal,
      PivotSelectionRule rule,
      boolean nonNegative) {
    int vars = f.getCoefficients().getDimension();
    // The default limit (100 iterations) is far too small for these sizes.
    int maxIter = 50 * (cs.size() + vars) + 1000;
    try {
      PointValuePair p =
          new SimplexSolver()
              .optimize(
                  new MaxIter(maxIter),
                  f,
                  new LinearConstraintSet(cs),
                  goal,
                  new NonNegativeConstraint(nonNegative),
                  rule);
      return p.getPoint();
    } catch (TooManyIterationsException e) {
      return null;
    }
  }

  private boolean primalFeasible(double[] x, double scale) {
    double tol = TOLERANCE * scale;
    for (double xj : x) {
      if (xj < -tol) {
        return false;
      }
    }
    for (int i = 0; i < rows.size(); i++) {
      double lhs = 0;
      for (int j = 0; j < x.length; j++) {
        lhs += rows.get(i)[j] * x[j];
      }
      double gap = lhs - rhs.get(i);
      if (gap > tol || (equality.get(i) && gap < -tol)) {
        return false;
      }
    }
    return true;
  }

  private boolean dualFeasible(double[] y) {
    for (int i = 0; i < y.length; i++) {
      if (!equality.get(i) && y[i] < -TOLERANCE) {
        return false;
      }
    }
    for (int j = 0; j < c.length; j++) {
      double lhs = 0;
      for (int i = 0; i < y.length; i++) {
        lhs += rows.get(i)[j] * y[i];
      }
      if (lhs < c[j] - TOLERANCE * Math.max(1, Math.abs(c[j]))) {
        return false;
      }
    }
    return true;
  }
}
