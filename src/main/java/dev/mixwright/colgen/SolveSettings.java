package dev.mixwright.colgen;

/**
 * How a solve runs. {@code gapTolerance}: stop once the bound meets the objective within this
 * relative gap ({@link ValueBound#within}: relative to the figures, never to an absolute 1). {@code perRound}: columns asked of the pricer per segment per round. {@code timeLimitMs},
 * {@code maxIterations}: limits (0 for none). {@code heuristicFirst}: price with the heuristic first
 * and go exact only for segments where it finds nothing (the last round is always exact).
 * {@code smoothing}: Wentges's weight α on the best dual point found so far, 0 for none (prices at
 * α·best + (1 − α)·master duals, with the mispricing safeguard). {@code retireAfter}: a column unused
 * for this many rounds in a row leaves the master (its bounds become 0 and pricing may bring it
 * back), 0 for never.
 */
public record SolveSettings(
    double gapTolerance, int perRound, long timeLimitMs, int maxIterations, boolean heuristicFirst,
    double smoothing, int retireAfter) implements java.io.Serializable {
  private static final long serialVersionUID = 1L;

  public static final double DEFAULT_GAP = 1e-6;
  /**
   * Chosen by the benchmark (docs/performance.md): 10 per segment needed fewest seconds on the
   * largest catalogs; 1 took about twice the rounds, 20 fewer rounds but more time per round.
   */
  public static final int DEFAULT_PER_ROUND = 10;
  /**
   * Chosen by the benchmark (docs/performance.md): with 10 columns per round, smoothing (0.3, 0.5,
   * 0.8) saved no rounds on the generated catalogs and 0.8 added mispricings.
   */
  public static final double DEFAULT_SMOOTHING = 0.0;
  /**
   * Chosen by the benchmark (docs/performance.md): masters stayed below about 1,300 columns and their
   * re-solves below a fifth of the run, so retiring columns saved nothing measurable.
   */
  public static final int DEFAULT_RETIRE_AFTER = 0;

  public SolveSettings {
    if (!(gapTolerance >= 0)) {
      throw new IllegalArgumentException("gap tolerance must be >= 0");
    }
    if (perRound < 1) {
      throw new IllegalArgumentException("columns per round must be >= 1");
    }
    if (!(smoothing >= 0 && smoothing < 1)) {
      throw new IllegalArgumentException("smoothing must be at least 0 and below 1, got " + smoothing);
    }
    if (retireAfter < 0) {
      throw new IllegalArgumentException("rounds before retiring an idle column must be >= 0 (0: never)");
    }
  }

  public static SolveSettings defaults() {
    return new SolveSettings(DEFAULT_GAP, DEFAULT_PER_ROUND, 0, 0, false, DEFAULT_SMOOTHING, DEFAULT_RETIRE_AFTER);
  }

  public SolveSettings withGapTolerance(double gap) {
    return new SolveSettings(gap, perRound, timeLimitMs, maxIterations, heuristicFirst, smoothing, retireAfter);
  }

  public SolveSettings withPerRound(int k) {
    return new SolveSettings(gapTolerance, k, timeLimitMs, maxIterations, heuristicFirst, smoothing, retireAfter);
  }

  public SolveSettings withHeuristicFirst(boolean on) {
    return new SolveSettings(gapTolerance, perRound, timeLimitMs, maxIterations, on, smoothing, retireAfter);
  }

  public SolveSettings withLimits(long timeMs, int iterations) {
    return new SolveSettings(gapTolerance, perRound, timeMs, iterations, heuristicFirst, smoothing, retireAfter);
  }

  public SolveSettings withSmoothing(double alpha) {
    return new SolveSettings(gapTolerance, perRound, timeLimitMs, maxIterations, heuristicFirst, alpha, retireAfter);
  }

  public SolveSettings withRetireAfter(int rounds) {
    return new SolveSettings(gapTolerance, perRound, timeLimitMs, maxIterations, heuristicFirst, smoothing, rounds);
  }
}
