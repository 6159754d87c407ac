package dev.mixwright.pricing;

import java.util.List;

/**
 * What a pricer found. {@code found}: best first, scores above the query's threshold, none excluded.
 * {@code upperBound}: a proven upper bound on the score of every buildable, non-excluded variant, or
 * {@code Double.POSITIVE_INFINITY} when the pricer proves nothing; when {@code found} is empty and the
 * search was complete this is the threshold. {@code restBound}: a proven upper bound on the score of
 * every buildable variant that is neither excluded nor found (the threshold, or the k-th score when k
 * were found, or higher when the search stopped early; +∞ when nothing is proven), which is what a
 * Lagrangian bound summed over the whole space needs. {@code exact}: the search was complete, so
 * {@code found} holds the true k best above the threshold. {@code nodes}: work done, for logs.
 */
public record PricingOutcome(
    List<PricedVariant> found, double upperBound, double restBound, boolean exact, long nodes) {

  public PricingOutcome {
    found = List.copyOf(found);
  }

  /**
   * The outcome of a search that kept the k best above {@code threshold} ({@code found}, best first)
   * and pruned only at or below its pruning level (the threshold, or the k-th best once k are held).
   * A complete search proves the best found (or, when nothing beats the threshold, the threshold). An
   * incomplete one proves the largest of the threshold, the best found and {@code openBound}, the
   * bound of what it left unexplored; what it did not find is bounded by the pruning level or by
   * {@code openBound}.
   */
  public static PricingOutcome of(
      List<PricedVariant> found, int k, double threshold, boolean exact, double openBound, long nodes) {
    double best = found.isEmpty() ? Double.NEGATIVE_INFINITY : found.get(0).reducedCost();
    double level = found.size() < k ? threshold : Math.max(threshold, found.get(k - 1).reducedCost());
    if (exact) {
      return new PricingOutcome(found, found.isEmpty() ? threshold : best, level, true, nodes);
    }
    return new PricingOutcome(
        found, Math.max(threshold, Math.max(best, openBound)), Math.max(level, openBound), false, nodes);
  }

  public double best() {
    return found.isEmpty() ? Double.NEGATIVE_INFINITY : found.get(0).reducedCost();
  }
}
