package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantSpace;
import org.junit.jupiter.api.Test;

/** The search on the bucket-elimination tables alone. */
class BucketEliminationPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return BucketEliminationPricer.fitting(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT)
        .orElseThrow(() -> new AssertionError("the test catalogs are small enough for the tables"));
  }

  @Test
  void nodeLimitKeepsAValidBound() {
    NodeLimits.keepValidBounds(
        (space, limit) -> BucketEliminationPricer.fitting(space, limit, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT)
            .orElseThrow());
  }

  @Test
  void tablesTooLargeForTheLimitGiveNoPricer() {
    VariantSpace space = new VariantSpace(PricingCases.large(11, 40, 5, 100));
    assertTrue(BucketEliminationPricer.fitting(space, Long.MAX_VALUE, 1).isEmpty());
  }
}
