package dev.mixwright.testing;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;

/**
 * Small random catalogs for tests (invented data): a few groups with a few options, some optional
 * groups, pairwise forbid and when/require rules, segments with accepts, value and maxShare. Small
 * enough to enumerate every variant. Same seed, same catalog.
 */
public final class RandomCatalogs {
  private RandomCatalogs() {}

  public static Catalog small(long seed) {
    return random(new Random(seed), 2 + new Random(seed).nextInt(4), 4, 3, 3, 5, false);
  }

  /**
   * 2 to 5 groups of up to 5 options, 1 to 4 resources, 1 to 3 segments, up to 9 rules; drawn again
   * from the same stream until the full master has at most {@code maxColumns} columns, so
   * {@link EnumeratedLp} can solve it.
   */
  public static Catalog enumerable(Random rnd, int maxColumns) {
    while (true) {
      Catalog c = random(rnd, 2 + rnd.nextInt(4), 5, 1 + rnd.nextInt(4), 1 + rnd.nextInt(3),
          rnd.nextInt(10), false);
      try {
        if (EnumeratedLp.columns(new VariantSpace(c)).size() <= maxColumns) {
          return c;
        }
      } catch (IllegalArgumentException tooLarge) {
        // draw again
      }
    }
  }

  /**
   * @param groups number of option groups
   * @param maxOptions options per group drawn from 1..maxOptions (2..maxOptions when possible)
   * @param resources resource rows
   * @param segments segments
   * @param rules rules to draw (some may be vacuous)
   * @param portfolio whether to add a portfolio section
   */
  public static Catalog random(
      Random rnd, int groups, int maxOptions, int resources, int segments, int rules, boolean portfolio) {
    List<Resource> res = new ArrayList<>();
    List<Group> gs = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      int n = maxOptions <= 1 ? 1 : 1 + rnd.nextInt(maxOptions);
      boolean required = rnd.nextDouble() < 0.7;
      List<Option> opts = new ArrayList<>();
      for (int k = 0; k < n; k++) {
        double cost = 10 + rnd.nextInt(90);
        double price = cost + rnd.nextInt(80) - 15;
        Map<String, Double> uses = new LinkedHashMap<>();
        for (int r = 0; r < resources; r++) {
          if (rnd.nextDouble() < 0.6) {
            uses.put("r" + r, (double) rnd.nextInt(5));
          }
        }
        opts.add(new Option("o" + k, null, price, cost, uses, 0.0));
      }
      gs.add(new Group("g" + g, null, required, opts));
    }
    List<Rule> rs = new ArrayList<>();
    for (int i = 0; i < rules && groups >= 2; i++) {
      int a = rnd.nextInt(groups);
      int b = rnd.nextInt(groups - 1);
      if (b >= a) {
        b++;
      }
      Map<String, List<String>> one = Map.of("g" + a, List.of(anyChoice(rnd, gs.get(a))));
      if (rnd.nextBoolean()) {
        LinkedHashMap<String, List<String>> f = new LinkedHashMap<>(one);
        f.put("g" + b, List.of(anyChoice(rnd, gs.get(b))));
        rs.add(new Rule(null, Map.of(), Map.of(), f));
      } else {
        List<String> req = new ArrayList<>();
        Group gb = gs.get(b);
        for (int k = 0; k < gb.choiceCount(); k++) {
          if (rnd.nextDouble() < 0.6) {
            req.add(gb.choiceId(k));
          }
        }
        if (req.isEmpty()) {
          req.add(gb.choiceId(0));
        }
        rs.add(new Rule(null, one, Map.of("g" + b, req), Map.of()));
      }
    }
    List<Segment> segs = new ArrayList<>();
    for (int s = 0; s < segments; s++) {
      Map<String, List<String>> accepts = new LinkedHashMap<>();
      if (rnd.nextDouble() < 0.4) {
        int g = rnd.nextInt(groups);
        Group gg = gs.get(g);
        List<String> ok = new ArrayList<>();
        for (int k = 0; k < gg.choiceCount(); k++) {
          if (rnd.nextDouble() < 0.7) {
            ok.add(gg.choiceId(k));
          }
        }
        if (!ok.isEmpty()) {
          accepts.put(gg.id(), ok);
        }
      }
      Map<String, Double> value = new LinkedHashMap<>();
      if (rnd.nextDouble() < 0.5) {
        Group gg = gs.get(rnd.nextInt(groups));
        value.put(gg.id() + "." + anyChoice(rnd, gg), (double) (rnd.nextInt(40) - 10));
      }
      double share = rnd.nextDouble() < 0.5 ? 1.0 : 0.2 + 0.1 * rnd.nextInt(8);
      segs.add(new Segment("s" + s, null, 50 + rnd.nextInt(300), share, accepts, value));
    }
    for (int r = 0; r < resources; r++) {
      res.add(new Resource("r" + r, null, "h", 100 + rnd.nextInt(1500)));
    }
    Optional<PortfolioSpec> p =
        portfolio
            ? Optional.of(new PortfolioSpec(rnd.nextInt(400), 1 + rnd.nextInt(4), rnd.nextInt(60)))
            : Optional.empty();
    return new Catalog(1, "random " + rnd.nextInt(), "EUR", "year", res, gs, rs, segs, p);
  }

  private static String anyChoice(Random rnd, Group g) {
    return g.choiceId(rnd.nextInt(g.choiceCount()));
  }
}
