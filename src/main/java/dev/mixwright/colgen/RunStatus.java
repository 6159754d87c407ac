package dev.mixwright.colgen;

/** How a solve ended. */
public enum RunStatus {
  /** The gap target was met: the LP optimum over the whole space is proven. */
  OPTIMAL("optimal"),
  /** A limit or a signal ended the run first; the bound still holds and the run can resume. */
  STOPPED("stopped"),
  /** Nothing can be sold: no buildable variant, or no segment accepts one. */
  INFEASIBLE("infeasible");

  private final String word;

  RunStatus(String word) {
    this.word = word;
  }

  /** The word written to result.json. */
  public String word() {
    return word;
  }

  public boolean isOptimal() {
    return this == OPTIMAL;
  }
}
