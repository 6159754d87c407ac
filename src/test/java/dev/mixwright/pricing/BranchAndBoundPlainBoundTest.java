package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

/** The branch-and-bound pricer without tail searches: the best-remaining-choice bound alone. */
class BranchAndBoundPlainBoundTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new BranchAndBoundPricer(space, Long.MAX_VALUE, false, 0, false);
  }
}
