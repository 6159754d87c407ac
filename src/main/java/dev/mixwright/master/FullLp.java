package dev.mixwright.master;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;

/**
 * The whole master LP with every column written out, solved once on GLOP: the approach a planner
 * tries first, kept as the benchmark's baseline (same rows as {@link RestrictedMaster}).
 *
 * <p>GLOP runs with its dual simplex ({@code use_dual_simplex:true}), which was far faster than the
 * default primal simplex on this LP in measurement (see docs/performance.md): with 0 ≤ x ≤ u and
 * x = 0 feasible, the slack basis is dual feasible after bound flipping, so the dual simplex starts
 * without a phase 1. Presolve stays on: the model is solved once. No per-column data is kept on the
 * Java side; the answer is checked with the solver's own feasibility verification instead. Not
 * thread-safe; close it to free the native solver.
 */
public final class FullLp implements AutoCloseable {
  private final MPSolver solver;
  private final MPObjective objective;
  private final MPConstraint[] resourceRows;
  private final MPConstraint[] segmentRows;
  private int columns;
  private boolean closed;

  /** The outcome of the solve: status, objective, simplex iterations and the row duals. */
  public record Result(LpStatus status, double objective, long simplexIterations, double[] resourceDual,
      double[] segmentDual) {}

  /**
   * @param dualSimplex true for GLOP's dual simplex (the baseline's best setting), false for its
   *     default
   */
  public FullLp(double[] capacity, double[] demand, boolean dualSimplex) {
    solver = Rows.solver("GLOP");
    if (dualSimplex) {
      solver.setSolverSpecificParametersAsString("use_dual_simplex:true");
    }
    objective = solver.objective();
    objective.setMaximization();
    resourceRows = Rows.atMost(solver, capacity, "r");
    segmentRows = Rows.atMost(solver, demand, "s");
  }

  /** Adds column j = (variant, segment) with margin m_j, use a_j and bound u_j. */
  public void addColumn(int segment, double margin, double[] use, double upper) {
    if (use.length != resourceRows.length) {
      throw new IllegalArgumentException("use has " + use.length + " entries, rows " + resourceRows.length);
    }
    MPVariable x = solver.makeNumVar(0.0, upper, "");
    objective.setCoefficient(x, margin);
    for (int r = 0; r < use.length; r++) {
      if (use[r] != 0.0) {
        resourceRows[r].setCoefficient(x, use[r]);
      }
    }
    segmentRows[segment].setCoefficient(x, 1.0);
    columns++;
  }

  public int columnCount() {
    return columns;
  }

  public Result solve() {
    MPSolver.ResultStatus rs = solver.solve();
    long iters = solver.iterations();
    if (rs != MPSolver.ResultStatus.OPTIMAL) {
      LpStatus st = switch (rs) {
        case INFEASIBLE -> LpStatus.INFEASIBLE;
        case UNBOUNDED -> LpStatus.UNBOUNDED;
        default -> LpStatus.FAILED;
      };
      return new Result(st, Double.NaN, iters, new double[0], new double[0]);
    }
    if (!solver.verifySolution(1e-6, false)) {
      return new Result(LpStatus.FAILED, Double.NaN, iters, new double[0], new double[0]);
    }
    double[] pi = new double[resourceRows.length];
    for (int r = 0; r < pi.length; r++) {
      pi[r] = Math.max(0.0, resourceRows[r].dualValue());
    }
    double[] mu = new double[segmentRows.length];
    for (int s = 0; s < mu.length; s++) {
      mu[s] = Math.max(0.0, segmentRows[s].dualValue());
    }
    return new Result(LpStatus.OPTIMAL, objective.value(), iters, pi, mu);
  }

  @Override
  public void close() {
    if (!closed) {
      closed = true;
      solver.delete();
    }
  }
}
