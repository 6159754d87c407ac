package dev.mixwright.master;

/** Outcome of one LP solve, in the product's terms. */
public enum LpStatus {
  OPTIMAL,
  INFEASIBLE,
  UNBOUNDED,
  /** The solver gave up or returned something that failed verification. */
  FAILED,
  /** The time it was given ran out before it finished. */
  STOPPED;

  public boolean isOptimal() {
    return this == OPTIMAL;
  }
}
