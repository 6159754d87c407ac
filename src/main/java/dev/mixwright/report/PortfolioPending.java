package dev.mixwright.report;

/**
 * The words for a portfolio that a run owes but has not written yet, shared by result.json's
 * {@code portfolioPending} field and every command that shows a run ({@code solve}, {@code report},
 * {@code explain}, {@code compare}), so that none of them calls such a run finished.
 */
public final class PortfolioPending {
  private PortfolioPending() {}

  /** Written to result.json before the integer stage starts; still there if the run is cut off during it. */
  public static final String RUNNING = "the integer stage began and has not ended (a run cut off during it"
      + " leaves this); 'mixwright resume' on this folder runs it and writes the portfolio";

  /** A signal ended the stage early: its best portfolio so far is written, and resume goes on with it. */
  public static final String INTERRUPTED = "the integer stage was interrupted by a signal; the portfolio"
      + " written is its best so far, and 'mixwright resume' on this folder continues the stage";

  /** The LP stage stopped before its optimum, so the integer stage has not begun. */
  public static final String LP_STOPPED = "the LP stage stopped before its optimum; 'mixwright resume' finishes"
      + " it and then runs the integer stage";

  /** One line for people, or null when the run owes no portfolio. */
  public static String line(RunResult r) {
    if (r.portfolioPending() == null) {
      return null;
    }
    return (r.portfolio() == null ? "integer portfolio pending, none written yet: "
        : "integer portfolio not final: ") + r.portfolioPending();
  }
}
