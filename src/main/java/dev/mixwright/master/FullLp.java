package dev.mixwright.master;

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
  private final Rows rows;
  private int columns;
  private LpStatus lastStatus;

  /** The outcome of the solve: status, objective, simplex iterations and the row duals. */
  public record Result(LpStatus status, double objective, long simplexIterations, double[] resourceDual,
      double[] segmentDual) {}

  /**
   * @param dualSimplex true for GLOP's dual simplex (the baseline's best setting), false for its
   *     default
   */
  public FullLp(double[] capacity, double[] demand, boolean dualSimplex) {
    rows = new Rows("GLOP", capacity, demand);
    if (dualSimplex) {
      rows.solver.setSolverSpecificParametersAsString("use_dual_simplex:true");
    }
  }

  /** Adds column j = (variant, segment) with margin m_j, use a_j and bound u_j. */
  public void addColumn(int segment, double margin, double[] use, double upper) {
    rows.addSales("", upper, segment, margin, use);
    columns++;
  }

  public int columnCount() {
    return columns;
  }

  public Result solve() {
    MPSolver.ResultStatus rs = rows.solver.solve();
    long iters = rows.solver.iterations();
    lastStatus = Rows.lpStatus(rs);
    if (lastStatus.isOptimal() && !rows.solver.verifySolution(1e-6, false)) {
      lastStatus = LpStatus.FAILED;
    }
    if (!lastStatus.isOptimal()) {
      return new Result(lastStatus, Double.NaN, iters, new double[0], new double[0]);
    }
    return new Result(LpStatus.OPTIMAL, rows.objective.value(), iters, rows.resourceDuals(),
        rows.segmentDuals());
  }

  /**
   * x_j per column in the order added, read from the solver on request (nothing per column is kept
   * here); only after a solve that ended optimal.
   */
  public double[] columnValues() {
    if (lastStatus == null || !lastStatus.isOptimal()) {
      throw new IllegalStateException("no optimal solution to read (last solve: " + lastStatus + ")");
    }
    MPVariable[] vars = rows.solver.variables();
    double[] x = new double[vars.length];
    for (int j = 0; j < x.length; j++) {
      x[j] = vars[j].solutionValue();
    }
    return x;
  }

  @Override
  public void close() {
    rows.close();
  }
}
