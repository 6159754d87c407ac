package dev.mixwright.space;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.StringJoiner;

/**
 * Says which catalog rules leave the space, or a segment, with no buildable variant, and which
 * rules can never fire or kill the combination they apply to.
 *
 * <p>Conflicts: a deletion filter (Chinneck &amp; Dravnieks 1991, "Locating minimal infeasible
 * constraint sets in linear programs", ORSA Journal on Computing 3(2), applied here to rules): start
 * from all rules, drop each in turn and keep it dropped when what is left still leaves nothing. The
 * result is irreducible: it leaves nothing, and without any one of its rules something is
 * buildable. It is one such set, not necessarily the smallest. Each test compiles a sub-catalog with
 * only the kept rules and counts it with {@link SpaceCounter}; when the count is only a bound above
 * zero, a depth-first search settles whether a variant exists. Cost: m + 1 compilations and counts
 * for m rules.
 *
 * <p>Rules are catalog rules, so a single-group rule that {@link VariantSpace} folded into
 * {@link VariantSpace#allowed} is named like any other.
 */
public final class SpaceDiagnosis {
  private final VariantSpace space;
  private final Catalog catalog;
  private final long tableLimit;

  public SpaceDiagnosis(VariantSpace space) {
    this(space, SpaceCounter.DEFAULT_TABLE_LIMIT);
  }

  /** @param tableLimit passed to every {@link SpaceCounter} this diagnosis runs */
  public SpaceDiagnosis(VariantSpace space, long tableLimit) {
    this.space = space;
    this.catalog = space.catalog();
    this.tableLimit = tableLimit;
  }

  /** The rules that leave nothing buildable; empty when some variant is buildable. */
  public Optional<RuleConflict> spaceConflict() {
    List<Integer> all = allRules();
    if (!leavesNothing(all, -1, Map.of())) {
      return Optional.empty();
    }
    List<Integer> core = deletionFilter(List.of(), all, -1, Map.of());
    String message;
    if (core.isEmpty()) {
      message = "no buildable variant: some group has no choice at all";
    } else if (core.size() == 1) {
      message = "no buildable variant: " + ref(core.get(0)) + " alone leaves nothing buildable";
    } else {
      message =
          "no buildable variant: "
              + andList(core.stream().map(this::ref).toList())
              + " together leave nothing buildable, and dropping any one of them makes some variant"
              + " buildable";
    }
    List<RuleNote> notes = new ArrayList<>();
    for (int r : core) {
      String role =
          core.size() == 1
              ? "leaves nothing buildable by itself"
              : "one of " + core.size() + " rules that together leave nothing buildable";
      notes.add(new RuleNote(r, RuleNote.Kind.IN_CONFLICT, ref(r) + ": " + summary(r) + " — " + role));
    }
    return Optional.of(new RuleConflict(OptionalInt.empty(), core, message, notes));
  }

  /**
   * The rules that, with segment s's accepts fixed, leave no buildable variant the segment accepts;
   * empty when the segment has one.
   */
  public Optional<RuleConflict> segmentConflict(int s) {
    if (s < 0 || s >= catalog.segments().size()) {
      throw new IllegalArgumentException(
          "segment index " + s + " out of range 0.." + (catalog.segments().size() - 1));
    }
    List<Integer> all = allRules();
    if (!leavesNothing(all, s, Map.of())) {
      return Optional.empty();
    }
    List<Integer> core = deletionFilter(List.of(), all, s, Map.of());
    Segment seg = catalog.segments().get(s);
    String who = "segment " + seg.id() + " (segments[" + s + "])";
    String accepts =
        seg.accepts().isEmpty() ? "though it accepts every variant" : "given its accepts (" + cond(seg.accepts()) + ")";
    String message;
    if (core.isEmpty()) {
      message = who + " accepts no variant at all: its accepts " + cond(seg.accepts()) + " allow none";
    } else if (core.size() == 1) {
      message =
          who + " has no buildable variant it accepts: " + accepts + ", " + ref(core.get(0))
              + " alone leaves nothing";
    } else {
      message =
          who + " has no buildable variant it accepts: " + accepts + ", "
              + andList(core.stream().map(this::ref).toList())
              + " together leave nothing, and dropping any one of them makes a variant acceptable";
    }
    List<RuleNote> notes = new ArrayList<>();
    for (int r : core) {
      String role =
          core.size() == 1
              ? "with the accepts of segment " + seg.id() + " it leaves nothing by itself"
              : "one of " + core.size() + " rules that with the accepts of segment " + seg.id()
                  + " leave nothing";
      notes.add(new RuleNote(r, RuleNote.Kind.IN_CONFLICT, ref(r) + ": " + summary(r) + " — " + role));
    }
    return Optional.of(new RuleConflict(OptionalInt.of(s), core, message, notes));
  }

