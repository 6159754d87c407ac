package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Choice;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** The integer stage over catalogs with segments that choose by multinomial logit. */
class ChoicePortfolioTest {

  /** Terms drawn per seed: an introduction cost near a variant's earnings, a small limit, some lots. */
  private static Catalog withRandomTerms(Catalog c, Random rnd) {
    double intro = 100 + rnd.nextInt(1500);
    int limit = 1 + rnd.nextInt(3);
    double lot = rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40);
    Catalog t = StageRuns.withTerms(c, intro, limit, lot);
    if (rnd.nextDouble() < 0.25) {
      t = new Catalog(t.format(), t.name(), t.currency(), t.period(), t.resources(), t.groups(), t.rules(),
          t.segments(), Optional.of(new PortfolioSpec(intro, limit, lot, true)));
    }
    return rnd.nextDouble() < 0.3 ? StageRuns.withTooling(t, rnd) : t;
  }

  /**
   * Against the fully enumerated MIP solved by SCIP in one piece ({@link EnumeratedMip}, independent of
   * the pool, the pricer and the project's bounds): the stage's bound is never below the optimum, its
   * value never above it, and equal to it when it says proven. Its offer obeys every row of the
   * choice model, checked from the catalog figures.
   */
  @Test
  void matchesTheEnumeratedMipOnMixedCatalogs() {
    int proven = 0;
    int runs = 24;
    for (long seed = 1; seed <= runs; seed++) {
      long at = seed;
      try {
        Random rnd = new Random(seed * 7919);
        Catalog c = withRandomTerms(RandomChoiceCatalogs.tiny(seed, true), rnd);
        VariantSpace space = new VariantSpace(c);
        PortfolioOutcome o = StageRuns.stage(space, StageRuns.settings());
        if (checkAgainstEnumerated(space, o)) {
          proven++;
        }
      } catch (AssertionError | RuntimeException e) {
        throw new AssertionError("seed " + at + ": " + e.getMessage(), e);
      }
    }
    System.out.println("choice portfolio: " + proven + " of " + runs + " proven");
    // on catalogs this small the quick proof lists every survivor, so most runs end proven
    assertTrue(proven >= runs / 2, "only " + proven + " of " + runs + " proven");
  }

  /**
   * The branch-and-price tree with choice rows in its node masters (the quick proof off, so the tree
   * decides): its bound never below the enumerated optimum (SCIP on {@link EnumeratedMip}), its value
   * never above it, equal when proven.
   */
  @Test
  void treeKeepsItsBoundWithChoiceRows() {
    for (long seed = 101; seed <= 106; seed++) {
      long at = seed;
      try {
        Random rnd = new Random(seed * 104729);
        Catalog c = withRandomTerms(RandomChoiceCatalogs.tiny(seed, true), rnd);
        VariantSpace space = new VariantSpace(c);
        PortfolioOutcome o = new IntegerStage(space, PortfolioSettings.defaults().withTimeLimit(5_000))
            .quickProof(false).run(StageRuns.lp(space));
        checkAgainstEnumerated(space, o);
      } catch (AssertionError | RuntimeException e) {
        throw new AssertionError("seed " + at + ": " + e.getMessage(), e);
      }
    }
  }

  /**
   * The checks against the enumerated MIP (SCIP, {@link EnumeratedMip}) and the catalog figures;
   * true when the portfolio says proven.
   */
  private static boolean checkAgainstEnumerated(VariantSpace space, PortfolioOutcome o) {
    EnumeratedMip.Result ref = EnumeratedMip.solve(space, false, 60_000);
    assertTrue(ref.optimal(), "the reference MIP was not solved to optimality");
    double tol = 1e-5 * (1 + Math.abs(ref.value()));
    StageRuns.checkFeasible(space, o);
    checkChoiceRows(space, o);
    assertTrue(o.result().bound() >= ref.value() - tol, "bound " + o.result().bound() + " below the optimum " + ref.value());
    assertTrue(o.result().value() <= ref.value() + tol, "value " + o.result().value() + " above the optimum " + ref.value());
    if (o.status() != PortfolioStatus.PROVEN) {
      assertTrue(!o.reason().isEmpty(), "a heuristic portfolio says why");
      return false;
    }
    assertEquals(ref.value(), o.result().value(), tol, "proven but not the enumerated optimum");
    return true;
  }

  /** Each choosing segment's sales obey x_sv ≤ w_s(v)·(buyers_s − Σ_v x_sv), from the catalog figures. */
  static void checkChoiceRows(VariantSpace space, PortfolioOutcome o) {
    for (int s = 0; s < space.segmentCount(); s++) {
      if (!space.chooses(s)) {
        continue;
      }
      double sold = 0;
      for (OfferedVariant v : o.offer().variants()) {
        sold += v.sales()[s];
      }
      double out = space.buyers(s) - sold;
      assertTrue(out >= -1e-6 * space.buyers(s), "segment " + s + " sells more than its buyers");
      for (OfferedVariant v : o.offer().variants()) {
        double w = Math.exp(space.utility(v.choices(), s) - space.stayOut(s));
        assertTrue(v.sales()[s] <= w * out + 1e-6 * (1 + space.buyers(s)),
            "segment " + s + " buys more of a variant than its logit ratio allows");
      }
    }
  }

  /**
   * One group of three options with equal margins (price 100, cost 60), one choosing segment of 1000
   * buyers, capacity far from binding, no introduction cost: every variant pays, so the portfolio is
   * all three and sales are the multinomial logit's buyers·w_v/(1 + Σ w) (Train, "Discrete Choice
   * Methods with Simulation", 2nd ed. 2009, ch. 3, the logit choice probability, with the stay-out
   * as the alternative of utility stayOut). Both the stage and the LP of the fixed offer set.
   */
  @Test
  void fixedOfferSetSellsTheLogitShares() {
    Map<String, Double> uses = Map.of("bench", 1.0);
    Group g = new Group("hull", null, true, List.of(new Option("a", null, 100, 60, uses, 0.0),
        new Option("b", null, 100, 60, uses, 0.0), new Option("c", null, 100, 60, uses, 0.0)));
    Map<String, Double> partWorth = Map.of("hull.a", 0.2, "hull.b", 1.0, "hull.c", -0.3);
    double buyers = 1000;
    double stayOut = 0.5;
    double priceWeight = -0.01;
    Segment s = Segment.choosing("scullers", null, Map.of(), Map.of(),
        new Choice(buyers, stayOut, priceWeight, partWorth));
    Catalog c = new Catalog(1, "logit shares", "EUR", "year", List.of(new Resource("bench", null, "h", 1e6)),
        List.of(g), List.of(), List.of(s), Optional.of(new PortfolioSpec(0, 3, 0)));
    VariantSpace space = new VariantSpace(c);
    double[] w = new double[3];
    double sum = 0;
    String[] ids = {"hull.a", "hull.b", "hull.c"};
    for (int k = 0; k < 3; k++) {
      w[k] = Math.exp(partWorth.get(ids[k]) + priceWeight * 100 - stayOut);
      sum += w[k];
    }
    PortfolioTerms terms = PortfolioTerms.of(space);
    Pool pool = new Pool(space, terms);
    for (int k = 0; k < 3; k++) {
      pool.add(new int[] {k});
    }
    Plan fixed = FixedPortfolio.solve(pool, terms, new int[] {0, 1, 2});
    PortfolioOutcome o = StageRuns.stage(space, StageRuns.settings());
    assertEquals(3, o.offer().variants().size());
    for (int k = 0; k < 3; k++) {
      double logit = buyers * w[k] / (1 + sum); // Train (2009), ch. 3
      assertEquals(logit, fixed.sales().get(k)[0], 1e-6 * buyers, "fixed offer set, option " + k);
      for (OfferedVariant v : o.offer().variants()) {
        if (v.choices()[0] == k) {
          assertEquals(logit, v.sales()[0], 1e-6 * buyers, "stage, option " + k);
        }
      }
    }
    assertEquals(40 * buyers * sum / (1 + sum), o.result().value(), 1e-6 * buyers * 40);
    assertEquals(PortfolioStatus.PROVEN, o.status(), o.reason());
  }
}
