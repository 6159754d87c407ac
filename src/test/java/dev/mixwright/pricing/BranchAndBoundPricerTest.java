package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantSpace;
import java.util.Set;
import org.junit.jupiter.api.Test;

class BranchAndBoundPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT);
  }

  @Test
  void nodeLimitKeepsAValidBound() {
    NodeLimits.keepValidBounds((space, limit) -> new BranchAndBoundPricer(space, limit, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT));
  }

  @Test
  void nodeLimitOnALargeSpace() {
    VariantSpace space = new VariantSpace(PricingCases.large(11, 40, 5, 100));
    double[] pi = {3.5, 1.25};
    PricingQuery q = ReducedCosts.query(space, 0, pi, 120, 3, Double.NEGATIVE_INFINITY, Set.of());
    PricingOutcome full = new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT).price(q);
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
      PricingOutcome out = new BranchAndBoundPricer(space, limit, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT).price(q);
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
    PricingOutcome enough = new BranchAndBoundPricer(space, 2 * full.nodes(), BranchAndBoundPricer.DEFAULT_TABLE_LIMIT).price(q);
    assertTrue(enough.exact(), "twice the nodes a full search takes: the tail searches fit in half of it, so nothing changes");
    assertEquals(full.best(), enough.best());
  }
}
