package dev.mixwright.space;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Choice;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.StringJoiner;

/**
 * A validated catalog compiled for the hot paths. Choices of all groups are numbered consecutively
 * ("flat" index {@code offset(g) + k}); in an optional group the last choice is {@code none}. A variant
 * is an {@code int[]} of one choice index per group. Rules become {@link Nogood}s; a rule that names a
 * single group becomes a restriction of that group's choices ({@link #allowed(int)}) instead.
 *
 * <p>Each price point of an option is a choice of its own: an option with {@code prices: [760, 820]}
 * gives two consecutive choices, written {@code c12@5100} and {@code c12@5300}, so a group's choice
 * count is the number of its price points (plus {@code none}). Rules, {@code accepts}, {@code value}
 * and part-worths name the option and are compiled onto every price point of it; counting the space
 * counts each price point as a distinct variant. {@link #optionOf} and {@link #pricePointOf} map a
 * choice back to the catalog.
 *
 * <p>All per-choice data lives in flat {@code double[]}/{@code boolean[]} arrays; nothing here lists
 * the space. For a segment that chooses, {@link #choiceUtilities(int)} holds each choice's share of
 * the utility, so that u_s(v) = Σ_g util_s[offset(g) + v_g] (see {@link #utility}).
 */
public final class VariantSpace {
  private final Catalog catalog;
  private final int groupCount;
  private final int resourceCount;
  private final int segmentCount;
  private final int[] choiceCount;
  private final int[] offset;
  private final int[] optionOf;
  private final int[] pointOf;
  private final double[] price;
  private final double[] cost;
  private final double[] margin;
  private final double[] use;
  private final boolean[] allowed;
  /** foldedBy[r]: the flat choices rule r (an exclude entry past the rules) removed from {@link #allowed}. */
  private final int[][] foldedBy;
  private final double[][] segmentValue;
  /** Per segment, the choices its accepts lists (all, in a group it does not name). */
  private final boolean[][] accepted;
  private final boolean[][] segmentAllowed;
  private final double[][] partWorth;
  private final double[][] choiceUtility;
  private final Nogood[] nogoods;
  private final int[][] nogoodsOfGroup;
  private final int[] bitsOfGroup;
  private final int keyWords;

