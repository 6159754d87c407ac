package dev.mixwright.master;

/**
 * A solved restricted master. Arrays are aligned with the master's rows and columns: {@code x[j]} and
 * {@code reducedCost[j]} per column in the order added; {@code resourceDual[r]} (π_r ≥ 0) per resource
 * row; {@code segmentDual[s]} (μ_s ≥ 0) per segment row. Duals are present only when the status is
 * optimal; otherwise the arrays are empty.
 */
public record MasterSolution(
    LpStatus status,
    double objective,
    double[] x,
    double[] reducedCost,
    boolean[] atUpper,
    double[] resourceDual,
    double[] segmentDual,
    long simplexIterations) {

  public boolean isOptimal() {
    return status.isOptimal();
  }
}
