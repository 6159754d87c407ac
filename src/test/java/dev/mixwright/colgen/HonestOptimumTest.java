package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.pricing.BruteForcePricer;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * "Optimal" means the bound meets the objective on the scale of the catalog's own figures: a
 * catalog whose figures are all tiny must solve to the same relative accuracy as one with large
 * figures. The reference is the fully enumerated LP solved by Apache Commons Math's SimplexSolver
 * ({@link EnumeratedLp}).
 */
class HonestOptimumTest {

  @Test
  void theGapIsRelativeToTheLargerFigureWhateverItsSize() {
    assertEquals(0.25, ValueBound.gap(0.003, 0.004), 1e-12, "small figures are no excuse");
    assertEquals(0.5, ValueBound.gap(0.3, 0.6), 1e-12);
    assertEquals(1.0, ValueBound.gap(0, 0.4), 1e-12, "nothing reached against a bound of 0.4 is 100 %");
    assertEquals(0.0, ValueBound.gap(0, 0), 0.0);
    // below the catalog's round-off floor a difference is no gap
    assertTrue(ValueBound.gap(0, 1e-12, 1e-6) <= 1e-6);
  }

  /** Demands and capacities times {@code f}: every figure of the LP scales by f, its optimum too. */
  static Catalog scaled(Catalog c, double f) {
    List<Resource> res = new ArrayList<>();
    for (Resource r : c.resources()) {
      res.add(new Resource(r.id(), r.label(), r.unit(), r.capacity() * f));
    }
    List<Segment> segs = new ArrayList<>();
    for (Segment s : c.segments()) {
      segs.add(new Segment(s.id(), s.label(), s.demand() * f, s.maxShare(), s.accepts(), s.value(), s.choice()));
    }
    return new Catalog(c.format(), c.name(), c.currency(), c.period(), res, c.groups(), c.rules(), segs, c.portfolio());
  }

  @Test
  void aCatalogOfTinyFiguresSolvesToTheSameRelativeAccuracy() {
    long seed0 = 15_000;
    int checked = 0;
    for (long seed = seed0; seed < seed0 + 40; seed++) {
      Catalog tiny = scaled(RandomCatalogs.enumerable(new Random(seed), 400), 1e-5);
      VariantSpace space = new VariantSpace(tiny);
      EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
      if (!(ref.objective() > 0)) {
        continue;
      }
      checked++;
      SolveOutcome out = new ColumnGeneration(space, new BruteForcePricer(space), null,
          SolveSettings.defaults().withGapTolerance(1e-4), StopCriterion.never(), System.nanoTime()).run();
      String at = "seed " + seed + ": objective " + out.result().value() + " vs Commons Math " + ref.objective();
      assertTrue(out.result().gap() <= 1e-4 || !out.status().isOptimal(), at + ": optimal with gap " + out.result().gap());
      if (out.status().isOptimal()) {
        assertTrue(out.result().value() >= ref.objective() * (1 - 1e-4) - 1e-12, at);
      }
      assertTrue(out.result().bound() >= ref.objective() * (1 - 1e-9), at + ": the bound must hold");
    }
    assertTrue(checked >= 10, "too few catalogs with something to sell: " + checked);
  }
}
