package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantSpace;

/** The branch-and-bound pricer on its bucket-elimination tables alone, without the forward-checking try. */
class ExactTablesPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    BranchAndBoundPricer p = new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT, true);
    assertTrue(p.exactBound(), "the test catalogs are small enough for the tables");
    return p;
  }
}
