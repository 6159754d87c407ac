package dev.mixwright.space;

import java.util.List;
import java.util.OptionalInt;

/**
 * Why the space, or one segment, has no variant: a minimal set of catalog rules (indices into
 * {@code catalog.rules()}, ascending) that by themselves leave nothing, every one of them needed.
 * {@code segment} is empty for the whole space; for a segment the segment's accepts count as fixed
 * and are not part of the set (an empty set then means the accepts alone allow nothing).
 */
public record RuleConflict(
    OptionalInt segment, List<Integer> rules, String message, List<RuleNote> notes) {

  public RuleConflict {
    rules = List.copyOf(rules);
    notes = List.copyOf(notes);
  }
}