  /** Compiles a catalog that {@code CatalogLoader} has validated (ids are assumed to resolve). */
  public VariantSpace(Catalog catalog) {
    this.catalog = catalog;
    List<Group> groups = catalog.groups();
    groupCount = groups.size();
    resourceCount = catalog.resources().size();
    segmentCount = catalog.segments().size();
    choiceCount = new int[groupCount];
    offset = new int[groupCount + 1];
    for (int g = 0; g < groupCount; g++) {
      Group group = groups.get(g);
      int n = group.required() ? 0 : 1;
      for (Option o : group.options()) {
        n += o.pricePointCount();
      }
      choiceCount[g] = n;
      offset[g + 1] = offset[g] + n;
    }
    int total = offset[groupCount];
    optionOf = new int[total];
    pointOf = new int[total];
    price = new double[total];
    cost = new double[total];
    margin = new double[total];
    use = new double[total * resourceCount];
    for (int g = 0; g < groupCount; g++) {
      List<Option> options = groups.get(g).options();
      int f = offset[g];
      for (int k = 0; k < options.size(); k++) {
        Option o = options.get(k);
        for (int p = 0; p < o.pricePointCount(); p++, f++) {
          optionOf[f] = k;
          pointOf[f] = p;
          price[f] = o.prices().get(p);
          cost[f] = o.cost();
          margin[f] = price[f] - cost[f];
          for (Map.Entry<String, Double> u : o.uses().entrySet()) {
            use[f * resourceCount + catalog.resourceIndex(u.getKey())] = u.getValue();
          }
        }
      }
      if (f < offset[g + 1]) {
        optionOf[f] = options.size(); // none
      }
    }
    allowed = new boolean[total];
    Arrays.fill(allowed, true);
    foldedBy = new int[catalog.rules().size() + catalog.exclude().size()][];
    List<Nogood> compiled = new ArrayList<>();
    for (int r = 0; r < catalog.rules().size(); r++) {
      compileRule(catalog.rules().get(r), r, compiled);
    }
    // exclude entries are forbid rules in all but name, numbered after the rules, so that every
    // pricer (they all read these nogoods) skips what may not be offered
    for (int e = 0; e < catalog.exclude().size(); e++) {
      addNogood(excludeClause(catalog.exclude().get(e)), null, -1, catalog.rules().size() + e, compiled);
    }
    nogoods = compiled.toArray(new Nogood[0]);
    nogoodsOfGroup = nogoodsOfGroup(nogoods, groupCount);
    segmentValue = new double[segmentCount][total];
    accepted = new boolean[segmentCount][];
    segmentAllowed = new boolean[segmentCount][];
    partWorth = new double[segmentCount][total];
    choiceUtility = new double[segmentCount][];
    for (int s = 0; s < segmentCount; s++) {
      Segment seg = catalog.segments().get(s);
      for (Map.Entry<String, Double> v : seg.value().entrySet()) {
        for (int f : flatsOf(v.getKey())) {
          segmentValue[s][f] = v.getValue();
        }
      }
      boolean[] acc = new boolean[total];
      Arrays.fill(acc, true);
      for (Map.Entry<String, List<String>> a : seg.accepts().entrySet()) {
        int g = catalog.groupIndex(a.getKey());
        boolean[] listed = mark(g, a.getValue());
        for (int k = 0; k < choiceCount[g]; k++) {
          acc[offset[g] + k] = listed[offset[g] + k];
        }
      }
      accepted[s] = acc;
      segmentAllowed[s] = both(allowed, acc);
      if (seg.chooses()) {
        Choice ch = seg.choice().orElseThrow();
        for (Map.Entry<String, Double> u : ch.utility().entrySet()) {
          for (int f : flatsOf(u.getKey())) {
            partWorth[s][f] = u.getValue();
          }
        }
        double[] util = new double[total];
        for (int f = 0; f < total; f++) {
          util[f] = partWorth[s][f] + ch.priceWeight() * (price[f] + segmentValue[s][f]);
        }
        choiceUtility[s] = util;
      }
    }
    bitsOfGroup = new int[groupCount];
    int bits = 0;
    for (int g = 0; g < groupCount; g++) {
      bitsOfGroup[g] = Math.max(1, 32 - Integer.numberOfLeadingZeros(choiceCount[g] - 1));
      bits += bitsOfGroup[g];
    }
    keyWords = Math.max(1, (bits + 63) / 64);
  }

  /**
   * This space as if the catalog held only the rules marked in {@code keepRule} (in their order, and
   * without exclude entries), sharing every array the rules do not touch: what compiling that
   * catalog would give, in O(choices · segments + nogoods) instead of a compile.
   * {@link SpaceDiagnosis} asks hundreds of such questions.
   */
  VariantSpace withRulesOnly(boolean[] keepRule) {
    return new VariantSpace(this, keepRule);
  }

