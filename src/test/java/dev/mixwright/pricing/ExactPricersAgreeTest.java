package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.pricing.PricingCases.Case;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** The three exact pricers cross-checked on the same queries. */
class ExactPricersAgreeTest {

  private static List<Pricer> exact(VariantSpace space) {
    return List.of(new BruteForcePricer(space), new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT), new CpSatPricer(space, 0, 1));
  }

  @Test
  void sameBestReducedCostPerSegmentOnRandomDuals() {
    int compared = 0;
    for (int i = 0; i < 120; i++) {
      Case c = PricingCases.random(i);
      VariantSpace space = c.space();
      List<Pricer> pricers = exact(space);
      Random rnd = new Random(i + 77);
      for (int s = 0; s < space.segmentCount(); s++) {
        double[] pi = new double[space.resourceCount()];
        for (int r = 0; r < pi.length; r++) {
          pi[r] = rnd.nextDouble() * 20;
        }
        double mu = rnd.nextDouble() * 80;
        PricingQuery q = ReducedCosts.query(space, s, pi, mu, 1, Double.NEGATIVE_INFINITY, Set.of());
        PricingOutcome ref = pricers.get(0).price(q);
        for (Pricer p : pricers) {
          PricingOutcome out = p.price(q);
          assertTrue(out.exact(), p.name());
          assertEquals(ref.best(), out.best(), PricingCases.tol(ref.best()), () -> p.name() + " case " + c);
          assertEquals(ref.upperBound(), out.upperBound(), PricingCases.tol(ref.upperBound()), p.name());
        }
        compared++;
      }
    }
    assertTrue(compared >= 300, "compared " + compared);
  }

  @Test
  void sameKBestOutsideTheMasterColumns() {
    for (int i = 0; i < 100; i++) {
      Case c = PricingCases.random(500 + i);
      Random rnd = new Random(i);
      Set<VariantKey> excluded = new HashSet<>();
      for (var col : c.columns()) {
        if (rnd.nextDouble() < 0.3) {
          excluded.add(c.space().key(col.v()));
        }
      }
      PricingQuery q = c.query(4, 0.0, excluded);
      double[] ref = null;
      for (Pricer p : exact(c.space())) {
        double[] got = p.price(q).found().stream().mapToDouble(PricedVariant::reducedCost).toArray();
        if (ref == null) {
          ref = got;
        }
        assertEquals(ref.length, got.length, p.name());
        for (int j = 0; j < got.length; j++) {
          assertEquals(ref[j], got[j], PricingCases.tol(ref[j]), p.name());
        }
      }
    }
  }

  /** 40 groups × 5 options (5^40 combinations) with 100 pairwise rules: too large to enumerate. */
  @Test
  void branchAndBoundAndCpSatAgreeOnALargeSpace() {
    VariantSpace space = new VariantSpace(PricingCases.large(2027, 40, 5, 100));
    assertTrue(space.nogoodCount() >= 90, "rules compiled: " + space.nogoodCount());
    Pricer bnb = new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT);
    Pricer cpsat = new CpSatPricer(space, 0, 1);
    Random rnd = new Random(5);
    for (int round = 0; round < 6; round++) {
      int s = round % 2;
      double[] pi = {rnd.nextDouble() * 12, rnd.nextDouble() * 12};
      double mu = rnd.nextDouble() * 300;
      PricingQuery q = ReducedCosts.query(space, s, pi, mu, 5, Double.NEGATIVE_INFINITY, Set.of());
      PricingOutcome a = bnb.price(q);
      PricingOutcome b = cpsat.price(q);
      assertTrue(a.exact() && b.exact());
      assertEquals(5, a.found().size());
      for (int j = 0; j < 5; j++) {
        assertEquals(b.found().get(j).reducedCost(), a.found().get(j).reducedCost(), PricingCases.tol(a.best()));
        for (PricedVariant pv : List.of(a.found().get(j), b.found().get(j))) {
          assertTrue(space.isColumn(pv.choices(), s));
          double direct = ReducedCosts.of(space, pv.choices(), s, pi, mu);
          assertEquals(direct, pv.reducedCost(), PricingCases.tol(direct));
        }
      }
      // the best two excluded: both must agree on the third best
      Set<VariantKey> top2 = Set.of(space.key(a.found().get(0).choices()), space.key(a.found().get(1).choices()));
      PricingQuery qx = ReducedCosts.query(space, s, pi, mu, 1, Double.NEGATIVE_INFINITY, top2);
      double third = a.found().get(2).reducedCost();
      assertEquals(third, bnb.price(qx).best(), PricingCases.tol(third));
      assertEquals(third, cpsat.price(qx).best(), PricingCases.tol(third));
    }
  }
}
