package dev.mixwright.master;

import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;

/**
 * The whole master LP with every column written out, solved once: the approach a planner tries
 * first, kept as the benchmark's baseline (same rows as {@link RestrictedMaster}), on GLOP or on
 * HiGHS (both through MPSolver; see {@link Solver}).
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
  private final Solver solver;
  private int columns;
  private LpStatus lastStatus;

  /**
   * The outcome of the solve: status, objective, simplex iterations and the row duals (empty when
   * the solve was not optimal or the solver's duals are not read, see {@link Solver#readsDuals}).
   */
  public record Result(LpStatus status, double objective, long simplexIterations, double[] resourceDual,
      double[] segmentDual) {}

  /** The LP solver that solves the full LP, with its setting. */
  public enum Solver {
    /** GLOP with its dual simplex: the baseline's best GLOP setting. */
    GLOP_DUAL("GLOP", "use_dual_simplex:true"),
    /** GLOP with its default (primal) simplex. */
    GLOP("GLOP", ""),
    /**
     * HiGHS through MPSolver with its defaults (it picks its own simplex and presolve). In OR-Tools
     * 9.14 it ignores MPSolver's time limit, so it is only handed LPs it can finish, and a row's
     * dual value reads back the row's activity (measured: max 2x + y, x + y ≤ 3 gives 3.0 where
     * GLOP gives the true 2.0), so its duals are not returned. It prints a banner on stdout that
     * no MPSolver setting silences.
     */
    HIGHS("HIGHS", "", false);

    private final String id;
    private final String parameters;
    private final boolean duals;

    Solver(String id, String parameters) {
      this(id, parameters, true);
    }

    Solver(String id, String parameters, boolean duals) {
      this.id = id;
      this.parameters = parameters;
      this.duals = duals;
    }

    /** Whether the row duals it returns are the LP's dual values. */
    public boolean readsDuals() {
      return duals;
    }

    /** The name a table prints. */
    public String word() {
      return this == GLOP_DUAL ? "GLOP (dual simplex)" : this == GLOP ? "GLOP" : "HiGHS";
    }
  }

  /** @param solver which LP solver solves it */
  public FullLp(double[] capacity, double[] demand, Solver solver) {
    this.solver = solver;
    rows = new Rows(solver.id, capacity, demand);
    if (!solver.parameters.isEmpty()) {
      rows.solver.setSolverSpecificParametersAsString(solver.parameters);
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
    if (columns == 0 && !solver.readsDuals()) {
      // HiGHS ends an LP without columns with a status (99) MPSolver's Java enum does not know, and
      // reading that solver afterwards aborts the JVM; nothing sold is the optimum, at duals 0
      lastStatus = LpStatus.OPTIMAL;
      return new Result(LpStatus.OPTIMAL, 0, 0, new double[0], new double[0]);
    }
    MPSolver.ResultStatus rs = rows.solver.solve();
    long iters = rows.solver.iterations();
    lastStatus = Rows.lpStatus(rs);
    if (lastStatus.isOptimal() && !rows.solver.verifySolution(1e-6, false)) {
      lastStatus = LpStatus.FAILED;
    }
    if (!lastStatus.isOptimal()) {
      return new Result(lastStatus, Double.NaN, iters, new double[0], new double[0]);
    }
    if (!solver.readsDuals()) {
      return new Result(LpStatus.OPTIMAL, rows.objective.value(), iters, new double[0], new double[0]);
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
