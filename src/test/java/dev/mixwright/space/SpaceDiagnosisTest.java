package dev.mixwright.space;

import static dev.mixwright.space.Fixtures.catalog;
import static dev.mixwright.space.Fixtures.forbid;
import static dev.mixwright.space.Fixtures.group;
import static dev.mixwright.space.Fixtures.m;
import static dev.mixwright.space.Fixtures.segment;
import static dev.mixwright.space.Fixtures.when;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

class SpaceDiagnosisTest {
  static final List<Group> BIKE =
      List.of(
          group("motor", true, "hub250", "mid750"),
          group("battery", true, "b400", "b625", "b750"),
          group("frame", true, "step", "cargo"),
          group("wheel", true, "w20", "w26"));

  /**
   * Rules 2–5 and 1–4 each leave nothing (two overlapping conflicts); rule 0 is unrelated. The
   * deletion filter tries rule 1 before the others, finds {2, 3, 4, 5} still empty, and keeps that.
   */
  @Test
  void findsAMinimalConflictIncludingAFoldedSingleGroupRule() {
    List<Rule> rules =
        List.of(
            forbid(m("frame", "cargo", "wheel", "w20")),
            when(m("motor", "mid750"), m("battery", "b750")),
            when(m("motor", "hub250"), m("battery", "b400")),
            forbid(m("battery", "b400")),
            forbid(m("motor", "mid750", "battery", "b750")),
            forbid(m("motor", "mid750", "battery", "b625")));
    Catalog c = catalog(BIKE, rules, List.of(segment("any", Map.of())));
    SpaceDiagnosis d = new SpaceDiagnosis(new VariantSpace(c));

    RuleConflict conflict = d.spaceConflict().orElseThrow();
    assertEquals(List.of(2, 3, 4, 5), conflict.rules());
    assertEquals(OptionalInt.empty(), conflict.segment());
    assertIrreducible(c, conflict.rules(), -1);
    assertTrue(conflict.message().contains("rules[3]"), conflict.message());
    assertEquals(4, conflict.notes().size());
    assertTrue(conflict.notes().stream().allMatch(n -> n.kind() == RuleNote.Kind.IN_CONFLICT));
    assertTrue(conflict.notes().get(1).message().startsWith("rules[3]: forbid battery=b400"),
        conflict.notes().get(1).message());
    // Every segment is empty too; its own filter gives an irreducible set as well.
    RuleConflict seg = d.segmentConflict(0).orElseThrow();
    assertIrreducible(c, seg.rules(), 0);
  }

  @Test
  void namesTheRulesThatConflictWithASegmentsAccepts() {
    List<Rule> rules =
        List.of(
            forbid(m("frame", "cargo", "wheel", "w20")),
            when(m("motor", "mid750"), m("battery", "b750")),
            forbid(m("motor", "mid750", "battery", "b750")),
            forbid(m("frame", "step", "wheel", "w26")));
    List<Segment> segs =
        List.of(
            segment("everyone", Map.of()),
            segment("fast", m("motor", "mid750")),
            segment("cheap", m("battery", "b400", "motor", "mid750")),
            segment("city", m("frame", "cargo", "wheel", "w20")));
    Catalog c = catalog(BIKE, rules, segs);
    SpaceDiagnosis d = new SpaceDiagnosis(new VariantSpace(c));

    assertEquals(Optional.empty(), d.spaceConflict());
    assertEquals(Optional.empty(), d.segmentConflict(0));
    RuleConflict fast = d.segmentConflict(1).orElseThrow();
    assertEquals(List.of(1, 2), fast.rules());
    assertEquals(OptionalInt.of(1), fast.segment());
    assertIrreducible(c, fast.rules(), 1);
    assertTrue(fast.message().startsWith("segment fast (segments[1]) has no buildable variant"), fast.message());
    assertTrue(fast.message().contains("motor=mid750"), fast.message());

    RuleConflict cheap = d.segmentConflict(2).orElseThrow();
    assertEquals(List.of(1), cheap.rules());
    assertTrue(cheap.message().contains("rules[1] alone"), cheap.message());

    RuleConflict city = d.segmentConflict(3).orElseThrow();
    assertEquals(List.of(0), city.rules());

    assertEquals(List.of(1, 2, 3), d.segmentConflicts().stream().map(r -> r.segment().getAsInt()).toList());
  }

