package dev.mixwright.master;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;
import java.util.ArrayList;
import java.util.List;

/**
 * The restricted master LP on GLOP:
 *
 * <pre>
 *   max  Σ_j m_j x_j
 *   s.t. Σ_j a_rj x_j ≤ capacity_r      for every resource r   (dual π_r ≥ 0)
 *        Σ_{j in s} x_j ≤ demand_s       for every segment s    (dual μ_s ≥ 0)
 *        0 ≤ x_j ≤ u_j
 * and per segment that chooses, instead of its demand row, the sales-based LP (Gallego, Ratliff &amp;
 * Shebalov 2015, Operations Research 63(1):212–232):
 *        Σ_{j in s} x_j + x_s0 = buyers_s                    (dual μ_s, free)
 *        x_j − w_j·x_s0 ≤ 0   for each column j of s        (dual β_j ≥ 0)
 *        x_j ≥ 0, x_s0 ≥ 0 (margin 0), no other bound on x_j
 * </pre>
 *
 * Each choosing column brings its own row (column-and-row generation): with β = 0 on the rows of
 * absent columns the master's duals stay feasible for the full LP exactly when every absent column
 * prices out, so pricing keeps its shape (see {@code colgen.ColumnGeneration}).
 *
 * Columns are added one at a time into the live solver, so each re-solve warm-starts from the last
 * basis (measured: about 10x fewer simplex iterations than a cold solve at 50 rows × 2,000 columns).
 * x = 0 (with x_s0 = buyers_s) is always feasible, so the master is never infeasible. Not thread-safe; close it to free the
 * native solver.
 */
public final class RestrictedMaster implements AutoCloseable {
  private static final double FEASIBILITY_TOLERANCE = Rows.FEASIBILITY_TOLERANCE;

  private final Rows rows;
  private final double[] capacity;
  private final double[] demand;
  private final List<MPVariable> vars = new ArrayList<>();
  private final List<double[]> columnUse = new ArrayList<>();
  private final List<Integer> columnSegment = new ArrayList<>();
  private final List<Double> columnObjective = new ArrayList<>();
  private final boolean[] chooses;
  /** x_s0 per choosing segment, null for a fixed one. */
  private final MPVariable[] stay;
  /** Per column its attraction row x_j − w_j·x_s0 ≤ 0, null for a column of a fixed segment. */
  private final List<MPConstraint> attractionRows = new ArrayList<>();
  private final List<Double> attraction = new ArrayList<>();

  /**
   * @param capacity right-hand side of each resource row
   * @param demand right-hand side of each segment row (may be empty for a plain product-mix LP)
   */
  public RestrictedMaster(double[] capacity, double[] demand) {
    this(capacity, demand, new boolean[demand.length]);
  }

  /**
   * @param demand per segment its demand, or its buyers where {@code chooses[s]}
   * @param chooses per segment, whether its buyers choose (a buyers row and a stay-out column)
   */
  public RestrictedMaster(double[] capacity, double[] demand, boolean[] chooses) {
    if (chooses.length != demand.length) {
      throw new IllegalArgumentException("chooses has " + chooses.length + " entries, segments " + demand.length);
    }
    this.capacity = capacity.clone();
    this.demand = demand.clone();
    this.chooses = chooses.clone();
    rows = new Rows("GLOP", capacity, demand);
    stay = new MPVariable[demand.length];
    for (int s = 0; s < demand.length; s++) {
      if (chooses[s]) {
        stay[s] = rows.makeBuyersRow(s, demand[s]);
      }
    }
    // Without presolve GLOP re-solves incrementally from the previous basis.
    rows.solver.setSolverSpecificParametersAsString("use_preprocessing:false");
  }

  /**
   * Adds a column and returns its index.
   *
   * @param segment its segment row, or -1 for none
   * @param margin objective coefficient m_j
   * @param use resource use a_j, aligned with the capacity rows
   * @param upper upper bound u_j ({@code Double.POSITIVE_INFINITY} for none)
   */
  public int addColumn(int segment, double margin, double[] use, double upper) {
    if (segment >= 0 && chooses[segment]) {
      throw new IllegalArgumentException("segment " + segment + " chooses: add its columns with addChoiceColumn");
    }
    return add(segment, margin, use, upper, Double.NaN);
  }

  /**
   * Adds a column of a choosing segment with its row x_j − w_j·x_s0 ≤ 0, and returns its index.
   *
   * @param attraction w_j = exp(u_s(v) − stayOut_s) &gt; 0
   */
  public int addChoiceColumn(int segment, double margin, double[] use, double attraction) {
    if (segment < 0 || !chooses[segment]) {
      throw new IllegalArgumentException("segment " + segment + " does not choose: add its columns with addColumn");
    }
    if (!(attraction > 0) || Double.isInfinite(attraction)) {
      throw new IllegalArgumentException("attraction must be positive and finite, got " + attraction);
    }
    return add(segment, margin, use, Double.POSITIVE_INFINITY, attraction);
  }

