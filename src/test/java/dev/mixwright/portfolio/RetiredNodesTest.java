package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.RandomCatalogs;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/**
 * The branch-and-price tree that retires nodes with few survivors and decides them by one MIP over
 * their variants (the quick proof off, so the tree decides), against the fully enumerated MIP solved
 * by SCIP ({@link StageRuns#againstEnumerated}, every buildable variant, written from the catalog
 * figures): the bound never below the optimum, the value never above it, equal when proven; on
 * fixed-demand and on choosing catalogs, one worker and two.
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
      if (StageRuns.againstEnumerated(space, o)) {
        proven.incrementAndGet();
      }
      if (retired[0]) {
        retiring.incrementAndGet();
      }
    });
    System.out.println("retired nodes in " + retiring + " of " + runs + " runs, " + proven + " proven");
    assertTrue(retiring.get() >= runs / 4, "retirement should settle a share of the trees: " + retiring);
    assertTrue(proven.get() >= runs * 3 / 4, "most small cases should be proven: " + proven);
  }

  /**
   * With whole units a node whose introductions are all decided still sells fractions in its
   * relaxation, so no branching decision is left; it must retire into the proof set, whose MIP sells
   * whole units, rather than stay open. Introduction costs of a few EUR keep the root's gap (the
   * rounding of its sales) above two introduction costs, so it is not retired at once and the tree
   * reaches such nodes. Against the enumerated MIP with integer sales ({@link StageRuns#againstEnumerated}).
   */
  @Test
  void wholeUnitsTreesRetireTheirUndividableNodes() {
    AtomicInteger proven = new AtomicInteger();
    int runs = 16;
    Cases.each(runs, (seed, rnd) -> {
      Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(2), 4, 1 + rnd.nextInt(2), 1 + rnd.nextInt(3),
          rnd.nextInt(5), true);
      var p = c.portfolio().orElseThrow();
      c = new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), c.rules(),
          c.segments(), java.util.Optional.of(new dev.mixwright.catalog.PortfolioSpec(1 + rnd.nextInt(8),
              p.maxVariants(), p.minLot(), true)));
      VariantSpace space = new VariantSpace(c);
      PortfolioOutcome o = new IntegerStage(space, PortfolioSettings.defaults().withTimeLimit(20_000))
          .workers(1 + rnd.nextInt(2)).quickProof(false).run(StageRuns.lp(space));
      if (StageRuns.againstEnumerated(space, o)) {
        proven.incrementAndGet();
      }
    });
    System.out.println("whole units: " + proven + " of " + runs + " proven by the tree");
    assertTrue(proven.get() >= runs * 3 / 4, "the tree should decide most small whole-unit cases: " + proven);
  }
}
