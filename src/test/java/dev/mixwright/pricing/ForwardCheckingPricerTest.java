package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertFalse;

import dev.mixwright.space.VariantSpace;
import org.junit.jupiter.api.Test;

/** The forward-checking search alone, on any space. */
class ForwardCheckingPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new ForwardCheckingPricer(space, Long.MAX_VALUE);
  }

  @Test
  void nodeLimitKeepsAValidBound() {
    NodeLimits.keepValidBounds(ForwardCheckingPricer::new);
  }

  @Test
  void constrainedGroupsComeFirstInTheOrder() {
    VariantSpace space = new VariantSpace(PricingCases.large(3, 12, 4, 10));
    int[] order = new ForwardCheckingPricer(space, Long.MAX_VALUE).groupOrder();
    boolean free = false;
    for (int g : order) {
      if (space.nogoodsOf(g).length == 0) {
        free = true;
      } else {
        assertFalse(free, "a group with rules after one without");
      }
    }
  }
}
