package dev.mixwright.run;

import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.space.VariantSpace;
import java.util.List;

/** Outcomes the loop does not produce itself. */
final class SolveOutcomes {
  private SolveOutcomes() {}

  static SolveOutcome infeasible(VariantSpace space, String reason, long elapsedMs) {
    return new SolveOutcome(RunStatus.INFEASIBLE, reason, 0, 0, 0, 0, List.of(), new double[0],
        new double[0], new double[space.resourceCount()], new double[space.segmentCount()], List.of(),
        elapsedMs);
  }
}
