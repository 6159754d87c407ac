package dev.mixwright.master;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;

/**
 * What every solver wrapper here shares: the solver itself, a maximised objective, the "use ≤
 * capacity" and "sold ≤ demand" rows of the product-mix LP (and the variant limit of the
 * portfolio), how a sales column or a variant block enters them, their duals, and the check run on
 * a returned point before anything reads its duals. Each wrapper owns one and closes it.
 */
final class Rows implements AutoCloseable {
  /** Slack allowed on a row, relative to the size of its right-hand side (at least 1). */
  static final double FEASIBILITY_TOLERANCE = 1e-6;

  final MPSolver solver;
  final MPObjective objective;
  private final MPConstraint[] resourceRows;
  private final MPConstraint[] segmentRows;
  /** Σ_v y_v ≤ K, or null when there is no limit. */
  private final MPConstraint limitRow;
  /** The worst scenario's margin when the objective is the epigraph ({@link #epigraph}), else null. */
  private MPVariable worst;
  private boolean closed;
  /** Empty free rows made ahead for {@link #row} when {@link #reserveRows} is on. */
  private final java.util.ArrayDeque<MPConstraint> spare = new java.util.ArrayDeque<>();
  private boolean reserve;
  private int spareMade;

  /** The rows of the product-mix LP, without a variant limit. */
  Rows(String solverId, double[] capacity, double[] demand) {
    this(solverId, capacity, demand, Integer.MAX_VALUE);
  }

  /**
   * @param solverId an OR-Tools solver ({@code GLOP}, {@code SCIP}, {@code CP_SAT}, ...)
   * @param variantLimit K of the portfolio, {@code Integer.MAX_VALUE} for none
   */
  Rows(String solverId, double[] capacity, double[] demand, int variantLimit) {
    solver = solver(solverId);
    objective = solver.objective();
    objective.setMaximization();
    resourceRows = atMost(solver, capacity, "r");
    segmentRows = atMost(solver, demand, "s");
    limitRow = variantLimit == Integer.MAX_VALUE ? null
        : solver.makeConstraint(Double.NEGATIVE_INFINITY, variantLimit, "limit");
  }

  /**
   * From now on {@link #row} hands out rows made ahead in batches. GLOP warm-starts from its last
   * basis when the new model has the same rows and the old columns unchanged (new columns may fill
   * existing rows); a model with more rows starts from scratch. Measured on the branch-and-price
   * masters of the tight family at 10^12 variants (one run each): re-solves after a node's new
   * variants entered took 837 simplex iterations on average with new rows, 904 from scratch, and 695
   * with rows made ahead (21.9 ms against 16.5 ms a solve; GLOP had been 55 % of the tree's time). An
   * empty row with free bounds changes nothing; its slack stays basic until a block takes it.
   */
  void reserveRows() {
    reserve = true;
  }

  /**
   * A row lo ≤ Σ ≤ hi with no coefficients yet: a new one, or with {@link #reserveRows} one made
   * ahead (a batch as large as the rows so far, at least 64, when none is left).
   */
  MPConstraint row(double lo, double hi, String name) {
    if (!reserve) {
      return solver.makeConstraint(lo, hi, name);
    }
    if (spare.isEmpty()) {
      int n = Math.max(64, solver.numConstraints());
      for (int k = 0; k < n; k++) {
        spare.add(solver.makeConstraint(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, "spare" + spareMade++));
      }
    }
    MPConstraint c = spare.poll();
    c.setBounds(lo, hi);
    return c;
  }

  /** A fresh OR-Tools solver ({@code GLOP}, {@code SCIP}, {@code CP_SAT}, ...), natives loaded. */
  static MPSolver solver(String id) {
    Natives.load();
    MPSolver solver = MPSolver.createSolver(id);
    if (solver == null) {
      throw new IllegalStateException("OR-Tools has no " + id + " solver in this build");
    }
    return solver;
  }

