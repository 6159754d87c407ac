package dev.mixwright.cli;

import dev.mixwright.colgen.Durations;
import dev.mixwright.master.PortfolioMip;
import dev.mixwright.portfolio.PortfolioSettings;
import picocli.CommandLine.Option;

/** The integer stage's options of {@code solve} (a mixin, so the stage keeps its options together). */
final class PortfolioOptions {
  @Option(names = "--portfolio-time-limit", paramLabel = "DURATION", defaultValue = "60s",
      description = "wall time for the integer portfolio stage, e.g. 30s, 10m (default ${DEFAULT-VALUE}; 0 for none)")
  String timeLimit;

  @Option(names = "--mip-solver", paramLabel = "NAME", defaultValue = "scip",
      description = "MIP solver of the integer stage: scip (default) or cpsat")
  String engine;

  @Option(names = "--survivor-limit", paramLabel = "N", defaultValue = "" + PortfolioSettings.DEFAULT_SURVIVOR_LIMIT,
      description = "most variants the optimality proof may add to the MIP's pool (default ${DEFAULT-VALUE})")
  int survivorLimit;

  @Option(names = "--no-portfolio", description = "skip the integer stage even when the catalog has a portfolio section")
  boolean skip;

  PortfolioSettings settings() {
    long ms;
    try {
      ms = Durations.parse(timeLimit);
    } catch (IllegalArgumentException e) {
      throw new UserError("--portfolio-time-limit: " + e.getMessage());
    }
    PortfolioMip.Engine e;
    try {
      e = PortfolioMip.Engine.byWord(engine);
    } catch (IllegalArgumentException x) {
      throw new UserError("--mip-solver: " + x.getMessage());
    }
    if (survivorLimit < 0) {
      throw new UserError("--survivor-limit must be >= 0, got " + survivorLimit);
    }
    return PortfolioSettings.defaults().withTimeLimit(ms).withEngine(e).withSurvivorLimit(survivorLimit);
  }
}
