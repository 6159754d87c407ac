package dev.mixwright.master;

/**
 * A solved restricted master. Arrays are aligned with the master's rows and columns: {@code x[j]} and
 * {@code reducedCost[j]} per column in the order added; {@code resourceDual[r]} (π_r ≥ 0) per resource
 * row; {@code segmentDual[s]} per segment row (μ_s ≥ 0 for a demand row; free in sign for the buyers
 * row of a choosing segment); {@code columnDual[j]} (β_j ≥ 0) per column, the dual of its row
 * x_j − w_j·x_s0 ≤ 0 when its segment chooses, 0 for a column of a fixed segment; {@code
 * stayingOut[s]} x_s0, the buyers of a choosing segment who buy none (NaN for a fixed segment).
 * {@code dualObjective}: the objective of these duals, a bound on the restricted master's optimum;
 * equal to {@code objective} when the master was solved exactly, above it by what the offer sets not
 * yet added would still pay when it was solved with slack ({@link RestrictedMaster#solve(double)}).
 * Values and duals are present only when the status is optimal; otherwise the arrays are empty.
 */
public record MasterSolution(
    LpStatus status,
    double objective,
    double[] x,
    double[] reducedCost,
    boolean[] atUpper,
    double[] resourceDual,
    double[] segmentDual,
    double[] columnDual,
    double[] stayingOut,
    long simplexIterations,
    double dualObjective) {

  /** A solve that ended without an optimum: no values, no duals. */
  static MasterSolution failed(LpStatus status, long simplexIterations) {
    return new MasterSolution(status, Double.NaN, new double[0], new double[0], new boolean[0], new double[0],
        new double[0], new double[0], new double[0], simplexIterations, Double.NaN);
  }

  public boolean isOptimal() {
    return status.isOptimal();
  }
}
