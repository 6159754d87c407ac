package dev.mixwright.catalog;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Random;

/**
 * Seeded synthetic catalogs for benchmarks and tests (invented data, no real product behind it).
 *
 * <p>Shape, chosen to look like a configurable-product catalog rather than noise:
 *
 * <ul>
 *   <li>Options of a group are tiers: a higher tier costs more, sells for more, earns a larger
 *       margin and mostly uses more of the group's resources (some resources run the other way, so
 *       that trading tiers moves load between resources).
 *   <li>Each group draws on one to three resources; every resource is used by some group.
 *   <li>Rules are pairwise, mostly between groups close in catalog order (related parts sit
 *       together, e.g. capacity and compressor), a few between any two groups: {@code forbid} of one or
 *       two options against one or two, and {@code when}/{@code require} of one option against a
 *       subset of another group.
 *   <li>Segments buy a volume, cap the share of one variant, may accept only part of one group and
 *       pay extra (or less) for a few options.
 *   <li>Capacities: the use per unit of a typical good variant (per group, the mean use of the
 *       better-margin half of its choices) times the total demand, scaled by a draw in 40–70 %, so
 *       that selling everyone the best variant is impossible and several resources bind.
 * </ul>
 *
 * <p>That is the {@link Family#CLASSIC} family. The other families change one structure that makes
 * a catalog hard to count or price (see {@link Family}); each keeps the classic groups, segments
 * and, except where it says otherwise, the classic capacities.
 *
 * <p>No rule may exclude a per-segment reference variant drawn up front, so every segment keeps at
 * least one buildable, acceptable variant by construction. Same spec (seed included), same catalog:
 * only {@link java.util.Random}, whose sequence Java specifies, drives the choices, and every number
 * is rounded to a short decimal so the written file is stable. O(groups · options · resources +
 * rules · segments · options) time.
 */
public final class CatalogGenerator {
  /** Rules between groups at most this far apart in catalog order, except the long-range share. */
  private static final int NEAR = 3;

  private static final double LONG_RANGE_SHARE = 0.1;

  private CatalogGenerator() {}

  /** A kind of catalog: which structure its rules and capacities have. */
  public enum Family {
    /** Pairwise rules mostly between neighbouring groups, capacities at 40–70 % of demand. */
    CLASSIC,
    /**
     * Pairwise forbid rules of large blocks (two to four options against two to four), packed on
     * neighbours at most two groups apart: many rules per group pair.
     */
    DENSE,
    /** Pairwise rules like the classic ones, each between two groups drawn from the whole catalog. */
    DISTANT,
    /** Forbid rules over three to five groups anywhere in the catalog, one or two options each. */
    WIDE,
    /** When/require rules with two or three groups in {@code when} and two in {@code require}. */
    MULTI,
    /** Classic rules; capacities at 15–30 % of what the demand would use. */
    TIGHT,
    /** Classic rules; capacities at 110–160 %, so that few resources bind. */
    LOOSE;

    /** The name {@code generate --family} takes. */
    public String word() {
      return name().toLowerCase(Locale.ROOT);
    }

    public static Family of(String word) {
      for (Family f : values()) {
        if (f.word().equals(word)) {
          return f;
        }
      }
      StringBuilder all = new StringBuilder();
      for (Family f : values()) {
        all.append(all.length() == 0 ? "" : ", ").append(f.word());
      }
      throw new IllegalArgumentException("unknown family '" + word + "'; choose one of " + all);
    }

    boolean classicRules() {
      return this == CLASSIC || this == TIGHT || this == LOOSE;
    }
  }