  /** {@link #segmentConflict} for every segment that has no acceptable variant, in catalog order. */
  public List<RuleConflict> segmentConflicts() {
    List<RuleConflict> out = new ArrayList<>();
    for (int s = 0; s < catalog.segments().size(); s++) {
      segmentConflict(s).ifPresent(out::add);
    }
    return out;
  }

  /**
   * Rules that can never fire (no variant the other rules allow matches the rule's {@code when}, or
   * holds its full {@code forbid} combination) and when/require rules that forbid every variant their
   * {@code when} matches. Each note names the other rules responsible (a minimal set, found by the
   * same deletion filter). A rule is not judged when the other rules already leave nothing
   * buildable; {@link #spaceConflict} covers that. Cost: about 2m compilations and counts, plus m per note.
   */
  public List<RuleNote> ruleNotes() {
    List<Integer> all = allRules();
    boolean spaceEmpty = leavesNothing(all, -1, Map.of());
    List<RuleNote> notes = new ArrayList<>();
    for (int i = 0; i < all.size(); i++) {
      Rule rule = catalog.rules().get(i);
      List<Integer> others = new ArrayList<>(all);
      others.remove(Integer.valueOf(i));
      if (leavesNothing(others, -1, Map.of())) {
        continue;
      }
      Map<String, List<String>> match = rule.isForbid() ? rule.forbid() : rule.when();
      if (leavesNothing(others, -1, match)) {
        List<Integer> core = deletionFilter(List.of(), others, -1, match);
        String what =
            rule.isForbid()
                ? "holds " + combination(match) + ", so it removes nothing"
                : "has " + cond(match);
        notes.add(
            new RuleNote(
                i,
                RuleNote.Kind.NEVER_FIRES,
                ref(i) + ": can never fire — no variant the other rules allow " + what + " ("
                    + cause(core, "its own lists name no choice a variant can hold") + ")"));
        continue;
      }
      if (!rule.isForbid() && !rule.when().isEmpty() && !spaceEmpty
          && leavesNothing(all, -1, match)) {
        List<Integer> core = deletionFilter(List.of(i), others, -1, match);
        notes.add(
            new RuleNote(
                i,
                RuleNote.Kind.FORBIDS_WHEN,
                ref(i) + ": forbids every variant it applies to — with " + cond(rule.when())
                    + " no variant the other rules allow also has " + cond(rule.require()) + ", so "
                    + cond(rule.when()) + " is in effect never buildable ("
                    + cause(core, "its require contradicts its own when") + ")"));
      }
    }
    return notes;
  }

  private List<Integer> allRules() {
    List<Integer> all = new ArrayList<>();
    for (int r = 0; r < catalog.rules().size(); r++) {
      all.add(r);
    }
    return all;
  }

  /**
   * Deletion filter: {@code fixed} stay, each of {@code candidates} is dropped in turn and stays
   * dropped when what is left still leaves nothing. Needs: fixed + candidates leave nothing.
   */
  private List<Integer> deletionFilter(
      List<Integer> fixed, List<Integer> candidates, int segment, Map<String, List<String>> match) {
    List<Integer> keep = new ArrayList<>(candidates);
    for (Integer r : candidates) {
      List<Integer> trial = new ArrayList<>(keep);
      trial.remove(r);
      List<Integer> rules = new ArrayList<>(fixed);
      rules.addAll(trial);
      if (leavesNothing(rules, segment, match)) {
        keep = trial;
      }
    }
    return keep;
  }

