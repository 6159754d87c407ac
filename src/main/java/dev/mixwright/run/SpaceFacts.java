package dev.mixwright.run;

import dev.mixwright.space.BudgetedCount;
import dev.mixwright.space.RuleNote;
import dev.mixwright.space.SpaceCount;
import dev.mixwright.space.SpaceDiagnosis;
import dev.mixwright.space.SpaceSurvey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;

/**
 * The size of a catalog's space, in total and per segment, as far as a count within its budget
 * gets; whether anything (and each segment) is sellable, by search; when not, which rules cause it.
 */
public record SpaceFacts(SpaceCount total, List<SpaceCount> perSegment, String emptyReason, List<String> segmentNotes) {

  /** @param countBudgetMs time for all counts together; 0 or less for no limit */
  public static SpaceFacts of(VariantSpace space, long countBudgetMs) {
    SpaceSurvey survey = SpaceSurvey.of(space);
    List<SpaceCount> counts = new BudgetedCount(space).wholeAndSegments(countBudgetMs);
    return new SpaceFacts(counts.get(0), counts.subList(1, counts.size()), survey.emptyReason(), survey.segmentNotes());
  }

  /**
   * Rules that can never fire or that forbid their own when; worth a look, not errors. Past
   * {@code budgetMs} (0 or less: no limit) the rules not yet judged are named in a last note.
   */
  public static List<String> ruleNotes(VariantSpace space, long budgetMs) {
    List<String> out = new ArrayList<>();
    SpaceDiagnosis.Judged judged = new SpaceDiagnosis(space).ruleNotes(budgetMs);
    for (RuleNote n : judged.notes()) {
      if (n.kind() != RuleNote.Kind.IN_CONFLICT) {
        out.add(n.message());
      }
    }
    if (!judged.complete()) {
      int from = judged.judged();
      int to = judged.rules() - 1;
      out.add("rule notes stopped after " + budgetMs + " ms: " + (from == to ? "rules[" + from + "] was"
          : "rules[" + from + "] to rules[" + to + "] (" + (to - from + 1) + " rules) were")
          + " not checked for never firing or forbidding their own when");
    }
    return out;
  }

  /** True when nothing at all can be sold. */
  public boolean nothingSellable() {
    return !emptyReason.isEmpty();
  }
}