  /**
   * What to generate.
   *
   * @param groups option groups (≥ 2)
   * @param options options per group (≥ 2); an optional group also has {@code none}
   * @param resources shared resources (≥ 1)
   * @param segments market segments (≥ 1)
   * @param rules compatibility rules (≥ 0)
   * @param optionalShare share of groups that are optional, 0..1
   * @param seed the same seed gives the same catalog
   * @param family the structure of rules and capacities
   */
  public record Spec(
      int groups, int options, int resources, int segments, int rules, double optionalShare, long seed,
      Family family) {
    /** A classic catalog. */
    public Spec(int groups, int options, int resources, int segments, int rules, double optionalShare, long seed) {
      this(groups, options, resources, segments, rules, optionalShare, seed, Family.CLASSIC);
    }

    public Spec {
      java.util.Objects.requireNonNull(family, "family");
      require(family != Family.WIDE || groups >= 3, "the wide family needs at least 3 groups, got " + groups);
      require(family != Family.MULTI || groups >= 4, "the multi family needs at least 4 groups, got " + groups);
      require(groups >= 2, "groups must be at least 2, got " + groups);
      require(options >= 2, "options per group must be at least 2, got " + options);
      require(resources >= 1, "resources must be at least 1, got " + resources);
      require(segments >= 1, "segments must be at least 1, got " + segments);
      require(rules >= 0, "rules must be at least 0, got " + rules);
      require(optionalShare >= 0 && optionalShare <= 1, "optional share must be between 0 and 1, got " + optionalShare);
      require(groups <= 9999 && options <= 999 && resources <= 999 && segments <= 999,
          "at most 9999 groups, 999 options, 999 resources and 999 segments");
    }

    /** The defaults the benchmark uses for the share of optional groups. */
    public static Spec of(int groups, int options, int resources, int segments, int rules, long seed) {
      return new Spec(groups, options, resources, segments, rules, 0.2, seed);
    }

    private static void require(boolean ok, String message) {
      if (!ok) {
        throw new IllegalArgumentException(message);
      }
    }
  }

  public static Catalog generate(Spec spec) {
    return new Draw(spec).catalog();
  }

  /** One generation: the random stream and what has been drawn so far. */
  private static final class Draw {
    final Spec spec;
    final Random rnd;
    final String[] groupId;
    final String[] resourceId;
    final boolean[] optional;
    // per group, per choice (options then none): margin and use per resource
    final double[][] margin;
    final double[][][] use;

    Draw(Spec spec) {
      this.spec = spec;
      this.rnd = new Random(spec.seed());
      groupId = new String[spec.groups()];
      resourceId = new String[spec.resources()];
      optional = new boolean[spec.groups()];
      margin = new double[spec.groups()][];
      use = new double[spec.groups()][][];
      for (int g = 0; g < groupId.length; g++) {
        groupId[g] = id("g", g + 1, spec.groups());
      }
      for (int r = 0; r < resourceId.length; r++) {
        resourceId[r] = id("r", r + 1, spec.resources());
      }
    }

    Catalog catalog() {
      List<Group> groups = groups();
      List<Segment> partial = segments(groups);
      int[][] reference = references(groups, partial);
      List<Rule> rules = rules(groups, reference);
      List<Resource> resources = resources(partial);
      String name = String.format(Locale.ROOT, "Generated %d x %d, %d resources, %d segments, %d rules, seed %d",
          spec.groups(), spec.options(), spec.resources(), spec.segments(), spec.rules(), spec.seed());
      if (spec.family() != Family.CLASSIC) {
        name += ", family " + spec.family().word();
      }
      return new Catalog(1, name, "EUR", "year", resources, groups, rules, partial, Optional.empty());
    }

    List<Group> groups() {
      int k = spec.options();
      List<Group> out = new ArrayList<>();
      for (int g = 0; g < spec.groups(); g++) {
        optional[g] = rnd.nextDouble() < spec.optionalShare();
        // Which resources this group loads, and in which direction along its tiers.
        int[] profile = profile(g);
        double[] intensity = new double[profile.length];
        boolean[] falling = new boolean[profile.length];
        for (int i = 0; i < profile.length; i++) {
          intensity[i] = 0.2 + rnd.nextDouble() * 1.8;
          falling[i] = rnd.nextDouble() < 0.25;
        }
        double base = 20 + rnd.nextInt(400);
        int choices = k + (optional[g] ? 1 : 0);
        margin[g] = new double[choices];
        use[g] = new double[choices][spec.resources()];
        List<Option> opts = new ArrayList<>();
        for (int o = 0; o < k; o++) {
          double tier = k == 1 ? 0 : (double) o / (k - 1);
          double cost = round(base * (1 + 1.5 * tier) * (0.9 + 0.2 * rnd.nextDouble()), 0);
          double markup = 1.12 + 0.3 * tier + (rnd.nextDouble() - 0.4) * 0.15;
          double price = round(cost * markup, 0);
          Map<String, Double> uses = new LinkedHashMap<>();
          for (int i = 0; i < profile.length; i++) {
            double t = falling[i] ? 1 - tier : tier;
            double u = round(intensity[i] * (0.5 + t) * (0.8 + 0.4 * rnd.nextDouble()), 2);
            if (u > 0) {
              uses.put(resourceId[profile[i]], u);
              use[g][o][profile[i]] = u;
            }
          }
          margin[g][o] = price - cost;
          opts.add(new Option("o" + (o + 1), null, price, cost, uses, 0.0)); // the generator draws no tooling
        }
        out.add(new Group(groupId[g], null, !optional[g], opts));
      }
      return out;
    }

