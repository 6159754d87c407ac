package dev.mixwright.catalog;

import java.util.regex.Pattern;

/**
 * Checks on single values shared by the YAML/JSON walker and the CSV option tables. Each returns
 * null when the value is fine, else the message of the problem.
 */
final class Checks {
  private static final Pattern DECIMAL =
      Pattern.compile("[-+]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][-+]?\\d+)?");

  private Checks() {}

  /** The kinds of id a catalog declares, with the word and an example used in messages. */
  enum IdKind {
    RESOURCE("resource", "weld"),
    GROUP("group", "frame"),
    OPTION("option", "step"),
    SEGMENT("segment", "commuters"),
    RULE("rule", "cargo-needs-big-battery");

    final String noun;
    final String example;

    IdKind(String noun, String example) {
      this.noun = noun;
      this.example = example;
    }
  }

  static String idProblem(String id, IdKind kind) {
    if (id.isBlank()) {
      return "must not be empty — give the " + kind.noun + " an id, e.g. " + kind.example;
    }
    if (!id.equals(id.strip())) {
      return "has spaces at the start or end (" + Where.quote(id) + "); remove them";
    }
    boolean choice = kind == IdKind.GROUP || kind == IdKind.OPTION;
    if (choice && (id.indexOf(',') >= 0 || id.indexOf('=') >= 0)) {
      return "must not contain ',' or '=' ("
          + Where.quote(id)
          + ") — they separate choices in group=option,group=option; use '-' or '_' instead";
    }
    if (kind == IdKind.OPTION && id.indexOf(Option.PRICE_MARK) >= 0) {
      return "must not contain '@' ("
          + Where.quote(id)
          + ") — it separates an option from its price point in group=option@price; use '-' or '_'"
          + " instead";
    }
    if (kind == IdKind.GROUP && id.indexOf('.') >= 0) {
      return "must not contain '.' ("
          + Where.quote(id)
          + ") — segment value keys are written group.option; use '-' or '_' instead";
    }
    if (kind == IdKind.OPTION && id.equals(Group.NONE)) {
      return "'none' is reserved for the absent choice of an optional group — rename this option"
          + " (e.g. 'no-rack'), or drop it and make the group optional with required: false";
    }
    return null;
  }

  /** Finite and at least zero. */
  static String nonNegativeProblem(double x, String hint) {
    if (!Double.isFinite(x)) {
      return "must be a finite number, got " + Where.num(x) + " — " + hint;
    }
    if (x < 0) {
      return "must be >= 0, got " + Where.num(x) + " — " + hint;
    }
    return null;
  }

  static String finiteProblem(double x, String hint) {
    return Double.isFinite(x)
        ? null
        : "must be a finite number, got " + Where.num(x) + " — " + hint;
  }

  static String shareProblem(double x) {
    return x > 0 && x <= 1
        ? null
        : "must be in (0, 1], got "
            + Where.num(x)
            + " — a share of demand, e.g. 0.35 (write 35% as 0.35; leave maxShare out for no"
            + " limit)";
  }

  /** A plain decimal number as written in a CSV cell, or null when the text is not one. */
  static Double decimal(String text) {
    return DECIMAL.matcher(text).matches() ? Double.valueOf(text) : null;
  }
}
