package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.pricing.PricingCases.Case;
import dev.mixwright.pricing.PricingCases.Scored;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * What every exact pricer must do, judged against the enumeration of {@link PricingCases} (brute
 * force: every column listed, reduced costs from the catalog figures).
 */
abstract class ExactPricerContract {

  protected abstract Pricer create(VariantSpace space);

  /** Random cases per test; slower pricers may use fewer. */
  protected int cases() {
    return 150;
  }

  /** Checks what holds for any pricer's answer, exact or not. */
  static void checkValid(Case c, PricingQuery q, PricingOutcome out) {
    List<PricedVariant> found = out.found();
    assertTrue(found.size() <= q.k(), "at most k");
    Set<VariantKey> keys = new HashSet<>();
    for (int i = 0; i < found.size(); i++) {
      PricedVariant p = found.get(i);
      int[] v = p.choices();
      String what = c.space().label(v);
      // accepted by the segment and buildable, so no choice of weight -∞ was used
      assertTrue(c.space().isColumn(v, c.segment()), () -> "not a column: " + what);
      for (int g = 0; g < v.length; g++) {
        assertTrue(q.weight()[c.space().offset(g) + v[g]] > Double.NEGATIVE_INFINITY, what);
      }
      double direct = ReducedCosts.of(c.space(), v, c.segment(), c.pi(), c.mu());
      assertEquals(direct, p.reducedCost(), PricingCases.tol(direct), () -> "reduced cost of " + what);
      assertTrue(p.reducedCost() > q.threshold(), "above the threshold");
      assertFalse(q.excluded().contains(c.space().key(v)), () -> "excluded variant returned: " + what);
      assertTrue(keys.add(c.space().key(v)), () -> "returned twice: " + what);
      if (i > 0) {
        assertTrue(found.get(i - 1).reducedCost() >= p.reducedCost(), "best first");
      }
    }
  }

  /** An exact answer: the k best outside the excluded set and above the threshold, and its bound. */
  static void checkExact(Case c, PricingQuery q, PricingOutcome out) {
    checkValid(c, q, out);
    assertTrue(out.exact(), "exact pricer did not complete");
    List<Scored> expected =
        c.outside(q.excluded()).stream().filter(s -> s.d() > q.threshold()).limit(q.k()).toList();
    double[] want = expected.stream().mapToDouble(Scored::d).toArray();
    double[] got = out.found().stream().mapToDouble(PricedVariant::reducedCost).toArray();
    assertEquals(want.length, got.length, () -> "count: want " + Arrays.toString(want) + " got " + Arrays.toString(got));
    for (int i = 0; i < want.length; i++) {
      assertEquals(want[i], got[i], PricingCases.tol(want[i]), "score " + i);
    }
    if (want.length == 0) {
      assertEquals(q.threshold(), out.upperBound(), "complete and empty: the bound is the threshold");
    } else {
      assertEquals(want[0], out.upperBound(), PricingCases.tol(want[0]), "complete: the bound is the best");
    }
    checkBound(c, q, out);
  }

  /**
   * The upper bound covers the best column outside the excluded set, and the rest bound every column
   * neither excluded nor found.
   */
  static void checkBound(Case c, PricingQuery q, PricingOutcome out) {
    List<Scored> outside = c.outside(q.excluded());
    if (!outside.isEmpty()) {
      double best = outside.get(0).d();
      assertTrue(out.upperBound() >= best - PricingCases.tol(best), "bound " + out.upperBound() + " below best " + best);
    }
    Set<VariantKey> found = new HashSet<>();
    out.found().forEach(p -> found.add(c.space().key(p.choices())));
    for (Scored s : outside) {
      if (!found.contains(c.space().key(s.v()))) {
        assertTrue(out.restBound() >= s.d() - PricingCases.tol(s.d()),
            "rest bound " + out.restBound() + " below " + s.d() + ", which was not found");
      }
    }
  }

  /** Midpoint between two neighbouring distinct scores, so no score sits on the threshold. */
  static double threshold(List<Scored> cols, Random rnd) {
    if (cols.size() < 2 || rnd.nextInt(4) == 0) {
      return Double.NEGATIVE_INFINITY;
    }
    int i = rnd.nextInt(cols.size() - 1);
    double a = cols.get(i).d();
    double b = cols.get(i + 1).d();
    return a - b > 1e-6 ? (a + b) / 2 : Double.NEGATIVE_INFINITY;
  }

  @Test
  void kBestAboveThresholdMatchesEnumeration() {
    for (int i = 0; i < cases(); i++) {
      Case c = PricingCases.random(i);
      Random rnd = new Random(i);
      Pricer p = create(c.space());
      for (int k : new int[] {1, 1 + rnd.nextInt(8), 40}) {
        PricingQuery q = c.query(k, threshold(c.columns(), rnd), Set.of());
        checkExact(c, q, p.price(q));
      }
    }
  }

