package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.pricing.PricingCases.Case;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

class HeuristicPricerTest {

  @Test
  void foundVariantsAreValidAndNothingIsClaimed() {
    int someFound = 0;
    for (int i = 0; i < 200; i++) {
      Case c = PricingCases.random(i);
      Random rnd = new Random(i);
      Set<VariantKey> excluded = new HashSet<>();
      for (var col : c.columns()) {
        if (rnd.nextDouble() < 0.3) {
          excluded.add(c.space().key(col.v()));
        }
      }
      PricingQuery q = c.query(1 + rnd.nextInt(6), ExactPricerContract.threshold(c.columns(), rnd), excluded);
      PricingOutcome out = new HeuristicPricer(c.space()).price(q);
      ExactPricerContract.checkValid(c, q, out);
      assertFalse(out.exact(), "a heuristic never claims a proof");
      assertEquals(Double.POSITIVE_INFINITY, out.upperBound());
      List<PricingCases.Scored> outside = c.outside(excluded);
      if (!out.found().isEmpty()) {
        someFound++;
        double best = outside.get(0).d();
        assertTrue(out.best() <= best + PricingCases.tol(best), "better than the true best");
      }
    }
    assertTrue(someFound >= 100, "found something in " + someFound + " cases only");
  }

  @Test
  void withoutRulesGreedyIsOptimal() {
    for (int i = 0; i < 60; i++) {
      Random rnd = new Random(i);
      Catalog cat = dev.mixwright.testing.RandomCatalogs.random(rnd, 2 + rnd.nextInt(5), 4, 2, 2, 0, false);
      VariantSpace space = new VariantSpace(cat);
      double[] pi = {rnd.nextDouble() * 10, rnd.nextDouble() * 10};
      List<PricingCases.Scored> cols = PricingCases.enumerate(space, 0, pi, 5);
      PricingQuery q = ReducedCosts.query(space, 0, pi, 5, 1, Double.NEGATIVE_INFINITY, Set.of());
      PricingOutcome out = new HeuristicPricer(space).price(q);
      assertEquals(cols.get(0).d(), out.best(), PricingCases.tol(cols.get(0).d()));
    }
  }

  @Test
  void sameSeedSameAnswer() {
    Case c = PricingCases.random(8);
    PricingQuery q = c.query(5, Double.NEGATIVE_INFINITY, Set.of());
    var a = new HeuristicPricer(c.space(), 5, 42).price(q).found();
    var b = new HeuristicPricer(c.space(), 5, 42).price(q).found();
    assertEquals(a.size(), b.size());
    for (int i = 0; i < a.size(); i++) {
      assertTrue(java.util.Arrays.equals(a.get(i).choices(), b.get(i).choices()));
    }
  }
}