    /**
     * One to three distinct resources, more when there are more resources than groups: group g
     * always takes every resource r with r mod G = g, so every resource is used.
     */
    int[] profile(int g) {
      int must = 0;
      for (int r = g; r < spec.resources(); r += spec.groups()) {
        must++;
      }
      int n = Math.max(must, Math.min(spec.resources(), 1 + rnd.nextInt(3)));
      int[] p = new int[n];
      int i = 0;
      for (int r = g; r < spec.resources(); r += spec.groups()) {
        p[i++] = r;
      }
      for (; i < n; i++) {
        int r;
        boolean taken;
        do {
          r = rnd.nextInt(spec.resources());
          taken = false;
          for (int j = 0; j < i; j++) {
            taken |= p[j] == r;
          }
        } while (taken);
        p[i] = r;
      }
      return p;
    }

    List<Segment> segments(List<Group> groups) {
      List<Segment> out = new ArrayList<>();
      for (int s = 0; s < spec.segments(); s++) {
        double demand = 100 * (20 + rnd.nextInt(181));
        double share = 0.05 * (2 + rnd.nextInt(7));
        Map<String, List<String>> accepts = new LinkedHashMap<>();
        if (rnd.nextDouble() < 0.6) {
          int g = rnd.nextInt(groups.size());
          Group gg = groups.get(g);
          List<String> ok = new ArrayList<>();
          for (int c = 0; c < gg.choiceCount(); c++) {
            if (rnd.nextDouble() < 0.6) {
              ok.add(gg.choiceId(c));
            }
          }
          if (ok.isEmpty()) {
            ok.add(gg.choiceId(rnd.nextInt(gg.choiceCount())));
          }
          if (ok.size() < gg.choiceCount()) {
            accepts.put(gg.id(), ok);
          }
        }
        Map<String, Double> value = new LinkedHashMap<>();
        int premiums = 2 + rnd.nextInt(3);
        for (int i = 0; i < premiums; i++) {
          Group gg = groups.get(rnd.nextInt(groups.size()));
          // premium segments pay for the upper tiers, thrifty ones a little less for them
          int o = spec.options() / 2 + rnd.nextInt(spec.options() - spec.options() / 2);
          value.put(gg.id() + "." + gg.choiceId(o), round(-30 + rnd.nextDouble() * 150, 0));
        }
        out.add(new Segment(id("s", s + 1, spec.segments()), null, demand, round(share, 2), accepts, value));
      }
      return out;
    }

    /** A random accepted choice per group, per segment: variants no rule may exclude. */
    int[][] references(List<Group> groups, List<Segment> segments) {
      int[][] ref = new int[segments.size()][groups.size()];
      for (int s = 0; s < segments.size(); s++) {
        for (int g = 0; g < groups.size(); g++) {
          Group gg = groups.get(g);
          List<String> ok = segments.get(s).accepts().get(gg.id());
          if (ok == null) {
            ref[s][g] = rnd.nextInt(gg.choiceCount());
          } else {
            ref[s][g] = gg.indexOf(ok.get(rnd.nextInt(ok.size())));
          }
        }
      }
      return ref;
    }

