package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogGenerator;
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
    retiring(false, "retired");
  }

  /**
   * The same catalogs with each retiring node decided at once by a MIP over its members, its offered
   * variants fixed ({@link BranchAndPrice.MemberMip}): a node closed that held a better portfolio, or a
   * MIP bound taken over the wrong set, would put the value or the bound on the wrong side of the
   * enumerated optimum.
   */
  @Test
  void nodesClosedByTheirOwnMipKeepTheProofExact() {
    retiring(true, "closed by a MIP");
  }

  /**
   * The tree alone from the empty portfolio, with every node that retires (whatever its gap, with at
   * most 6–13 members) decided at once by its own MIP: the optimum must be found inside the nodes, so a
   * node closed by a MIP over too few variants, or at a bound that does not bound it, ends the tree below
   * the enumerated optimum. Generated tight and classic catalogs of 243–1,024 variants, as above.
   */
  @Test
  void treesThatCloseNodesByTheirOwnMipFindTheOptimum() {
    AtomicInteger closing = new AtomicInteger();
    int runs = 30;
    Cases.each(runs, (seed, rnd) -> {
      StageRuns.TreeRun run = smallRetiringTree(seed, rnd, 1 + rnd.nextInt(2), true);
      if (run == null) {
        return;
      }
      BranchAndPrice.Result r = run.result();
      if (r.closedByMip() > 0 && r.closed() && r.retired() == 0) {
        closing.incrementAndGet();
        assertEquals(run.optimum(), r.incumbent().value(), run.tol(), "the tree closed below the enumerated optimum");
      }
    });
    System.out.println("trees from the empty portfolio closed with nodes decided by their MIP: " + closing + " of "
        + runs);
    assertTrue(closing.get() >= runs / 3, "most trees should close with nodes decided by their MIP: " + closing);
  }

  /**
   * The tree alone from the empty portfolio ({@link StageRuns#treeFromNothing}) on a generated tight or
   * classic catalog of 243–1,024 variants, its nodes retiring whatever their gap with at most 6–13
   * members, decided by their own MIP when {@code nodeMips}.
   */
  private static StageRuns.TreeRun smallRetiringTree(long seed, java.util.Random rnd, int workers, boolean nodeMips) {
    var family = rnd.nextBoolean() ? CatalogGenerator.Family.TIGHT : CatalogGenerator.Family.CLASSIC;
    Catalog c = StageRuns.withTerms(CatalogGenerator.generate(new CatalogGenerator.Spec(5, 3 + rnd.nextInt(2),
        3, 3, 3, 0.2, seed, family)), 800 + rnd.nextInt(4200), 6, 50);
    VariantSpace space = new VariantSpace(c);
    return StageRuns.treeFromNothing(space, (terms, pool, clock) -> {
      BranchAndPrice tree = new BranchAndPrice(space, terms, pool, StageRuns.settings(), clock, clock.phase(1.0),
          e -> {}, workers).retirement(new BranchAndPrice.Retirement(Double.POSITIVE_INFINITY, 6 + rnd.nextInt(8)));
      return nodeMips ? tree.memberMip(PoolMip.forNodes(pool, terms, StageRuns.settings(), clock.signalFlag(), () -> {}))
          : tree;
    });
  }

  /**
   * 24 seeded catalogs, fixed and choosing, against the enumerated MIP: the tree's record must name
   * {@code seen} in a quarter of them, and three quarters must be proven.
   */
  private static void retiring(boolean nodeMips, String seen) {
    AtomicInteger retiring = new AtomicInteger();
    AtomicInteger proven = new AtomicInteger();
    Cases.each(24, (seed, rnd) -> {
      Catalog c = StageRuns.fixedOrChoosing(seed, rnd);
      VariantSpace space = new VariantSpace(c);
      boolean[] retired = new boolean[1];
      PortfolioOutcome o = new IntegerStage(space, PortfolioSettings.defaults().withTimeLimit(20_000))
          .workers(1 + rnd.nextInt(2)).quickProof(false).nodeMips(nodeMips)
          .addListener(e -> retired[0] |= e.kind() == PortfolioEvent.Kind.TREE && e.note().contains(seen))
          .run(StageRuns.lp(space));
      if (StageRuns.againstEnumerated(space, o)) {
        proven.incrementAndGet();
      }
      if (retired[0]) {
        retiring.incrementAndGet();
      }
    });
    System.out.println("'" + seen + "' in " + retiring + " of 24 runs, " + proven + " proven");
    assertTrue(retiring.get() >= 24 / 4, "'" + seen + "' should settle a share of the trees: " + retiring);
    assertTrue(proven.get() >= 24 * 3 / 4, "most small cases should be proven: " + proven);
  }

  /**
   * Retired nodes that hold the tree's bound while nodes below them are still open go back to the
   * open list and are branched. The tree alone runs from the empty portfolio, so the optimum often
   * lies in a node that retired and went back: a reopened node that got lost would close the tree
   * below the optimum, or put its bound below it. Nodes retire here whatever their gap but only with
   * a few members ({@link BranchAndPrice.Retirement}), so that the root branches and a retired node can
   * lie above open ones; generated tight and classic catalogs of 243–1,024 variants make the trees
   * deep enough. Against the enumerated MIP (SCIP on every buildable variant).
   */
  @Test
  void retiredNodesThatHoldTheBoundGoBackToTheOpenList() {
    AtomicInteger reopening = new AtomicInteger();
    AtomicInteger decided = new AtomicInteger();
    int runs = 40;
    Cases.each(runs, (seed, rnd) -> {
      StageRuns.TreeRun run = smallRetiringTree(seed, rnd, 1, false);
      if (run == null) {
        return;
      }
      BranchAndPrice.Result r = run.result();
      if (r.reopened() > 0) {
        reopening.incrementAndGet();
        if (r.closed() && r.retired() == 0) {
          decided.incrementAndGet();
          assertEquals(run.optimum(), r.incumbent().value(), run.tol(), "the tree closed below the enumerated optimum");
        }
      }
    });
    System.out.println("retired nodes went back to the open list in " + reopening + " of " + runs
        + " trees from the empty portfolio, " + decided + " of them closed by the tree alone");
    assertTrue(decided.get() >= 2, "some trees should send retired nodes back and close: " + decided);
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
