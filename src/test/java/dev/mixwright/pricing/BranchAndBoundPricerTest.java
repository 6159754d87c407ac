package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

class BranchAndBoundPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new BranchAndBoundPricer(space);
  }
}
