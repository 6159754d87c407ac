package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomCatalogs;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

class LagrangianPortfolioBoundTest {

  @Test
  void handComputedTopK() {
    // constant 100, values 50, 30, 20, -5, K = 2, everything else at most 10:
    // λ = max(10, third largest 20) = 20, L = 100 + 2·20 + (50−20) + (30−20) = 180 = 100 + 50 + 30
    LagrangianPortfolioBound b = LagrangianPortfolioBound.of(100, new double[] {20, 50, -5, 30}, 10, 2, new double[0], new double[0]);
    assertEquals(180, b.value(), 1e-12);
    // λ̂ = the K-th largest, 30: a portfolio holding a variant of value 12 is worth at most 180 − (30 − 12)
    assertEquals(30, b.lambda(), 1e-12);
    assertEquals(162, b.withVariant(12), 1e-12);
    // what is not listed may be worth up to 40: then λ ≥ 40 and L = 100 + 2·40 + (50 − 40) = 190
    assertEquals(190, LagrangianPortfolioBound.of(100, new double[] {20, 50, -5, 30}, 40, 2, new double[0], new double[0])
        .value(), 1e-12);
    // no limit: all positive values count, and only when nothing unlisted is positive
    assertEquals(200, LagrangianPortfolioBound.of(100, new double[] {20, 50, -5, 30}, 0, PortfolioTerms.UNLIMITED,
        new double[0], new double[0]).value(), 1e-12);
    assertEquals(Double.POSITIVE_INFINITY, LagrangianPortfolioBound.of(100, new double[] {20}, 1, PortfolioTerms.UNLIMITED,
        new double[0], new double[0]).value());
  }

  @Test
  void validAtAnyPricesAgainstTheEnumeratedOptimum() {
    // property over a seeded series: random π, μ ≥ 0, the pricer's k best (k small, so the λ-form with
    // a positive rest bound is exercised), never below the integer optimum of the full MIP (SCIP)
    for (int i = 0; i < 40; i++) {
      Random rnd = new Random(7000 + i);
      Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3), 1 + rnd.nextInt(3),
          rnd.nextInt(6), true);
      VariantSpace space = new VariantSpace(c);
      PortfolioTerms t = PortfolioTerms.of(space);
      if (t.variantCap() == 0) {
        continue;
      }
      double opt = EnumeratedMip.solve(space, false, 60_000).bound();
      for (int trial = 0; trial < 5; trial++) {
        double[] pi = new double[space.resourceCount()];
        for (int r = 0; r < pi.length; r++) {
          pi[r] = rnd.nextDouble() < 0.3 ? 0 : rnd.nextDouble() * 10;
        }
        double[] mu = new double[space.segmentCount()];
        for (int s = 0; s < mu.length; s++) {
          mu[s] = rnd.nextDouble() < 0.5 ? 0 : rnd.nextDouble() * 30;
        }
        int k = 1 + rnd.nextInt(3);
        PricingOutcome out = new VariantPricer(space, t, Long.MAX_VALUE).price(
            new VariantQuery(pi, mu, t.introductionCost(), null, 0, k, Set.of(), 0));
        List<PricedVariant> f = out.found();
        double[] listed = f.stream().mapToDouble(PricedVariant::reducedCost).toArray();
        double constant = 0;
        for (int r = 0; r < pi.length; r++) {
          constant += pi[r] * t.capacity()[r];
        }
        for (int s = 0; s < mu.length; s++) {
          constant += mu[s] * t.demand()[s];
        }
        LagrangianPortfolioBound b = LagrangianPortfolioBound.of(constant, listed, out.restBound(), t.variantCap(), pi, mu);
        assertTrue(opt <= b.value() + 1e-6 * (1 + Math.abs(opt)), "case " + i + ": " + b.value() + " < " + opt);
      }
    }
  }
}
