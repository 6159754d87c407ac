package dev.mixwright.testing;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Choice;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
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
 * Tiny random catalogs with segments that choose and options with price points (invented data),
 * small enough that every offer set of a choosing segment can be listed: at most {@code
 * OfferSetLp.MAX_COLUMNS_PER_SEGMENT} accepted buildable variants in each choosing segment, and at
 * least one. Same seed, same catalog. Part-worths, stay-out utilities and price weights are drawn
 * so that attractions are neither negligible nor overwhelming (about e^-4 to e^3), and capacities
 * so that they bind in some catalogs and not in others.
 */
public final class RandomChoiceCatalogs {
  private RandomChoiceCatalogs() {}

  /**
   * @param withFixedSegments whether segments with a fixed demand may sit beside the choosing ones
   */
  public static Catalog tiny(long seed, boolean withFixedSegments) {
    Random rnd = new Random(seed);
    for (int attempt = 0; ; attempt++) {
      Catalog c = draw(rnd, withFixedSegments, seed, attempt);
      if (fits(c)) {
        return c;
      }
    }
  }

  private static boolean fits(Catalog c) {
    VariantSpace space = new VariantSpace(c);
    int[] perSegment = new int[space.segmentCount()];
    for (EnumeratedLp.Column col : EnumeratedLp.columns(space)) {
      perSegment[col.segment()]++;
    }
    for (int s = 0; s < perSegment.length; s++) {
      if (space.chooses(s)
          && (perSegment[s] == 0 || perSegment[s] > OfferSetLp.MAX_COLUMNS_PER_SEGMENT)) {
        return false;
      }
    }
    return true;
  }

  private static Catalog draw(Random rnd, boolean withFixed, long seed, int attempt) {
    int groups = 2 + rnd.nextInt(2);
    int resources = 1 + rnd.nextInt(2);
    List<Group> gs = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      int n = 1 + rnd.nextInt(2);
      List<Option> opts = new ArrayList<>();
      for (int k = 0; k < n; k++) {
        double cost = 10 + rnd.nextInt(40);
        List<Double> prices = new ArrayList<>();
        int points = rnd.nextDouble() < 0.4 ? 2 + rnd.nextInt(2) : 1;
        double p = cost + rnd.nextInt(30) - 5;
        for (int i = 0; i < points; i++) {
          prices.add(Math.max(0, p));
          p += 5 + rnd.nextInt(25);
        }
        Map<String, Double> uses = new LinkedHashMap<>();
        for (int r = 0; r < resources; r++) {
          if (rnd.nextDouble() < 0.7) {
            uses.put("r" + r, (double) (1 + rnd.nextInt(4)));
          }
        }
        opts.add(new Option("o" + k, null, prices, cost, uses, 0));
      }
      gs.add(new Group("g" + g, null, rnd.nextDouble() < 0.75, opts));
    }
    List<Rule> rules = new ArrayList<>();
    if (rnd.nextDouble() < 0.4) {
      LinkedHashMap<String, List<String>> f = new LinkedHashMap<>();
      f.put("g0", List.of(anyChoice(rnd, gs.get(0))));
      f.put("g1", List.of(anyChoice(rnd, gs.get(1))));
      rules.add(new Rule(null, Map.of(), Map.of(), f));
    }
    List<Segment> segs = new ArrayList<>();
    int choosing = 1 + rnd.nextInt(2);
    double totalBuyers = 0;
    for (int s = 0; s < choosing; s++) {
      Map<String, Double> utility = new LinkedHashMap<>();
      for (Group g : gs) {
        for (int k = 0; k < g.choiceCount(); k++) {
          if (rnd.nextDouble() < 0.5) {
            utility.put(g.id() + "." + g.choiceId(k), Math.round((-1 + 3 * rnd.nextDouble()) * 100) / 100.0);
          }
        }
      }
      double buyers = 50 + rnd.nextInt(250);
      totalBuyers += buyers;
      double stayOut = Math.round((-0.5 + 2 * rnd.nextDouble()) * 100) / 100.0;
      double priceWeight = -Math.round((2 + 18 * rnd.nextDouble())) / 1000.0;
      Map<String, List<String>> accepts = new LinkedHashMap<>();
      if (rnd.nextDouble() < 0.4) {
        Group g = gs.get(rnd.nextInt(groups));
        accepts.put(g.id(), List.of(anyChoice(rnd, g)));
      }
      Map<String, Double> value = new LinkedHashMap<>();
      if (rnd.nextDouble() < 0.4) {
        Group g = gs.get(rnd.nextInt(groups));
        value.put(g.id() + "." + anyChoice(rnd, g), (double) (rnd.nextInt(30) - 10));
      }
      segs.add(Segment.choosing("c" + s, null, accepts, value, new Choice(buyers, stayOut, priceWeight, utility)));
    }
    if (withFixed && rnd.nextBoolean()) {
      double demand = 20 + rnd.nextInt(150);
      totalBuyers += demand;
      double share = rnd.nextBoolean() ? 1.0 : 0.3 + 0.1 * rnd.nextInt(5);
      segs.add(new Segment("f0", null, demand, share, Map.of(), Map.of()));
    }
    List<Resource> res = new ArrayList<>();
    for (int r = 0; r < resources; r++) {
      // one unit uses about 2.5 per group holding the resource; scale so that it binds at times
      double capacity = Math.round(totalBuyers * groups * (0.3 + 1.7 * rnd.nextDouble()));
      res.add(new Resource("r" + r, null, "h", capacity));
    }
    return new Catalog(
        1, "random choice " + seed + "/" + attempt, "EUR", "year", res, gs, rules, segs, Optional.empty());
  }

  private static String anyChoice(Random rnd, Group g) {
    return g.choiceId(rnd.nextInt(g.choiceCount()));
  }
}
