package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CurrentVariant;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The integer stage with a current range: hand-checked cases (worked out in the comments, invented
 * data) and a seeded property against the fully enumerated MIP (SCIP on every buildable variant,
 * {@link EnumeratedMip}, which writes the current-range terms from the spec's words).
 */
class CurrentRangePortfolioTest {

  /**
   * One group "model": a (price 30, cost 10), b (25, 10), c (8, 10: margin −2), each 1 hour of
   * {@code hours}. North takes a and c (demand 80), south takes b (demand {@code south}).
   */
  private static Catalog catalog(double hours, double south, double f, double lot, List<CurrentVariant> current) {
    List<Group> groups = List.of(new Group("model", null, true, List.of(
        new Option("a", null, 30, 10, Map.of("hours", 1.0), 0.0),
        new Option("b", null, 25, 10, Map.of("hours", 1.0), 0.0),
        new Option("c", null, 8, 10, Map.of("hours", 1.0), 0.0))));
    List<Segment> segments = List.of(
        new Segment("north", null, 80, 1.0, Map.of("model", List.of("a", "c")), Map.of()),
        new Segment("south", null, south, 1.0, Map.of("model", List.of("b")), Map.of()));
    return new Catalog(1, "hand", "EUR", "year", List.of(new Resource("hours", null, "h", hours)), groups, List.of(),
        segments, Optional.of(new PortfolioSpec(f, Integer.MAX_VALUE, lot)), current, List.of());
  }

  private static CurrentVariant current(String model, double discontinue, boolean keep) {
    return new CurrentVariant(Map.of("model", model), discontinue, keep);
  }

  private static PortfolioOutcome proven(Catalog c) {
    VariantSpace space = new VariantSpace(c);
    PortfolioOutcome o = StageRuns.stage(space, StageRuns.settings());
    assertTrue(o.status().isProven(), o.reason());
    // the fully enumerated MIP (SCIP) agrees with the hand computation
    assertEquals(EnumeratedMip.solve(space, false, 0).value(), o.result().value(), 1e-6);
    return o;
  }

  private static List<String> labels(VariantSpace space, List<OfferedVariant> vs) {
    return vs.stream().map(v -> space.label(v.choices())).sorted().toList();
  }

  @Test
  void aPinnedVariantStaysEvenWhenItLosesMoney() {
    // F = 100, lot 10, 100 hours. Without c: a 80 (1,600) + b 20 (300) − 200 = 1,700.
    // c pinned (no introduction cost) must sell its lot of 10 at −2 and takes 10 of north's 80:
    // a 70 (1,400) + b 20 (300) + c 10 (−20) − 200 = 1,480.
    Catalog c = catalog(100, 50, 100, 10, List.of(current("c", 0, true)));
    PortfolioOutcome o = proven(c);
    VariantSpace space = new VariantSpace(c);
    assertEquals(1480, o.result().value(), 1e-6);
    assertEquals(List.of("model=c"), labels(space, o.range().kept()));
    assertEquals(List.of("model=a", "model=b"), labels(space, o.range().added()));
    assertTrue(o.range().dropped().isEmpty());
    // today's range alone: c sells its lot of 10 and no more, at −2 = −20
    assertEquals(-20, o.range().currentRangeValue(), 1e-6);
  }

  @Test
  void aDiscontinuationCostKeepsAWeakVariant() {
    // 80 hours, south takes 5, F = 100, lot 5, b on sale today. a alone: 1,600 − 100 = 1,500; a 75 +
    // b 5 (b's lot) = 1,575 − 100 (a's introduction) = 1,475. Dropping b for free: 1,500 wins.
    Catalog free = catalog(80, 5, 100, 5, List.of(current("b", 0, false)));
    PortfolioOutcome o = proven(free);
    VariantSpace space = new VariantSpace(free);
    assertEquals(1500, o.result().value(), 1e-6);
    assertEquals(1, o.range().dropped().size());
    // with discontinue 100, dropping b gives 1,500 − 100 = 1,400 < 1,475: b is kept
    Catalog costly = catalog(80, 5, 100, 5, List.of(current("b", 100, false)));
    PortfolioOutcome p = proven(costly);
    assertEquals(1475, p.result().value(), 1e-6);
    assertEquals(List.of("model=b"), labels(space, p.range().kept()));
    assertEquals(List.of("model=a"), labels(space, p.range().added()));
    assertEquals(0, p.range().discontinueCosts(), 1e-12);
    // today's range {b} alone sells 5 at 15 = 75, whatever it would cost to drop it
    assertEquals(75, p.range().currentRangeValue(), 1e-6);
  }

  /** The sellable buildable variants of a small space, by an odometer. */
  private static List<int[]> sellable(VariantSpace space) {
    List<int[]> out = new ArrayList<>();
    int[] v = new int[space.groupCount()];
    while (true) {
      for (int s = 0; s < space.segmentCount(); s++) {
        if (space.isColumn(v, s)) {
          out.add(v.clone());
          break;
        }
      }
      int g = space.groupCount() - 1;
      while (g >= 0 && ++v[g] == space.choiceCount(g)) {
        v[g] = 0;
        g--;
      }
      if (g < 0) {
        return out;
      }
    }
  }

  private static double tol(double x) {
    return 1e-6 * (1 + Math.abs(x));
  }

  @Test
  void enumeratedMipAgreesOnRandomCurrentRanges() {
    compareOnRandomCurrentRanges(9100, false);
  }

  /**
   * The same comparison with the quick proof off, so that the branch-and-price tree decides: its
   * nodes must charge a kept variant nothing, a dropped one its discontinue cost, and keep a pinned
   * one offered from the root.
   */
  @Test
  void theTreeAgreesOnRandomCurrentRanges() {
    compareOnRandomCurrentRanges(9300, true);
  }

  private void compareOnRandomCurrentRanges(long firstSeed, boolean treeOnly) {
    int compared = 0;
    int proven = 0;
    int treeRan = 0;
    for (int i = 0; i < 30; i++) {
      long seed = firstSeed + i;
      Random rnd = new Random(seed);
      Catalog base = RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3), 1 + rnd.nextInt(3),
          rnd.nextInt(7), true);
      VariantSpace plain = new VariantSpace(base);
      List<int[]> all = sellable(plain);
      if (all.isEmpty()) {
        continue;
      }
      double f = base.portfolio().orElseThrow().introductionCost();
      List<CurrentVariant> cur = new ArrayList<>();
      List<int[]> picked = new ArrayList<>();
      int n = 1 + rnd.nextInt(Math.min(3, all.size()));
      for (int j = 0; j < n; j++) {
        int[] v = all.remove(rnd.nextInt(all.size()));
        picked.add(v);
        cur.add(new CurrentVariant(plain.describe(v), rnd.nextInt(3) * (f + 50), j == 0 && rnd.nextDouble() < 0.4));
      }
      // an exclusion of two choices of an unpinned pick (or of a random variant), never of the pinned one
      List<Map<String, String>> exclude = new ArrayList<>();
      int[] target = picked.size() > 1 ? picked.get(1) : all.isEmpty() ? null : all.get(rnd.nextInt(all.size()));
      if (target != null && plain.groupCount() >= 2) {
        Map<String, String> e = new LinkedHashMap<>();
        for (int g = plain.groupCount() - 2; g < plain.groupCount(); g++) {
          e.put(base.groups().get(g).id(), plain.optionId(g, target[g]));
        }
        if (!cur.get(0).keep() || !holdsAll(plain, picked.get(0), e)) {
          exclude.add(e);
        }
      }
      Catalog c = base.withCurrentRange(cur, exclude);
      VariantSpace space = new VariantSpace(c);
      EnumeratedMip.Result full;
      try {
        full = EnumeratedMip.solve(space, false, 60_000);
      } catch (IllegalStateException pinnedLotsDoNotFit) {
        continue;
      }
      if (!full.optimal()) {
        continue;
      }
      compared++;
      PortfolioOutcome o = treeOnly
          ? new IntegerStage(space, StageRuns.settings()).workers(1 + i % 2).quickProof(false).run(StageRuns.lp(space))
          : StageRuns.stage(space, StageRuns.settings());
      if (o.tree().nodes() > 0) {
        treeRan++;
      }
      String where = "seed " + seed + " (" + o.status().word() + " " + o.reason() + ")";
      assertTrue(full.value() <= o.result().bound() + tol(full.value()), where + ": bound " + o.result().bound()
          + " below the enumerated optimum " + full.value());
      assertTrue(o.result().value() <= full.value() + tol(full.value()), where + ": better than the optimum?");
      if (o.status().isProven()) {
        proven++;
        assertEquals(full.value(), o.result().value(), tol(full.value()), where);
      }
      for (OfferedVariant v : o.offer().variants()) {
        assertFalse(EnumeratedMip.excluded(space, v.choices()), where + ": offers an excluded variant");
      }
      if (cur.get(0).keep()) {
        assertTrue(o.range().kept().stream().anyMatch(v -> space.key(v.choices()).equals(space.key(picked.get(0)))),
            where + ": the pinned variant is not kept");
      }
      assertEquals(cur.size(), o.range().kept().size() + o.range().dropped().size(), where);
      // today's range = the enumerated model with every current variant pinned and nothing else allowed
      List<CurrentVariant> allPinned = cur.stream().map(cv -> new CurrentVariant(cv.variant(), cv.discontinue(), true))
          .toList();
      PortfolioSpec p = c.portfolio().orElseThrow();
      Catalog today = new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), c.rules(),
          c.segments(), Optional.of(new PortfolioSpec(p.introductionCost(), cur.size(), p.minLot(), p.wholeUnits())),
          allPinned, List.of());
      double expected;
      try {
        expected = EnumeratedMip.solve(new VariantSpace(today), false, 60_000).value();
      } catch (IllegalStateException doesNotFit) {
        expected = Double.NaN;
      }
      if (Double.isNaN(expected)) {
        assertTrue(Double.isNaN(o.range().currentRangeValue()), where + ": today's range should not fit");
      } else {
        assertEquals(expected, o.range().currentRangeValue(), tol(expected), where + ": today's range");
      }
    }
    assertTrue(compared >= 20, "the reference should solve most cases, got " + compared);
    assertTrue(proven >= compared / 2, "most small cases should be proven, got " + proven + " of " + compared);
    if (treeOnly) {
      System.out.println("current ranges, tree only: " + proven + " of " + compared + " proven, the tree ran in "
          + treeRan);
      assertTrue(treeRan >= compared / 2, "the tree should decide most cases, ran in " + treeRan);
    }
  }

  private static boolean holdsAll(VariantSpace space, int[] v, Map<String, String> e) {
    for (Map.Entry<String, String> x : e.entrySet()) {
      int g = space.catalog().groupIndex(x.getKey());
      if (!space.optionId(g, v[g]).equals(x.getValue())) {
        return false;
      }
    }
    return true;
  }
}
