package dev.mixwright.cli;

import dev.mixwright.master.PortfolioMip;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.run.PortfolioPlan;
import picocli.CommandLine.Option;

/**
 * The integer stage's options of {@code solve}, as a mixin. Values are converted while the command
 * line is parsed, so a bad one stops the run before anything is solved or written.
 */
final class PortfolioOptions {
  @Option(names = "--portfolio-time-limit", paramLabel = "DURATION", defaultValue = "60s",
      converter = Converters.DurationMs.class,
      description = "wall time for the integer portfolio stage, e.g. 30s, 10m (default ${DEFAULT-VALUE}; 0 for none)")
  long timeLimitMs;

  @Option(names = "--mip-solver", paramLabel = "NAME", defaultValue = "scip", converter = Converters.EngineName.class,
      description = "MIP solver of the integer stage: scip (default; proves optimality) or cpsat (incumbents only)")
  PortfolioMip.Engine engine;

  @Option(names = "--survivor-limit", paramLabel = "N", defaultValue = "" + PortfolioSettings.DEFAULT_SURVIVOR_LIMIT,
      converter = Converters.Count.class,
      description = "most variants the optimality proof may add to the MIP's pool (default ${DEFAULT-VALUE})")
  int survivorLimit;

  @Option(names = "--no-portfolio", description = "skip the integer stage even when the catalog has a portfolio section")
  boolean skip;

  PortfolioPlan plan() {
    return new PortfolioPlan(!skip,
        PortfolioSettings.defaults().withTimeLimit(timeLimitMs).withEngine(engine).withSurvivorLimit(survivorLimit));
  }
}
