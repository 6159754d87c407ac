package dev.mixwright.pricing;

import dev.mixwright.space.VariantKey;
import java.util.Set;

/**
 * One pricing problem: maximise {@code constant + Σ_g weight[offset(g) + v_g]} over buildable variants
 * v, where a weight of {@code Double.NEGATIVE_INFINITY} marks a choice that may not be used (not
 * accepted by the segment, or removed by a single-group rule). Wanted: up to {@code k} variants of
 * score strictly above {@code threshold}, best first, none of them in {@code excluded}.
 *
 * <p>For the reduced cost of segment s at duals (π, μ): {@code weight[f] = margin[f] + value_s[f] −
 * Σ_r π_r·use_r[f]} and {@code constant = −μ_s}; see {@link ReducedCosts#query}.
 *
 * <p>{@code cancel} says when to give up (see {@link Cancellation}); the answer is then not exact.
 */
public record PricingQuery(
    int segment, double[] weight, double constant, int k, double threshold, Set<VariantKey> excluded,
    Cancellation cancel) {

  public PricingQuery {
    if (k < 1) {
      throw new IllegalArgumentException("k must be >= 1");
    }
    excluded = excluded == null ? Set.of() : excluded;
    cancel = cancel == null ? Cancellation.SIGNAL : cancel;
  }

  /** A query that gives up only on a signal. */
  public PricingQuery(int segment, double[] weight, double constant, int k, double threshold,
      Set<VariantKey> excluded) {
    this(segment, weight, constant, k, threshold, excluded, Cancellation.SIGNAL);
  }

  /** This query, given up when {@code c} asks. */
  public PricingQuery until(Cancellation c) {
    return new PricingQuery(segment, weight, constant, k, threshold, excluded, c);
  }

  /**
   * Whether a search may stop now: cancellation was asked, and stopping cannot make a sellable
   * segment look empty (a query with no threshold, the loop's seed, needs one variant, so it stops
   * only once it holds one).
   */
  boolean mayStop(int held) {
    return (threshold != Double.NEGATIVE_INFINITY || held > 0) && cancel.requested();
  }
}
