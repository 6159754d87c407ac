package dev.mixwright.cli;

import dev.mixwright.colgen.Durations;
import dev.mixwright.master.PortfolioMip;
import dev.mixwright.portfolio.PortfolioSettings;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Option;
import picocli.CommandLine.TypeConversionException;

/**
 * The integer stage's options of {@code solve}, as a mixin. Values are converted while the command
 * line is parsed, so a bad one stops the run before anything is solved or written.
 */
final class PortfolioOptions {
  @Option(names = "--portfolio-time-limit", paramLabel = "DURATION", defaultValue = "60s",
      converter = DurationMs.class,
      description = "wall time for the integer portfolio stage, e.g. 30s, 10m (default ${DEFAULT-VALUE}; 0 for none)")
  long timeLimitMs;

  @Option(names = "--mip-solver", paramLabel = "NAME", defaultValue = "scip", converter = EngineName.class,
      description = "MIP solver of the integer stage: scip (default; proves optimality) or cpsat (incumbents only)")
  PortfolioMip.Engine engine;

  @Option(names = "--survivor-limit", paramLabel = "N", defaultValue = "" + PortfolioSettings.DEFAULT_SURVIVOR_LIMIT,
      converter = Count.class,
      description = "most variants the optimality proof may add to the MIP's pool (default ${DEFAULT-VALUE})")
  int survivorLimit;

  @Option(names = "--no-portfolio", description = "skip the integer stage even when the catalog has a portfolio section")
  boolean skip;

  PortfolioSettings settings() {
    return PortfolioSettings.defaults().withTimeLimit(timeLimitMs).withEngine(engine).withSurvivorLimit(survivorLimit);
  }

  static final class DurationMs implements ITypeConverter<Long> {
    @Override
    public Long convert(String value) {
      try {
        return Durations.parse(value);
      } catch (IllegalArgumentException e) {
        throw new TypeConversionException(e.getMessage());
      }
    }
  }

  static final class EngineName implements ITypeConverter<PortfolioMip.Engine> {
    @Override
    public PortfolioMip.Engine convert(String value) {
      try {
        return PortfolioMip.Engine.byWord(value);
      } catch (IllegalArgumentException e) {
        throw new TypeConversionException(e.getMessage());
      }
    }
  }

  static final class Count implements ITypeConverter<Integer> {
    @Override
    public Integer convert(String value) {
      try {
        int n = Integer.parseInt(value.trim());
        if (n >= 0) {
          return n;
        }
      } catch (NumberFormatException e) {
        // fall through to the message
      }
      throw new TypeConversionException("'" + value + "' is not a whole number >= 0");
    }
  }
}
