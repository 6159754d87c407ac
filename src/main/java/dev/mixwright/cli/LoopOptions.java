package dev.mixwright.cli;

import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.run.PricerChoice;
import picocli.CommandLine.Option;

/** The loop's options every solving command shares (solve, sweep), as a mixin. */
final class LoopOptions {
  @Option(names = "--gap", paramLabel = "REL", defaultValue = "1e-6", converter = Converters.Gap.class,
      description = "stop when (bound - objective) / max(|objective|, |bound|) <= REL, e.g. 1e-6 or 0.1%% (default ${DEFAULT-VALUE})")
  double gap;

  @Option(names = "--pricer", paramLabel = "NAME", defaultValue = "bnb", converter = Converters.ExactPricer.class,
      description = "exact pricing algorithm: bnb (default), cpsat, brute")
  PricerChoice pricer;

  @Option(names = "--per-round", paramLabel = "K", defaultValue = "" + SolveSettings.DEFAULT_PER_ROUND,
      converter = Converters.PositiveCount.class,
      description = "columns sought per segment per round (default ${DEFAULT-VALUE})")
  int perRound;

  /** The defaults with these options; limits and the newer switches are set by the caller. */
  SolveSettings settings() {
    return SolveSettings.defaults().withGapTolerance(gap).withPerRound(perRound);
  }
}