  /** One row {@code Σ ≤ rhs[i]} per entry, named {@code prefix + i}, with no coefficients yet. */
  static MPConstraint[] atMost(MPSolver solver, double[] rhs, String prefix) {
    MPConstraint[] out = new MPConstraint[rhs.length];
    for (int i = 0; i < rhs.length; i++) {
      out[i] = solver.makeConstraint(Double.NEGATIVE_INFINITY, rhs[i], prefix + i);
    }
    return out;
  }

  /** True when every row's use stays within its right-hand side, up to the scaled tolerance. */
  static boolean within(double[] use, double[] rhs) {
    for (int i = 0; i < use.length; i++) {
      if (use[i] > rhs[i] + FEASIBILITY_TOLERANCE * Math.max(1.0, Math.abs(rhs[i]))) {
        return false;
      }
    }
    return true;
  }

  /** How an LP solve ended, in the product's terms. */
  static LpStatus lpStatus(MPSolver.ResultStatus rs) {
    return switch (rs) {
      case OPTIMAL -> LpStatus.OPTIMAL;
      case INFEASIBLE -> LpStatus.INFEASIBLE;
      case UNBOUNDED -> LpStatus.UNBOUNDED;
      default -> LpStatus.FAILED;
    };
  }

  /**
   * A new sales column 0 ≤ x_j ≤ u_j entered in the rows: margin m_j in the objective, use a_j in
   * the resource rows, 1 in the row of its segment ({@code segment} −1 for none).
   */
  MPVariable addSales(String name, double upper, int segment, double margin, double[] use) {
    checkUse(use);
    MPVariable x = solver.makeNumVar(0.0, upper, name);
    objective.setCoefficient(x, margin);
    for (int r = 0; r < use.length; r++) {
      if (use[r] != 0.0) {
        resourceRows[r].setCoefficient(x, use[r]);
      }
    }
    if (segment >= 0) {
      segmentRows[segment].setCoefficient(x, 1.0);
    }
    return x;
  }

  /**
   * Enters variant block i around its introduction variable y (continuous for the relaxation,
   * binary for the MIP): − F_v y in the objective, y in the limit row, the minimum lot row
   * {@code L_v y − Σ_s x_s ≤ 0} when L_v &gt; 0, and per listed segment a sales column
   * 0 ≤ x_s ≤ u_s with its link row {@code x_s − u_s y ≤ 0}. Returns the sales columns in the order
   * of {@code segments}.
   */
  MPVariable[] addBlock(int i, MPVariable y, int[] segments, double[] margin, double[] use, double[] upper,
      double fixedCost, double minLot) {
    double[][] each = new double[segments.length][];
    java.util.Arrays.fill(each, use);
    return addBlock(i, y, segments, margin, each, upper, fixedCost, new double[] {minLot}, new int[segments.length],
        null);
  }

  /**
   * The general block, for a range chosen across scenarios (the rows then stack every scenario's
   * resources and segments): entry k is a sales column in segment row {@code segments[k]} using
   * {@code use[k]}, and belongs to lot group {@code lotOf[k]} (its scenario), whose row is
   * {@code minLot[g] y − Σ_{k in g} x_k ≤ 0}. With {@code marginRows} the margins go into those rows
   * (row g: t − Σ_{k in g} m_k x_k ≤ 0, the epigraph of the worst scenario) instead of the objective.
   */
  MPVariable[] addBlock(int i, MPVariable y, int[] segments, double[] margin, double[][] use, double[] upper,
      double fixedCost, double[] minLot, int[] lotOf, MPConstraint[] marginRows) {
    objective.setCoefficient(y, -fixedCost);
    if (limitRow != null) {
      limitRow.setCoefficient(y, 1.0);
    }
    MPConstraint[] lot = new MPConstraint[minLot.length];
    for (int g = 0; g < lot.length; g++) {
      if (minLot[g] > 0) {
        lot[g] = row(Double.NEGATIVE_INFINITY, 0.0, "lot" + i + (lot.length > 1 ? "_" + g : ""));
        lot[g].setCoefficient(y, minLot[g]);
      }
    }
    MPVariable[] x = new MPVariable[segments.length];
    for (int k = 0; k < segments.length; k++) {
      x[k] = addSales("x" + i + "_" + segments[k], upper[k], segments[k], margin[k], use[k]);
      if (marginRows != null) {
        objective.setCoefficient(x[k], 0.0);
        marginRows[lotOf[k]].setCoefficient(x[k], -margin[k]);
      }
      MPConstraint link = row(Double.NEGATIVE_INFINITY, 0.0, "link" + i + "_" + segments[k]);
      link.setCoefficient(x[k], 1.0);
      link.setCoefficient(y, -upper[k]);
      if (lot[lotOf[k]] != null) {
        lot[lotOf[k]].setCoefficient(x[k], -1.0);
      }
    }
    return x;
  }

