package dev.mixwright.testing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The two references of the choice model checked against each other and against the multinomial
 * logit itself, on seeded random tiny catalogs ({@link RandomChoiceCatalogs}); every failure names
 * its seed.
 */
class ChoiceReferencesTest {
  private static final int SEEDS = 40;

  /**
   * Gallego, Ratliff &amp; Shebalov 2015 (Operations Research 63(1)) prove the sales-based LP equal to
   * the choice-based deterministic LP over offer sets (Liu &amp; van Ryzin 2008, MSOM 10(2)).
   */
  @Test
  void salesBasedLpEqualsOfferSetLp() {
    int binding = 0;
    for (long seed = 0; seed < SEEDS; seed++) {
      Catalog c = RandomChoiceCatalogs.tiny(seed, false);
      VariantSpace space = new VariantSpace(c);
      double sblp = SalesBasedLp.solve(space).objective();
      double cdlp = OfferSetLp.solve(space).objective();
      long s = seed;
      assertEquals(cdlp, sblp, 1e-6 * Math.max(1, Math.abs(cdlp)), () -> "seed " + s);
      if (sblp < SalesBasedLp.solve(new VariantSpace(roomy(c))).objective() - 1e-6) {
        binding++;
      }
    }
    // the theorem is only interesting where capacity binds; the generator must produce such cases
    assertTrue(binding >= SEEDS / 5, "capacity binds in only " + binding + " of " + SEEDS + " catalogs");
  }

  /** The same with fixed-demand segments beside: their columns are the same in both LPs. */
  @Test
  void equalityHoldsWithFixedSegmentsBeside() {
    for (long seed = 100; seed < 100 + SEEDS / 2; seed++) {
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, true));
      double sblp = SalesBasedLp.solve(space).objective();
      double cdlp = OfferSetLp.solve(space).objective();
      long s = seed;
      assertEquals(cdlp, sblp, 1e-6 * Math.max(1, Math.abs(cdlp)), () -> "seed " + s);
    }
  }

  /**
   * Offered a fixed list with capacity to spare, a segment buys buyers · w(v) / (1 + Σ w) of each
   * variant and buyers / (1 + Σ w) stay out (Train, <i>Discrete Choice Methods with Simulation</i>,
   * 2nd ed. 2009, ch. 3); the shares are computed here by plain arithmetic from the catalog.
   */
  @Test
  void fixedOfferListSellsTheLogitShares() {
    for (long seed = 200; seed < 200 + SEEDS; seed++) {
      long s0 = seed;
      VariantSpace space = new VariantSpace(roomy(RandomChoiceCatalogs.tiny(seed, false)));
      Random rnd = new Random(seed);
      List<EnumeratedLp.Column> offered = new ArrayList<>();
      for (EnumeratedLp.Column col : EnumeratedLp.columns(space)) {
        if (rnd.nextDouble() < 0.6) {
          offered.add(col);
        }
      }
      SalesBasedLp.Solution sol = SalesBasedLp.solve(space, offered, true);
      for (int s = 0; s < space.segmentCount(); s++) {
        double sum = 0;
        for (EnumeratedLp.Column col : SalesBasedLp.ofSegment(offered, s)) {
          sum += Math.exp(space.utility(col.choices(), s) - space.stayOut(s));
        }
        double buyers = space.buyers(s);
        for (int j = 0; j < offered.size(); j++) {
          EnumeratedLp.Column col = offered.get(j);
          if (col.segment() == s) {
            double w = Math.exp(space.utility(col.choices(), s) - space.stayOut(s));
            double expected = buyers * w / (1 + sum);
            assertEquals(expected, sol.x()[j], 1e-7 * buyers, () -> "seed " + s0);
          }
        }
        assertEquals(buyers / (1 + sum), sol.stayingOut()[s], 1e-7 * buyers, () -> "seed " + s0);
      }
    }
  }

  /**
   * With capacity to spare the LPs fall apart by segment, and each segment's best is one offer set
   * (a linear objective over the buyers' split between sets is best at a vertex): checked against
   * every offer set listed by brute force here.
   */
  @Test
  void withoutBindingCapacityTheBestOfferSetIsTheOptimum() {
    for (long seed = 300; seed < 300 + SEEDS; seed++) {
      long s0 = seed;
      VariantSpace space = new VariantSpace(roomy(RandomChoiceCatalogs.tiny(seed, false)));
      List<EnumeratedLp.Column> all = EnumeratedLp.columns(space);
      double best = 0;
      for (int s = 0; s < space.segmentCount(); s++) {
        List<EnumeratedLp.Column> cols = SalesBasedLp.ofSegment(all, s);
        double bestSet = 0;
        for (int mask = 0; mask < 1 << cols.size(); mask++) {
          double denominator = 1;
          double revenue = 0;
          for (int k = 0; k < cols.size(); k++) {
            if ((mask >> k & 1) != 0) {
              double w = Math.exp(space.utility(cols.get(k).choices(), s) - space.stayOut(s));
              denominator += w;
              revenue += w * cols.get(k).margin();
            }
          }
          bestSet = Math.max(bestSet, space.buyers(s) * revenue / denominator);
        }
        best += bestSet;
      }
      double sblp = SalesBasedLp.solve(space).objective();
      assertEquals(best, sblp, 1e-6 * Math.max(1, best), () -> "seed " + s0);
      assertEquals(best, OfferSetLp.solve(space).objective(), 1e-6 * Math.max(1, best), () -> "seed " + s0);
    }
  }

  /** Duals of the SBLP price its columns: no column has positive reduced cost at the optimum. */
  @Test
  void salesBasedDualsAreDualFeasible() {
    for (long seed = 400; seed < 400 + SEEDS / 2; seed++) {
      long s0 = seed;
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, true));
      SalesBasedLp.Solution sol = SalesBasedLp.solve(space);
      for (int j = 0; j < sol.columns().size(); j++) {
        EnumeratedLp.Column col = sol.columns().get(j);
        double d = col.margin() - sol.segmentDual()[col.segment()] - sol.columnDual()[j];
        for (int r = 0; r < space.resourceCount(); r++) {
          d -= sol.resourceDual()[r] * col.use()[r];
        }
        assertTrue(d <= 1e-6 * Math.max(1, Math.abs(col.margin())), () -> "seed " + s0);
      }
      for (int s = 0; s < space.segmentCount(); s++) {
        if (space.chooses(s)) {
          // the dual row of x_s0: μ_s − Σ_j w_j β_j ≥ 0
          double row = sol.segmentDual()[s];
          for (int j = 0; j < sol.columns().size(); j++) {
            if (sol.columns().get(j).segment() == s) {
              row -= sol.attraction()[j] * sol.columnDual()[j];
            }
          }
          assertTrue(row >= -1e-6, () -> "seed " + s0);
        }
      }
    }
  }

  /** The catalog with capacities no plan can use up: every unit uses at most 4 per group. */
  private static Catalog roomy(Catalog c) {
    double buyers = c.segments().stream().mapToDouble(s -> s.demand()).sum();
    List<Resource> res = new ArrayList<>();
    for (Resource r : c.resources()) {
      res.add(new Resource(r.id(), r.label(), r.unit(), 4 * c.groups().size() * buyers + 1));
    }
    return new Catalog(
        c.format(), c.name(), c.currency(), c.period(), res, c.groups(), c.rules(), c.segments(), c.portfolio());
  }
}
