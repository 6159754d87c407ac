package dev.mixwright.pricing;

import dev.mixwright.testing.Odometer;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import java.util.Set;

/**
 * Test cases for pricers and the reference they are judged by: every column of a segment listed by
 * an odometer over all choices, its reduced cost computed from the catalog figures with
 * {@link ReducedCosts#of} (brute force, independent of every pricer and of the weight vector).
 */
public final class PricingCases {
  private PricingCases() {}

  /** A column and its reduced cost computed directly. */
  record Scored(int[] v, double d) {}

  /** One pricing situation: a space, a segment and random duals. */
  record Case(VariantSpace space, int segment, double[] pi, double mu, List<Scored> columns) {
    PricingQuery query(int k, double threshold, Set<VariantKey> excluded) {
      return ReducedCosts.query(space, segment, pi, mu, k, threshold, excluded);
    }

    /** Scores of the columns not excluded, best first. */
    List<Scored> outside(Set<VariantKey> excluded) {
      return columns.stream().filter(c -> !excluded.contains(space.key(c.v()))).toList();
    }
  }

  /** Tolerance for comparing the same reduced cost summed in two orders. */
  static double tol(double x) {
    return 1e-9 * (1 + Math.abs(x));
  }

  /** Case {@code i} of a reproducible series: small and medium random catalogs, random duals. */
  static Case random(long i) {
    Random rnd = new Random(1000 + i);
    Catalog c =
        i % 3 == 2
            ? RandomCatalogs.random(rnd, 5 + rnd.nextInt(4), 4, 3, 3, 6 + rnd.nextInt(14), false)
            : RandomCatalogs.small(i);
    if (i % 2 == 1) {
      c = withWideRules(c, rnd, 1 + rnd.nextInt(4));
    }
    VariantSpace space = new VariantSpace(c);
    int s = rnd.nextInt(space.segmentCount());
    double[] pi = new double[space.resourceCount()];
    for (int r = 0; r < pi.length; r++) {
      // duals as a master gives them: many zero, the rest fractional
      pi[r] = rnd.nextDouble() < 0.3 ? 0 : rnd.nextDouble() * 25;
    }
    double mu = rnd.nextDouble() < 0.3 ? 0 : rnd.nextDouble() * 120;
    return new Case(space, s, pi, mu, enumerate(space, s, pi, mu));
  }

  /**
   * The catalog plus rules over three groups (a forbid of three, or a when of two groups with a
   * require on a third), which compile to nogoods wider than a pair.
   */
  public static Catalog withWideRules(Catalog c, Random rnd, int count) {
    List<Group> gs = c.groups();
    if (gs.size() < 3) {
      return c;
    }
    List<Rule> rules = new ArrayList<>(c.rules());
    for (int n = 0; n < count; n++) {
      List<Integer> pick = distinctGroups(rnd, gs.size(), 3);
      LinkedHashMap<String, List<String>> two = new LinkedHashMap<>();
      for (int k = 0; k < 2; k++) {
        Group g = gs.get(pick.get(k));
        two.put(g.id(), List.of(g.choiceId(rnd.nextInt(g.choiceCount()))));
      }
      Group third = gs.get(pick.get(2));
      if (rnd.nextBoolean()) {
        LinkedHashMap<String, List<String>> f = new LinkedHashMap<>(two);
        f.put(third.id(), List.of(third.choiceId(rnd.nextInt(third.choiceCount()))));
        rules.add(new Rule(null, Map.of(), Map.of(), f));
      } else {
        rules.add(new Rule(null, two, Map.of(third.id(), aboutHalf(third, rnd)), Map.of()));
      }
    }
    return withRules(c, rules);
  }

