package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.pricing.PricingCases.Case;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.HashSet;
import java.util.Random;
import java.util.Set;

/** The node-limit check every exact search with a node limit passes. */
final class NodeLimits {
  private NodeLimits() {}

  interface Make {
    Pricer make(VariantSpace space, long nodeLimit);
  }

  /**
   * On 200 random cases with limits of 1 to 12 nodes: an exact answer matches the enumeration, a
   * stopped one is valid and keeps a finite upper bound on what it did not see.
   */
  static void keepValidBounds(Make make) {
    int stopped = 0;
    for (int i = 0; i < 200; i++) {
      Case c = PricingCases.random(i);
      Random rnd = new Random(i * 13L);
      Set<VariantKey> excluded = new HashSet<>();
      for (var col : c.columns()) {
        if (rnd.nextDouble() < 0.2) {
          excluded.add(c.space().key(col.v()));
        }
      }
      PricingQuery q = c.query(1 + rnd.nextInt(3), ExactPricerContract.threshold(c.columns(), rnd), excluded);
      PricingOutcome out = make.make(c.space(), 1 + rnd.nextInt(12)).price(q);
      if (out.exact()) {
        ExactPricerContract.checkExact(c, q, out);
      } else {
        stopped++;
        ExactPricerContract.checkValid(c, q, out);
        ExactPricerContract.checkBound(c, q, out);
        assertTrue(Double.isFinite(out.upperBound()), "a stopped search still bounds by its open nodes (case " + i + ")");
      }
    }
    assertTrue(stopped >= 40, "the limit was hit in " + stopped + " cases only");
  }
}
