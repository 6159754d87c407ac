package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogGenerator;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.pricing.HeuristicPricer;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomCatalogs;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Every acceleration of the loop must end at the LP optimum over the whole space: judged against
 * {@link EnumeratedLp} (all columns listed, solved with Apache Commons Math SimplexSolver) on small
 * random catalogs, and against the plain loop on a generated one too large to list.
 */
class AccelerationsTest {
  private static final SolveSettings PLAIN = SolveSettings.defaults().withPerRound(1).withSmoothing(0).withRetireAfter(0)
      .withHeuristicFirst(false);

  private static List<SolveSettings> variants() {
    return List.of(
        PLAIN,
        PLAIN.withPerRound(5),
        PLAIN.withPerRound(10),
        PLAIN.withSmoothing(0.5),
        PLAIN.withSmoothing(0.9).withPerRound(3),
        PLAIN.withRetireAfter(1),
        PLAIN.withRetireAfter(2).withSmoothing(0.7).withPerRound(5),
        PLAIN.withHeuristicFirst(true).withPerRound(5));
  }

  private static SolveOutcome solve(VariantSpace space, SolveSettings s) {
    return new ColumnGeneration(space, new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT), new HeuristicPricer(space), s, null,
        System.nanoTime()).run(List.of());
  }

  @Test
  void everySettingReachesTheEnumeratedOptimum() {
    int checked = 0;
    for (long seed = 0; seed < 36; seed++) {
      Catalog c = seed % 3 != 0 ? RandomCatalogs.small(seed)
          : RandomCatalogs.random(new Random(seed), 4, 4, 3, 3, 8, false);
      VariantSpace space = new VariantSpace(c);
      EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
      if (ref.columnCount() == 0) {
        continue;
      }
      checked++;
      for (SolveSettings s : variants()) {
        SolveOutcome o = solve(space, s);
        String what = "seed " + seed + ", " + s;
        assertEquals(RunStatus.OPTIMAL, o.status(), what);
        double tol = 1e-6 * Math.max(1, Math.abs(ref.objective()));
        assertEquals(ref.objective(), o.result().value(), tol, what);
        // the proven bound is a true upper bound and meets the objective
        assertTrue(o.result().bound() >= ref.objective() - tol, what + ": bound " + o.result().bound());
        assertTrue(o.result().gap() <= s.gapTolerance(), what);
      }
    }
    assertTrue(checked >= 30, "only " + checked + " catalogs had columns");
  }

  @Test
  void onALargeGeneratedCatalogEverySettingAgreesWithThePlainLoop() {
    Catalog c = CatalogGenerator.generate(CatalogGenerator.Spec.of(14, 6, 6, 3, 40, 7));
    VariantSpace space = new VariantSpace(c);
    SolveOutcome plain = solve(space, PLAIN);
    assertEquals(RunStatus.OPTIMAL, plain.status());
    for (SolveSettings s : variants()) {
      SolveOutcome o = solve(space, s);
      assertEquals(RunStatus.OPTIMAL, o.status(), s.toString());
      // both are within the 1e-6 relative gap of the same optimum
      assertEquals(plain.result().value(), o.result().value(), 2e-6 * Math.max(1, Math.abs(plain.result().value())), s.toString());
    }
  }

  @Test
  void smoothedRunWhoseMasterOnceEndedAbnormalStillReachesTheOptimum() {
    // Measured: on this catalog GLOP's incremental re-solve ended ABNORMAL in round 12 with
    // smoothing 0.3 before RestrictedMaster learnt to retry from a cold start.
    VariantSpace space = new VariantSpace(CatalogGenerator.generate(CatalogGenerator.Spec.of(19, 7, 20, 6, 60, 1)));
    SolveOutcome plain = solve(space, PLAIN.withPerRound(5));
    SolveOutcome smoothed = solve(space, PLAIN.withPerRound(5).withSmoothing(0.3));
    assertEquals(RunStatus.OPTIMAL, smoothed.status());
    assertEquals(plain.result().value(), smoothed.result().value(), 2e-6 * Math.max(1, Math.abs(plain.result().value())));
  }
}