  @Test
  void flagsRulesThatNeverFireOrKillTheirWhen() {
    List<Rule> rules =
        List.of(
            forbid(m("motor", "hub250", "battery", "b400,b625,b750")),
            when(m("motor", "hub250"), m("frame", "step")),
            when(m("frame", "cargo"), m("battery", "b400")),
            new Rule("no-cargo-small-battery", Map.of(), Map.of(), m("frame", "cargo", "battery", "b400")),
            forbid(m("wheel", "w20", "frame", "cargo")));
    Catalog c = catalog(BIKE, rules, List.of());
    SpaceDiagnosis d = new SpaceDiagnosis(new VariantSpace(c));
    assertEquals(Optional.empty(), d.spaceConflict());

    List<RuleNote> notes = d.ruleNotes();
    assertEquals(
        List.of("1 NEVER_FIRES", "2 FORBIDS_WHEN", "4 NEVER_FIRES"),
        notes.stream().map(n -> n.rule() + " " + n.kind()).toList(),
        notes.toString());
    String never = notes.get(0).message();
    assertTrue(never.startsWith("rules[1]: can never fire — no variant the other rules allow has motor=hub250"), never);
    assertTrue(never.contains("ruled out by rules[0]: forbid motor=hub250 with battery in [b400, b625, b750]"), never);
    String kills = notes.get(1).message();
    assertTrue(kills.contains("frame=cargo is in effect never buildable"), kills);
    assertTrue(kills.contains("rules[3] (no-cargo-small-battery): forbid frame=cargo with battery=b400"), kills);
    String redundant = notes.get(2).message();
    assertTrue(redundant.contains("holds wheel=w20 with frame=cargo, so it removes nothing"), redundant);
    assertTrue(redundant.contains("rules[2]") && redundant.contains("rules[3]"), redundant);

    SpaceDiagnosis.Judged all = d.ruleNotes(0);
    assertTrue(all.complete());
    assertEquals(notes, all.notes());
    // A budget, whatever it cuts, leaves the notes of a prefix of the rules (no timing is asserted).
    for (long budgetMs : new long[] {1, 1_000_000}) {
      SpaceDiagnosis.Judged cut = d.ruleNotes(budgetMs);
      assertTrue(cut.judged() >= 0 && cut.judged() <= rules.size(), cut.toString());
      assertEquals(notes.stream().filter(n -> n.rule() < cut.judged()).toList(), cut.notes());
    }

    // Checked independently: rule 1's when and rule 4's combination match nothing under the others.
    assertFalse(BruteForce.count(c, v -> BruteForce.rulesHold(c, without(c, 1), v)
        && BruteForce.matches(c, rules.get(1).when(), v)) > 0);
    assertFalse(BruteForce.count(c, v -> BruteForce.rulesHold(c, without(c, 4), v)
        && BruteForce.matches(c, rules.get(4).forbid(), v)) > 0);
  }

  /**
   * Three two-way groups that must all differ pairwise: a triangle to 2-colour, so nothing is
   * buildable, yet no single choice is ruled out. With no search budget and a one-entry table the
   * question stays open, and the diagnosis must then claim no conflict rather than a wrong one.
   */
  @Test
  void anUnsettledQuestionGivesNoConflict() {
    List<Group> groups =
        List.of(group("a", true, "x", "y"), group("b", true, "x", "y"), group("c", true, "x", "y"));
    List<Rule> rules = new ArrayList<>();
    for (String[] pair : new String[][] {{"a", "b"}, {"a", "c"}, {"b", "c"}}) {
      for (String o : List.of("x", "y")) {
        rules.add(forbid(m(pair[0], o, pair[1], o)));
      }
    }
    Catalog c = catalog(groups, rules, List.of());
    VariantSpace space = new VariantSpace(c);
    assertEquals(Optional.empty(), new SpaceDiagnosis(space, 1, 0, 0).spaceConflict());
    RuleConflict found = new SpaceDiagnosis(space).spaceConflict().orElseThrow();
    assertTrue(found.irreducible());
    assertIrreducible(c, found.rules(), -1);
    // With counting alone (no search) the exact count of zero settles every question.
    RuleConflict counted = new SpaceDiagnosis(space, 1 << 10, 0, 0).spaceConflict().orElseThrow();
    assertEquals(found.rules(), counted.rules());
  }

  @Test
  void aSegmentWhoseAcceptsListNothingNeedsNoRule() {
    Catalog c =
        catalog(
            BIKE,
            List.of(forbid(m("frame", "cargo", "wheel", "w20"))),
            List.of(segment("nobody", Map.of("frame", List.of()))));
    RuleConflict x = new SpaceDiagnosis(new VariantSpace(c)).segmentConflict(0).orElseThrow();
    assertEquals(List.of(), x.rules());
    assertTrue(x.message().contains("accepts no variant at all"), x.message());
  }

  private static List<Rule> without(Catalog c, int r) {
    List<Rule> out = new ArrayList<>(c.rules());
    out.remove(r);
    return out;
  }

  /** Brute force: the set leaves nothing, and without any one of its rules something is left. */
  static void assertIrreducible(Catalog c, List<Integer> set, int seg) {
    assertFalse(BruteForce.feasible(c, set, seg), "set " + set + " should leave nothing");
    for (Integer r : set) {
      List<Integer> less = new ArrayList<>(set);
      less.remove(r);
      assertTrue(BruteForce.feasible(c, less, seg), "set " + set + " without " + r + " should leave something");
    }
  }
}
