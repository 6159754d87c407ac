package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.pricing.BruteForcePricer;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * Column generation against an independent reference: the fully enumerated LP of the same catalog
 * solved by Apache Commons Math's SimplexSolver ({@link EnumeratedLp}), on random small catalogs
 * with rules, optional groups, and segments with accepts, value and maxShare. Seeded cases
 * ({@link Cases}); a draw whose full LP is empty or too large for the dense reference is skipped and
 * not counted; a failure names its seed.
 */
class ColumnGenerationProperties {

  private static Catalog draw(Random rnd, int groups, int segments) {
    return RandomCatalogs.random(rnd, groups, 4, 1 + rnd.nextInt(3), segments, rnd.nextInt(7), false);
  }

  /** The space's enumerated columns, or null when there are none or too many to enumerate. */
  private static List<EnumeratedLp.Column> enumerable(VariantSpace space) {
    if (combinations(space) > 2000) {
      return null;
    }
    List<EnumeratedLp.Column> all = EnumeratedLp.columns(space);
    return all.isEmpty() || all.size() > 400 ? null : all;
  }

  @Test
  void objectiveEqualsFullyEnumeratedLp() {
    Cases.checked(120, (seed, rnd) -> {
      int groups = Cases.between(rnd, 1, 5);
      int segments = Cases.between(rnd, 1, 3);
      int perRound = Cases.between(rnd, 1, 6);
      boolean bnb = rnd.nextBoolean();
      VariantSpace space = new VariantSpace(draw(rnd, groups, segments));
      List<EnumeratedLp.Column> all = enumerable(space);
      if (all == null) {
        return false;
      }
      EnumeratedLp.Reference ref = EnumeratedLp.solve(space);

      Pricer pricer = bnb ? new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT) : new BruteForcePricer(space);
      SolveOutcome out =
          new ColumnGeneration(space, pricer, null, SolveSettings.defaults().withPerRound(perRound),
              StopCriterion.never(), System.nanoTime()).run();

      assertEquals(RunStatus.OPTIMAL, out.status());
      double scale = Math.max(1.0, Math.abs(ref.objective()));
      assertEquals(ref.objective(), out.result().value(), 1e-6 * scale, "objective vs Commons Math");
      assertTrue(out.result().bound() >= ref.objective() - 1e-6 * scale, "the bound must hold");
      assertTrue(out.result().gap() <= 1e-6);

      // The final duals leave no enumerated column with a positive reduced cost, unless it is in the
      // master (a master column at its upper bound keeps d > 0 legitimately).
      List<Set<VariantKey>> inMaster = new ArrayList<>();
      for (int s = 0; s < space.segmentCount(); s++) {
        inMaster.add(new HashSet<>());
      }
      for (Column c : out.master().columns()) {
        inMaster.get(c.segment()).add(space.key(c.choices()));
      }
      double[] best = ref.maxReducedCost(out.duals().resource(), out.duals().segment(), inMaster);
      double tol = 1e-7 * Math.max(1.0, maxAbsMargin(all));
      for (int s = 0; s < best.length; s++) {
        assertTrue(best[s] <= tol, "segment " + s + " has an outside column with d = " + best[s]);
      }
      // And the reference confirms the final duals are optimal for the whole space.
      assertEquals(ref.objective(), ref.dualBound(out.duals().resource(), out.duals().segment()), 1e-6 * scale);
      return true;
    });
  }

  @Test
  void boundHoldsEveryRound() {
    Cases.checked(60, (seed, rnd) -> {
      VariantSpace space = new VariantSpace(draw(rnd, Cases.between(rnd, 2, 5), 2));
      if (enumerable(space) == null) {
        return false;
      }
      EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
      double scale = Math.max(1.0, Math.abs(ref.objective()));
      List<IterationRecord> rounds = new ArrayList<>();
      new ColumnGeneration(space, new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT), null, SolveSettings.defaults().withPerRound(1),
              StopCriterion.never(), System.nanoTime())
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
      return !rounds.isEmpty();
    });
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
