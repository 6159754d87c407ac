package dev.mixwright.pricing;

/**
 * Finds the variants of largest reduced cost over the whole space of one catalog. Implementations take
 * the {@link dev.mixwright.space.VariantSpace} in their constructor; {@link #price} may be called
 * many times with different weights. An implementation instance is used by one thread at a time.
 */
public interface Pricer {

  /** Short name for logs and options, e.g. {@code bnb}. */
  String name();

  /** Solves one pricing problem. */
  PricingOutcome price(PricingQuery query);
}