  private int add(int segment, double margin, double[] use, double upper, double w) {
    int j = vars.size();
    MPVariable x = rows.addSales("x" + j, upper, segment, margin, use);
    vars.add(x);
    columnUse.add(use.clone());
    columnSegment.add(segment);
    columnObjective.add(margin);
    attraction.add(w);
    attractionRows.add(Double.isNaN(w) ? null : rows.addAttractionRow("w" + j, x, stay[segment], w));
    return j;
  }

  /** Changes a column's bounds ({@code 0, 0} retires it without removing it). */
  public void setColumnBounds(int j, double lower, double upper) {
    vars.get(j).setBounds(lower, upper);
  }

  /** Changes a resource row's capacity. */
  public void setCapacity(int r, double value) {
    capacity[r] = value;
    rows.setCapacity(r, value);
  }

  public int columnCount() {
    return vars.size();
  }

  /** Solves, verifies primal feasibility, and reads values and duals. */
  public MasterSolution solve() {
    MasterSolution sol = solveOnce();
    if (sol.status() == LpStatus.FAILED) {
      // Measured: GLOP's incremental re-solve without presolve can end ABNORMAL after some sequences
      // of added columns (seen with smoothed duals on a generated catalog); a cold start from
      // scratch then solves the same LP. reset() drops the basis, not the model.
      rows.solver.reset();
      sol = solveOnce();
    }
    return sol;
  }

  private MasterSolution solveOnce() {
    MPSolver.ResultStatus rs = rows.solver.solve();
    long iters = rows.solver.iterations();
    int n = vars.size();
    LpStatus status = Rows.lpStatus(rs);
    if (!status.isOptimal()) {
      return MasterSolution.failed(status, iters);
    }
    double[] x = new double[n];
    double[] rc = new double[n];
    boolean[] atUpper = new boolean[n];
    for (int j = 0; j < n; j++) {
      MPVariable v = vars.get(j);
      x[j] = v.solutionValue();
      rc[j] = v.reducedCost();
      atUpper[j] = v.basisStatus() == MPSolver.BasisStatus.AT_UPPER_BOUND;
    }
    double[] stayingOut = new double[demand.length];
    for (int s = 0; s < demand.length; s++) {
      stayingOut[s] = stay[s] == null ? Double.NaN : stay[s].solutionValue();
    }
    if (!verify(x, stayingOut)) {
      return MasterSolution.failed(LpStatus.FAILED, iters);
    }
    double[] pi = rows.resourceDuals();
    double[] mu = rows.segmentDuals(chooses);
    double[] beta = new double[n];
    for (int j = 0; j < n; j++) {
      MPConstraint row = attractionRows.get(j);
      beta[j] = row == null ? 0.0 : Rows.nonNegativeDual(row);
    }
    double z = 0;
    for (int j = 0; j < n; j++) {
      z += columnObjective.get(j) * x[j];
    }
    return new MasterSolution(LpStatus.OPTIMAL, z, x, rc, atUpper, pi, mu, beta, stayingOut, iters);
  }

  /** Checks the returned point against rows and bounds, scaled by the row's size. */
  private boolean verify(double[] x, double[] stayingOut) {
    double[] rowUse = new double[capacity.length];
    double[] segUse = new double[demand.length];
    for (int j = 0; j < x.length; j++) {
      MPVariable v = vars.get(j);
      double tol = FEASIBILITY_TOLERANCE * Math.max(1.0, Math.abs(v.ub() == Double.POSITIVE_INFINITY ? x[j] : v.ub()));
      if (x[j] < v.lb() - tol || x[j] > v.ub() + tol) {
        return false;
      }
      double[] a = columnUse.get(j);
      for (int r = 0; r < a.length; r++) {
        rowUse[r] += a[r] * x[j];
      }
      int s = columnSegment.get(j);
      if (s >= 0) {
        segUse[s] += x[j];
      }
      if (s >= 0 && chooses[s]
          && x[j] - attraction.get(j) * stayingOut[s] > FEASIBILITY_TOLERANCE * Math.max(1.0, demand[s])) {
        return false;
      }
    }
    for (int s = 0; s < demand.length; s++) {
      if (chooses[s]) {
        double tol = FEASIBILITY_TOLERANCE * Math.max(1.0, demand[s]);
        if (stayingOut[s] < -tol || Math.abs(segUse[s] + stayingOut[s] - demand[s]) > tol) {
          return false;
        }
        segUse[s] = 0;
      }
    }
    return Rows.within(rowUse, capacity) && Rows.within(segUse, demand);
  }

  @Override
  public void close() {
    rows.close();
  }
}
