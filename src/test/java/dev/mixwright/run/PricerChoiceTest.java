package dev.mixwright.run;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.RandomCatalogs;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;

class PricerChoiceTest {
  @Test
  void everyNameCreatesThePricerOfThatName() {
    VariantSpace space = new VariantSpace(RandomCatalogs.random(new Random(3), 3, 3, 1, 2, 2, false));
    for (PricerChoice p : PricerChoice.values()) {
      assertEquals(p.word(), p.create(space).name());
      assertEquals(p, PricerChoice.byWord(" " + p.word().toUpperCase(Locale.ROOT) + " "));
    }
  }
}
