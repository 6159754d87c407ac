package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedMip;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/**
 * The branch-and-price tree that retires nodes with few survivors and decides them by one MIP over
 * their variants (the quick proof off, so the tree decides), against the fully enumerated MIP solved
 * by SCIP ({@link EnumeratedMip}, every buildable variant, written from the catalog figures): the
 * bound never below the optimum, the value never above it, equal when proven; on fixed-demand and on
 * choosing catalogs, one worker and two.
 */
class RetiredNodesTest {

  @Test
  void retiredNodesKeepTheProofExact() {
    AtomicInteger retiring = new AtomicInteger();
    AtomicInteger proven = new AtomicInteger();
    int runs = 24;
    Cases.each(runs, (seed, rnd) -> {
      Catalog c = StageRuns.fixedOrChoosing(seed, rnd);
      VariantSpace space = new VariantSpace(c);
      boolean[] retired = new boolean[1];
      PortfolioOutcome o = new IntegerStage(space, PortfolioSettings.defaults().withTimeLimit(20_000))
          .workers(1 + rnd.nextInt(2)).quickProof(false)
          .addListener(e -> retired[0] |= e.kind() == PortfolioEvent.Kind.TREE && e.note().contains("retired"))
          .run(StageRuns.lp(space));
      StageRuns.checkFeasible(space, o);
      EnumeratedMip.Result ref = EnumeratedMip.solve(space, false, 60_000);
      assertTrue(ref.optimal(), "the reference MIP was not solved to optimality");
      double tol = 1e-6 * (1 + Math.abs(ref.value()));
      assertTrue(o.result().bound() >= ref.value() - tol, "bound " + o.result().bound() + " below " + ref.value());
      assertTrue(o.result().value() <= ref.value() + tol, "value above the optimum");
      if (o.status().isProven()) {
        proven.incrementAndGet();
        assertEquals(ref.value(), o.result().value(), tol, "proven but not the enumerated optimum");
      }
      if (retired[0]) {
        retiring.incrementAndGet();
      }
    });
    System.out.println("retired nodes in " + retiring + " of " + runs + " runs, " + proven + " proven");
    assertTrue(retiring.get() >= runs / 4, "retirement should settle a share of the trees: " + retiring);
    assertTrue(proven.get() >= runs * 3 / 4, "most small cases should be proven: " + proven);
  }
}
