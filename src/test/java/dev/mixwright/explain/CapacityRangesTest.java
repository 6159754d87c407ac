package dev.mixwright.explain;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.Resource;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.pricing.BranchAndBoundPricer;

import dev.mixwright.space.VariantSpace;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class CapacityRangesTest {

  /**
   * A concave piecewise-linear curve with known breakpoints: slopes falling from left to right,
   * reaching 0 at the last piece. At a breakpoint the solver answers with either side's slope (both
   * are supergradients there), chosen at random, as a degenerate LP may.
   */
  private static final class Curve implements CapacityRanges.Solver {
    final double[] breaks; // ascending, > 0
    final double[] slopes; // slopes[i] on (breaks[i-1], breaks[i]); one more than breaks
    final Random rnd;
    int calls;

    Curve(Random rnd) {
      this.rnd = rnd;
      int n = 1 + rnd.nextInt(6);
      breaks = new double[n];
      double b = 0;
      for (int i = 0; i < n; i++) {
        b += 10 + rnd.nextInt(200);
        breaks[i] = b;
      }
      slopes = new double[n + 1];
      double s = 0;
      for (int i = n; i >= 0; i--) {
        slopes[i] = s;
        s += 1 + rnd.nextInt(50);
      }
    }

    double value(double x) {
      double z = 1000;
      double at = 0;
      for (int i = 0; i <= breaks.length; i++) {
        double end = i < breaks.length ? breaks[i] : Double.POSITIVE_INFINITY;
        double seg = Math.min(x, end) - at;
        if (seg <= 0) {
          break;
        }
        z += slopes[i] * seg;
        at = end;
      }
      return z;
    }

    @Override
    public CapacityRanges.Point at(double x) {
      calls++;
      int piece = 0;
      while (piece < breaks.length && x > breaks[piece]) {
        piece++;
      }
      boolean onBreak = piece < breaks.length && x == breaks[piece];
      double slope = onBreak && rnd.nextBoolean() ? slopes[piece + 1] : slopes[piece];
      return new CapacityRanges.Point(x, value(x), slope);
    }
  }

  @Test
  void findsTheExactEndsOfThePieceOnKnownCurves() {
    CapacityRanges search = new CapacityRanges(1e-9, 1e-12);
    for (long seed = 0; seed < 300; seed++) {
      Curve c = new Curve(new Random(seed));
      double last = c.breaks[c.breaks.length - 1];
      // A point inside a random piece (the last piece has slope 0).
      int piece = new Random(seed + 1000).nextInt(c.breaks.length + 1);
      double lo = piece == 0 ? 0 : c.breaks[piece - 1];
      double hi = piece == c.breaks.length ? last + 100 : c.breaks[piece];
      double b0 = lo + (hi - lo) * 0.37;
      CapacityRanges.Point p0 = c.at(b0);
      c.calls = 0;
      CapacityRanges.Range r = search.find("r", p0, last + 1, c);
      String why = "seed " + seed + " breaks " + Arrays.toString(c.breaks) + " slopes " + Arrays.toString(c.slopes);
      assertEquals(c.slopes[piece], r.price(), why);
      assertEquals(lo, r.low(), 1e-9, why);
      assertEquals(piece == c.breaks.length ? Double.POSITIVE_INFINITY : hi, r.high(), 1e-9, why);
      if (piece > 0) {
        assertEquals(c.slopes[piece - 1], r.priceBelow(), 1e-9, why);
      }
      if (piece < c.breaks.length) {
        assertEquals(c.slopes[piece + 1], r.priceAbove(), 1e-9, why);
      }
      assertTrue(r.exact());
      // One solve per piece crossed, plus the far point, on each side.
      assertTrue(c.calls <= c.breaks.length + 3, why + " took " + c.calls + " solves");
      assertEquals(c.calls, r.solves());
    }
  }

  @Test
  void onTheStarterCatalogIndependentSolvesConfirmEachRangeAndThatItCannotBeWidened() throws Exception {
    Catalog cat = CatalogLoader.load(Path.of("catalogs/heatpump-starter.yaml"));
    SolveSettings tight = SolveSettings.defaults().withGapTolerance(1e-9).withPerRound(5);
    CapacityRanges search = new CapacityRanges(1e-6, 1e-7);
    VariantSpace space = new VariantSpace(cat);
    int checked = 0;
    for (int r = 0; r < cat.resources().size(); r++) {
      CapacityRanges.ColumnGenerationSolver solver =
          new CapacityRanges.ColumnGenerationSolver(cat, r, BranchAndBoundPricer::withDefaultLimits, tight, List.of());
      CapacityRanges.Point p0 = solver.at(cat.resources().get(r).capacity());
      CapacityRanges.Range range = search.find(cat.resources().get(r).id(), p0,
          CapacityRanges.unusableCapacity(space, r), solver);
      assertTrue(range.exact());
      assertTrue(range.low() <= p0.capacity() && p0.capacity() <= range.high());
      double hi = Double.isInfinite(range.high()) ? 2 * p0.capacity() : range.high();
      List<Double> inside = new ArrayList<>();
      for (double f : new double[] {0.05, 0.5, 0.95}) {
        inside.add(range.low() + f * (hi - range.low()));
      }
      for (double b : inside) {
        // Cold, independent solves: no columns shared with the search.
        SolveOutcome o = solveCold(cat, r, b, tight);
        double line = p0.objective() + p0.price() * (b - p0.capacity());
        assertEquals(line, o.result().value(), 1e-7 * Math.abs(line), "on the piece at " + b);
        checked++;
      }
      double width = hi - range.low();
      if (Double.isFinite(range.high())) {
        double b = range.high() + 0.02 * width;
        double line = p0.objective() + p0.price() * (b - p0.capacity());
        double z = solveCold(cat, r, b, tight).result().value();
        assertTrue(z < line - 1e-7 * Math.abs(line), "the piece ends at " + range.high() + ": " + z + " vs " + line);
        // Concave: beyond the end the curve rises no faster than the price reported above it.
        double slope = (z - (p0.objective() + p0.price() * (range.high() - p0.capacity()))) / (b - range.high());
        assertTrue(slope <= range.priceAbove() + 1e-4 * Math.max(1, range.priceAbove()), "slope above " + slope);
      }
      if (range.low() > 0) {
        double b = range.low() - 0.02 * width;
        double line = p0.objective() + p0.price() * (b - p0.capacity());
        double z = solveCold(cat, r, b, tight).result().value();
        assertTrue(z < line - 1e-7 * Math.abs(line), "the piece starts at " + range.low());
      }
    }
    assertEquals(9, checked);
  }

  private static SolveOutcome solveCold(Catalog cat, int r, double capacity, SolveSettings s) {
    List<Resource> res = new ArrayList<>(cat.resources());
    Resource old = res.get(r);
    res.set(r, new Resource(old.id(), old.label(), old.unit(), capacity));
    Catalog c = new Catalog(cat.format(), cat.name(), cat.currency(), cat.period(), res, cat.groups(),
        cat.rules(), cat.segments(), cat.portfolio());
    VariantSpace space = new VariantSpace(c);
    return new ColumnGeneration(space, BranchAndBoundPricer.withDefaultLimits(space), null, s, StopCriterion.never(), System.nanoTime()).run();
  }
}
