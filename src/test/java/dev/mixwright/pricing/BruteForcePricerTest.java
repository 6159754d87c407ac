package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantSpace;
import java.util.Set;
import org.junit.jupiter.api.Test;

class BruteForcePricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new BruteForcePricer(space);
  }

  @Test
  void refusesSpacesAboveItsLimit() {
    VariantSpace space = new VariantSpace(PricingCases.large(1, 40, 5, 100));
    PricingQuery q = ReducedCosts.query(space, 0, new double[2], 0, 1, 0, Set.of());
    IllegalStateException e = assertThrows(IllegalStateException.class, () -> new BruteForcePricer(space).price(q));
    assertTrue(e.getMessage().contains("bnb"), e.getMessage());
  }
}
