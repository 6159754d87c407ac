package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.pricing.PricingCases;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** The variant pricer against brute force: every variant listed, ψ from {@link BruteVariants#value}. */
class VariantPricerTest {

  record Scored(int[] v, double value) {}

  private static double tol(double x) {
    return Double.isInfinite(x) ? 0 : 1e-7 * (1 + Math.abs(x));
  }

  @Test
  void kBestAboveThresholdOutsideTheExcludedSet() {
    for (int i = 0; i < 250; i++) {
      Random rnd = new Random(500 + i);
      Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(5), 4, 1 + rnd.nextInt(3), 1 + rnd.nextInt(3),
          rnd.nextInt(10), true);
      VariantSpace space = new VariantSpace(c);
      checkOneQuery(new VariantPricer(space, PortfolioTerms.of(space), Long.MAX_VALUE), space, rnd, "case " + i);
    }
  }

  /**
   * Rules over three and four groups (the generator's wide and multi kinds) compile to nogoods that
   * forward checking fires only once all but one of their groups are assigned; one pricer answers
   * several queries in a row (its search state is reused), each checked against brute force.
   */
  @Test
  void rulesOverSeveralGroupsAndRepeatedQueriesMatchBruteForce() {
    for (int i = 0; i < 150; i++) {
      Random rnd = new Random(7100 + i);
      Catalog c = RandomCatalogs.random(rnd, 4 + rnd.nextInt(4), 4, 1 + rnd.nextInt(3), 1 + rnd.nextInt(3),
          rnd.nextInt(8), true);
      c = i % 2 == 0 ? PricingCases.withWideRules(c, rnd, 1 + rnd.nextInt(5))
          : PricingCases.withMultiRules(c, rnd, 1 + rnd.nextInt(4));
      VariantSpace space = new VariantSpace(c);
      VariantPricer pricer = new VariantPricer(space, PortfolioTerms.of(space), Long.MAX_VALUE);
      for (int q = 0; q < 4; q++) {
        checkOneQuery(pricer, space, rnd, "case " + i + " query " + q);
      }
    }
  }

  /**
   * Across scenarios the pricer's "segments" are the (scenario, segment) pairs. Brute force: g is
   * positively homogeneous (its feasible set does not depend on d), so
   * g_k(ω m − π a − μ) = ω · g_k(m − (π/ω) a − μ/ω), the single-scenario reference at scaled prices.
   */
  @Test
  void acrossScenariosTheKBestMatchBruteForce() throws Exception {
    for (int i = 0; i < 60; i++) {
      Random rnd = new Random(8300 + i);
      Catalog c = RandomCatalogs.random(rnd, 3 + rnd.nextInt(3), 4, 1 + rnd.nextInt(2), 1 + rnd.nextInt(3),
          rnd.nextInt(6), true);
      if (i % 2 == 1) {
        c = PricingCases.withWideRules(c, rnd, 1 + rnd.nextInt(3));
      }
      int n = 2 + rnd.nextInt(2);
      List<VariantSpace> spaces = ScenarioStageTest.spaces(c, rnd, n);
      List<PortfolioTerms> terms = spaces.stream().map(PortfolioTerms::of).toList();
      VariantSpace space = spaces.get(0);
      int rc = space.resourceCount();
      int sc = space.segmentCount();
      double[] pi = new double[n * rc];
      for (int r = 0; r < pi.length; r++) {
        pi[r] = rnd.nextDouble() < 0.4 ? 0 : rnd.nextDouble() * 6;
      }
      double[] mu = new double[n * sc];
      for (int s = 0; s < mu.length; s++) {
        mu[s] = rnd.nextDouble() < 0.5 ? 0 : rnd.nextDouble() * 15;
      }
      double[] omega = new double[n];
      for (int k = 0; k < n; k++) {
        omega[k] = 0.2 + rnd.nextDouble();
      }
      double charge = rnd.nextInt(200);
      double[] penalty = randomPenalty(space, rnd);
      List<Scored> all = new ArrayList<>();
      for (int[] v : BruteVariants.all(space)) {
        double x = -charge;
        for (int k = 0; k < n; k++) {
          double[] p = new double[rc];
          double[] m = new double[sc];
          for (int r = 0; r < rc; r++) {
            p[r] = pi[k * rc + r] / omega[k];
          }
          for (int s = 0; s < sc; s++) {
            m[s] = mu[k * sc + s] / omega[k];
          }
          x += omega[k] * BruteVariants.value(spaces.get(k), terms.get(k), v, p, m, 0, null);
        }
        if (penalty != null) {
          for (int g = 0; g < v.length; g++) {
            x -= penalty[space.offset(g) + v[g]];
          }
        }
        all.add(new Scored(v, x));
      }
      VariantPricer pricer = new VariantPricer(spaces, terms, Long.MAX_VALUE);
      int k = 1 + rnd.nextInt(6);
      double threshold = rnd.nextBoolean() || all.isEmpty() ? Double.NEGATIVE_INFINITY
          : all.get(rnd.nextInt(all.size())).value() - 1;
      Set<VariantKey> excluded = excludeSome(space, all, rnd);
      PricingOutcome out = pricer.price(new VariantQuery(pi, mu, charge, penalty, threshold, k, excluded, 0, omega));
      assertMatches(space, all, excluded, threshold, k, out, "case " + i, null);
    }
  }

  private static double[] randomPenalty(VariantSpace space, Random rnd) {
    if (!rnd.nextBoolean()) {
      return null;
    }
    double[] penalty = new double[space.totalChoices()];
    for (int f = 0; f < penalty.length; f++) {
      penalty[f] = rnd.nextDouble() < 0.3 ? rnd.nextInt(200) : 0;
    }
    return penalty;
  }

  private static Set<VariantKey> excludeSome(VariantSpace space, List<Scored> all, Random rnd) {
    Set<VariantKey> excluded = new HashSet<>();
    for (Scored sc : all) {
      if (rnd.nextDouble() < 0.2) {
        excluded.add(space.key(sc.v()));
      }
    }
    return excluded;
  }

  /** One random query of one scenario on {@code pricer}, against every variant scored by brute force. */
  private static void checkOneQuery(VariantPricer pricer, VariantSpace space, Random rnd, String where) {
    PortfolioTerms t = PortfolioTerms.of(space);
    double[] pi = new double[space.resourceCount()];
    for (int r = 0; r < pi.length; r++) {
      pi[r] = rnd.nextDouble() < 0.4 ? 0 : rnd.nextDouble() * 8;
    }
    double[] mu = new double[space.segmentCount()];
    for (int s = 0; s < mu.length; s++) {
      mu[s] = rnd.nextDouble() < 0.5 ? 0 : rnd.nextDouble() * 20;
    }
    double charge = rnd.nextInt(300);
    double[] penalty = randomPenalty(space, rnd);
    List<Scored> all = new ArrayList<>();
    for (int[] v : BruteVariants.all(space)) {
      all.add(new Scored(v, BruteVariants.value(space, t, v, pi, mu, charge, penalty)));
    }
    all.sort(Comparator.comparingDouble(Scored::value).reversed());
    Set<VariantKey> excluded = excludeSome(space, all, rnd);
    int k = 1 + rnd.nextInt(6);
    double threshold = rnd.nextBoolean() ? Double.NEGATIVE_INFINITY
        : all.isEmpty() ? 0 : all.get(rnd.nextInt(all.size())).value() - 1;
    PricingOutcome out = pricer.price(new VariantQuery(pi, mu, charge, penalty, threshold, k, excluded, 0));
    assertMatches(space, all, excluded, threshold, k, out, where,
        v -> BruteVariants.value(space, t, v, pi, mu, charge, penalty));
  }

  /**
   * The outcome lists the k best of {@code all} (scored by brute force) above the threshold and outside
   * the excluded set, each buildable and once, and its rest bound covers every variant it left out.
   */
  private static void assertMatches(VariantSpace space, List<Scored> scored, Set<VariantKey> excluded,
      double threshold, int k, PricingOutcome out, String where, java.util.function.ToDoubleFunction<int[]> direct) {
    List<Scored> all = new ArrayList<>(scored);
    all.sort(Comparator.comparingDouble(Scored::value).reversed());
    assertTrue(out.exact(), where);
    List<Scored> want = all.stream()
        .filter(sc -> !excluded.contains(space.key(sc.v())) && sc.value() > threshold)
        .limit(k).toList();
    assertEquals(want.size(), out.found().size(), where);
    Set<VariantKey> seen = new HashSet<>();
    for (int j = 0; j < want.size(); j++) {
      PricedVariant got = out.found().get(j);
      assertEquals(want.get(j).value(), got.reducedCost(), tol(got.reducedCost()), where);
      if (direct != null) {
        double d = direct.applyAsDouble(got.choices());
        assertEquals(d, got.reducedCost(), tol(d), where);
      }
      assertTrue(space.isBuildable(got.choices()), where);
      assertFalse(excluded.contains(space.key(got.choices())), where);
      assertTrue(seen.add(space.key(got.choices())), where);
    }
    for (Scored sc : all) {
      VariantKey key = space.key(sc.v());
      if (!excluded.contains(key) && !seen.contains(key)) {
        assertTrue(sc.value() <= out.restBound() + tol(sc.value()), where + ": rest bound");
      }
    }
  }

  @Test
  void anEarlyStopKeepsAValidRestBound() {
    int stopped = 0;
    for (int i = 0; i < 120; i++) {
      Random rnd = new Random(900 + i);
      Catalog c = RandomCatalogs.random(rnd, 4 + rnd.nextInt(3), 4, 2, 2, rnd.nextInt(8), true);
      VariantSpace space = new VariantSpace(c);
      PortfolioTerms t = PortfolioTerms.of(space);
      double[] pi = new double[space.resourceCount()];
      for (int r = 0; r < pi.length; r++) {
        pi[r] = rnd.nextDouble() * 5;
      }
      double[] mu = new double[space.segmentCount()];
      PricingOutcome out = new VariantPricer(space, t, 1 + rnd.nextInt(12)).price(
          new VariantQuery(pi, mu, 0, null, Double.NEGATIVE_INFINITY, 3, Set.of(), 0));
      if (!out.exact()) {
        stopped++;
      }
      Set<VariantKey> found = new HashSet<>();
      out.found().forEach(f -> found.add(space.key(f.choices())));
      for (int[] v : BruteVariants.all(space)) {
        double x = BruteVariants.value(space, t, v, pi, mu, 0, null);
        if (!found.contains(space.key(v))) {
          assertTrue(x <= out.restBound() + tol(x), "case " + i);
        }
      }
    }
    assertTrue(stopped > 20, "the node limit should stop many of these searches");
  }
}
