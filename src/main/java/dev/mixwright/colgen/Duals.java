package dev.mixwright.colgen;

import java.util.OptionalDouble;

/**
 * The final master's dual values: {@code resource} (π) aligned with the catalog's resources and
 * {@code segment} (μ) with its segments. Unknown when no master was solved (nothing can be sold);
 * then there are no values at all rather than zeros, which would read as proven shadow prices.
 */
public record Duals(double[] resource, double[] segment) {
  private static final Duals UNKNOWN = new Duals(null, null);

  public Duals {
    if ((resource == null) != (segment == null)) {
      throw new IllegalArgumentException("resource and segment duals are known together or not at all");
    }
  }

  public static Duals unknown() {
    return UNKNOWN;
  }

  public boolean known() {
    return resource != null;
  }

  /** π, one per resource; only when {@link #known()}. */
  @Override
  public double[] resource() {
    return require(resource);
  }

  /** μ, one per segment; only when {@link #known()}. */
  @Override
  public double[] segment() {
    return require(segment);
  }

  /** π_r, or empty when the duals are unknown. */
  public OptionalDouble resource(int r) {
    return known() ? OptionalDouble.of(resource[r]) : OptionalDouble.empty();
  }

  /** μ_s, or empty when the duals are unknown. */
  public OptionalDouble segment(int s) {
    return known() ? OptionalDouble.of(segment[s]) : OptionalDouble.empty();
  }

  private static double[] require(double[] values) {
    if (values == null) {
      throw new IllegalStateException("the duals are unknown (no master was solved); ask known() first");
    }
    return values;
  }
}
