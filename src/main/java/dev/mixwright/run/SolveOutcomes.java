package dev.mixwright.run;

import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.space.VariantSpace;

/** Outcomes the loop does not produce itself. */
final class SolveOutcomes {
  private SolveOutcomes() {}

  static SolveOutcome infeasible(VariantSpace space, String reason, long elapsedMs) {
    return SolveOutcome.infeasible(reason, elapsedMs);
  }
}
