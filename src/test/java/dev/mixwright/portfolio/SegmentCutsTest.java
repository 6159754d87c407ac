package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.explain.PortfolioExplainer;
import dev.mixwright.explain.PortfolioVerdict;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The segment cuts ({@link SegmentCuts}) against brute force: on seeded random catalogs, fixed and
 * choosing, the relaxation with its cuts must stay at or above the integer optimum of the fully
 * enumerated MIP (SCIP over every buildable variant, {@link EnumeratedMip}), its Lagrangian bound with
 * the cuts' duals too, and the whole stage must still reach that optimum when it says proven. Checked
 * by mutation: with the right-hand side lowered by a tenth of r, or with the r·γ of the cuts left out
 * of the bound's value of their variants, this test fails. It also checks what {@code explain} reads
 * from a run: at the prices kept in the result every variant of the optimum is valued at or above it.
 */
class SegmentCutsTest {
  private static final int CASES = 80;

  private static double tol(double x) {
    return 1e-6 * (1 + Math.abs(x));
  }

  /**
   * A copy of c where every segment with a fixed demand takes at most 20–45 % of it per variant, so that
   * its demand is not a whole number of column bounds and the relaxation has a fixed-charge gap to cut,
   * and (in three cases of four) resources 20 times as large, so that demand binds rather than capacity.
   */
  private static Catalog withShares(Catalog c, Random rnd) {
    List<Segment> segs = new ArrayList<>();
    for (Segment s : c.segments()) {
      segs.add(s.choice().isPresent() ? s
          : new Segment(s.id(), s.label(), s.demand(), 0.2 + 0.05 * rnd.nextInt(6), s.accepts(), s.value()));
    }
    // and resources loose in most cases, so that demand binds rather than capacity
    double loosen = rnd.nextInt(4) == 0 ? 1 : 20;
    List<Resource> res = new ArrayList<>();
    for (Resource r : c.resources()) {
      res.add(new Resource(r.id(), r.label(), r.unit(), r.capacity() * loosen));
    }
    Catalog out = new Catalog(c.format(), c.name(), c.currency(), c.period(), res, c.groups(), c.rules(), segs,
        c.portfolio());
    // a limit that leaves room for several variants per segment
    return StageRuns.withTerms(out, 20 + rnd.nextInt(400), 4 + rnd.nextInt(4), rnd.nextBoolean() ? 0 : 5);
  }

  @Test
  void theCutsKeepEveryIntegerPortfolio() {
    int withCuts = 0;
    int binding = 0;
    for (int i = 0; i < CASES; i++) {
      Random rnd = new Random(7300 + i);
      VariantSpace space = new VariantSpace(withShares(StageRuns.fixedOrChoosing(7300 + i, rnd), rnd));
      PortfolioOutcome o = StageRuns.stage(space, StageRuns.settings());
      String where = "case " + (7300 + i);
      StageRuns.againstEnumerated(space, o);
      RelaxationResult rx = o.relaxation();
      if (rx == null || rx.segmentCuts() == 0) {
        continue;
      }
      withCuts++;
      EnumeratedMip.Result mip = EnumeratedMip.solve(space, false, 60_000);
      assertTrue(mip.bound() <= rx.bound().value() + tol(mip.bound()),
          where + ": the bound with the cuts' duals " + rx.bound().value() + " is below the optimum " + mip.bound());
      // explain tests a variant against the prices the result keeps, those of the bound before the cuts
      // (PortfolioSection): a variant of the optimum must never be valued below the optimum there
      LagrangianPortfolioBound kept = rx.plainBound();
      PortfolioExplainer.Facts facts = new PortfolioExplainer.Facts(false, o.result().value(), List.of(), List.of(),
          kept.resourcePrice(), kept.segmentPrice(), kept.lambda(), kept.valueAtLambda());
      for (int[] v : mip.offered()) {
        PortfolioVerdict verdict = new PortfolioExplainer(space).explain(v, facts);
        assertTrue(verdict.boundWith() >= mip.value() - tol(mip.value()), where + ": explain values "
            + java.util.Arrays.toString(v) + " of the optimum at " + verdict.boundWith() + ", below " + mip.value());
      }
      if (rx.converged()) {
        assertTrue(mip.bound() <= rx.objective() + tol(mip.bound()),
            where + ": the relaxation with cuts " + rx.objective() + " is below the optimum " + mip.bound());
        if (rx.objective() < mip.bound() + 0.05 * Math.abs(mip.bound())) {
          binding++;
        }
      }
    }
    assertTrue(withCuts >= CASES / 5, "cuts should be separated in a good share of the cases: " + withCuts);
    assertTrue(binding >= 1, "some cut relaxation should come near the optimum: " + binding);
  }
}
