package dev.mixwright.portfolio;

import dev.mixwright.master.PortfolioMip;

/**
 * How the integer stage runs. {@code timeLimitMs}: wall time for the whole stage (0 for none).
 * {@code engine}: the MIP solver. {@code survivorLimit}: most variants the proof may add to the pool
 * in one enumeration; beyond it the result stays heuristic. {@code relaxationRounds}: most rounds of
 * the relaxation's column generation. {@code perRound}: variants added per round. {@code gap}:
 * relative gap at which the MIP and the relaxation count as solved.
 */
public record PortfolioSettings(
    long timeLimitMs, PortfolioMip.Engine engine, int survivorLimit, int relaxationRounds, int perRound,
    double gap) implements java.io.Serializable {
  private static final long serialVersionUID = 1L;

  public static final long DEFAULT_TIME_LIMIT_MS = 60_000;
  public static final int DEFAULT_SURVIVOR_LIMIT = 3000;
  public static final double DEFAULT_GAP = 1e-6;

  public PortfolioSettings {
    if (timeLimitMs < 0 || survivorLimit < 0 || relaxationRounds < 0 || perRound < 1 || !(gap >= 0)) {
      throw new IllegalArgumentException("portfolio settings out of range");
    }
  }

  public static PortfolioSettings defaults() {
    return new PortfolioSettings(DEFAULT_TIME_LIMIT_MS, PortfolioMip.Engine.SCIP, DEFAULT_SURVIVOR_LIMIT, 200, 10,
        DEFAULT_GAP);
  }

  public PortfolioSettings withTimeLimit(long ms) {
    return new PortfolioSettings(ms, engine, survivorLimit, relaxationRounds, perRound, gap);
  }

  public PortfolioSettings withEngine(PortfolioMip.Engine e) {
    return new PortfolioSettings(timeLimitMs, e, survivorLimit, relaxationRounds, perRound, gap);
  }

  public PortfolioSettings withSurvivorLimit(int n) {
    return new PortfolioSettings(timeLimitMs, engine, n, relaxationRounds, perRound, gap);
  }
}