  /**
   * The worst of {@code n} scenarios as the objective: a free t with coefficient 1 and one row
   * {@code t − (scenario g's margin) ≤ 0} per scenario, whose margins {@link #addBlock} enters. The
   * rows' duals ρ_g ≥ 0 sum to 1 at an optimum (t's column), so they weigh the scenarios.
   */
  MPConstraint[] epigraph(int n) {
    MPVariable t = solver.makeNumVar(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, "worst");
    objective.setCoefficient(t, 1.0);
    MPConstraint[] out = new MPConstraint[n];
    for (int g = 0; g < n; g++) {
      out[g] = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0.0, "worst" + g);
      out[g].setCoefficient(t, 1.0);
    }
    worst = t;
    return out;
  }

  /** The epigraph's t after a solve, NaN without one. */
  double worstValue() {
    return worst == null ? Double.NaN : worst.solutionValue();
  }

  /** Each row's dual clamped at 0 (the epigraph's ρ_g after an optimal LP solve). */
  static double[] nonNegativeDuals(MPConstraint[] rows) {
    return duals(rows);
  }

  /**
   * Turns segment row s into the buyers row of a segment that chooses, Σ_j x_j + x_s0 = buyers
   * (Gallego, Ratliff &amp; Shebalov 2015), and returns its stay-out variable x_s0 ≥ 0 (margin 0).
   */
  MPVariable makeBuyersRow(int s, double buyers) {
    segmentRows[s].setBounds(buyers, buyers);
    MPVariable stay = solver.makeNumVar(0.0, Double.POSITIVE_INFINITY, "stay" + s);
    segmentRows[s].setCoefficient(stay, 1.0);
    return stay;
  }

  /**
   * The row of a choosing segment's column, x_j − w_j·x_s0 ≤ 0: the column sells at most w_j times
   * what stays out, the multinomial logit's ratio (its dual β_j ≥ 0).
   */
  MPConstraint addAttractionRow(String name, MPVariable x, MPVariable stay, double attraction) {
    MPConstraint row = row(Double.NEGATIVE_INFINITY, 0.0, name);
    row.setCoefficient(x, 1.0);
    row.setCoefficient(stay, -attraction);
    return row;
  }

  /** Moves the right-hand side of resource row r. */
  void setCapacity(int r, double value) {
    resourceRows[r].setUb(value);
  }

  private void checkUse(double[] use) {
    if (use.length != resourceRows.length) {
      throw new IllegalArgumentException("use has " + use.length + " entries, rows " + resourceRows.length);
    }
  }

  boolean hasLimit() {
    return limitRow != null;
  }

  /** π_r ≥ 0 per resource row, after an optimal LP solve (a negative zero from the solver reads 0). */
  double[] resourceDuals() {
    return duals(resourceRows);
  }

  /** A row's dual clamped at 0 (a negative zero or round-off of a ≤ row of a maximisation reads 0). */
  static double nonNegativeDual(MPConstraint row) {
    return Math.max(0.0, row.dualValue());
  }

  /** μ_s ≥ 0 per segment row, after an optimal LP solve. */
  double[] segmentDuals() {
    return duals(segmentRows);
  }

  /** λ ≥ 0 of the variant limit, 0 when there is none. */
  double limitDual() {
    return limitRow == null ? 0.0 : Math.max(0.0, limitRow.dualValue());
  }

  private static double[] duals(MPConstraint[] rows) {
    double[] out = new double[rows.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = nonNegativeDual(rows[i]);
    }
    return out;
  }

  @Override
  public void close() {
    if (!closed) {
      closed = true;
      solver.delete();
    }
  }
}
