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

class BranchAndBoundPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new BranchAndBoundPricer(space);
  }

  @Test
  void nodeLimitKeepsAValidBound() {
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
      PricingQuery q = c.query(1 + rnd.nextInt(3), threshold(c.columns(), rnd), excluded);
      PricingOutcome out = new BranchAndBoundPricer(c.space(), 1 + rnd.nextInt(12)).price(q);
      if (out.exact()) {
        checkExact(c, q, out);
      } else {
        stopped++;
        checkValid(c, q, out);
        checkBound(c, q, out);
        assertTrue(Double.isFinite(out.upperBound()), "a stopped search still bounds by its open nodes");
      }
    }
    assertTrue(stopped >= 40, "the limit was hit in " + stopped + " cases only");
  }

  @Test
  void nodeLimitOnALargeSpace() {
    VariantSpace space = new VariantSpace(PricingCases.large(11, 40, 5, 100));
    double[] pi = {3.5, 1.25};
    PricingQuery q = ReducedCosts.query(space, 0, pi, 120, 3, Double.NEGATIVE_INFINITY, Set.of());
    PricingOutcome full = new BranchAndBoundPricer(space).price(q);
    assertTrue(full.exact());
    double rootBound = q.constant();
    for (int g = 0; g < space.groupCount(); g++) {
      double m = Double.NEGATIVE_INFINITY;
      for (int c = 0; c < space.choiceCount(g); c++) {
        m = Math.max(m, q.weight()[space.offset(g) + c]);
      }
      rootBound += m;
    }
    for (long limit : new long[] {1, 10, 45, 200}) {
      PricingOutcome out = new BranchAndBoundPricer(space, limit).price(q);
      if (limit < full.nodes()) {
        assertFalse(out.exact(), "limit " + limit);
        assertTrue(out.nodes() <= limit);
      }
      assertTrue(out.upperBound() >= full.best() - PricingCases.tol(full.best()), "limit " + limit);
      assertTrue(out.upperBound() <= rootBound + PricingCases.tol(rootBound), "no looser than the root bound");
      for (PricedVariant pv : out.found()) {
        assertTrue(space.isColumn(pv.choices(), 0));
        assertTrue(pv.reducedCost() <= full.best() + PricingCases.tol(full.best()));
      }
    }
    PricingOutcome enough = new BranchAndBoundPricer(space, 2 * full.nodes()).price(q);
    assertTrue(enough.exact(), "twice the nodes a full search takes: the tail searches fit in half of it, so nothing changes");
    assertEquals(full.best(), enough.best());
  }

  @Test
  void constrainedGroupsComeFirstInTheOrder() {
    VariantSpace space = new VariantSpace(PricingCases.large(3, 12, 4, 10));
    int[] order = new BranchAndBoundPricer(space).groupOrder();
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