    List<Rule> rules(List<Group> groups, int[][] reference) {
      if (!spec.family().classicRules()) {
        return familyRules(groups, reference);
      }
      List<Rule> out = new ArrayList<>();
      int guard = 0;
      while (out.size() < spec.rules() && guard++ < 50 * spec.rules() + 100) {
        int a = rnd.nextInt(groups.size());
        int b;
        if (rnd.nextDouble() < LONG_RANGE_SHARE) {
          b = rnd.nextInt(groups.size() - 1);
          b = b >= a ? b + 1 : b;
        } else {
          int step = 1 + rnd.nextInt(Math.min(NEAR, groups.size() - 1));
          b = a + step < groups.size() ? a + step : a - step;
          if (b < 0) {
            continue;
          }
        }
        Group ga = groups.get(a);
        Group gb = groups.get(b);
        int x = rnd.nextInt(ga.choiceCount());
        Rule rule;
        boolean[] inA = new boolean[ga.choiceCount()];
        inA[x] = true;
        if (rnd.nextDouble() < 0.6) {
          if (rnd.nextDouble() < 0.3) {
            inA[rnd.nextInt(ga.choiceCount())] = true;
          }
          boolean[] inB = new boolean[gb.choiceCount()];
          inB[rnd.nextInt(gb.choiceCount())] = true;
          if (rnd.nextDouble() < 0.3) {
            inB[rnd.nextInt(gb.choiceCount())] = true;
          }
          if (excludesReference(reference, a, inA, b, inB)) {
            continue;
          }
          Map<String, List<String>> f = new LinkedHashMap<>();
          f.put(ga.id(), ids(ga, inA));
          f.put(gb.id(), ids(gb, inB));
          rule = new Rule(null, Map.of(), Map.of(), f);
        } else {
          boolean[] allowed = new boolean[gb.choiceCount()];
          int n = 0;
          for (int c = 0; c < allowed.length; c++) {
            allowed[c] = rnd.nextDouble() < 0.55;
            n += allowed[c] ? 1 : 0;
          }
          if (n == 0 || n == allowed.length) {
            continue; // requires nothing, or forbids every variant holding the when-choice
          }
          boolean[] outside = new boolean[allowed.length];
          for (int c = 0; c < allowed.length; c++) {
            outside[c] = !allowed[c];
          }
          if (excludesReference(reference, a, inA, b, outside)) {
            continue;
          }
          rule = new Rule(null, Map.of(ga.id(), ids(ga, inA)), Map.of(gb.id(), ids(gb, allowed)), Map.of());
        }
        out.add(rule);
      }
      return out;
    }

    /**
     * Rules of the non-classic families: each draws the groups of a rule by its own pattern and its
     * sets at random, and skips a draw that would exclude a reference variant.
     */
    List<Rule> familyRules(List<Group> groups, int[][] reference) {
      List<Rule> out = new ArrayList<>();
      int n = groups.size();
      int guard = 0;
      while (out.size() < spec.rules() && guard++ < 50 * spec.rules() + 100) {
        Rule rule =
            switch (spec.family()) {
              case DENSE -> {
                int a = rnd.nextInt(n);
                int step = 1 + rnd.nextInt(Math.min(2, n - 1));
                int b = a + step < n ? a + step : a - step;
                yield b < 0 ? null : forbid(groups, reference, new int[] {a, b}, 2, 4);
              }
              case DISTANT -> {
                int[] ab = distinct(2, n);
                yield rnd.nextDouble() < 0.6
                    ? forbid(groups, reference, ab, 1, 2)
                    : when(groups, reference, new int[] {ab[0]}, new int[] {ab[1]});
              }
              case WIDE -> forbid(groups, reference, distinct(3 + rnd.nextInt(Math.min(3, n - 2)), n), 1, 2);
              case MULTI -> {
                int w = 2 + rnd.nextInt(Math.min(2, n - 3));
                int[] all = distinct(w + 2, n);
                yield when(groups, reference, java.util.Arrays.copyOf(all, w),
                    java.util.Arrays.copyOfRange(all, w, w + 2));
              }
              default -> throw new IllegalStateException("classic rules come from rules(): " + spec.family());
            };
        if (rule != null) {
          out.add(rule);
        }
      }
      return out;
    }

    /** k distinct groups of 0..n-1, in the order drawn. */
    int[] distinct(int k, int n) {
      int[] out = new int[k];
      for (int i = 0; i < k; i++) {
        boolean taken;
        do {
          out[i] = rnd.nextInt(n);
          taken = false;
          for (int j = 0; j < i; j++) {
            taken |= out[j] == out[i];
          }
        } while (taken);
      }
      return out;
    }

