package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

class CpSatPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new CpSatPricer(space);
  }

  @Override
  protected int cases() {
    return 60; // each query is one CP-SAT solve per variant found
  }
}
