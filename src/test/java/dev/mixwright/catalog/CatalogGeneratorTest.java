package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.BudgetedCount;
import dev.mixwright.space.Existence;
import dev.mixwright.space.VariantSpace;
import java.util.Random;
import org.junit.jupiter.api.Test;

class CatalogGeneratorTest {

  private static CatalogGenerator.Spec spec(Random rnd, long seed) {
    return new CatalogGenerator.Spec(2 + rnd.nextInt(14), 2 + rnd.nextInt(7), 1 + rnd.nextInt(8),
        1 + rnd.nextInt(6), rnd.nextInt(45), rnd.nextDouble() * 0.6, seed);
  }

  @Test
  void sameSeedSameBytes() {
    Random rnd = new Random(5);
    for (int i = 0; i < 20; i++) {
      CatalogGenerator.Spec s = spec(rnd, i);
      String a = CatalogWriter.toYaml(CatalogGenerator.generate(s));
      String b = CatalogWriter.toYaml(CatalogGenerator.generate(s));
      assertEquals(a, b, "spec " + s);
    }
    CatalogGenerator.Spec s = CatalogGenerator.Spec.of(10, 5, 4, 3, 20, 1);
    CatalogGenerator.Spec t = CatalogGenerator.Spec.of(10, 5, 4, 3, 20, 2);
    assertNotEquals(CatalogWriter.toYaml(CatalogGenerator.generate(s)), CatalogWriter.toYaml(CatalogGenerator.generate(t)));
  }

  @Test
  void everyGeneratedCatalogLoadsAndEverySegmentHasVariants() throws CatalogException {
    Random rnd = new Random(11);
    for (int i = 0; i < 60; i++) {
      CatalogGenerator.Spec s = spec(rnd, 100 + i);
      Catalog c = CatalogGenerator.generate(s);
      // the loader validates everything a user's file must satisfy; the writer's output must pass it
      Catalog back = CatalogLoader.parse(CatalogWriter.toYaml(c), "x.yaml", null);
      assertEquals(c, back, "round trip of " + s);
      assertEquals(s.groups(), c.groups().size());
      assertEquals(s.rules(), c.rules().size(), "every requested rule was placed: " + s);
      assertEverySegmentSells(back, s);
    }
  }

  /** Sellability by complete search (no node limit), not by counting. */
  private static void assertEverySegmentSells(Catalog c, CatalogGenerator.Spec s) {
    VariantSpace space = new VariantSpace(c);
    assertTrue(Existence.within(space, BudgetedCount.wholeSpace(space), Long.MAX_VALUE).found(),
        "buildable variants for " + s);
    for (int seg = 0; seg < space.segmentCount(); seg++) {
      assertTrue(Existence.within(space, BudgetedCount.segment(space, seg), Long.MAX_VALUE).found(),
          "segment " + seg + " accepts a buildable variant: " + s);
    }
  }

  private static CatalogGenerator.Spec spec(Random rnd, long seed, CatalogGenerator.Family family) {
    return new CatalogGenerator.Spec(4 + rnd.nextInt(20), 2 + rnd.nextInt(7), 1 + rnd.nextInt(8),
        1 + rnd.nextInt(6), rnd.nextInt(60), rnd.nextDouble() * 0.6, seed, family);
  }

  /** Every family writes catalogs that load back unchanged, with every rule placed and every segment selling. */
  @Test
  void everyFamilyMakesValidCatalogs() throws CatalogException {
    for (CatalogGenerator.Family f : CatalogGenerator.Family.values()) {
      Random rnd = new Random(f.ordinal());
      for (int i = 0; i < 15; i++) {
        CatalogGenerator.Spec s = spec(rnd, 300 + i, f);
        Catalog c = CatalogGenerator.generate(s);
        Catalog back = CatalogLoader.parse(CatalogWriter.toYaml(c), "x.yaml", null);
        assertEquals(c, back, "round trip of " + s);
        assertEquals(s.rules(), c.rules().size(), "every requested rule was placed: " + s);
        assertEverySegmentSells(back, s);
        assertEquals(c, CatalogGenerator.generate(s), "same spec, same catalog: " + s);
      }
    }
  }

