package dev.mixwright.colgen;

import java.util.List;

/**
 * The end of a solve. {@code result}: the final restricted master's objective and the best proven
 * upper bound on the LP optimum over the whole space. {@code master}: its columns with x and reduced
 * costs; {@code duals}: its dual values (unknown when nothing can be sold). {@code stopReason} is
 * empty unless the status is stopped or infeasible.
 */
public record SolveOutcome(
    RunStatus status,
    String stopReason,
    ValueBound result,
    int iterations,
    MasterColumns master,
    Duals duals,
    List<IterationRecord> history,
    long elapsedMs) {

  public SolveOutcome {
    history = List.copyOf(history);
  }

  /** Nothing can be sold: no master was solved, so there are no columns and no duals. */
  public static SolveOutcome infeasible(String reason, long elapsedMs) {
    return new SolveOutcome(RunStatus.INFEASIBLE, reason, new ValueBound(0, 0), 0, MasterColumns.none(),
        Duals.unknown(), List.of(), elapsedMs);
  }

  /**
   * Every column the run put in its master, the seed columns (iteration 0 in the column log) included,
   * so that it equals the number of lines of columns.jsonl.
   */
  public int columnsGenerated() {
    return master.columns().size();
  }
}
