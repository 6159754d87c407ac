package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.pricing.BruteForcePricer;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import net.jqwik.api.Assume;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * Column generation against an independent reference: the fully enumerated LP of the same catalog
 * solved by Apache Commons Math's SimplexSolver ({@link EnumeratedLp}), on random small catalogs
 * with rules, optional groups, and segments with accepts, value and maxShare.
 */
class ColumnGenerationProperties {

  private static Catalog draw(long seed, int groups, int segments) {
    Random rnd = new Random(seed * 0x9E3779B97F4A7C15L);
    return RandomCatalogs.random(rnd, groups, 4, 1 + rnd.nextInt(3), segments, rnd.nextInt(7), false);
  }

  @Property(tries = 120)
  void objectiveEqualsFullyEnumeratedLp(
      @ForAll long seed,
      @ForAll @IntRange(min = 1, max = 5) int groups,
      @ForAll @IntRange(min = 1, max = 3) int segments,
      @ForAll @IntRange(min = 1, max = 6) int perRound,
      @ForAll boolean bnb) {
    VariantSpace space = new VariantSpace(draw(seed, groups, segments));
    Assume.that(combinations(space) <= 2000);
    List<EnumeratedLp.Column> all = EnumeratedLp.columns(space);
    Assume.that(!all.isEmpty() && all.size() <= 400);
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);

    Pricer pricer = bnb ? new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT) : new BruteForcePricer(space);
    SolveOutcome out =
        new ColumnGeneration(space, pricer, SolveSettings.defaults().withPerRound(perRound)).run();

    assertEquals(RunStatus.OPTIMAL, out.status());
    double scale = Math.max(1.0, Math.abs(ref.objective()));
    assertEquals(ref.objective(), out.objective(), 1e-6 * scale, "objective vs Commons Math");
    assertTrue(out.bound() >= ref.objective() - 1e-6 * scale, "the bound must hold");
    assertTrue(out.gap() <= 1e-6);

    // The final duals leave no enumerated column with a positive reduced cost, unless it is in the
    // master (a master column at its upper bound keeps d > 0 legitimately).
    List<Set<VariantKey>> inMaster = new ArrayList<>();
    for (int s = 0; s < space.segmentCount(); s++) {
      inMaster.add(new HashSet<>());
    }
    for (Column c : out.columns()) {
      inMaster.get(c.segment()).add(space.key(c.choices()));
    }
    double[] best = ref.maxReducedCost(out.resourceDual(), out.segmentDual(), inMaster);
    double tol = 1e-7 * Math.max(1.0, maxAbsMargin(all));
    for (int s = 0; s < best.length; s++) {
      assertTrue(best[s] <= tol, "segment " + s + " has an outside column with d = " + best[s]);
    }
    // And the reference confirms the final duals are optimal for the whole space.
    assertEquals(ref.objective(), ref.dualBound(out.resourceDual(), out.segmentDual()), 1e-6 * scale);
  }

  @Property(tries = 60)
  void boundHoldsEveryRound(@ForAll long seed, @ForAll @IntRange(min = 2, max = 5) int groups) {
    VariantSpace space = new VariantSpace(draw(seed, groups, 2));
    Assume.that(combinations(space) <= 2000);
    List<EnumeratedLp.Column> all = EnumeratedLp.columns(space);
    Assume.that(!all.isEmpty() && all.size() <= 400);
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
    double scale = Math.max(1.0, Math.abs(ref.objective()));
    List<IterationRecord> rounds = new ArrayList<>();
    new ColumnGeneration(space, new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT), SolveSettings.defaults().withPerRound(1))
        .addListener(new ColGenListener() {
          @Override
          public void iteration(IterationRecord r) {
            rounds.add(r);
          }
        })
        .run();
    for (IterationRecord r : rounds) {
      assertTrue(r.objective() <= ref.objective() + 1e-6 * scale, "master above the LP optimum");
      assertTrue(r.bound() >= ref.objective() - 1e-6 * scale, "round " + r.iteration() + " bound below z_LP");
    }
  }

  /** Choice combinations times segments: what enumeration would visit. */
  private static long combinations(VariantSpace space) {
    long n = space.segmentCount();
    for (int g = 0; g < space.groupCount(); g++) {
      n *= space.choiceCount(g);
    }
    return n;
  }

  private static double maxAbsMargin(List<EnumeratedLp.Column> cols) {
    double m = 0;
    for (EnumeratedLp.Column c : cols) {
      m = Math.max(m, Math.abs(c.margin()));
    }
    return m;
  }
}
