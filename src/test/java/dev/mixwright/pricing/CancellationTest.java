package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.RandomCatalogs;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;

/** A stop request reaches inside a pricing search: it ends within a few thousand nodes, not exact. */
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
}