  @Test
  void classicIsTheDefaultSoOldSeedsGiveTheSameCatalogs() {
    CatalogGenerator.Spec old = new CatalogGenerator.Spec(12, 5, 4, 3, 30, 0.2, 9);
    assertEquals(CatalogGenerator.Family.CLASSIC, old.family());
    assertEquals(CatalogGenerator.generate(old),
        CatalogGenerator.generate(new CatalogGenerator.Spec(12, 5, 4, 3, 30, 0.2, 9, CatalogGenerator.Family.CLASSIC)));
    assertEquals(CatalogGenerator.Family.WIDE, CatalogGenerator.Family.of("wide"));
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> CatalogGenerator.Family.of("spiky"));
    assertTrue(e.getMessage().contains("classic, dense, distant, wide, multi, tight, loose"), e.getMessage());
  }

  private static Catalog family(CatalogGenerator.Family f, long seed) {
    return CatalogGenerator.generate(new CatalogGenerator.Spec(20, 6, 6, 4, 60, 0.2, seed, f));
  }

  private static int distance(Catalog c, java.util.Collection<String> groups) {
    int lo = Integer.MAX_VALUE;
    int hi = Integer.MIN_VALUE;
    for (String g : groups) {
      lo = Math.min(lo, c.groupIndex(g));
      hi = Math.max(hi, c.groupIndex(g));
    }
    return hi - lo;
  }

  @Test
  void wideRulesForbidAcrossThreeToFiveGroups() {
    for (long seed = 1; seed <= 5; seed++) {
      for (Rule r : family(CatalogGenerator.Family.WIDE, seed).rules()) {
        assertTrue(r.isForbid() && r.forbid().size() >= 3 && r.forbid().size() <= 5, "rule " + r);
      }
    }
  }

  @Test
  void multiRulesHaveSeveralGroupsOnEachSide() {
    for (long seed = 1; seed <= 5; seed++) {
      for (Rule r : family(CatalogGenerator.Family.MULTI, seed).rules()) {
        assertTrue(!r.isForbid() && r.when().size() >= 2 && r.require().size() == 2, "rule " + r);
      }
    }
  }

  @Test
  void denseRulesForbidLargeBlocksBetweenNeighbours() {
    for (long seed = 1; seed <= 5; seed++) {
      Catalog c = family(CatalogGenerator.Family.DENSE, seed);
      for (Rule r : c.rules()) {
        assertTrue(r.isForbid() && r.forbid().size() == 2, "rule " + r);
        assertTrue(distance(c, r.forbid().keySet()) <= 2, "neighbours: " + r);
        r.forbid().values().forEach(ids -> assertTrue(ids.size() >= 2, "a block of two or more: " + r));
      }
    }
  }

  @Test
  void distantRulesTieGroupsFarApart() {
    for (long seed = 1; seed <= 5; seed++) {
      Catalog c = family(CatalogGenerator.Family.DISTANT, seed);
      long far = c.rules().stream()
          .mapToInt(r -> distance(c, r.isForbid() ? r.forbid().keySet() : union(r)))
          .filter(d -> d > 3).count();
      // uniform pairs of 20 groups lie more than 3 apart with probability 1 - 3·(2·20 - 4)/(20·19) ≈ 0.72
      assertTrue(far >= c.rules().size() / 2, far + " of " + c.rules().size() + " rules span more than 3 groups");
    }
  }

  private static java.util.Set<String> union(Rule r) {
    java.util.Set<String> s = new java.util.HashSet<>(r.when().keySet());
    s.addAll(r.require().keySet());
    return s;
  }

  /** Tight and loose draw the classic groups and rules and scale only the capacities. */
  @Test
  void tightAndLooseMoveOnlyTheCapacities() {
    for (long seed = 1; seed <= 5; seed++) {
      Catalog classic = family(CatalogGenerator.Family.CLASSIC, seed);
      Catalog tight = family(CatalogGenerator.Family.TIGHT, seed);
      Catalog loose = family(CatalogGenerator.Family.LOOSE, seed);
      assertEquals(classic.groups(), tight.groups());
      assertEquals(classic.rules(), loose.rules());
      for (int r = 0; r < classic.resources().size(); r++) {
        double cap = classic.resources().get(r).capacity();
        // classic scales by 0.4–0.7, tight by 0.15–0.3, loose by 1.1–1.6 (rounded to whole units)
        assertTrue(tight.resources().get(r).capacity() <= cap, "tight " + r);
        assertTrue(loose.resources().get(r).capacity() >= cap, "loose " + r);
      }
    }
  }

  @Test
  void capacitiesAreBelowWhatTheBestVariantsWouldNeed() {
    Catalog c = CatalogGenerator.generate(CatalogGenerator.Spec.of(12, 6, 5, 4, 30, 3));
    VariantSpace space = new VariantSpace(c);
    double demand = c.segments().stream().mapToDouble(Segment::demand).sum();
    // Per resource, the use if every unit sold took each group's highest-use choice: capacity must
    // be well below it, or the resource can never bind.
    for (int r = 0; r < space.resourceCount(); r++) {
      double most = 0;
      for (int g = 0; g < space.groupCount(); g++) {
        double m = 0;
        for (int k = 0; k < space.choiceCount(g); k++) {
          m = Math.max(m, space.choiceUse(space.offset(g) + k, r));
        }
        most += m;
      }
      assertTrue(most > 0, "every resource is used by some option");
      assertTrue(c.resources().get(r).capacity() < 0.75 * most * demand, "resource " + r + " can bind");
    }
  }

  @Test
  void badSpecsAreRefusedInWords() {
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> CatalogGenerator.Spec.of(1, 5, 4, 3, 20, 1));
    assertTrue(e.getMessage().contains("groups"), e.getMessage());
    e = assertThrows(IllegalArgumentException.class, () -> new CatalogGenerator.Spec(5, 5, 4, 3, 20, 1.5, 1));
    assertTrue(e.getMessage().contains("optional share"), e.getMessage());
  }
}
