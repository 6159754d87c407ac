package dev.mixwright.cli;

import picocli.CommandLine.Option;

/** The limits of a solving session (solve, resume), as a mixin; 0 means none. */
final class LimitOptions {
  @Option(names = "--time-limit", paramLabel = "DURATION", defaultValue = "0", converter = Converters.DurationMs.class,
      description = "stop after this long, e.g. 90s, 10m, 8h (resume: counted from its own start)")
  long timeLimitMs;

  @Option(names = "--max-iterations", paramLabel = "N", defaultValue = "0", converter = Converters.Count.class,
      description = "stop after N rounds (resume: N more rounds)")
  int maxIterations;
}