    /** A random subset of the group's choices of lo..hi members (at most all but one). */
    boolean[] subset(Group g, int lo, int hi) {
      int c = g.choiceCount();
      int want = Math.min(c - 1, lo + rnd.nextInt(hi - lo + 1));
      boolean[] in = new boolean[c];
      for (int k = 0; k < Math.max(1, want); ) {
        int x = rnd.nextInt(c);
        if (!in[x]) {
          in[x] = true;
          k++;
        }
      }
      return in;
    }

    /** forbid of lo..hi choices in each of the groups; null when it would exclude a reference. */
    Rule forbid(List<Group> groups, int[][] reference, int[] gs, int lo, int hi) {
      boolean[][] sets = new boolean[gs.length][];
      for (int i = 0; i < gs.length; i++) {
        sets[i] = subset(groups.get(gs[i]), lo, hi);
      }
      if (matchesReference(reference, gs, sets)) {
        return null;
      }
      Map<String, List<String>> f = new LinkedHashMap<>();
      for (int i = 0; i < gs.length; i++) {
        f.put(groups.get(gs[i]).id(), ids(groups.get(gs[i]), sets[i]));
      }
      return new Rule(null, Map.of(), Map.of(), f);
    }

    /**
     * when each of {@code whenGroups} holds one or two listed choices, each of {@code requireGroups}
     * must hold one of about half its choices; null when that would exclude a reference.
     */
    Rule when(List<Group> groups, int[][] reference, int[] whenGroups, int[] requireGroups) {
      Map<String, List<String>> w = new LinkedHashMap<>();
      Map<String, List<String>> r = new LinkedHashMap<>();
      int k = whenGroups.length;
      int[] gs = java.util.Arrays.copyOf(whenGroups, k + 1);
      boolean[][] sets = new boolean[k + 1][];
      for (int i = 0; i < k; i++) {
        sets[i] = subset(groups.get(whenGroups[i]), 1, 2);
        w.put(groups.get(whenGroups[i]).id(), ids(groups.get(whenGroups[i]), sets[i]));
      }
      for (int b : requireGroups) {
        Group gb = groups.get(b);
        boolean[] allowed = subset(gb, Math.max(1, gb.choiceCount() / 3), Math.max(1, 2 * gb.choiceCount() / 3));
        boolean[] outside = new boolean[allowed.length];
        for (int c = 0; c < allowed.length; c++) {
          outside[c] = !allowed[c];
        }
        gs[k] = b;
        sets[k] = outside;
        if (matchesReference(reference, gs, sets)) {
          return null;
        }
        r.put(gb.id(), ids(gb, allowed));
      }
      return new Rule(null, w, r, Map.of());
    }

    /** Whether some segment's reference variant holds, in every group gs[i], a choice of sets[i]. */
    static boolean matchesReference(int[][] reference, int[] gs, boolean[][] sets) {
      for (int[] v : reference) {
        boolean all = true;
        for (int i = 0; i < gs.length && all; i++) {
          all = sets[i][v[gs[i]]];
        }
        if (all) {
          return true;
        }
      }
      return false;
    }

    /** Whether "group a in inA and group b in inB" holds for some segment's reference variant. */
    static boolean excludesReference(int[][] reference, int a, boolean[] inA, int b, boolean[] inB) {
      for (int[] v : reference) {
        if (inA[v[a]] && inB[v[b]]) {
          return true;
        }
      }
      return false;
    }

    static List<String> ids(Group g, boolean[] marked) {
      List<String> out = new ArrayList<>();
      for (int c = 0; c < marked.length; c++) {
        if (marked[c]) {
          out.add(g.choiceId(c));
        }
      }
      return out;
    }

