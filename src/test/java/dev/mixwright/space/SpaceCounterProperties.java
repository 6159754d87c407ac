package dev.mixwright.space;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Rule;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.RandomCatalogs;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * SpaceCounter against brute force (odometer over every combination of choices), on seeded cases
 * ({@link Cases}); a failure names its seed.
 */
class SpaceCounterProperties {
  static final long MAX_BRUTE = 100_000;

  /** A random catalog from RandomCatalogs, with fewer groups until brute force stays small. */
  static Catalog sized(long seed, int groups, int maxOptions, int rules, int segments) {
    for (int g = groups; ; g--) {
      Catalog c = RandomCatalogs.random(new Random(seed), g, maxOptions, 1, segments, rules, false);
      if (BruteForce.combinations(c) <= MAX_BRUTE) {
        return c;
      }
    }
  }

  /**
   * A catalog for one case: {@link #sized} with the group count, options per group and rule count
   * each drawn from a {@code {min, max}} range, and {@code wide} rules of {@link #withWideRules} on
   * top; the catalog draws from a stream of its own, apart from the case's.
   */
  static Catalog draw(Random rnd, int[] groups, int[] options, int[] rules, int segments, int wide) {
    int g = Cases.between(rnd, groups[0], groups[1]);
    int o = Cases.between(rnd, options[0], options[1]);
    int r = Cases.between(rnd, rules[0], rules[1]);
    long seed = rnd.nextLong();
    Catalog c = sized(seed, g, o, r, segments);
    return wide > 0 ? withWideRules(c, seed, wide) : c;
  }

