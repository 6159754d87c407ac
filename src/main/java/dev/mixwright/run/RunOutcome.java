package dev.mixwright.run;

import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.report.RunResult;
import dev.mixwright.space.VariantSpace;
import java.nio.file.Path;

/** How a solve or resume ended; the command line prints it and picks the exit code from it. */
public sealed interface RunOutcome {

  Path runDir();

  /** The loop ran (or found nothing sellable) and result.json was written. */
  record Solved(Path runDir, VariantSpace space, SolveOutcome lp, RunResult result) implements RunOutcome {}

  /** A resume found the run already proven optimal to its gap target: nothing was done. */
  record AlreadyOptimal(Path runDir, double objective) implements RunOutcome {}

  /** A resume found a run that ended infeasible, which no resume can change. */
  record EndedInfeasible(Path runDir, String reason) implements RunOutcome {}
}
