package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.Scenario.Amount;
import dev.mixwright.scenario.Scenario.Change;
import dev.mixwright.scenario.Scenario.Field;
import dev.mixwright.scenario.Scenario.Target;
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
      kBest(i, new Random(500 + i), false);
    }
  }

  /**
   * Charges and bonuses per accepting segment (a tree node's segment counts): the pricer takes a
   * charge only where acceptance is certain and a bonus while a segment may still accept, so its
   * bounds stay optimistic; the k best and the rest bound must still match brute force.
   */
  @Test
  void acceptanceChargesAndBonusesMatchBruteForce() {
    for (int i = 0; i < 250; i++) {
      kBest(i, new Random(7000 + i), true);
    }
  }

  /**
   * Segments that choose: ψ of every variant takes its logit cap buyers·w/(1+w) ({@link
   * BruteVariants#caps}), and the search's node bounds the cap of an optimistic utility; the k best
   * and the rest bound must match brute force, with and without acceptance charges.
   */
  @Test
  void logitCapsMatchBruteForce() {
    for (int i = 0; i < 300; i++) {
      kBest(i, new Random(31_000 + i), i % 2 == 1, true);
    }
  }

  /**
   * Charges and bonuses per (segment, choice) pair (a tree node's count of the variants a segment accepts
   * that use one option): a charge is taken inside the search only where the choice is assigned and
   * acceptance certain, a bonus while both are possible; the k best, their values (also through {@link
   * VariantPricer#value}) and the rest bound against brute force, with segment charges and logit caps in
   * half the cases. Taking a charge before acceptance is certain, or dropping a bonus of a choice not yet
   * assigned, makes it fail.
   */
  @Test
  void pairChargesAndBonusesMatchBruteForce() {
    for (int i = 0; i < 300; i++) {
      kBest(i, new Random(57_000 + i), i % 2 == 0, i % 4 < 2, true);
    }
  }

  /**
   * Across scenarios with choosing segments: each (scenario, segment) pair takes its scenario's
   * buyers and utilities (prices and demands move per scenario), ψ sums the scenarios' lot values;
   * the k best and the rest bound against brute force.
   */
  @Test
  void logitCapsAcrossScenariosMatchBruteForce() throws Exception {
    for (int i = 0; i < 120; i++) {
      Random rnd = new Random(47_000 + i);
      Catalog c = StageRuns.withChoice(RandomCatalogs.random(rnd, 2 + rnd.nextInt(4), 4, 1 + rnd.nextInt(2),
          1 + rnd.nextInt(3), rnd.nextInt(8), true), rnd, 0.8);
      int n = 2 + rnd.nextInt(2);
      List<VariantSpace> spaces = new ArrayList<>();
      List<PortfolioTerms> terms = new ArrayList<>();
      for (int k = 0; k < n; k++) {
        List<Change> ch = new ArrayList<>();
        for (var seg : c.segments()) {
          ch.add(new Change(new Target(Field.DEMAND, seg.id(), null), Amount.percent(rnd.nextInt(81) - 40), "k" + k));
        }
        for (var g : c.groups()) {
          ch.add(new Change(new Target(Field.PRICE, g.id(), g.options().get(0).id()),
              Amount.set(rnd.nextInt(150)), "k" + k));
        }
        VariantSpace sp = new VariantSpace((k == 0 ? Scenario.none() : new Scenario("k" + k, ch)).applyTo(c));
        spaces.add(sp);
        terms.add(PortfolioTerms.of(sp));
      }
      VariantSpace space = spaces.get(0);
      int rc = space.resourceCount();
      int sc = space.segmentCount();
      double[] pi = new double[n * rc];
      for (int r = 0; r < pi.length; r++) {
        pi[r] = rnd.nextDouble() < 0.4 ? 0 : rnd.nextDouble() * 8;
      }
      double[] mu = new double[n * sc];
      for (int s = 0; s < mu.length; s++) {
        mu[s] = rnd.nextDouble() < 0.5 ? 0 : rnd.nextDouble() * 20;
      }
      double[] omega = new double[n];
      for (int k = 0; k < n; k++) {
        omega[k] = (1 + rnd.nextInt(4)) / 4.0;
      }
      double charge = rnd.nextInt(300);
      List<Scored> all = new ArrayList<>();
      for (int[] v : BruteVariants.all(space)) {
        double sum = -charge;
        for (int k = 0; k < n; k++) {
          VariantSpace sp = spaces.get(k);
          double[] d = new double[sc];
          for (int s = 0; s < sc; s++) {
            d[s] = sp.isColumn(v, s)
                ? omega[k] * sp.margin(v, s) - dot(pi, k * rc, sp.use(v)) - mu[k * sc + s]
                : Double.NEGATIVE_INFINITY;
          }
          sum += BruteVariants.lotValue(d, BruteVariants.caps(sp, terms.get(k), v), terms.get(k).minLot());
        }
        all.add(new Scored(v, sum));
      }
      all.sort(Comparator.comparingDouble(Scored::value).reversed());
      int k = 1 + rnd.nextInt(5);
      VariantQuery q = new VariantQuery(pi, mu, charge, null, Double.NEGATIVE_INFINITY, k, Set.of(), 0, omega);
      PricingOutcome out = new VariantPricer(spaces, terms, Long.MAX_VALUE).price(q);
      String where = "scenario case " + i;
      assertTrue(out.exact(), where);
      List<Scored> want = all.stream().filter(x -> x.value() > Double.NEGATIVE_INFINITY).limit(k).toList();
      assertEquals(want.size(), out.found().size(), where);
      Set<VariantKey> seen = new HashSet<>();
      for (int j = 0; j < want.size(); j++) {
        PricedVariant got = out.found().get(j);
        assertEquals(want.get(j).value(), got.reducedCost(), tol(got.reducedCost()), where);
        assertEquals(got.reducedCost(), VariantPricer.value(spaces, terms, got.choices(), q), tol(got.reducedCost()),
            where);
        seen.add(space.key(got.choices()));
      }
      for (Scored x : all) {
        if (!seen.contains(space.key(x.v()))) {
          assertTrue(x.value() <= out.restBound() + tol(x.value()), where + ": rest bound");
        }
      }
    }
  }

  private static double dot(double[] pi, int from, double[] use) {
    double x = 0;
    for (int r = 0; r < use.length; r++) {
      x += pi[from + r] * use[r];
    }
    return x;
  }

  private static double[] randomAccept(Random rnd, int segments) {
    double[] accept = new double[segments];
    for (int s = 0; s < segments; s++) {
      double u = rnd.nextDouble();
      accept[s] = u < 0.3 ? 0 : u < 0.65 ? rnd.nextInt(40_000) : -rnd.nextInt(40_000);
    }
    return accept;
  }

  private static void kBest(int i, Random rnd, boolean withAccept) {
    kBest(i, rnd, withAccept, false);
  }

  private static void kBest(int i, Random rnd, boolean withAccept, boolean withChoice) {
    kBest(i, rnd, withAccept, withChoice, false);
  }

  /** Σ over the segments that accept v of the pair charges of v's choices. */
  private static double pairValue(VariantSpace space, int[] v, double[][] pair) {
    double p = 0;
    for (int s = 0; pair != null && s < pair.length; s++) {
      if (space.isColumn(v, s)) {
        for (int g = 0; g < v.length; g++) {
          p += pair[s][space.offset(g) + v[g]];
        }
      }
    }
    return p;
  }

  private static double[][] randomPairs(Random rnd, VariantSpace space) {
    double[][] pair = new double[space.segmentCount()][space.totalChoices()];
    for (double[] row : pair) {
      for (int f = 0; f < row.length; f++) {
        double u = rnd.nextDouble();
        row[f] = u < 0.8 ? 0 : u < 0.9 ? rnd.nextInt(40_000) : -rnd.nextInt(40_000);
      }
    }
    return pair;
  }

  /**
   * Choosing segments with a value per unit of a variant's attraction (the duals of the sales envelopes,
   * {@link SalesEnvelope}): the search adds it at a node's optimistic utility while a segment may still
   * accept, a leaf at the variant's own; the k best, their values and the rest bound against brute
   * force (the bonus written out as Σ_s bonus_s·exp(u_s(v) − stayOut_s) over the choosing segments that
   * accept v), with segment and pair charges in some of the cases. Leaving the bonus out of the search's
   * bounds makes it fail.
   */
  @Test
  void attractionBonusesMatchBruteForce() {
    for (int i = 0; i < 300; i++) {
      kBest(i, new Random(83_000 + i), i % 2 == 0, true, i % 4 == 1, true);
    }
  }

  /** Σ over the choosing segments s that accept v of bonus[s]·exp(u_s(v) − stayOut_s). */
  private static double attractionValue(VariantSpace space, int[] v, double[] bonus) {
    double b = 0;
    for (int s = 0; bonus != null && s < bonus.length; s++) {
      if (space.chooses(s) && space.isColumn(v, s)) {
        b += bonus[s] * Math.exp(space.utility(v, s) - space.stayOut(s));
      }
    }
    return b;
  }

  private static void kBest(int i, Random rnd, boolean withAccept, boolean withChoice, boolean withPairs) {
    kBest(i, rnd, withAccept, withChoice, withPairs, false);
  }

  private static void kBest(int i, Random rnd, boolean withAccept, boolean withChoice, boolean withPairs,
      boolean withAttraction) {
    Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(5), 4, 1 + rnd.nextInt(3), 1 + rnd.nextInt(3),
        rnd.nextInt(10), true);
    if (withAccept) {
      c = StageRuns.withMasks(c, rnd);
    }
    if (withChoice) {
      c = StageRuns.withChoice(c, rnd, 0.7);
    }
    VariantSpace space = new VariantSpace(c);
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
    double[] penalty = null;
    if (rnd.nextBoolean()) {
      penalty = new double[space.totalChoices()];
      for (int f = 0; f < penalty.length; f++) {
        penalty[f] = rnd.nextDouble() < 0.3 ? rnd.nextInt(200) : 0;
      }
    }
    double[] accept = withAccept ? randomAccept(rnd, space.segmentCount()) : null;
    double[][] pair = withPairs ? randomPairs(rnd, space) : null;
    double[] attraction = null;
    if (withAttraction) {
      attraction = new double[space.segmentCount()];
      for (int s = 0; s < attraction.length; s++) {
        attraction[s] = space.chooses(s) && rnd.nextDouble() < 0.7 ? rnd.nextDouble() * 30 : 0;
      }
    }
    double[] bonus = attraction;
    List<Scored> all = new ArrayList<>();
    for (int[] v : BruteVariants.all(space)) {
      all.add(new Scored(v, BruteVariants.value(space, t, v, pi, mu, charge, penalty, accept)
          - pairValue(space, v, pair) + attractionValue(space, v, bonus)));
    }
    all.sort(Comparator.comparingDouble(Scored::value).reversed());
    Set<VariantKey> excluded = new HashSet<>();
    for (Scored sc : all) {
      if (rnd.nextDouble() < 0.2) {
        excluded.add(space.key(sc.v()));
      }
    }
    int k = 1 + rnd.nextInt(6);
    double threshold = rnd.nextBoolean() ? Double.NEGATIVE_INFINITY
        : all.isEmpty() ? 0 : all.get(rnd.nextInt(all.size())).value() - 1;
    PricingOutcome out = new VariantPricer(space, t, Long.MAX_VALUE).price(
        new VariantQuery(pi, mu, charge, penalty, threshold, k, excluded, 0).withAcceptCharge(accept)
            .withPairCharge(pair).withAttractionBonus(bonus));
    assertTrue(out.exact());
    List<Scored> want = all.stream()
        .filter(sc -> !excluded.contains(space.key(sc.v())) && sc.value() > threshold)
        .limit(k).toList();
    String where = "case " + i + (withAccept ? " with acceptance charges" : "") + (withChoice ? " choosing" : "")
        + (withPairs ? " with pair charges" : "") + (withAttraction ? " with attraction bonuses" : "");
    assertEquals(want.size(), out.found().size(), where);
    Set<VariantKey> seen = new HashSet<>();
    for (int j = 0; j < want.size(); j++) {
      PricedVariant got = out.found().get(j);
      assertEquals(want.get(j).value(), got.reducedCost(), tol(got.reducedCost()), where);
      double direct = BruteVariants.value(space, t, got.choices(), pi, mu, charge, penalty, accept)
          - pairValue(space, got.choices(), pair) + attractionValue(space, got.choices(), bonus);
      assertEquals(direct, got.reducedCost(), tol(direct), where);
      double own = VariantPricer.value(space, t, got.choices(),
          new VariantQuery(pi, mu, charge, penalty, threshold, k, excluded, 0).withAcceptCharge(accept)
              .withPairCharge(pair).withAttractionBonus(bonus));
      assertEquals(direct, own, tol(direct), where);
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

  /**
   * A tree worker keeps one pricer for all its nodes, and each node's count rows bring other penalties
   * and charges, at times of the size of the master's artificial cost (about 10^9 on the families at
   * 10^12 variants). The pricer orders the groups per query, deciding groups first, and rebuilds its
   * forward checker when the order changes; here one pricer answers a sequence of such queries (and a
   * query without any, back to the static order), each against brute force, and the order of each query
   * must put the groups that decide something first, by decreasing size.
   */
  @Test
  void oneSearchOrderPerQueryUnderLargeCountDuals() {
    int reordered = 0;
    for (int i = 0; i < 60; i++) {
      Random rnd = new Random(83_000 + i);
      Catalog c = StageRuns.withMasks(RandomCatalogs.random(rnd, 3 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3),
          1 + rnd.nextInt(3), rnd.nextInt(10), true), rnd);
      VariantSpace space = new VariantSpace(c);
      PortfolioTerms t = PortfolioTerms.of(space);
      VariantPricer pricer = new VariantPricer(space, t, Long.MAX_VALUE);
      int[] before = pricer.groupOrder();
      for (int q = 0; q < 5; q++) {
        double[] pi = new double[space.resourceCount()];
        for (int r = 0; r < pi.length; r++) {
          pi[r] = rnd.nextDouble() < 0.4 ? 0 : rnd.nextDouble() * 8;
        }
        double[] mu = new double[space.segmentCount()];
        double big = 2.4e9;
        double[] penalty = null;
        double[] accept = null;
        if (q < 4) {
          penalty = new double[space.totalChoices()];
          for (int f = 0; f < penalty.length; f++) {
            double u = rnd.nextDouble();
            penalty[f] = u < 0.15 ? -big : u < 0.25 ? rnd.nextInt(20_000) - 10_000 : 0;
          }
          accept = new double[space.segmentCount()];
          for (int s = 0; s < accept.length; s++) {
            double u = rnd.nextDouble();
            accept[s] = u < 0.4 ? 0 : u < 0.7 ? big * (1 + rnd.nextInt(5)) : -big;
          }
        }
        double charge = q < 4 && rnd.nextBoolean() ? big : rnd.nextInt(300);
        List<Scored> all = new ArrayList<>();
        for (int[] v : BruteVariants.all(space)) {
          all.add(new Scored(v, BruteVariants.value(space, t, v, pi, mu, charge, penalty, accept)));
        }
        all.sort(Comparator.comparingDouble(Scored::value).reversed());
        int k = 1 + rnd.nextInt(4);
        PricingOutcome out = pricer.price(
            new VariantQuery(pi, mu, charge, penalty, 0.0, k, Set.of(), 0).withAcceptCharge(accept));
        String where = "case " + i + " query " + q;
        assertTrue(out.exact(), where);
        List<Scored> want = all.stream().filter(x -> x.value() > 0.0).limit(k).toList();
        assertEquals(want.size(), out.found().size(), where);
        Set<VariantKey> seen = new HashSet<>();
        for (int j = 0; j < want.size(); j++) {
          PricedVariant got = out.found().get(j);
          assertEquals(want.get(j).value(), got.reducedCost(), tol(got.reducedCost()), where);
          seen.add(space.key(got.choices()));
        }
        for (Scored x : all) {
          if (!seen.contains(space.key(x.v()))) {
            assertTrue(x.value() <= out.restBound() + tol(x.value()), where + ": rest bound");
          }
        }
        int[] order = pricer.groupOrder();
        double[] size = decided(space, penalty, accept);
        for (int d = 1; d < order.length; d++) {
          assertTrue(size[order[d - 1]] >= size[order[d]], where + ": deciding groups first, largest first");
        }
        if (penalty == null) {
          assertTrue(java.util.Arrays.equals(before, order), where + ": no charges, the static order");
        } else if (!java.util.Arrays.equals(before, order)) {
          reordered++;
        }
      }
    }
    assertTrue(reordered > 60, "most queries with charges should change the order: " + reordered);
  }

  /** Per group: the spread of its penalties plus |accept_s| of every charged segment rejecting some of its choices. */
  private static double[] decided(VariantSpace space, double[] penalty, double[] accept) {
    double[] size = new double[space.groupCount()];
    for (int g = 0; g < size.length && penalty != null; g++) {
      double lo = Double.POSITIVE_INFINITY;
      double hi = Double.NEGATIVE_INFINITY;
      for (int f = space.offset(g); f < space.offset(g + 1); f++) {
        lo = Math.min(lo, penalty[f]);
        hi = Math.max(hi, penalty[f]);
      }
      size[g] = hi - lo;
      for (int s = 0; s < space.segmentCount(); s++) {
        boolean rejects = false;
        for (int c = 0; c < space.choiceCount(g); c++) {
          rejects |= !space.allowedIn(s, space.offset(g) + c);
        }
        if (accept[s] != 0 && rejects) {
          size[g] += Math.abs(accept[s]);
        }
      }
    }
    return size;
  }

  @Test
  void anEarlyStopKeepsAValidRestBound() {
    int stopped = 0;
    for (int i = 0; i < 120; i++) {
      Random rnd = new Random(900 + i);
      Catalog c = RandomCatalogs.random(rnd, 4 + rnd.nextInt(3), 4, 2, 2, rnd.nextInt(8), true);
      if (i % 3 == 2) {
        c = StageRuns.withChoice(c, rnd, 0.7);
      }
      VariantSpace space = new VariantSpace(c);
      PortfolioTerms t = PortfolioTerms.of(space);
      double[] pi = new double[space.resourceCount()];
      for (int r = 0; r < pi.length; r++) {
        pi[r] = rnd.nextDouble() * 5;
      }
      double[] mu = new double[space.segmentCount()];
      double[] accept = i % 2 == 1 ? randomAccept(rnd, space.segmentCount()) : null;
      PricingOutcome out = new VariantPricer(space, t, 1 + rnd.nextInt(12)).price(
          new VariantQuery(pi, mu, 0, null, Double.NEGATIVE_INFINITY, 3, Set.of(), 0).withAcceptCharge(accept));
      if (!out.exact()) {
        stopped++;
      }
      Set<VariantKey> found = new HashSet<>();
      out.found().forEach(f -> found.add(space.key(f.choices())));
      for (int[] v : BruteVariants.all(space)) {
        double x = BruteVariants.value(space, t, v, pi, mu, 0, null, accept);
        if (!found.contains(space.key(v))) {
          assertTrue(x <= out.restBound() + tol(x), "case " + i);
        }
      }
    }
    assertTrue(stopped > 20, "the node limit should stop many of these searches");
  }
}