  private VariantSpace(VariantSpace all, boolean[] keepRule) {
    List<Rule> rules = all.catalog.rules();
    int[] renumber = new int[rules.size()];
    List<Rule> kept = new ArrayList<>();
    for (int r = 0; r < rules.size(); r++) {
      renumber[r] = kept.size();
      if (keepRule[r]) {
        kept.add(rules.get(r));
      }
    }
    Catalog c = all.catalog;
    this.catalog = new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), kept,
        c.segments(), c.portfolio());
    groupCount = all.groupCount;
    resourceCount = all.resourceCount;
    segmentCount = all.segmentCount;
    choiceCount = all.choiceCount;
    offset = all.offset;
    optionOf = all.optionOf;
    pointOf = all.pointOf;
    price = all.price;
    cost = all.cost;
    margin = all.margin;
    use = all.use;
    segmentValue = all.segmentValue;
    accepted = all.accepted;
    partWorth = all.partWorth;
    choiceUtility = all.choiceUtility;
    bitsOfGroup = all.bitsOfGroup;
    keyWords = all.keyWords;
    allowed = new boolean[all.allowed.length];
    Arrays.fill(allowed, true);
    foldedBy = new int[kept.size()][];
    for (int r = 0; r < rules.size(); r++) {
      if (keepRule[r] && all.foldedBy[r] != null) {
        foldedBy[renumber[r]] = all.foldedBy[r];
        for (int f : all.foldedBy[r]) {
          allowed[f] = false;
        }
      }
    }
    List<Nogood> ns = new ArrayList<>();
    for (Nogood n : all.nogoods) {
      if (n.rule() < rules.size() && keepRule[n.rule()]) {
        ns.add(new Nogood(n.groups(), n.member(), renumber[n.rule()]));
      }
    }
    nogoods = ns.toArray(new Nogood[0]);
    nogoodsOfGroup = nogoodsOfGroup(nogoods, groupCount);
    segmentAllowed = new boolean[segmentCount][];
    for (int s = 0; s < segmentCount; s++) {
      segmentAllowed[s] = both(allowed, accepted[s]);
    }
  }

  private static boolean[] both(boolean[] a, boolean[] b) {
    boolean[] out = new boolean[a.length];
    for (int f = 0; f < a.length; f++) {
      out[f] = a[f] && b[f];
    }
    return out;
  }

  /** For each group, the indices of the nogoods that name it, in rising order. */
  private static int[][] nogoodsOfGroup(Nogood[] nogoods, int groupCount) {
    int[] count = new int[groupCount];
    for (Nogood n : nogoods) {
      for (int g : n.groups()) {
        count[g]++;
      }
    }
    int[][] out = new int[groupCount][];
    for (int g = 0; g < groupCount; g++) {
      out[g] = new int[count[g]];
      count[g] = 0;
    }
    for (int i = 0; i < nogoods.length; i++) {
      for (int g : nogoods[i].groups()) {
        out[g][count[g]++] = i;
      }
    }
    return out;
  }

  /** The flat choices of {@code "group.option"}: every price point of the option. */
  private int[] flatsOf(String groupDotOption) {
    int dot = groupDotOption.indexOf('.');
    int g = catalog.groupIndex(groupDotOption.substring(0, dot));
    return choicesOfOption(g, catalog.groups().get(g).indexOf(groupDotOption.substring(dot + 1)));
  }

  /**
   * Flat indices of the choices of option k of group g (all its price points), or of {@code none}
   * when k is the group's option count.
   */
  public int[] choicesOfOption(int g, int k) {
    return java.util.stream.IntStream.range(offset[g], offset[g + 1])
        .filter(f -> optionOf[f] == k)
        .toArray();
  }

  /** Flat membership array with the listed choices of group g set. */
  private boolean[] mark(int g, List<String> choiceIds) {
    boolean[] m = new boolean[offset[groupCount]];
    Group group = catalog.groups().get(g);
    for (String id : choiceIds) {
      for (int f : choicesOfOption(g, group.indexOf(id))) {
        m[f] = true;
      }
    }
    return m;
  }

  /** An exclude entry as a forbid clause: an option named without a price covers all its price points. */
  private Map<String, List<String>> excludeClause(Map<String, String> entry) {
    Map<String, List<String>> clause = new java.util.LinkedHashMap<>();
    entry.forEach((gid, choice) -> {
      int mark = choice.indexOf(Option.PRICE_MARK);
      clause.put(gid, List.of(mark > 0 ? choice.substring(0, mark) : choice));
    });
    return clause;
  }

  private void compileRule(Rule rule, int index, List<Nogood> out) {
    if (rule.isForbid()) {
      addNogood(rule.forbid(), null, -1, index, out);
      return;
    }
    for (Map.Entry<String, List<String>> req : rule.require().entrySet()) {
      int h = catalog.groupIndex(req.getKey());
      addNogood(rule.when(), req.getValue(), h, index, out);
    }
  }

  /**
   * Adds the nogood "every group of {@code conds} holds a listed choice" and, when {@code h >= 0},
   * "group h holds a choice outside {@code required}". Empty intersections make it vacuous; a single
   * group makes it a restriction of that group.
   */
  private void addNogood(
      Map<String, List<String>> conds, List<String> required, int h, int rule, List<Nogood> out) {
    int total = offset[groupCount];
    boolean[] member = new boolean[total];
    boolean[] inScope = new boolean[groupCount];
    for (Map.Entry<String, List<String>> c : conds.entrySet()) {
      int g = catalog.groupIndex(c.getKey());
      inScope[g] = true;
      boolean[] listed = mark(g, c.getValue());
      for (int k = 0; k < choiceCount[g]; k++) {
        member[offset[g] + k] = listed[offset[g] + k];
      }
    }
    if (h >= 0) {
      boolean[] listed = mark(h, required);
      for (int k = 0; k < choiceCount[h]; k++) {
        boolean outside = !listed[offset[h] + k];
        member[offset[h] + k] = inScope[h] ? member[offset[h] + k] && outside : outside;
      }
      inScope[h] = true;
    }
    int[] scope = java.util.stream.IntStream.range(0, groupCount).filter(g -> inScope[g]).toArray();
    for (int g : scope) {
      boolean any = false;
      for (int k = 0; k < choiceCount[g]; k++) {
        any |= member[offset[g] + k];
      }
      if (!any) {
        return; // can never match: the rule forbids nothing here
      }
    }
    if (scope.length == 1) {
      int g = scope[0];
      int[] removed = foldedBy[rule] == null ? new int[0] : foldedBy[rule];
      for (int k = 0; k < choiceCount[g]; k++) {
        if (member[offset[g] + k]) {
          allowed[offset[g] + k] = false;
          removed = Arrays.copyOf(removed, removed.length + 1);
          removed[removed.length - 1] = offset[g] + k;
        }
      }
      foldedBy[rule] = removed;
      return;
    }
    out.add(new Nogood(scope, member, rule));
  }

  public Catalog catalog() {
    return catalog;
  }

  public int groupCount() {
    return groupCount;
  }

  public int resourceCount() {
    return resourceCount;
  }

  public int segmentCount() {
    return segmentCount;
  }

  public int choiceCount(int g) {
    return choiceCount[g];
  }

  /** First flat index of group g; {@code offset(groupCount())} is the number of choices in all. */
  public int offset(int g) {
    return offset[g];
  }

  public int[] offsets() {
    return offset.clone();
  }

  public int totalChoices() {
    return offset[groupCount];
  }

  /** Price minus cost of a flat choice ({@code none} is 0). */
  public double choiceMargin(int flat) {
    return margin[flat];
  }

  /** List price of a flat choice: the price point it stands for ({@code none} is 0). */
  public double choicePrice(int flat) {
    return price[flat];
  }

  /** Variable cost of a flat choice ({@code none} is 0). */
  public double choiceCost(int flat) {
    return cost[flat];
  }

  /** The group of a flat choice. */
  public int groupOf(int flat) {
    // Offsets rise strictly: every group has at least one choice.
    int g = Arrays.binarySearch(offset, flat);
    return g >= 0 ? g : -g - 2;
  }

  /**
   * Index in {@code Group.options()} of the option a flat choice stands for; the group's option
   * count for {@code none}.
   */
  public int optionOf(int flat) {
    return optionOf[flat];
  }

  /** Index of a flat choice's price point in {@code Option.prices()} (0 for {@code none}). */
  public int pricePointOf(int flat) {
    return pointOf[flat];
  }

  /** True for the {@code none} choice of an optional group. */
  public boolean isNone(int flat) {
    return optionOf[flat] == catalog.groups().get(groupOf(flat)).options().size();
  }

  /**
   * How choice k of group g is written in a variant: the option id, {@code option@price} for a price
   * point of an option with several, or {@code none}.
   */
  public String choiceId(int g, int k) {
    int f = offset[g] + k;
    Group group = catalog.groups().get(g);
    return optionOf[f] == group.options().size()
        ? Group.NONE
        : group.options().get(optionOf[f]).pointId(pointOf[f]);
  }

  /** The option id of choice k of group g without its price point ({@code none} for none). */
  public String optionId(int g, int k) {
    return catalog.groups().get(g).choiceId(optionOf[offset[g] + k]);
  }

  /** True when segment s chooses by multinomial logit. */
  public boolean chooses(int s) {
    return choiceUtility[s] != null;
  }

  /** Potential buyers of a choosing segment s (its demand cap, as for any segment). */
  public double buyers(int s) {
    return catalog.segments().get(s).demand();
  }

  /** Utility of staying out for a choosing segment s. */
  public double stayOut(int s) {
    return choiceOf(s).stayOut();
  }

  /** Utility per currency unit of price for a choosing segment s. */
  public double priceWeight(int s) {
    return choiceOf(s).priceWeight();
  }

  private Choice choiceOf(int s) {
    return catalog
        .segments()
        .get(s)
        .choice()
        .orElseThrow(() -> new IllegalStateException("segment " + s + " does not choose"));
  }

  /** Part-worth of a flat choice in segment s (0 when not given, and in fixed segments). */
  public double partWorth(int s, int flat) {
    return partWorth[s][flat];
  }

  /** Part-worths of segment s over all flat choices (a copy). */
  public double[] partWorths(int s) {
    return partWorth[s].clone();
  }

  /**
   * A flat choice's contribution to the utility of a choosing segment s: part-worth + priceWeight ×
   * (price + value_s). Throws for a segment that does not choose.
   */
  public double choiceUtility(int s, int flat) {
    return utilitiesOf(s)[flat];
  }

  /** {@link #choiceUtility} of every flat choice of a choosing segment s (a copy). */
  public double[] choiceUtilities(int s) {
    return utilitiesOf(s).clone();
  }

  private double[] utilitiesOf(int s) {
    if (choiceUtility[s] == null) {
      throw new IllegalStateException(
          "segment '" + catalog.segments().get(s).id() + "' does not choose; it has no utilities");
    }
    return choiceUtility[s];
  }

  /**
   * u_s(v) = Σ part-worths + priceWeight · price_s(v) of PRODUCT.md, for a choosing segment s;
   * additive over the groups.
   */
  public double utility(int[] v, int s) {
    double[] util = utilitiesOf(s);
    double u = 0;
    for (int g = 0; g < groupCount; g++) {
      u += util[offset[g] + v[g]];
    }
    return u;
  }

  /** price_s(v): the chosen price points plus segment s's value of the chosen options. */
  public double price(int[] v, int s) {
    return withSegmentValue(price, v, s);
  }

  /** Use of resource r by a flat choice. */
  public double choiceUse(int flat, int r) {
    return use[flat * resourceCount + r];
  }

  /** Extra value segment s pays for a flat choice. */
  public double choiceValue(int s, int flat) {
    return segmentValue[s][flat];
  }

  /** False when a single-group rule removes the flat choice from every buildable variant. */
  public boolean allowed(int flat) {
    return allowed[flat];
  }

  /** Allowed and accepted by segment s. */
  public boolean allowedIn(int s, int flat) {
    return segmentAllowed[s][flat];
  }

  public Nogood[] nogoods() {
    return nogoods.clone();
  }

  public int nogoodCount() {
    return nogoods.length;
  }

  public Nogood nogood(int i) {
    return nogoods[i];
  }

  /** Indices of the nogoods that name group g. */
  public int[] nogoodsOf(int g) {
    return nogoodsOfGroup[g].clone();
  }

  /** Buildable: every choice allowed and no nogood violated. */
  public boolean isBuildable(int[] v) {
    for (int g = 0; g < groupCount; g++) {
      if (v[g] < 0 || v[g] >= choiceCount[g] || !allowed[offset[g] + v[g]]) {
        return false;
      }
    }
    for (Nogood n : nogoods) {
      if (n.violatedBy(v, offset)) {
        return false;
      }
    }
    return true;
  }

  /** Buildable and accepted by segment s. */
  public boolean isColumn(int[] v, int s) {
    for (int g = 0; g < groupCount; g++) {
      if (v[g] < 0 || v[g] >= choiceCount[g] || !segmentAllowed[s][offset[g] + v[g]]) {
        return false;
      }
    }
    return isBuildable(v);
  }

  /** margin(v, s) of PRODUCT.md: price minus cost over the groups plus segment s's value. */
  public double margin(int[] v, int s) {
    return withSegmentValue(margin, v, s);
  }

  /** Σ_g of a per-choice figure plus segment s's value, over the choices of v. */
  private double withSegmentValue(double[] perChoice, int[] v, int s) {
    double sum = 0;
    for (int g = 0; g < groupCount; g++) {
      int f = offset[g] + v[g];
      sum += perChoice[f] + segmentValue[s][f];
    }
    return sum;
  }

  /** Resource use of one unit of v, written into {@code out} (length resourceCount). */
  public double[] use(int[] v, double[] out) {
    Arrays.fill(out, 0);
    for (int g = 0; g < groupCount; g++) {
      int base = (offset[g] + v[g]) * resourceCount;
      for (int r = 0; r < resourceCount; r++) {
        out[r] += use[base + r];
      }
    }
    return out;
  }

  public double[] use(int[] v) {
    return use(v, new double[resourceCount]);
  }

  /** Packed key of a variant, for sets of variants. */
  public VariantKey key(int[] v) {
    long[] words = new long[keyWords];
    int bit = 0;
    for (int g = 0; g < groupCount; g++) {
      int w = bit >>> 6;
      int b = bit & 63;
      words[w] |= ((long) v[g]) << b;
      if (b + bitsOfGroup[g] > 64) {
        words[w + 1] |= ((long) v[g]) >>> (64 - b);
      }
      bit += bitsOfGroup[g];
    }
    return new VariantKey(words);
  }

  /**
   * Group id to choice id ({@link #choiceId}: {@code c12@5300} for a price point), in group order;
   * includes {@code none} for an absent optional group. {@link #parse} reads it back.
   */
  public Map<String, String> describe(int[] v) {
    LinkedHashMap<String, String> m = new LinkedHashMap<>();
    for (int g = 0; g < groupCount; g++) {
      m.put(catalog.groups().get(g).id(), choiceId(g, v[g]));
    }
    return m;
  }

  /** {@code group=option,group=option@price,...}, the form {@code explain --variant} takes. */
  public String label(int[] v) {
    StringJoiner j = new StringJoiner(",");
    describe(v).forEach((g, o) -> j.add(g + "=" + o));
    return j.toString();
  }

  /**
   * Parses group id to choice id into a variant; a price point is written {@code option@price}
   * (the price as in the catalog, e.g. {@code c12@5300}). Groups left out of an optional group mean
   * {@code none}. Throws {@link IllegalArgumentException} naming the group or option that is wrong.
   */
  public int[] parse(Map<String, String> choices) {
    int[] v = new int[groupCount];
    for (String gid : choices.keySet()) {
      if (catalog.groupIndex(gid) < 0) {
        throw new IllegalArgumentException("unknown group '" + gid + "'; groups are " + groupIds());
      }
    }
    for (int g = 0; g < groupCount; g++) {
      Group group = catalog.groups().get(g);
      String id = choices.get(group.id());
      if (id == null) {
        if (group.required()) {
          throw new IllegalArgumentException(
              "group '" + group.id() + "' is required: give " + group.id() + "=<option>");
        }
        v[g] = choiceCount[g] - 1;
        continue;
      }
      v[g] = parseChoice(g, id);
    }
    return v;
  }

  private int parseChoice(int g, String id) {
    for (int k = 0; k < choiceCount[g]; k++) {
      if (choiceId(g, k).equals(id)) {
        return k;
      }
    }
    Group group = catalog.groups().get(g);
    int mark = id.indexOf(Option.PRICE_MARK);
    String optionId = mark < 0 ? id : id.substring(0, mark);
    int o = group.indexOf(optionId);
    if (o >= 0 && o < group.options().size()) {
      Option option = group.options().get(o);
      int[] points = choicesOfOption(g, o);
      if (mark >= 0) {
        double wanted;
        try {
          wanted = Double.parseDouble(id.substring(mark + 1));
        } catch (NumberFormatException e) {
          wanted = Double.NaN;
        }
        for (int f : points) {
          if (price[f] == wanted) {
            return f - offset[g];
          }
        }
      }
      List<String> ids = choiceIds(g, points);
      throw new IllegalArgumentException(
          option.hasPricePoints()
              ? "option '" + optionId + "' of group '" + group.id() + "' has price points; choose one of " + ids
              : "option '" + optionId + "' of group '" + group.id() + "' has one price; write it as " + ids.get(0));
    }
    List<String> ids = choiceIds(g, java.util.stream.IntStream.range(offset[g], offset[g + 1]).toArray());
    throw new IllegalArgumentException(
        "group '" + group.id() + "' has no option '" + id + "'; choose one of " + ids);
  }

  private List<String> choiceIds(int g, int[] flats) {
    List<String> ids = new ArrayList<>();
    for (int f : flats) {
      ids.add(choiceId(g, f - offset[g]));
    }
    return ids;
  }

  private List<String> groupIds() {
    return catalog.groups().stream().map(Group::id).toList();
  }
}
