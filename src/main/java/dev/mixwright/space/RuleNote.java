package dev.mixwright.space;

/**
 * One finding about one catalog rule. {@code rule} indexes {@code catalog.rules()}; {@code message}
 * is a sentence for people that starts with {@code rules[i]}.
 */
public record RuleNote(int rule, Kind kind, String message) {

  public enum Kind {
    /** Part of a minimal set of rules that leaves the space (or a segment) with no variant. */
    IN_CONFLICT,
    /** No variant the other rules allow matches the rule, so it removes nothing. */
    NEVER_FIRES,
    /** The rule forbids every variant that matches its {@code when}: that combination is dead. */
    FORBIDS_WHEN
  }
}
