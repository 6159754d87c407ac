package dev.mixwright.cli;

import dev.mixwright.colgen.SolveSettings;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** Every setting of the LP loop of {@code solve}, as a mixin; {@link #settings} gives them as one value. */
final class SolveOptions {
  @Mixin LoopOptions loop;

  @Mixin LimitOptions limits;

  @Option(names = "--heuristic-first", negatable = true,
      description = "price with a fast heuristic first; exact rounds prove the bound (default: off)")
  boolean heuristicFirst = SolveSettings.defaults().heuristicFirst();

  @Option(names = "--smoothing", paramLabel = "ALPHA", defaultValue = "" + SolveSettings.DEFAULT_SMOOTHING,
      converter = Converters.Fraction.class,
      description = "weight of the best dual point so far when pricing, 0 (off) to below 1 (default ${DEFAULT-VALUE})")
  double smoothing;

  @Option(names = "--retire-after", paramLabel = "ROUNDS", defaultValue = "" + SolveSettings.DEFAULT_RETIRE_AFTER,
      converter = Converters.Count.class,
      description = "take a column out of the master after this many rounds unused, 0 for never (default ${DEFAULT-VALUE})")
  int retireAfter;

  SolveSettings settings() {
    return new SolveSettings(loop.gap, loop.perRound, limits.timeLimitMs, limits.maxIterations, heuristicFirst,
        smoothing, retireAfter);
  }
}
