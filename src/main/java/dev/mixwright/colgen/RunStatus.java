package dev.mixwright.colgen;

/** How a solve ended. */
public enum RunStatus {
  /** The gap target was met: the LP optimum over the whole space is proven. */
  OPTIMAL,
  /** A limit or a signal ended the run first; the bound still holds and the run can resume. */
  STOPPED,
  /** Nothing can be sold: no buildable variant, or no segment accepts one. */
  INFEASIBLE;

  /** The word written to result.json: the name in lower case. */
  public String word() {
    return name().toLowerCase(java.util.Locale.ROOT);
  }

  public boolean isOptimal() {
    return this == OPTIMAL;
  }

  /** A limit or a signal ended the run; resuming it can go on from where it stopped. */
  public boolean isStopped() {
    return this == STOPPED;
  }

  public boolean isInfeasible() {
    return this == INFEASIBLE;
  }

  /** Nothing is left to do: the optimum is proven, or there is nothing to sell. */
  public boolean isFinished() {
    return this != STOPPED;
  }
}
