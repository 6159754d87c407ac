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
 * The branch-and-price tree with its workers' masters cut to the bone ({@link
 * BranchAndPrice.NodeMasters#LEAN}: every node's master starts from its offered variants alone, so
 * every other pool variant is valued from its stored figures and enters only when it pays) against
 * the fully enumerated MIP ({@link EnumeratedMip}: every buildable variant, SCIP in one piece) and
 * against the tree with the default masters: the bound never below the optimum, the value never
 * above it, equal to it when proven; fixed and choosing segments, tooling, one worker and two.
 */
class LeanNodeMastersTest {

  @Test
  void leanMastersGiveTheSameProofAsFullOnes() {
    AtomicInteger proven = new AtomicInteger();
    AtomicInteger byTree = new AtomicInteger();
    int runs = 20;
    Cases.each(runs, (seed, rnd) -> {
      Catalog c = StageRuns.fixedOrChoosing(seed, rnd);
      if (rnd.nextInt(3) == 0) {
        c = StageRuns.withTooling(c, rnd);
      }
      VariantSpace space = new VariantSpace(c);
      int workers = 1 + rnd.nextInt(2);
      PortfolioOutcome lean = new IntegerStage(space, StageRuns.settings()).workers(workers).quickProof(false)
          .nodeMasters(BranchAndPrice.NodeMasters.LEAN).run(StageRuns.lp(space));
      PortfolioOutcome full = new IntegerStage(space, StageRuns.settings()).workers(workers).quickProof(false)
          .run(StageRuns.lp(space));
      if (StageRuns.againstEnumerated(space, lean)) {
        proven.incrementAndGet();
        byTree.addAndGet(lean.tree().nodes() > 0 ? 1 : 0);
      }
      double tol = 1e-6 * (1 + Math.abs(lean.result().value()));
      if (full.status().isProven() && lean.status().isProven()) {
        assertEquals(full.result().value(), lean.result().value(), tol, "lean and full masters proved different values");
      }
    });
    System.out.println("lean masters: " + proven + " of " + runs + " proven, " + byTree + " by the tree");
    assertTrue(proven.get() >= runs * 3 / 4, "most small cases should be proven: " + proven);
    assertTrue(byTree.get() >= runs / 4, "the tree should do the proving in a good share: " + byTree);
  }

  /**
   * The tree alone, started from the empty portfolio (value 0) instead of the stage's incumbent, so
   * it must find the optimum itself: a node bound that missed a pool variant left out of a lean
   * master would prune the optimum's subtree and close the tree at a worse value. No node retires
   * (survivor limit 0), so a closed tree decides by its bounds alone.
   */
  @Test
  void leanTreeFromNothingClosesAtTheOptimum() {
    AtomicInteger closed = new AtomicInteger();
    int runs = 20;
    Cases.each(runs, (seed, rnd) -> {
      Catalog c = StageRuns.fixedOrChoosing(seed, rnd);
      VariantSpace space = new VariantSpace(c);
      StageRuns.TreeRun run = StageRuns.treeFromNothing(space, (terms, pool, clock) -> new BranchAndPrice(space, terms,
          pool, StageRuns.settings().withSurvivorLimit(0), clock, clock.phase(1.0), e -> {}, 1 + rnd.nextInt(2),
          BranchAndPrice.NodeMasters.LEAN));
      if (run == null) {
        return;
      }
      BranchAndPrice.Result r = run.result();
      if (r.closed()) {
        closed.incrementAndGet();
        assertEquals(run.optimum(), r.incumbent().value(), run.tol(), "the tree closed below the enumerated optimum");
      }
    });
    System.out.println("lean tree from nothing: " + closed + " of " + runs + " closed");
    assertTrue(closed.get() >= runs / 2, "most trees should close: " + closed);
  }
}
