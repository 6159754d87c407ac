package dev.mixwright.space;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * Whether anything is buildable and whether each segment accepts a buildable variant, answered by
 * search ({@link Existence#within}), not by counting; when the answer is no, the rules that cause it
 * ({@link SpaceDiagnosis}). A question the search cannot settle within {@link #SEARCH_NODES} nodes
 * counts as "something is there": a run then goes ahead rather than refuse a catalog that may sell.
 *
 * @param whole whether any variant is buildable
 * @param segments per segment, in catalog order: whether it accepts a buildable variant
 * @param emptyReason why nothing at all can be sold; empty when something can
 * @param segmentNotes one line per segment that can sell nothing, with its cause
 */
public record SpaceSurvey(Existence whole, List<Existence> segments, String emptyReason, List<String> segmentNotes) {
  /** Node budget of each search: far above what propagation leaves on catalogs seen so far. */
  public static final long SEARCH_NODES = 5_000_000;

  public SpaceSurvey {
    segments = List.copyOf(segments);
    segmentNotes = List.copyOf(segmentNotes);
  }

  public static SpaceSurvey of(VariantSpace space) {
    return of(space, () -> false);
  }

  /**
   * {@link #of(VariantSpace)} that leaves unsettled what it has not settled once {@code stop} says so
   * (a time limit or a signal), as it does past its node budget.
   */
  public static SpaceSurvey of(VariantSpace space, BooleanSupplier stop) {
    Existence whole = Existence.within(space, BudgetedCount.wholeSpace(space), SEARCH_NODES, stop);
    List<Existence> per = new ArrayList<>();
    for (int s = 0; s < space.segmentCount(); s++) {
      per.add(whole.none() ? Existence.NONE
          : Existence.within(space, BudgetedCount.segment(space, s), SEARCH_NODES, stop));
    }
    SpaceDiagnosis diagnosis = new SpaceDiagnosis(space);
    String reason = "";
    List<String> notes = new ArrayList<>();
    if (whole.none()) {
      reason = diagnosis.spaceConflict().map(RuleConflict::message).orElse("no variant is buildable under the rules");
    } else {
      for (int s = 0; s < per.size(); s++) {
        if (per.get(s).none()) {
          Optional<RuleConflict> c = diagnosis.segmentConflict(s);
          notes.add("segments[" + s + "] (" + space.catalog().segments().get(s).id() + "): "
              + c.map(RuleConflict::message).orElse("accepts no buildable variant") + " — it will sell nothing");
        }
      }
      if (!per.isEmpty() && per.stream().allMatch(Existence::none)) {
        reason = "no segment accepts any buildable variant: " + String.join("; ", notes);
      }
    }
    return new SpaceSurvey(whole, per, reason, notes);
  }

  /** True when nothing at all can be sold. */
  public boolean nothingSellable() {
    return !emptyReason.isEmpty();
  }
}
