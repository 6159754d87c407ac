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
 */
public record PricingQuery(
    int segment, double[] weight, double constant, int k, double threshold, Set<VariantKey> excluded) {

  public PricingQuery {
    if (k < 1) {
      throw new IllegalArgumentException("k must be >= 1");
    }
    excluded = excluded == null ? Set.of() : excluded;
  }
}
