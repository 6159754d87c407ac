package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioLpSolution;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The Lagrangian bound with the attraction rows' duals ({@link ChoicePrices}) on random catalogs with
 * segments that choose, against the fully enumerated MIP solved by SCIP ({@link EnumeratedMip}, every
 * buildable variant, written from the catalog figures): never below the integer optimum, at the
 * master's duals over a random part of the space and at random prices (β ≥ 0, μ of any sign); and
 * equal to the relaxed master's objective when the master holds the whole space (LP duality).
 */
class ChoicePricesTest {

  private static Catalog withRandomTerms(Catalog c, Random rnd) {
    double intro = 100 + rnd.nextInt(1500);
    int limit = 1 + rnd.nextInt(3);
    double lot = rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40);
    return StageRuns.withTerms(c, intro, limit, lot);
  }

  @Test
  void boundHoldsAgainstTheEnumeratedOptimum() {
    Cases.each(30, (seed, rnd) -> {
      VariantSpace space = new VariantSpace(withRandomTerms(RandomChoiceCatalogs.tiny(seed, true), rnd));
      PortfolioTerms terms = PortfolioTerms.of(space);
      EnumeratedMip.Result ref = EnumeratedMip.solve(space, false, 60_000);
      assertTrue(ref.optimal(), "the reference MIP was not solved to optimality");
      double opt = ref.value();
      double tol = 1e-6 * (1 + Math.abs(opt));
      List<int[]> all = EnumeratedMip.sellable(space);
      for (boolean whole : new boolean[] {false, true}) {
        Pool pool = new Pool(space, terms);
        for (int[] v : all) {
          if (whole || rnd.nextBoolean()) {
            pool.add(v);
          }
        }
        StageClock clock = new StageClock(60_000, StopCriterion.never());
        Relaxation rx = new Relaxation(space, terms, new VariantPricer(space, terms, Long.MAX_VALUE),
            PortfolioSettings.defaults(), e -> {}, clock, clock.phase(1.0));
        try (PortfolioLp lp = new PortfolioLp(terms.capacity(), terms.demand(), terms.variantCap())) {
          pool.choice().enter(lp);
          for (PoolVariant v : pool.all()) {
            int i = lp.addVariant(v.segments(), v.margin(), v.use(), v.upper(), v.fixedCost(), terms.minLot());
            pool.choice().attract(lp, i, v);
          }
          PortfolioLpSolution sol = lp.solve();
          assertTrue(sol.isOptimal(), "the relaxed master over the pool");
          ChoicePrices beta = ChoicePrices.of(lp, pool.size());
          double b = rx.bound(pool, sol.resourceDual(), sol.segmentDual(), beta, 4).bound().value();
          assertTrue(b >= opt - tol, "at the master's duals: bound " + b + " below the optimum " + opt);
          if (whole) {
            // the master is the relaxation over the whole space: its duals give its objective back
            assertTrue(b <= sol.objective() + tol, "over the whole space the bound " + b
                + " should meet the relaxed objective " + sol.objective());
          }
          for (int trial = 0; trial < 4; trial++) {
            double[] pi = new double[space.resourceCount()];
            for (int r = 0; r < pi.length; r++) {
              pi[r] = rnd.nextDouble() < 0.3 ? 0 : rnd.nextDouble() * 10;
            }
            double[] mu = new double[space.segmentCount()];
            for (int s = 0; s < mu.length; s++) {
              // a buyers row is an equality: its price may be negative
              mu[s] = rnd.nextDouble() < 0.3 ? 0 : (space.chooses(s) ? -10 : 0) + rnd.nextDouble() * 40;
            }
            double[][] rb = new double[pool.size()][];
            double[] stay = new double[space.segmentCount()];
            for (int i = 0; i < pool.size(); i++) {
              PoolVariant v = pool.get(i);
              rb[i] = new double[v.segments().length];
              for (int k = 0; k < rb[i].length; k++) {
                int s = v.segments()[k];
                if (space.chooses(s) && rnd.nextBoolean()) {
                  rb[i][k] = rnd.nextDouble() * 20;
                  stay[s] += pool.choice().attraction(v.choices(), s) * rb[i][k];
                }
              }
            }
            double at = rx.bound(pool, pi, mu, new ChoicePrices(rb, stay), 1 + rnd.nextInt(3)).bound().value();
            assertTrue(at >= opt - tol, "at random prices: bound " + at + " below the optimum " + opt);
          }
        }
      }
    });
  }
}
