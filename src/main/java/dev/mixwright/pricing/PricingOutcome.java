package dev.mixwright.pricing;

import java.util.List;

/**
 * What a pricer found. {@code found}: best first, scores above the query's threshold, none excluded.
 * {@code upperBound}: a proven upper bound on the score of every buildable, non-excluded variant, or
 * {@code Double.POSITIVE_INFINITY} when the pricer proves nothing; when {@code found} is empty and the
 * search was complete this is the threshold. {@code exact}: the search was complete, so
 * {@code found} holds the true k best above the threshold. {@code nodes}: work done, for logs.
 */
public record PricingOutcome(List<PricedVariant> found, double upperBound, boolean exact, long nodes) {

  public PricingOutcome {
    found = List.copyOf(found);
  }

  public double best() {
    return found.isEmpty() ? Double.NEGATIVE_INFINITY : found.get(0).reducedCost();
  }
}
