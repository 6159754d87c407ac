package dev.mixwright.space;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.Objects;
import java.util.Optional;

/**
 * What is known of a number of buildable variants: the {@link Exact} count, or {@link Bounded}
 * bounds from both sides, with a sampled estimate when one was taken. A count that ran out of time
 * or table space is bounded; it never pretends to be exact.
 */
public sealed interface SpaceCount permits SpaceCount.Exact, SpaceCount.Bounded {

  /** The count itself. */
  record Exact(BigInteger value) implements SpaceCount {
    public Exact {
      requireCount(value, "value");
    }

    @Override
    public BigInteger lower() {
      return value;
    }

    @Override
    public BigInteger upper() {
      return value;
    }

    @Override
    public Optional<Estimate> estimate() {
      return Optional.empty();
    }

    @Override
    public String text() {
      return value.toString();
    }
  }

  /**
   * The count lies in [lower, upper], lower &lt; upper. {@code lower} counts variants proven
   * buildable, {@code upper} variants of a relaxation (rules left out); the estimate, when present,
   * is an unbiased sampled estimate with its standard error.
   */
  record Bounded(BigInteger lower, BigInteger upper, Optional<Estimate> estimate) implements SpaceCount {
    public Bounded {
      requireCount(lower, "lower");
      requireCount(upper, "upper");
      Objects.requireNonNull(estimate, "estimate");
      if (lower.compareTo(upper) >= 0) {
        throw new IllegalArgumentException(
            "bounds must leave a gap (else the count is exact): " + lower + " >= " + upper);
      }
    }

    @Override
    public String text() {
      String range = lower.signum() == 0 ? "at most " + upper : "between " + lower + " and " + upper;
      return estimate.map(e -> range + ", about " + e.text()).orElse(range);
    }
  }

  /**
   * A sampled estimate: {@code value} ± {@code standardError} (one standard error of the mean of
   * {@code samples} independent probes), both to six significant digits.
   */
  record Estimate(BigDecimal value, BigDecimal standardError, long samples) {
    public Estimate {
      Objects.requireNonNull(value, "value");
      Objects.requireNonNull(standardError, "standardError");
      if (value.signum() < 0 || standardError.signum() < 0 || samples < 1) {
        throw new IllegalArgumentException(
            "an estimate needs a value and error >= 0 and at least one sample: " + value + ", "
                + standardError + ", " + samples);
      }
    }

    /** Relative standard error; 0 when the value is 0. */
    public double relativeError() {
      return value.signum() == 0 ? 0 : standardError.doubleValue() / value.doubleValue();
    }

    public String text() {
      return scientific(value) + " ± " + scientific(standardError) + " (estimate from " + samples + " samples)";
    }

    /** Three significant digits, as 6.44e25 (plain below a million). */
    private static String scientific(BigDecimal x) {
      BigDecimal r = x.round(new MathContext(3));
      if (r.compareTo(BigDecimal.valueOf(1_000_000)) < 0) {
        return r.stripTrailingZeros().toPlainString();
      }
      int exponent = r.precision() - r.scale() - 1;
      return r.movePointLeft(exponent).stripTrailingZeros().toPlainString() + "e" + exponent;
    }
  }

  /** Largest number of buildable variants this leaves possible. */
  BigInteger upper();

  /** Smallest number of buildable variants this leaves possible. */
  BigInteger lower();

  Optional<Estimate> estimate();

  /** In words: the decimal count, or its bounds and estimate. */
  String text();

  default boolean exact() {
    return this instanceof Exact;
  }

  /** True when no variant is buildable; an upper bound of 0 proves it as well as an exact 0. */
  default boolean isEmpty() {
    return upper().signum() == 0;
  }

  /** The count when exact, else the upper bound: the one number older reports carried. */
  default BigInteger value() {
    return upper();
  }

  static SpaceCount exact(BigInteger value) {
    return new Exact(value);
  }

  static SpaceCount exact(long value) {
    return new Exact(BigInteger.valueOf(value));
  }

  /** Only an upper bound is known. */
  static SpaceCount atMost(BigInteger upper) {
    return between(BigInteger.ZERO, upper, Optional.empty());
  }

  /**
   * The count between {@code lower} and {@code upper}; exact when they meet. The estimate is clamped
   * into the bounds, since the count is known to lie there.
   */
  static SpaceCount between(BigInteger lower, BigInteger upper, Optional<Estimate> estimate) {
    if (lower.compareTo(upper) > 0) {
      throw new IllegalArgumentException("lower bound " + lower + " above upper bound " + upper);
    }
    if (lower.equals(upper)) {
      return new Exact(lower);
    }
    BigDecimal lo = new BigDecimal(lower);
    BigDecimal hi = new BigDecimal(upper);
    return new Bounded(lower, upper,
        estimate.map(e -> new Estimate(e.value().max(lo).min(hi), e.standardError(), e.samples())));
  }

  private static void requireCount(BigInteger v, String name) {
    Objects.requireNonNull(v, name);
    if (v.signum() < 0) {
      throw new IllegalArgumentException("a count cannot be negative: " + name + " = " + v);
    }
  }
}