  @Test
  void excludingTheBestGivesTheNextBest() {
    for (int i = 0; i < cases(); i++) {
      Case c = PricingCases.random(i);
      Pricer p = create(c.space());
      Set<VariantKey> excluded = new HashSet<>();
      for (int j = 0; j < Math.min(4, c.columns().size()); j++) {
        excluded.add(c.space().key(c.columns().get(j).v()));
        PricingQuery q = c.query(1, Double.NEGATIVE_INFINITY, Set.copyOf(excluded));
        PricingOutcome out = p.price(q);
        checkExact(c, q, out);
        if (j + 1 < c.columns().size()) {
          double next = c.columns().get(j + 1).d();
          assertEquals(next, out.best(), PricingCases.tol(next), "case " + i + ": best after excluding " + (j + 1));
        }
      }
    }
  }

  @Test
  void manyExclusionsLikeAMaster() {
    for (int i = 0; i < cases(); i++) {
      Case c = PricingCases.random(i);
      Random rnd = new Random(7 * i + 3);
      Set<VariantKey> excluded = new HashSet<>();
      for (Scored s : c.columns()) {
        if (rnd.nextDouble() < 0.35) {
          excluded.add(c.space().key(s.v()));
        }
      }
      PricingQuery q = c.query(3, 0.0, excluded);
      checkExact(c, q, create(c.space()).price(q));
    }
  }

  @Test
  void extraForbiddenChoicesAreNeverUsed() {
    for (int i = 0; i < cases(); i++) {
      Case c = PricingCases.random(i);
      Random rnd = new Random(31 * i);
      VariantSpace space = c.space();
      PricingQuery base = c.query(5, Double.NEGATIVE_INFINITY, Set.of());
      double[] w = base.weight().clone();
      boolean[] off = new boolean[w.length];
      for (int f = 0; f < w.length; f++) {
        if (rnd.nextDouble() < 0.2) {
          w[f] = Double.NEGATIVE_INFINITY;
          off[f] = true;
        }
      }
      List<Scored> allowed =
          c.columns().stream()
              .filter(s -> {
                for (int g = 0; g < s.v().length; g++) {
                  if (off[space.offset(g) + s.v()[g]]) {
                    return false;
                  }
                }
                return true;
              })
              .toList();
      Case restricted = new Case(space, c.segment(), c.pi(), c.mu(), allowed);
      PricingQuery q = new PricingQuery(c.segment(), w, base.constant(), 5, Double.NEGATIVE_INFINITY, Set.of());
      checkExact(restricted, q, create(space).price(q));
    }
  }

  @Test
  void thresholdIsStrict() {
    for (int i = 0; i < cases(); i++) {
      Case c = PricingCases.random(i);
      if (c.columns().isEmpty()) {
        continue;
      }
      Pricer p = create(c.space());
      PricingQuery all = c.query(1, Double.NEGATIVE_INFINITY, Set.of());
      PricedVariant best = p.price(all).found().get(0);
      // the threshold exactly at the best score as pricers compute it: the best must not come back
      PricingQuery q = c.query(50, best.reducedCost(), Set.of());
      PricingOutcome out = p.price(q);
      for (PricedVariant v : out.found()) {
        assertTrue(v.reducedCost() > best.reducedCost());
      }
      assertTrue(out.exact());
      if (out.found().isEmpty()) {
        assertEquals(best.reducedCost(), out.upperBound());
      }
    }
  }

  @Test
  void groupWithNothingUsableGivesNothing() {
    Case c = PricingCases.random(4);
    PricingQuery base = c.query(3, -5.0, Set.of());
    double[] w = base.weight().clone();
    Arrays.fill(w, c.space().offset(0), c.space().offset(1), Double.NEGATIVE_INFINITY);
    PricingOutcome out = create(c.space()).price(new PricingQuery(c.segment(), w, base.constant(), 3, -5.0, Set.of()));
    assertTrue(out.found().isEmpty());
    assertTrue(out.exact());
    assertEquals(-5.0, out.upperBound());
  }

  @Test
  void malformedQueriesAreRejected() {
    Case c = PricingCases.random(1);
    Pricer p = create(c.space());
    PricingQuery good = c.query(1, 0, Set.of());
    double[] shorter = Arrays.copyOf(good.weight(), good.weight().length - 1);
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> p.price(new PricingQuery(0, shorter, 0, 1, 0, Set.of())));
    assertTrue(e.getMessage().contains("weight"), e.getMessage());
    double[] nan = good.weight().clone();
    nan[0] = Double.NaN;
    e = assertThrows(IllegalArgumentException.class, () -> p.price(new PricingQuery(0, nan, 0, 1, 0, Set.of())));
    assertTrue(e.getMessage().contains("weight[0]"), e.getMessage());
  }
}