  /** Adds rules over three groups (forbid) and two-group when with require on a third. */
  static Catalog withWideRules(Catalog c, long seed, int extra) {
    int n = c.groups().size();
    if (n < 3) {
      return c;
    }
    Random rnd = new Random(seed ^ 0x5eed);
    List<Rule> rules = new ArrayList<>(c.rules());
    for (int i = 0; i < extra; i++) {
      List<Integer> pick = new ArrayList<>();
      while (pick.size() < 3) {
        int g = rnd.nextInt(n);
        if (!pick.contains(g)) {
          pick.add(g);
        }
      }
      Map<String, List<String>> a = new LinkedHashMap<>();
      for (int j = 0; j < 2; j++) {
        Group g = c.groups().get(pick.get(j));
        a.put(g.id(), someChoices(rnd, g));
      }
      Group third = c.groups().get(pick.get(2));
      if (rnd.nextBoolean()) {
        a.put(third.id(), someChoices(rnd, third));
        rules.add(new Rule("wide" + i, Map.of(), Map.of(), a));
      } else {
        rules.add(new Rule("wide" + i, a, Map.of(third.id(), someChoices(rnd, third)), Map.of()));
      }
    }
    return new Catalog(
        c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), rules,
        c.segments(), c.portfolio());
  }

  static List<String> someChoices(Random rnd, Group g) {
    List<String> out = new ArrayList<>();
    for (int k = 0; k < g.choiceCount(); k++) {
      if (rnd.nextDouble() < 0.5) {
        out.add(g.choiceId(k));
      }
    }
    if (out.isEmpty()) {
      out.add(g.choiceId(rnd.nextInt(g.choiceCount())));
    }
    return out;
  }

  @Test
  void exactCountEqualsBruteForce() {
    Cases.each(100, (seed, rnd) -> {
      VariantSpace space =
          new VariantSpace(draw(rnd, new int[] {1, 12}, new int[] {1, 7}, new int[] {0, 30}, 3, 0));
      SpaceCounter counter = new SpaceCounter(space);
      SpaceCount all = counter.count();
      assertTrue(all.exact());
      assertEquals(BigInteger.valueOf(BruteForce.buildable(space)), all.value()); // brute force
      List<SpaceCount> per = counter.perSegment();
      for (int s = 0; s < space.segmentCount(); s++) {
        assertTrue(per.get(s).exact());
        assertEquals(BigInteger.valueOf(BruteForce.columns(space, s)), per.get(s).value(), "segment " + s);
      }
    });
  }

  @Test
  void exactCountEqualsBruteForceWithWideRules() {
    Cases.each(80, (seed, rnd) -> {
      int wide = Cases.between(rnd, 1, 12);
      VariantSpace space =
          new VariantSpace(draw(rnd, new int[] {3, 12}, new int[] {2, 6}, new int[] {0, 12}, 2, wide));
      SpaceCounter counter = new SpaceCounter(space);
      assertEquals(SpaceCount.exact(BigInteger.valueOf(BruteForce.buildable(space))), counter.count());
      for (int s = 0; s < space.segmentCount(); s++) {
        assertEquals(
            SpaceCount.exact(BigInteger.valueOf(BruteForce.columns(space, s))), counter.count(s));
      }
    });
  }

  /** With tiny tables the count may only be a bound, but never below the truth. */
  @Test
  void boundNeverBelowTruth() {
    Cases.each(500, (seed, rnd) -> {
      VariantSpace space =
          new VariantSpace(draw(rnd, new int[] {3, 12}, new int[] {2, 6}, new int[] {5, 40}, 1, 4));
      int limit = Cases.between(rnd, 1, 64);
      SpaceCount c = new SpaceCounter(space, limit).count();
      BigInteger truth = BigInteger.valueOf(BruteForce.buildable(space)); // brute force
      if (c.exact()) {
        assertEquals(truth, c.value());
      } else {
        assertTrue(c.value().compareTo(truth) >= 0, c.value() + " < " + truth);
      }
      assertTrue(c.value().compareTo(BigInteger.valueOf(BruteForce.combinations(space.catalog()))) <= 0);
    });
  }

  /** count(domain) and the feasibility search agree with brute force on random restrictions. */
  @Test
  void restrictedCountAndSearchEqualBruteForce() {
    Cases.each(1000, (seed, rnd) -> {
      VariantSpace space =
          new VariantSpace(draw(rnd, new int[] {2, 10}, new int[] {2, 6}, new int[] {0, 30}, 1, 3));
      boolean[] domain = new boolean[space.totalChoices()];
      for (int f = 0; f < domain.length; f++) {
        domain[f] = rnd.nextDouble() < 0.75;
      }
      int[] off = space.offsets();
      long truth =
          BruteForce.count(
              space.catalog(),
              v -> {
                for (int g = 0; g < v.length; g++) {
                  if (!domain[off[g] + v[g]]) {
                    return false;
                  }
                }
                return space.isBuildable(v);
              });
      assertEquals(SpaceCount.exact(BigInteger.valueOf(truth)), new SpaceCounter(space).count(domain));
      boolean[] within = domain.clone();
      for (int f = 0; f < within.length; f++) {
        within[f] &= space.allowed(f);
      }
      assertEquals(truth > 0, SpaceDiagnosis.anyBuildable(space, within));
      Feasibility.Answer quick = Feasibility.search(space, within, 1 + rnd.nextInt(20));
      if (quick != Feasibility.Answer.UNKNOWN) {
        assertEquals(truth > 0, quick == Feasibility.Answer.FOUND);
      }
    });
  }

  /** The compiled space (allowed + nogoods) says what the catalog's rules say, read directly. */
  @Test
  void compiledRulesAgreeWithCatalogRules() {
    Cases.each(60, (seed, rnd) -> {
      Catalog c = draw(rnd, new int[] {2, 10}, new int[] {1, 6}, new int[] {0, 25}, 3, 3);
      VariantSpace space = new VariantSpace(c);
      long mismatches =
          BruteForce.count(c, v -> space.isBuildable(v) != BruteForce.rulesHold(c, c.rules(), v));
      assertEquals(0, mismatches);
      for (int s = 0; s < space.segmentCount(); s++) {
        int seg = s;
        long segMismatches =
            BruteForce.count(
                c,
                v ->
                    space.isColumn(v, seg)
                        != (BruteForce.rulesHold(c, c.rules(), v)
                            && BruteForce.accepts(c, c.segments().get(seg), v)));
        assertEquals(0, segMismatches, "segment " + s);
      }
    });
  }
}
