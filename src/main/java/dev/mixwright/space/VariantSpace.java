package dev.mixwright.space;

import dev.mixwright.catalog.Catalog;
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
 * <p>All per-choice data lives in flat {@code double[]}/{@code boolean[]} arrays; nothing here lists
 * the space.
 */
public final class VariantSpace {
  private final Catalog catalog;
  private final int groupCount;
  private final int resourceCount;
  private final int segmentCount;
  private final int[] choiceCount;
  private final int[] offset;
  private final double[] margin;
  private final double[] use;
  private final boolean[] allowed;
  private final double[][] segmentValue;
  private final boolean[][] segmentAllowed;
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
      choiceCount[g] = groups.get(g).choiceCount();
      offset[g + 1] = offset[g] + choiceCount[g];
    }
    int total = offset[groupCount];
    margin = new double[total];
    use = new double[total * resourceCount];
    for (int g = 0; g < groupCount; g++) {
      List<Option> options = groups.get(g).options();
      for (int k = 0; k < options.size(); k++) {
        Option o = options.get(k);
        margin[offset[g] + k] = o.margin();
        for (Map.Entry<String, Double> u : o.uses().entrySet()) {
          use[(offset[g] + k) * resourceCount + catalog.resourceIndex(u.getKey())] = u.getValue();
        }
      }
    }
    allowed = new boolean[total];
    Arrays.fill(allowed, true);
    List<Nogood> compiled = new ArrayList<>();
    for (int r = 0; r < catalog.rules().size(); r++) {
      compileRule(catalog.rules().get(r), r, compiled);
    }
    nogoods = compiled.toArray(new Nogood[0]);
    nogoodsOfGroup = new int[groupCount][];
    for (int g = 0; g < groupCount; g++) {
      int gg = g;
      nogoodsOfGroup[g] =
          java.util.stream.IntStream.range(0, nogoods.length)
              .filter(i -> Arrays.stream(nogoods[i].groups()).anyMatch(x -> x == gg))
              .toArray();
    }
    segmentValue = new double[segmentCount][total];
    segmentAllowed = new boolean[segmentCount][];
    for (int s = 0; s < segmentCount; s++) {
      Segment seg = catalog.segments().get(s);
      for (Map.Entry<String, Double> v : seg.value().entrySet()) {
        segmentValue[s][flatOf(v.getKey())] = v.getValue();
      }
      boolean[] ok = allowed.clone();
      for (Map.Entry<String, List<String>> a : seg.accepts().entrySet()) {
        int g = catalog.groupIndex(a.getKey());
        boolean[] listed = mark(g, a.getValue());
        for (int k = 0; k < choiceCount[g]; k++) {
          ok[offset[g] + k] &= listed[offset[g] + k];
        }
      }
      segmentAllowed[s] = ok;
    }
    bitsOfGroup = new int[groupCount];
    int bits = 0;
    for (int g = 0; g < groupCount; g++) {
      bitsOfGroup[g] = Math.max(1, 32 - Integer.numberOfLeadingZeros(choiceCount[g] - 1));
      bits += bitsOfGroup[g];
    }
    keyWords = Math.max(1, (bits + 63) / 64);
  }

  private int flatOf(String groupDotOption) {
    int dot = groupDotOption.indexOf('.');
    int g = catalog.groupIndex(groupDotOption.substring(0, dot));
    return offset[g] + catalog.groups().get(g).indexOf(groupDotOption.substring(dot + 1));
  }

  /** Flat membership array with the listed choices of group g set. */
  private boolean[] mark(int g, List<String> choiceIds) {
    boolean[] m = new boolean[offset[groupCount]];
    Group group = catalog.groups().get(g);
    for (String id : choiceIds) {
      m[offset[g] + group.indexOf(id)] = true;
    }
    return m;
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
      for (int k = 0; k < choiceCount[g]; k++) {
        if (member[offset[g] + k]) {
          allowed[offset[g] + k] = false;
        }
      }
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
    double m = 0;
    for (int g = 0; g < groupCount; g++) {
      int f = offset[g] + v[g];
      m += margin[f] + segmentValue[s][f];
    }
    return m;
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

  /** Group id to choice id, in group order (includes {@code none} for an absent optional group). */
  public Map<String, String> describe(int[] v) {
    LinkedHashMap<String, String> m = new LinkedHashMap<>();
    for (int g = 0; g < groupCount; g++) {
      Group group = catalog.groups().get(g);
      m.put(group.id(), group.choiceId(v[g]));
    }
    return m;
  }

  /** {@code group=option,group=option,...}, the form {@code explain --variant} takes. */
  public String label(int[] v) {
    StringJoiner j = new StringJoiner(",");
    describe(v).forEach((g, o) -> j.add(g + "=" + o));
    return j.toString();
  }

  /**
   * Parses group id to choice id into a variant. Groups left out of an optional group mean
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
        v[g] = group.options().size();
        continue;
      }
      int k = group.indexOf(id);
      if (k < 0) {
        List<String> ids = new ArrayList<>();
        for (int i = 0; i < group.choiceCount(); i++) {
          ids.add(group.choiceId(i));
        }
        throw new IllegalArgumentException(
            "group '" + group.id() + "' has no option '" + id + "'; choose one of " + ids);
      }
      v[g] = k;
    }
    return v;
  }

  private List<String> groupIds() {
    return catalog.groups().stream().map(Group::id).toList();
  }
}
