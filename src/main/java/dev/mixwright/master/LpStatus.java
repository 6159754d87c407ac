package dev.mixwright.master;

/** Outcome of one LP solve, in the product's terms. */
public enum LpStatus {
  OPTIMAL,
  INFEASIBLE,
  UNBOUNDED,
  /** The solver gave up or returned something that failed verification. */
  FAILED;

  public boolean isOptimal() {
    return this == OPTIMAL;
  }
}
