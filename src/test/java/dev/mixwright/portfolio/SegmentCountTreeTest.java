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
 * The branch-and-price tree with splits on a segment's count, on catalogs whose segments accept only
 * part of the space (the quick proof and retirement off, so the tree alone decides), against the fully
 * enumerated MIP solved by SCIP ({@link StageRuns#againstEnumerated}): the bound never below the
 * optimum, the value never above it, equal when proven.
 */
class SegmentCountTreeTest {

  @Test
  void segmentCountSplitsKeepTheTreeExact() {
    AtomicInteger splitting = new AtomicInteger();
    AtomicInteger proven = new AtomicInteger();
    int runs = 24;
    Cases.each(runs, (seed, rnd) -> {
      Catalog c = rnd.nextBoolean()
          ? RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3), 2 + rnd.nextInt(2), rnd.nextInt(7),
              true)
          : StageRuns.withTerms(RandomChoiceCatalogs.tiny(seed, true), 100 + rnd.nextInt(1500), 2 + rnd.nextInt(3),
              rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40));
      VariantSpace space = new VariantSpace(StageRuns.withMasks(c, rnd));
      boolean[] split = new boolean[1];
      PortfolioOutcome o = new IntegerStage(space, PortfolioSettings.defaults().withTimeLimit(20_000)
          .withSurvivorLimit(0))
          .workers(1 + rnd.nextInt(2)).quickProof(false)
          .addListener(e -> split[0] |= e.kind() == PortfolioEvent.Kind.TREE && e.note().contains("segment's count"))
          .run(StageRuns.lp(space));
      if (StageRuns.againstEnumerated(space, o)) {
        proven.incrementAndGet();
      }
      if (split[0]) {
        splitting.incrementAndGet();
      }
    });
    System.out.println("segment count splits in " + splitting + " of " + runs + " runs, " + proven + " proven");
    assertTrue(splitting.get() >= runs / 4, "segment counts should split a share of the trees: " + splitting);
    assertTrue(proven.get() >= runs * 3 / 4, "most small cases should be proven: " + proven);
  }

  /**
   * Splits on how many of a choosing segment's variants use one option ({@link TreeNode#pairKey}), on
   * tiny catalogs where every segment chooses and accepts part of the space, with introduction costs
   * large against a variant's lot (where the relaxation mixes single offers): the same checks against the
   * enumerated MIP, and the splits must happen in a share of the trees.
   */
  @Test
  void choosingSegmentCountsPerOptionKeepTheTreeExact() {
    AtomicInteger splitting = new AtomicInteger();
    AtomicInteger proven = new AtomicInteger();
    int runs = 40;
    Cases.each(runs, (seed, rnd) -> {
      Catalog c = StageRuns.withTerms(RandomChoiceCatalogs.tiny(900 + seed, true), 300 + rnd.nextInt(3000),
          2 + rnd.nextInt(3), rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40));
      VariantSpace space = new VariantSpace(StageRuns.withMasks(c, rnd));
      boolean[] split = new boolean[1];
      PortfolioOutcome o = new IntegerStage(space, PortfolioSettings.defaults().withTimeLimit(20_000)
          .withSurvivorLimit(0))
          .workers(1 + rnd.nextInt(2)).quickProof(false)
          .addListener(e -> split[0] |= e.kind() == PortfolioEvent.Kind.TREE && e.note().contains("use one option"))
          .run(StageRuns.lp(space));
      if (StageRuns.againstEnumerated(space, o)) {
        proven.incrementAndGet();
      }
      if (split[0]) {
        splitting.incrementAndGet();
      }
    });
    System.out.println("per-option splits in " + splitting + " of " + runs + " runs, " + proven + " proven");
    assertTrue(splitting.get() >= runs / 10, "per-option counts should split a share of the trees: " + splitting);
    // all 40 are proven in milliseconds; node bounds that leave out the pair rows' prices prove 34
    assertTrue(proven.get() >= runs - 2, "nearly every tiny case should be proven: " + proven);
  }
}
