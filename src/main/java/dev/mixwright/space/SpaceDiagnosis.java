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
 * buildable. It is one such set, not necessarily the smallest. Cost: m + 1 questions for m rules.
 *
 * <p>Each question ("does this sub-catalog leave a variant?") compiles a catalog with only the kept
 * rules and asks, in order: a search with constraint propagation and a small node budget
 * ({@link Feasibility}); a {@link SpaceCounter} count (a count, or bound, of zero proves emptiness;
 * an exact count above zero proves a variant); the search again with a large budget. When all three
 * fail to settle it the answer is unknown: a conflict then keeps the rule and says it may not be
 * irreducible, and a rule note is not given.
 *
 * <p>Rules are catalog rules, so a single-group rule that {@link VariantSpace} folded into
 * {@link VariantSpace#allowed} is named like any other.
 */
public final class SpaceDiagnosis {
  /** Table limit of the counts a diagnosis runs: smaller than a count's default, since it runs many. */
  public static final long DEFAULT_TABLE_LIMIT = 1L << 16;

  static final long QUICK_SEARCH_NODES = 20_000;
  static final long DEEP_SEARCH_NODES = 2_000_000;

  private enum Verdict {
    EMPTY,
    NOT_EMPTY,
    UNKNOWN
  }

  private final VariantSpace space;
  private final Catalog catalog;
  private final long tableLimit;
  private final long quickNodes;
  private final long deepNodes;

  public SpaceDiagnosis(VariantSpace space) {
    this(space, DEFAULT_TABLE_LIMIT);
  }

  /** @param tableLimit passed to every {@link SpaceCounter} this diagnosis runs */
  public SpaceDiagnosis(VariantSpace space, long tableLimit) {
    this(space, tableLimit, QUICK_SEARCH_NODES, DEEP_SEARCH_NODES);
  }

  /** Tests set the budgets low to send questions through counting, or to leave them unknown. */
  SpaceDiagnosis(VariantSpace space, long tableLimit, long quickNodes, long deepNodes) {
    this.space = space;
    this.catalog = space.catalog();
    this.tableLimit = tableLimit;
    this.quickNodes = quickNodes;
    this.deepNodes = deepNodes;
  }

  /**
   * The rules that leave nothing buildable; empty when some variant is buildable (or when that
   * cannot be settled within the search budget and table limit).
   */
  public Optional<RuleConflict> spaceConflict() {
    List<Integer> all = allRules();
    if (ask(all, -1, Map.of()) != Verdict.EMPTY) {
      return Optional.empty();
    }
    boolean[] sure = {true};
    List<Integer> core = deletionFilter(List.of(), all, -1, Map.of(), sure);
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
    return Optional.of(conflict(OptionalInt.empty(), core, sure[0], message,
        "leaves nothing buildable by itself",
        "one of " + core.size() + " rules that together leave nothing buildable"));
  }

  /**
   * The rules that, with segment s's accepts fixed, leave no buildable variant the segment accepts;
   * empty when the segment has one (or when that cannot be settled).
   */
  public Optional<RuleConflict> segmentConflict(int s) {
    if (s < 0 || s >= catalog.segments().size()) {
      throw new IllegalArgumentException(
          "segment index " + s + " out of range 0.." + (catalog.segments().size() - 1));
    }
    List<Integer> all = allRules();
    if (ask(all, s, Map.of()) != Verdict.EMPTY) {
      return Optional.empty();
    }
    boolean[] sure = {true};
    List<Integer> core = deletionFilter(List.of(), all, s, Map.of(), sure);
    Segment seg = catalog.segments().get(s);
    String who = "segment " + seg.id() + " (segments[" + s + "])";
    String accepts =
        seg.accepts().isEmpty()
            ? "though it accepts every variant"
            : "given its accepts (" + cond(seg.accepts()) + ")";
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
    return Optional.of(conflict(OptionalInt.of(s), core, sure[0], message,
        "with the accepts of segment " + seg.id() + " it leaves nothing by itself",
        "one of " + core.size() + " rules that with the accepts of segment " + seg.id() + " leave nothing"));
  }

  /** The conflict of {@code core}, each rule noted with its role: alone, or one of several. */
  private RuleConflict conflict(
      OptionalInt segment, List<Integer> core, boolean sure, String message, String alone, String shared) {
    List<RuleNote> notes = new ArrayList<>();
    for (int r : core) {
      String role = core.size() == 1 ? alone : shared;
      notes.add(new RuleNote(r, RuleNote.Kind.IN_CONFLICT, ref(r) + ": " + summary(r) + " — " + role));
    }
    return new RuleConflict(segment, core, sure, sure ? message : message + notIrreducible(), notes);
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
   * {@code when} matches. Each note names the other rules responsible (found by the same deletion
   * filter). A rule is not judged when the other rules already leave nothing buildable
   * ({@link #spaceConflict} covers that) or when a question cannot be settled. Cost: about 3m
   * questions, plus m per note.
   */
  public List<RuleNote> ruleNotes() {
    return ruleNotes(0).notes();
  }

  /**
   * The notes of {@link #ruleNotes()} for the rules judged within {@code budgetMs} (0 or less: no
   * limit). Rules are judged in catalog order and a rule begun is finished, so the notes are those
   * of the first {@link Judged#judged()} rules.
   */
  public Judged ruleNotes(long budgetMs) {
    long deadline = budgetMs > 0 ? System.nanoTime() + budgetMs * 1_000_000L : Long.MAX_VALUE;
    List<Integer> all = allRules();
    Verdict whole = ask(all, -1, Map.of());
    List<RuleNote> notes = new ArrayList<>();
    for (int i = 0; i < all.size(); i++) {
      if (budgetMs > 0 && System.nanoTime() - deadline > 0) {
        return new Judged(notes, i, all.size());
      }
      Rule rule = catalog.rules().get(i);
      List<Integer> others = new ArrayList<>(all);
      others.remove(Integer.valueOf(i));
      // Fewer rules leave at least as much buildable, so what all rules allow answers for the others
      // without compiling them apart: this skips most questions on a catalog with few notes.
      if (whole != Verdict.NOT_EMPTY && ask(others, -1, Map.of()) != Verdict.NOT_EMPTY) {
        continue;
      }
      Map<String, List<String>> match = rule.isForbid() ? rule.forbid() : rule.when();
      Verdict underAll = rule.isForbid() ? Verdict.UNKNOWN : ask(all, -1, match);
      if (underAll == Verdict.NOT_EMPTY) {
        continue; // the rule fires on a buildable variant and leaves it buildable
      }
      Verdict matchable = ask(others, -1, match);
      if (matchable == Verdict.EMPTY) {
        List<Integer> core = deletionFilter(List.of(), others, -1, match, new boolean[] {true});
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
      if (matchable == Verdict.NOT_EMPTY
          && !rule.isForbid()
          && !rule.when().isEmpty()
          && whole == Verdict.NOT_EMPTY
          && underAll == Verdict.EMPTY) {
        List<Integer> core = deletionFilter(List.of(i), others, -1, match, new boolean[] {true});
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
    return new Judged(notes, all.size(), all.size());
  }

  /** Rule notes of the first {@code judged} of {@code rules} rules; the rest were not looked at. */
  public record Judged(List<RuleNote> notes, int judged, int rules) {
    public Judged {
      notes = List.copyOf(notes);
    }

    public boolean complete() {
      return judged == rules;
    }
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
   * dropped when what is left still leaves nothing. Needs: fixed + candidates leave nothing. A
   * question that cannot be settled keeps the rule and clears {@code sure[0]}.
   */
  private List<Integer> deletionFilter(
      List<Integer> fixed,
      List<Integer> candidates,
      int segment,
      Map<String, List<String>> match,
      boolean[] sure) {
    List<Integer> keep = new ArrayList<>(candidates);
    for (Integer r : candidates) {
      List<Integer> trial = new ArrayList<>(keep);
      trial.remove(r);
      List<Integer> rules = new ArrayList<>(fixed);
      rules.addAll(trial);
      Verdict v = ask(rules, segment, match);
      if (v == Verdict.EMPTY) {
        keep = trial;
      } else if (v == Verdict.UNKNOWN) {
        sure[0] = false;
      }
    }
    return keep;
  }

  /**
   * Whether the catalog with only {@code rules} has a buildable variant that segment s accepts (s =
   * -1: any buildable variant) and that holds, in every group of {@code match}, a listed choice.
   */
  private Verdict ask(List<Integer> rules, int segment, Map<String, List<String>> match) {
    VariantSpace vs = rules.size() == catalog.rules().size() ? space : space.withRulesOnly(mask(rules));
    boolean[] domain = new boolean[vs.totalChoices()];
    for (int f = 0; f < domain.length; f++) {
      domain[f] = segment < 0 ? vs.allowed(f) : vs.allowedIn(segment, f);
    }
    for (Map.Entry<String, List<String>> e : match.entrySet()) {
      int g = catalog.groupIndex(e.getKey());
      for (int k = 0; k < vs.choiceCount(g); k++) {
        if (!e.getValue().contains(vs.optionId(g, k))) {
          domain[vs.offset(g) + k] = false;
        }
      }
    }
    Feasibility.Answer quick = Feasibility.search(vs, domain, quickNodes);
    if (quick != Feasibility.Answer.UNKNOWN) {
      return quick == Feasibility.Answer.FOUND ? Verdict.NOT_EMPTY : Verdict.EMPTY;
    }
    SpaceCount c = new SpaceCounter(vs, tableLimit).count(domain);
    if (c.isEmpty()) {
      return Verdict.EMPTY;
    }
    if (c.exact()) {
      return Verdict.NOT_EMPTY;
    }
    return switch (Feasibility.search(vs, domain, deepNodes)) {
      case FOUND -> Verdict.NOT_EMPTY;
      case NONE -> Verdict.EMPTY;
      case UNKNOWN -> Verdict.UNKNOWN;
    };
  }

  private boolean[] mask(List<Integer> rules) {
    boolean[] keep = new boolean[catalog.rules().size()];
    for (int r : rules) {
      keep[r] = true;
    }
    return keep;
  }

  /** A complete search for one variant within {@code domain}; exponential in the worst case. */
  static boolean anyBuildable(VariantSpace vs, boolean[] domain) {
    return Feasibility.search(vs, domain, Long.MAX_VALUE) == Feasibility.Answer.FOUND;
  }

  private static String notIrreducible() {
    return " (some checks ran out of search budget, so the set may hold rules it does not need)";
  }

  private String ref(int r) {
    String id = catalog.rules().get(r).id();
    return id == null ? "rules[" + r + "]" : "rules[" + r + "] (" + id + ")";
  }

  /** The rule in the catalog's own terms, e.g. "when refrigerant=r290 require topology in [monobloc, hybrid]". */
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
