package dev.mixwright.run;

import dev.mixwright.space.RuleConflict;
import dev.mixwright.space.RuleNote;
import dev.mixwright.space.SpaceCount;
import dev.mixwright.space.SpaceCounter;
import dev.mixwright.space.SpaceDiagnosis;
import dev.mixwright.space.VariantSpace;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The size of a catalog's space, in total and per segment; when nothing (or a segment) is
 * sellable, which rules cause it.
 */
public record SpaceFacts(SpaceCount total, List<SpaceCount> perSegment, String emptyReason, List<String> segmentNotes) {

  public static SpaceFacts of(VariantSpace space) {
    SpaceCounter counter = new SpaceCounter(space);
    SpaceCount total = counter.count();
    List<SpaceCount> per = counter.perSegment();
    SpaceDiagnosis diagnosis = new SpaceDiagnosis(space);
    String reason = "";
    List<String> segmentNotes = new ArrayList<>();
    if (total.isEmpty()) {
      reason = diagnosis.spaceConflict().map(RuleConflict::message).orElse("no variant is buildable under the rules");
    } else {
      for (int s = 0; s < per.size(); s++) {
        if (per.get(s).isEmpty()) {
          Optional<RuleConflict> c = diagnosis.segmentConflict(s);
          segmentNotes.add("segments[" + s + "] (" + space.catalog().segments().get(s).id() + "): "
              + c.map(RuleConflict::message).orElse("accepts no buildable variant") + " — it will sell nothing");
        }
      }
      if (per.stream().allMatch(SpaceCount::isEmpty)) {
        reason = "no segment accepts any buildable variant: " + String.join("; ", segmentNotes);
      }
    }
    return new SpaceFacts(total, per, reason, segmentNotes);
  }

  /** Rules that can never fire or that forbid their own when; worth a look, not errors. */
  public static List<String> ruleNotes(VariantSpace space) {
    List<String> out = new ArrayList<>();
    for (RuleNote n : new SpaceDiagnosis(space).ruleNotes()) {
      if (n.kind() != RuleNote.Kind.IN_CONFLICT) {
        out.add(n.message());
      }
    }
    return out;
  }

  public BigInteger buildable() {
    return total.value();
  }

  public boolean exact() {
    return total.exact();
  }

  /** True when nothing at all can be sold. */
  public boolean nothingSellable() {
    return !emptyReason.isEmpty();
  }
}