  /**
   * True when the catalog with only {@code rules} has no buildable variant that segment s accepts
   * (s = -1: any buildable variant) and that holds, in every group of {@code match}, a listed choice.
   */
  boolean leavesNothing(List<Integer> rules, int segment, Map<String, List<String>> match) {
    VariantSpace vs =
        rules.size() == catalog.rules().size() ? space : new VariantSpace(subCatalog(rules));
    boolean[] domain = new boolean[vs.totalChoices()];
    for (int f = 0; f < domain.length; f++) {
      domain[f] = segment < 0 ? vs.allowed(f) : vs.allowedIn(segment, f);
    }
    for (Map.Entry<String, List<String>> e : match.entrySet()) {
      int g = catalog.groupIndex(e.getKey());
      Group group = catalog.groups().get(g);
      for (int k = 0; k < group.choiceCount(); k++) {
        if (!e.getValue().contains(group.choiceId(k))) {
          domain[vs.offset(g) + k] = false;
        }
      }
    }
    SpaceCount c = new SpaceCounter(vs, tableLimit).count(domain);
    if (c.isEmpty()) {
      return true;
    }
    return !c.exact() && !anyBuildable(vs, domain);
  }

  private Catalog subCatalog(List<Integer> rules) {
    List<Rule> kept = rules.stream().sorted().map(catalog.rules()::get).toList();
    return new Catalog(
        catalog.format(),
        catalog.name(),
        catalog.currency(),
        catalog.period(),
        catalog.resources(),
        catalog.groups(),
        kept,
        catalog.segments(),
        catalog.portfolio());
  }

  /**
   * Depth-first search for one buildable variant within {@code domain}, groups in index order, each
   * nogood checked once its last group is set. Exponential in the worst case; only used when the
   * count gave a bound above zero.
   */
  static boolean anyBuildable(VariantSpace vs, boolean[] domain) {
    int n = vs.groupCount();
    if (n == 0) {
      return true;
    }
    int[] off = vs.offsets();
    List<List<Nogood>> checkAt = new ArrayList<>();
    for (int g = 0; g < n; g++) {
      checkAt.add(new ArrayList<>());
    }
    for (Nogood ng : vs.nogoods()) {
      int last = 0;
      for (int g : ng.groups()) {
        last = Math.max(last, g);
      }
      checkAt.get(last).add(ng);
    }
    int[] v = new int[n];
    v[0] = -1;
    int depth = 0;
    while (depth >= 0) {
      int k = v[depth] + 1;
      while (k < vs.choiceCount(depth)
          && !(domain[off[depth] + k] && passes(checkAt.get(depth), v, k, depth, off))) {
        k++;
      }
      if (k == vs.choiceCount(depth)) {
        depth--;
        continue;
      }
      v[depth] = k;
      if (depth == n - 1) {
        return true;
      }
      depth++;
      v[depth] = -1;
    }
    return false;
  }

  private static boolean passes(List<Nogood> nogoods, int[] v, int k, int depth, int[] off) {
    v[depth] = k;
    for (Nogood ng : nogoods) {
      if (ng.violatedBy(v, off)) {
        return false;
      }
    }
    return true;
  }

  private String ref(int r) {
    String id = catalog.rules().get(r).id();
    return id == null ? "rules[" + r + "]" : "rules[" + r + "] (" + id + ")";
  }

  /** The rule in the catalog's own terms, e.g. "when motor=mid750 require battery in [b625, b750]". */
  private String summary(int r) {
    Rule rule = catalog.rules().get(r);
    if (rule.isForbid()) {
      return "forbid " + combination(rule.forbid());
    }
    String when = rule.when().isEmpty() ? "always" : "when " + cond(rule.when());
    return when + " require " + cond(rule.require());
  }

  private String cause(List<Integer> core, String whenNone) {
    if (core.isEmpty()) {
      return whenNone;
    }
    StringJoiner j = new StringJoiner("; ", "ruled out by ", "");
    for (int r : core) {
      j.add(ref(r) + ": " + summary(r));
    }
    return j.toString();
  }

  private static String cond(Map<String, List<String>> m) {
    StringJoiner j = new StringJoiner(" and ");
    m.forEach((g, ids) -> j.add(one(g, ids)));
    return j.toString();
  }

  private static String combination(Map<String, List<String>> m) {
    StringJoiner j = new StringJoiner(" with ");
    m.forEach((g, ids) -> j.add(one(g, ids)));
    return j.toString();
  }

  private static String one(String group, List<String> ids) {
    return ids.size() == 1 ? group + "=" + ids.get(0) : group + " in [" + String.join(", ", ids) + "]";
  }

  private static String andList(List<String> items) {
    if (items.size() == 1) {
      return items.get(0);
    }
    return String.join(", ", items.subList(0, items.size() - 1)) + " and " + items.get(items.size() - 1);
  }
}
