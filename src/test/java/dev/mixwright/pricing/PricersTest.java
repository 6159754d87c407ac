package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantSpace;
import org.junit.jupiter.api.Test;

class PricersTest {
  @Test
  void byNameGivesThePricerOfThatName() {
    VariantSpace space = PricingCases.random(0).space();
    for (String n : Pricers.names()) {
      assertEquals(n, Pricers.byName(n, space).name());
    }
    assertEquals("bnb", Pricers.byName(null, space).name());
    assertEquals("bnb", Pricers.byName(" BNB ", space).name());
    assertTrue(Pricers.byName("bnb", space) instanceof BranchAndBoundPricer);
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Pricers.byName("simplex", space));
    assertTrue(e.getMessage().contains("'simplex'") && e.getMessage().contains("cpsat"), e.getMessage());
  }
}
