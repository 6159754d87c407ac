package dev.mixwright.catalog;

import java.util.List;

/**
 * An option group. A variant holds exactly one option of a required group and at most one of an
 * optional group; the absent choice of an optional group is written {@value #NONE}.
 */
public record Group(String id, String label, boolean required, List<Option> options) {
  public static final String NONE = "none";

  public Group {
    options = List.copyOf(options);
  }

  /** Index of the option with this id, {@code options().size()} for {@code none} in an optional group, or -1. */
  public int indexOf(String optionId) {
    for (int i = 0; i < options.size(); i++) {
      if (options.get(i).id().equals(optionId)) {
        return i;
      }
    }
    return !required && NONE.equals(optionId) ? options.size() : -1;
  }

  /** Number of choices: the options, plus {@code none} when the group is optional. */
  public int choiceCount() {
    return options.size() + (required ? 0 : 1);
  }

  public String choiceId(int index) {
    return index == options.size() ? NONE : options.get(index).id();
  }
}
