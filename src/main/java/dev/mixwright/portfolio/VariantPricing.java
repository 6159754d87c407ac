package dev.mixwright.portfolio;

import java.util.List;

/**
 * What {@link VariantPricer} found. {@code found}: best first, values above the query's threshold,
 * none excluded. {@code restBound}: a proven upper bound on ψ of every buildable variant that is
 * neither excluded nor in {@code found} (the threshold, or the k-th value when k were found, or
 * higher when the search stopped early). {@code exact}: the search was complete.
 */
public record VariantPricing(List<ValuedVariant> found, double restBound, boolean exact, long nodes) {
  public VariantPricing {
    found = List.copyOf(found);
  }

  public double best() {
    return found.isEmpty() ? Double.NEGATIVE_INFINITY : found.get(0).value();
  }
}
