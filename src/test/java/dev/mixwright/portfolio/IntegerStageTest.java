package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomCatalogs;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The integer stage against the fully enumerated MIP (every buildable variant, solved by SCIP in one
 * piece: {@link EnumeratedMip}) on small random catalogs with a portfolio section.
 */
class IntegerStageTest {
  private static final int CASES = 60;

  private static double tol(double x) {
    return 1e-6 * (1 + Math.abs(x));
  }

  private static Catalog randomCatalog(int i) {
    Random rnd = new Random(4000 + i);
    Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3), 1 + rnd.nextInt(3),
        rnd.nextInt(7), true);
    return i % 4 == 3 ? StageRuns.withTooling(c, rnd) : c;
  }

  @Test
  void provenMeansTheEnumeratedOptimumAndTheBoundNeverFallsBelowIt() {
    int proven = 0;
    int byTree = 0;
    int compared = 0;
    for (int i = 0; i < CASES; i++) {
      VariantSpace space = new VariantSpace(randomCatalog(i));
      // cases on one worker and on two; half of them without the quick proof, which leaves the proof
      // to the branch-and-price tree: every way must give the enumerated optimum
      PortfolioOutcome o = new IntegerStage(space, StageRuns.settings()).workers(1 + i % 2).quickProof(i % 4 < 2)
          .run(StageRuns.lp(space));
      StageRuns.checkFeasible(space, o);
      EnumeratedMip.Result full = EnumeratedMip.solve(space, false, 60_000); // SCIP over all variants
      if (!full.optimal()) {
        continue;
      }
      compared++;
      String where = "case " + i + " (" + o.status().word() + " " + o.reason() + ")";
      assertTrue(full.value() <= o.result().bound() + tol(full.value()), where + ": bound " + o.result().bound()
          + " below the enumerated optimum " + full.value());
      assertTrue(o.result().value() <= full.value() + tol(full.value()), where + ": better than the optimum?");
      if (o.status().isProven()) {
        proven++;
        byTree += o.tree().nodes() > 0 ? 1 : 0;
        assertEquals(full.value(), o.result().value(), tol(full.value()), where);
      }
    }
    assertTrue(byTree >= CASES / 4, "the tree should prove a good share of the cases: " + byTree);
    assertTrue(compared >= CASES * 9 / 10, "the reference should solve nearly every case");
    assertTrue(proven >= compared * 3 / 4, "most small cases should be proven, got " + proven + " of " + compared);
  }

  @Test
  void theRelaxationBoundIsNeverBelowTheIntegerOptimum() {
    // property over a seeded series: bound ≥ relaxed optimum over all variants ≥ integer optimum; with
    // segment cuts, LP relaxation ≥ relaxation with the cuts ≥ integer optimum
    int withCuts = 0;
    for (int i = 0; i < CASES; i++) {
      VariantSpace space = new VariantSpace(randomCatalog(100 + i));
      PortfolioOutcome o = StageRuns.stage(space, StageRuns.settings());
      EnumeratedMip.Result mip = EnumeratedMip.solve(space, false, 60_000);
      EnumeratedMip.Result lp = EnumeratedMip.solve(space, true, 0); // GLOP, y in [0, 1]
      String where = "case " + (100 + i);
      double relaxBound = o.relaxation() == null ? o.result().bound() : o.relaxation().bound().value();
      assertTrue(mip.bound() <= relaxBound + tol(mip.bound()), where + ": relaxation bound " + relaxBound
          + " below the integer optimum " + mip.bound());
      PortfolioTerms t = PortfolioTerms.of(space);
      boolean noTooling = !t.hasTooling();
      if (o.relaxation() != null && o.relaxation().segmentCuts() > 0) {
        withCuts++;
        if (o.relaxation().converged()) {
          // the cuts only tighten: the relaxation with them lies between the integer optimum and (with
          // the same model: no tooling, no cap from the lots) the enumerated LP relaxation
          assertTrue(mip.bound() <= o.relaxation().objective() + tol(mip.bound()), where + ": cuts cut off the optimum");
          if (noTooling && t.variantCap() == t.maxVariants()) {
            assertTrue(o.relaxation().objective() <= lp.value() + tol(lp.value()), where + ": cuts loosened it");
          }
        }
      } else if (noTooling && t.variantCap() == t.maxVariants() && o.relaxation() != null) {
        // without tooling, cuts and a cap tightened by the lots, the relaxed master over the whole
        // space is exactly the enumerated LP relaxation
        assertTrue(lp.value() <= relaxBound + tol(lp.value()), where + ": below the full relaxation");
        if (o.relaxation().converged()) {
          assertEquals(lp.value(), o.relaxation().objective(), tol(lp.value()), where + ": converged value");
        }
      }
    }
    assertTrue(withCuts >= CASES / 10, "segment cuts should be separated in some of the cases: " + withCuts);
  }

  @Test
  void aStageStoppedAtOnceStaysHeuristicWithAValidBound() {
    // a stop criterion that fires at its first check (no clock involved): the tree never runs, and
    // only the bounds found before it speak
    int heuristic = 0;
    for (int i = 0; i < 20; i++) {
      VariantSpace space = new VariantSpace(randomCatalog(200 + i));
      PortfolioOutcome o = new IntegerStage(space, StageRuns.settings())
          .stopWhen(now -> java.util.Optional.of("stopped by the test")).run(StageRuns.lp(space));
      StageRuns.checkFeasible(space, o);
      EnumeratedMip.Result full = EnumeratedMip.solve(space, false, 60_000);
      String where = "case " + (200 + i);
      assertTrue(full.bound() <= o.result().bound() + tol(full.bound()), where + ": bound below the optimum");
      assertTrue(o.result().value() <= full.value() + tol(full.value()), where);
      if (o.status().isProven()) {
        assertEquals(full.value(), o.result().value(), tol(full.value()), where);
      } else {
        heuristic++;
        assertTrue(o.reason().contains("stopped by the test"), where + ": " + o.reason());
      }
    }
    assertTrue(heuristic >= 10, "a stopped stage proves only what needs no search: " + heuristic);
  }

  @Test
  void wholeUnitsMatchTheEnumeratedMipWithIntegerSales() {
    int proven = 0;
    for (int i = 0; i < 25; i++) {
      Random rnd = new Random(7000 + i);
      Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(2), 4, 1 + rnd.nextInt(2), 1 + rnd.nextInt(3),
          rnd.nextInt(5), true);
      var p = c.portfolio().orElseThrow();
      c = new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), c.rules(),
          c.segments(), java.util.Optional.of(new dev.mixwright.catalog.PortfolioSpec(p.introductionCost(),
              p.maxVariants(), p.minLot(), true)));
      VariantSpace space = new VariantSpace(c);
      PortfolioOutcome o = StageRuns.stage(space, StageRuns.settings());
      StageRuns.checkFeasible(space, o);
      for (OfferedVariant v : o.offer().variants()) {
        for (double q : v.sales()) {
          assertEquals(Math.rint(q), q, 1e-9, "case " + i + ": whole units only");
        }
      }
      // SCIP over every buildable variant with integer sales (EnumeratedMip reads wholeUnits)
      EnumeratedMip.Result full = EnumeratedMip.solve(space, false, 60_000);
      if (!full.optimal()) {
        continue;
      }
      String where = "case " + i + " (" + o.status().word() + " " + o.reason() + ")";
      assertTrue(full.value() <= o.result().bound() + tol(full.value()), where + ": bound below the optimum");
      assertTrue(o.result().value() <= full.value() + tol(full.value()), where + ": better than the optimum?");
      if (o.status().isProven()) {
        proven++;
        assertEquals(full.value(), o.result().value(), tol(full.value()), where);
      }
    }
    assertTrue(proven >= 5, "some whole-unit cases should be proven: " + proven);
  }
}
