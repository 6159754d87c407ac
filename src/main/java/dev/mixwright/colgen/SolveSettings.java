package dev.mixwright.colgen;

/**
 * How a solve runs. {@code gapTolerance}: stop once (bound − objective) / max(1, |objective|) is at
 * most this. {@code perRound}: columns asked of the pricer per segment per round. {@code timeLimitMs},
 * {@code maxIterations}: limits (0 for none). {@code heuristicFirst}: price with the heuristic first
 * and go exact only for segments where it finds nothing (the last round is always exact).
 */
public record SolveSettings(
    double gapTolerance, int perRound, long timeLimitMs, int maxIterations, boolean heuristicFirst) {

  public static final double DEFAULT_GAP = 1e-6;
  public static final int DEFAULT_PER_ROUND = 5;

  public SolveSettings {
    if (!(gapTolerance >= 0)) {
      throw new IllegalArgumentException("gap tolerance must be >= 0");
    }
    if (perRound < 1) {
      throw new IllegalArgumentException("columns per round must be >= 1");
    }
  }

  public static SolveSettings defaults() {
    return new SolveSettings(DEFAULT_GAP, DEFAULT_PER_ROUND, 0, 0, false);
  }

  public SolveSettings withPerRound(int k) {
    return new SolveSettings(gapTolerance, k, timeLimitMs, maxIterations, heuristicFirst);
  }

  public SolveSettings withHeuristicFirst(boolean on) {
    return new SolveSettings(gapTolerance, perRound, timeLimitMs, maxIterations, on);
  }

  public SolveSettings withLimits(long timeMs, int iterations) {
    return new SolveSettings(gapTolerance, perRound, timeMs, iterations, heuristicFirst);
  }
}
