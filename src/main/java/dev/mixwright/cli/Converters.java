package dev.mixwright.cli;

import dev.mixwright.colgen.Durations;
import dev.mixwright.master.PortfolioMip;
import dev.mixwright.run.PricerChoice;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/**
 * The option values shared by several commands, converted and checked while the command line is
 * parsed: a bad value stops before anything is read or written, with picocli's message naming the
 * option (exit code 2).
 */
final class Converters {
  private Converters() {}

  /** A duration such as 90s, 10m or 8h, in milliseconds; 0 for none. */
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

  /** A whole number >= 0 (a limit, where 0 means none). */
  static final class Count implements ITypeConverter<Integer> {
    @Override
    public Integer convert(String value) {
      return whole(value, 0);
    }
  }

  /** A whole number >= 1. */
  static final class PositiveCount implements ITypeConverter<Integer> {
    @Override
    public Integer convert(String value) {
      return whole(value, 1);
    }
  }

  /** A relative gap: a number >= 0, or a percentage such as 0.5% (= 0.005). */
  static final class Gap implements ITypeConverter<Double> {
    @Override
    public Double convert(String value) {
      double v = real(value);
      if (!(v >= 0)) {
        throw new TypeConversionException("'" + value + "' must be >= 0, e.g. 1e-6 or 0.1%");
      }
      return v;
    }
  }

  /** A weight at least 0 and below 1, or the same as a percentage (30% = 0.3). */
  static final class Fraction implements ITypeConverter<Double> {
    @Override
    public Double convert(String value) {
      double v = real(value);
      if (!(v >= 0 && v < 1)) {
        throw new TypeConversionException("'" + value + "' must be at least 0 and below 1, e.g. 0.3 or 30%");
      }
      return v;
    }
  }

  /** A pricer that proves its bound: the heuristic alone cannot stop a run at an optimum. */
  static final class ExactPricer implements ITypeConverter<PricerChoice> {
    @Override
    public PricerChoice convert(String value) {
      PricerChoice p;
      try {
        p = PricerChoice.byWord(value);
      } catch (IllegalArgumentException e) {
        throw new TypeConversionException(e.getMessage());
      }
      if (!p.exact()) {
        throw new TypeConversionException("'" + value + "' proves no bound; choose " + PricerChoice.exactWords()
            + " (use --heuristic-first to add the heuristic in front of an exact pricer)");
      }
      return p;
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

  private static int whole(String value, int least) {
    try {
      int n = Integer.parseInt(value.trim());
      if (n >= least) {
        return n;
      }
    } catch (NumberFormatException e) {
      // fall through to the message
    }
    throw new TypeConversionException("'" + value + "' is not a whole number >= " + least);
  }

  /** A number, or a percentage written with %. */
  private static double real(String value) {
    String t = value.trim();
    boolean percent = t.endsWith("%");
    try {
      double v = Double.parseDouble(percent ? t.substring(0, t.length() - 1).trim() : t);
      return percent ? v / 100 : v;
    } catch (NumberFormatException e) {
      throw new TypeConversionException("'" + value + "' is not a number");
    }
  }
}
