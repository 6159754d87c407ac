package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.HardCatalogs;
import dev.mixwright.testing.RandomCatalogs;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;

/**
 * A stop request (a signal, or the query's own criterion such as the loop's time limit) reaches inside
 * a pricing search: it ends within a few thousand nodes, not exact.
 */
class CancellationTest {
  @AfterEach
  void clear() {
    Cancellation.clear();
  }

  /** All weights 0 and room for a million: the search has to visit node after node. */
  private static PricingOutcome price(Pricer p, VariantSpace space) {
    return p.price(new PricingQuery(0, new double[space.totalChoices()], 0, 1_000_000, Double.NEGATIVE_INFINITY,
        Set.of()));
  }

  @Test
  void aRequestEndsTheSearchesWithinAFewThousandNodes() {
    long seed = 15;
    VariantSpace space = new VariantSpace(RandomCatalogs.random(new Random(seed), 12, 5, 1, 1, 0, false));
    for (Pricer p : new Pricer[] {new ForwardCheckingPricer(space, 200_000),
        new BranchAndBoundPricer(space, 200_000, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT)}) {
      PricingOutcome full = price(p, space);
      assertTrue(full.nodes() >= 100_000, "seed " + seed + ": the uncancelled search runs to its limit");
      Cancellation.request();
      PricingOutcome cut = price(p, space);
      Cancellation.clear();
      assertFalse(cut.exact(), "seed " + seed);
      assertTrue(cut.nodes() <= 8192, "seed " + seed + ": " + cut.nodes() + " nodes after the request");
      assertFalse(cut.found().isEmpty(), "a query without threshold keeps a variant, so no segment looks empty");
    }
  }

  @Test
  void aQuerysOwnCriterionEndsTheSearchesLikeASignal() {
    long seed = 16;
    VariantSpace space = new VariantSpace(RandomCatalogs.random(new Random(seed), 12, 5, 1, 1, 0, false));
    Cancellation now = Cancellation.signalOr(() -> true);
    for (Pricer p : new Pricer[] {new ForwardCheckingPricer(space, 200_000),
        new BranchAndBoundPricer(space, 200_000, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT),
        BucketEliminationPricer.fitting(space, 200_000, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT).orElseThrow()}) {
      PricingOutcome cut = p.price(new PricingQuery(0, new double[space.totalChoices()], 0, 1_000_000, -1.0,
          Set.of(), now));
      assertFalse(cut.exact(), p.name() + ", seed " + seed);
      assertTrue(cut.nodes() <= 8192, p.name() + ", seed " + seed + ": " + cut.nodes() + " nodes");
      PricingOutcome seedQuery = price(p, space, now);
      assertFalse(seedQuery.found().isEmpty(), p.name() + ": a query without threshold still keeps a variant");
    }
  }

  /**
   * The seed query (no threshold) of a space whose best variant is a maximum independent set: its
   * searches for tail bounds hold no variant, yet they stop too, and the main search then stops at
   * its first variant.
   */
  @Test
  void aQueryWithoutThresholdStopsItsBoundSearchesAndKeepsOneVariant() throws Exception {
    VariantSpace space = new VariantSpace(CatalogLoader.parse(HardCatalogs.independentSets(3, 300, 0.05, 50),
        "sets.json", null));
    ForwardCheckingPricer p = new ForwardCheckingPricer(space, 2_000_000);
    Cancellation.request();
    PricingOutcome cut = p.price(new PricingQuery(0, weights(space), 0, 1, Double.NEGATIVE_INFINITY, Set.of()));
    assertFalse(cut.exact());
    assertTrue(cut.nodes() <= 8192 + space.groupCount(), cut.nodes() + " nodes after the request");
    assertEquals(1, cut.found().size());
    assertTrue(space.isBuildable(cut.found().get(0).choices()));
  }

  /** Each choice's margin: the seed query's weights at zero duals. */
  private static double[] weights(VariantSpace space) {
    double[] w = new double[space.totalChoices()];
    for (int f = 0; f < w.length; f++) {
      w[f] = space.choiceMargin(f);
    }
    return w;
  }

  private static PricingOutcome price(Pricer p, VariantSpace space, Cancellation c) {
    return p.price(new PricingQuery(0, new double[space.totalChoices()], 0, 1_000_000, Double.NEGATIVE_INFINITY,
        Set.of(), c));
  }
}