  /**
   * The catalog plus rules of the generator's {@code multi} family: when each of two or three groups
   * holds one or two listed choices, each of two other groups must hold one of about half its
   * choices. They compile to nogoods of three and four groups.
   */
  public static Catalog withMultiRules(Catalog c, Random rnd, int count) {
    List<Group> gs = c.groups();
    if (gs.size() < 4) {
      return c;
    }
    List<Rule> rules = new ArrayList<>(c.rules());
    for (int n = 0; n < count; n++) {
      int when = gs.size() >= 5 && rnd.nextBoolean() ? 3 : 2;
      List<Integer> pick = distinctGroups(rnd, gs.size(), when + 2);
      LinkedHashMap<String, List<String>> w = new LinkedHashMap<>();
      for (int k = 0; k < when; k++) {
        Group g = gs.get(pick.get(k));
        List<String> ids = new ArrayList<>(List.of(g.choiceId(rnd.nextInt(g.choiceCount()))));
        String second = g.choiceId(rnd.nextInt(g.choiceCount()));
        if (rnd.nextBoolean() && !ids.contains(second)) {
          ids.add(second);
        }
        w.put(g.id(), ids);
      }
      LinkedHashMap<String, List<String>> req = new LinkedHashMap<>();
      for (int k = when; k < when + 2; k++) {
        Group g = gs.get(pick.get(k));
        req.put(g.id(), aboutHalf(g, rnd));
      }
      rules.add(new Rule(null, w, req, Map.of()));
    }
    return withRules(c, rules);
  }

  private static Catalog withRules(Catalog c, List<Rule> rules) {
    return new Catalog(
        c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), rules, c.segments(), c.portfolio());
  }

  /** {@code size} distinct groups of 0..groups-1, in the order drawn. */
  private static List<Integer> distinctGroups(Random rnd, int groups, int size) {
    List<Integer> pick = new ArrayList<>();
    while (pick.size() < size) {
      int g = rnd.nextInt(groups);
      if (!pick.contains(g)) {
        pick.add(g);
      }
    }
    return pick;
  }

  /** Each choice of g with probability one half (its first when none was drawn), for a require. */
  private static List<String> aboutHalf(Group g, Random rnd) {
    List<String> ids = new ArrayList<>();
    for (int x = 0; x < g.choiceCount(); x++) {
      if (rnd.nextDouble() < 0.5) {
        ids.add(g.choiceId(x));
      }
    }
    if (ids.isEmpty()) {
      ids.add(g.choiceId(0));
    }
    return ids;
  }

  /** Every column of segment s, best reduced cost first. */
  static List<Scored> enumerate(VariantSpace space, int s, double[] pi, double mu) {
    int groups = space.groupCount();
    int[] v = new int[groups];
    List<Scored> out = new ArrayList<>();
    while (true) {
      if (space.isColumn(v, s)) {
        out.add(new Scored(v.clone(), ReducedCosts.of(space, v, s, pi, mu)));
      }
      if (!Odometer.next(space, v)) {
        break;
      }
    }
    out.sort(Comparator.comparingDouble(Scored::d).reversed());
    return out;
  }

  /**
   * A catalog too large to enumerate (5^40 combinations): {@code groups} required groups of
   * {@code options} options, {@code rules} pairwise forbid rules, two resources, two segments
   * (invented data).
   */
  static Catalog large(long seed, int groups, int options, int rules) {
    Random rnd = new Random(seed);
    List<Group> gs = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      List<Option> opts = new ArrayList<>();
      for (int k = 0; k < options; k++) {
        double cost = 10 + rnd.nextInt(90);
        opts.add(
            new Option(
                "o" + k,
                null,
                cost + rnd.nextInt(60) - 10,
                cost,
                Map.of("r0", (double) rnd.nextInt(4), "r1", (double) rnd.nextInt(3)), 0.0));
      }
      gs.add(new Group("g" + g, null, true, opts));
    }
    List<Rule> rs = new ArrayList<>();
    for (int i = 0; i < rules; i++) {
      int a = rnd.nextInt(groups);
      int b = (a + 1 + rnd.nextInt(groups - 1)) % groups;
      LinkedHashMap<String, List<String>> f = new LinkedHashMap<>();
      int x = rnd.nextInt(options);
      f.put("g" + a, List.of("o" + x, "o" + (x + 1 + rnd.nextInt(options - 1)) % options));
      f.put("g" + b, List.of("o" + rnd.nextInt(options)));
      rs.add(new Rule(null, Map.of(), Map.of(), f));
    }
    List<Segment> segs =
        List.of(
            new Segment("s0", null, 500, 1.0, Map.of(), Map.of("g0.o1", 25.0)),
            new Segment("s1", null, 300, 0.5, Map.of("g1", List.of("o0", "o2", "o4")), Map.of()));
    List<Resource> res = List.of(new Resource("r0", null, "h", 900), new Resource("r1", null, "h", 700));
    return new Catalog(1, "large " + seed, "EUR", "year", res, gs, rs, segs, Optional.empty());
  }
}
