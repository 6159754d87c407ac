package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.RandomCatalogs;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.util.Random;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.BiFunction;
import org.junit.jupiter.api.Test;

/**
 * The branch-and-price tree with splits on a segment's count, and on a choosing segment's count of one
 * option, on catalogs whose segments accept only part of the space (the quick proof and retirement off,
 * so the tree alone decides), against the fully enumerated MIP solved by SCIP ({@link
 * StageRuns#againstEnumerated}): the bound never below the optimum, the value never above it, equal when
 * proven.
 */
class SegmentCountTreeTest {

  @Test
  void segmentCountSplitsKeepTheTreeExact() {
    int runs = 24;
    int[] r = trees(runs, (seed, rnd) -> rnd.nextBoolean()
        ? RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3), 2 + rnd.nextInt(2), rnd.nextInt(7),
            true)
        : StageRuns.withTerms(RandomChoiceCatalogs.tiny(seed, true), 100 + rnd.nextInt(1500), 2 + rnd.nextInt(3),
            rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40)), "segment's count");
    System.out.println("segment count splits in " + r[0] + " of " + runs + " runs, " + r[1] + " proven");
    assertTrue(r[0] >= runs / 4, "segment counts should split a share of the trees: " + r[0]);
    assertTrue(r[1] >= runs * 3 / 4, "most small cases should be proven: " + r[1]);
  }

  /**
   * Splits on how many of a choosing segment's variants use one option ({@link TreeNode#pairKey}), on
   * tiny catalogs where every segment chooses and accepts part of the space, with introduction costs
   * large against a variant's lot (where the relaxation mixes single offers): the same checks against the
   * enumerated MIP, and the splits must happen in a share of the trees.
   */
  @Test
  void choosingSegmentCountsPerOptionKeepTheTreeExact() {
    int runs = 40;
    int[] r = trees(runs, (seed, rnd) -> StageRuns.withTerms(RandomChoiceCatalogs.tiny(900 + seed, true),
        300 + rnd.nextInt(3000), 2 + rnd.nextInt(3), rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40)), "use one option");
    System.out.println("per-option splits in " + r[0] + " of " + runs + " runs, " + r[1] + " proven");
    assertTrue(r[0] >= runs / 10, "per-option counts should split a share of the trees: " + r[0]);
    // all 40 are proven in milliseconds; node bounds that leave out the pair rows' prices prove 34
    assertTrue(r[1] >= runs - 2, "nearly every tiny case should be proven: " + r[1]);
  }

  /**
   * The tree alone on {@code runs} seeded catalogs (segments' acceptance masked), each against the
   * enumerated MIP; returns {trees whose record names {@code split}, trees proven}.
   */
  private static int[] trees(int runs, BiFunction<Long, Random, Catalog> make, String split) {
    AtomicInteger splitting = new AtomicInteger();
    AtomicInteger proven = new AtomicInteger();
    Cases.each(runs, (seed, rnd) -> {
      VariantSpace space = new VariantSpace(StageRuns.withMasks(make.apply(seed, rnd), rnd));
      boolean[] seen = new boolean[1];
      PortfolioOutcome o = new IntegerStage(space, PortfolioSettings.defaults().withTimeLimit(20_000)
          .withSurvivorLimit(0))
          .workers(1 + rnd.nextInt(2)).quickProof(false)
          .addListener(e -> seen[0] |= e.kind() == PortfolioEvent.Kind.TREE && e.note().contains(split))
          .run(StageRuns.lp(space));
      if (StageRuns.againstEnumerated(space, o)) {
        proven.incrementAndGet();
      }
      if (seen[0]) {
        splitting.incrementAndGet();
      }
    });
    return new int[] {splitting.get(), proven.get()};
  }
}
