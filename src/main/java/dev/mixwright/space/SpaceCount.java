package dev.mixwright.space;

import java.math.BigInteger;
import java.util.Objects;

/**
 * A number of buildable variants. When {@code exact} is false, {@code value} is an upper bound only:
 * the count was taken with some rules left out because counting under all of them needed a table
 * larger than the configured limit.
 */
public record SpaceCount(BigInteger value, boolean exact) {

  public SpaceCount {
    Objects.requireNonNull(value, "value");
    if (value.signum() < 0) {
      throw new IllegalArgumentException("a count cannot be negative: " + value);
    }
  }

  /** True when no variant is buildable; an upper bound of 0 proves it as well as an exact 0. */
  public boolean isEmpty() {
    return value.signum() == 0;
  }

  /** The decimal value, prefixed "at most " when it is only a bound. */
  public String text() {
    return exact ? value.toString() : "at most " + value;
  }
}
