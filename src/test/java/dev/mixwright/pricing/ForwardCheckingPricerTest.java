package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

/** The branch-and-bound pricer with its exact tables switched off: the forward-checking bound alone. */
class ForwardCheckingPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new BranchAndBoundPricer(space, Long.MAX_VALUE, 0);
  }
}
