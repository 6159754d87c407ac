package dev.mixwright.master;

/** How a MIP solve ended, in the product's terms. */
public enum MipStatus {
  /** Optimal to the requested gap. */
  OPTIMAL,
  /** A time limit stopped it with a solution in hand. */
  FEASIBLE,
  /** A time limit stopped it before any solution. */
  NO_SOLUTION,
  INFEASIBLE,
  /** The solver failed or returned a point that did not pass the checks. */
  FAILED;

  public boolean hasSolution() {
    return this == OPTIMAL || this == FEASIBLE;
  }
}
