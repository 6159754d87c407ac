package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantSpace;
import java.util.Set;
import org.junit.jupiter.api.Test;

class CpSatPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new CpSatPricer(space, 0, 1);
  }

  @Override
  protected int cases() {
    return 60; // each query is one CP-SAT solve per variant found
  }

  /** Whether or not a time limit stops CP-SAT, and wherever, what it answers must hold. */
  @Test
  void timeLimitedAnswersStayValid() {
    VariantSpace space = new VariantSpace(PricingCases.large(4, 40, 5, 100));
    double[] pi = {2.0, 4.5};
    PricingQuery q = ReducedCosts.query(space, 0, pi, 150, 3, Double.NEGATIVE_INFINITY, Set.of());
    double best = new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT).price(q).best();
    new CpSatPricer(space, 0, 1).price(q); // class loading and native warm-up, so the limit meets the search
    // limits short enough to stop CP-SAT before, during and after its first solution on this machine
    for (double limit : new double[] {1e-6, 0.005, 0.02, 0.05}) {
      PricingOutcome out = new CpSatPricer(space, limit, 1).price(q);
      assertTrue(out.upperBound() >= best - PricingCases.tol(best), "bound " + out.upperBound() + " below the best " + best);
      for (PricedVariant pv : out.found()) {
        assertTrue(space.isColumn(pv.choices(), 0));
        assertTrue(pv.reducedCost() <= best + PricingCases.tol(best));
      }
      if (out.exact()) {
        assertTrue(Math.abs(out.best() - best) <= PricingCases.tol(best));
      }
    }
  }
}
