package dev.mixwright.space;

import java.util.List;
import java.util.OptionalInt;

/**
 * Why the space, or one segment, has no variant: a set of catalog rules (indices into
 * {@code catalog.rules()}, ascending) that by themselves leave nothing. {@code irreducible}: every
 * one of them is needed (dropping any one leaves something); false only when some check ran out of
 * its search budget, in which case the set may hold rules it does not need. {@code segment} is
 * empty for the whole space; for a segment the segment's accepts count as fixed and are not part of
 * the set (an empty set then means the accepts alone allow nothing).
 */
public record RuleConflict(
    OptionalInt segment,
    List<Integer> rules,
    boolean irreducible,
    String message,
    List<RuleNote> notes) {

  public RuleConflict {
    rules = List.copyOf(rules);
    notes = List.copyOf(notes);
  }
}