    List<Resource> resources(List<Segment> segments) {
      double totalDemand = 0;
      for (Segment s : segments) {
        totalDemand += s.demand();
      }
      double[] typical = new double[spec.resources()];
      for (int g = 0; g < spec.groups(); g++) {
        int choices = margin[g].length;
        Integer[] byMargin = new Integer[choices];
        for (int c = 0; c < choices; c++) {
          byMargin[c] = c;
        }
        int gg = g;
        java.util.Arrays.sort(byMargin, (p, q) -> Double.compare(margin[gg][q], margin[gg][p]));
        int half = (choices + 1) / 2;
        for (int i = 0; i < half; i++) {
          for (int r = 0; r < spec.resources(); r++) {
            typical[r] += use[g][byMargin[i]][r] / half;
          }
        }
      }
      List<Resource> out = new ArrayList<>();
      for (int r = 0; r < spec.resources(); r++) {
        double scale =
            switch (spec.family()) {
              case TIGHT -> 0.15 + 0.15 * rnd.nextDouble();
              case LOOSE -> 1.1 + 0.5 * rnd.nextDouble();
              default -> 0.4 + 0.3 * rnd.nextDouble();
            };
        double cap = Math.max(1, round(typical[r] * totalDemand * scale, 0));
        out.add(new Resource(resourceId[r], null, "h", cap));
      }
      return out;
    }
  }

  /**
   * The same catalog with every segment choosing by multinomial logit instead of buying a fixed
   * volume: its demand becomes its buyers, and per segment each option draws a conjoint-like
   * part-worth that rises with its tier: {@code spread} × (importance of the group, drawn in
   * 0.5–1.5, × tier from 0 to 1, plus 0.3 × a standard normal), the absent choice of an optional
   * group below the lowest tier. Buyers who value the tiers that earn more keep the sales-based LP's
   * support small: it offers every variant whose adjusted margin exceeds the segment's dual μ, and
   * μ sits near the top margins only when the top variants attract (see docs/choice.md). The price weight makes one group's typical price spread worth half a util, and
   * the stay-out utility is the best variant's utility (ignoring rules, an upper bound) minus one,
   * so the best variants draw about as many buyers as staying out does. Same catalog and seed, same
   * result; options with price points get one part-worth for all points.
   */
  public static Catalog choosing(Catalog fixed, long seed, double spread) {
    Random rnd = new Random(seed);
    double priceSpread = 0;
    for (Group g : fixed.groups()) {
      double sum = 0;
      double sq = 0;
      int n = 0;
      for (Option o : g.options()) {
        for (double p : o.prices()) {
          sum += p;
          sq += p * p;
          n++;
        }
      }
      double mean = sum / n;
      priceSpread += Math.sqrt(Math.max(0, sq / n - mean * mean)) / fixed.groups().size();
    }
    double priceWeight = -round(0.5 / Math.max(1, priceSpread), 6);
    List<Segment> out = new ArrayList<>();
    for (Segment seg : fixed.segments()) {
      Map<String, Double> utility = new LinkedHashMap<>();
      double best = 0;
      for (Group g : fixed.groups()) {
        double top = Double.NEGATIVE_INFINITY;
        List<String> accepted = seg.accepts().get(g.id());
        double importance = 0.5 + rnd.nextDouble();
        int tiers = Math.max(1, g.options().size() - 1);
        for (int c = 0; c < g.choiceCount(); c++) {
          String choice = g.choiceId(c);
          double tier = c < g.options().size() ? (double) c / tiers : -0.5;
          double pw = round(spread * (importance * tier + 0.3 * rnd.nextGaussian()), 2);
          if (pw != 0) {
            utility.put(g.id() + "." + choice, pw);
          }
          double price = c < g.options().size() ? g.options().get(c).prices().get(0) : 0;
          price += seg.value().getOrDefault(g.id() + "." + choice, 0.0);
          if (accepted == null || accepted.contains(choice)) {
            top = Math.max(top, pw + priceWeight * price);
          }
        }
        best += top;
      }
      Choice choice = new Choice(seg.demand(), round(best - 1, 2), priceWeight, utility);
      out.add(Segment.choosing(seg.id(), seg.label(), seg.accepts(), seg.value(), choice));
    }
    return new Catalog(fixed.format(), fixed.name() + ", segments that choose", fixed.currency(), fixed.period(),
        fixed.resources(), fixed.groups(), fixed.rules(), out, fixed.portfolio());
  }

  /** {@code g07} for 7 of up to 99: ids of one kind have the same width, so they sort in order. */
  private static String id(String prefix, int n, int count) {
    int width = Integer.toString(count).length();
    return prefix + String.format(Locale.ROOT, "%0" + width + "d", n);
  }

  private static double round(double x, int decimals) {
    double f = Math.pow(10, decimals);
    return Math.round(x * f) / f;
  }
}
