package dev.mixwright.colgen;

import java.util.List;

/** Hooks into the loop; every method has an empty default. Called on the solving thread. */
public interface ColGenListener {
  default void started(int seedColumns) {}

  /** After each round's pricing, with the bound it proves. */
  default void iteration(IterationRecord record) {}

  /** After the master was re-solved with the columns of one round. */
  default void columnsAdded(List<Column> columns, double objectiveAfter, double boundAfter, long elapsedMs) {}

  default void ended(SolveOutcome outcome) {}
}
