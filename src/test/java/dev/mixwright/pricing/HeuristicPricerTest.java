package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.pricing.PricingCases.Case;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.HashSet;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** The heuristic pricer finds valid columns but never claims a proof (judged by brute force, PricingCases). */
class HeuristicPricerTest {

  @Test
  void neverClaimsAProofAndReturnsOnlyValidColumns() {
    for (int i = 0; i < 150; i++) {
      Case c = PricingCases.random(i);
      Random rnd = new Random(i);
      Set<VariantKey> excluded = new HashSet<>();
      for (PricingCases.Scored s : c.columns()) {
        if (rnd.nextDouble() < 0.2) {
          excluded.add(c.space().key(s.v()));
        }
      }
      PricingQuery q = c.query(1 + rnd.nextInt(6), ExactPricerContract.threshold(c.columns(), rnd), excluded);
      PricingOutcome out = new HeuristicPricer(c.space()).price(q);
      ExactPricerContract.checkValid(c, q, out);
      assertFalse(out.exact(), "case " + i + ": a heuristic proves nothing");
      assertEquals(Double.POSITIVE_INFINITY, out.upperBound(), "case " + i + ": no bound");
    }
  }

  @Test
  void findsTheOptimumOfAnUnconstrainedSpace() {
    // Without rules greedy is optimal (best choice per group), so the heuristic must find it.
    for (int i = 0; i < 150; i++) {
      Case c = PricingCases.random(i);
      VariantSpace space = c.space();
      if (space.nogoodCount() > 0 || c.columns().isEmpty()) {
        continue;
      }
      PricingQuery q = c.query(1, Double.NEGATIVE_INFINITY, Set.of());
      PricingOutcome out = new HeuristicPricer(space).price(q);
      double best = c.columns().get(0).d();
      assertEquals(best, out.best(), PricingCases.tol(best), "case " + i);
      assertTrue(!out.exact());
    }
  }
}
