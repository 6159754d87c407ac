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
    RESOURCE("resource", "brazing"),
    GROUP("group", "compressor"),
    OPTION("option", "scroll"),
    SEGMENT("segment", "retrofit"),
    RULE("rule", "big-units-no-single-rotary");

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
    if (id.length() > Limits.MAX_ID_LENGTH) {
      return "is "
          + id.length()
          + " characters long; an id has at most "
          + Limits.MAX_ID_LENGTH
          + " — give the "
          + kind.noun
          + " a short id, e.g. "
          + kind.example
          + ", and put longer words in its label";
    }
    String control = controlProblem(id);
    if (control != null) {
      return control;
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
          + " (e.g. 'no-tank'), or drop it and make the group optional with required: false";
    }
    return null;
  }

  /**
   * The kinds of figure a catalog holds, each with the range it must lie in. The ranges are far
   * wider than any real catalog needs and narrow enough that the LP stays solvable in double
   * precision: with money and quantities at most 1e9 and uses between 1e-6 and 1e6, every product
   * and sum the solver forms stays below about 1e24, well inside what GLOP's scaling handles.
   */
  enum Figure {
    MONEY("money (prices, costs, tooling, values)", Limits.MAX_MONEY, 0, false),
    SIGNED_MONEY("money (prices, costs, tooling, values)", Limits.MAX_MONEY, 0, true),
    QUANTITY("a quantity (capacities, demand, buyers, lots)", Limits.MAX_QUANTITY, 0, false),
    /** Buyers: the sign is checked apart, with its own wording. */
    SIGNED_QUANTITY("a quantity (capacities, demand, buyers, lots)", Limits.MAX_QUANTITY, 0, true),
    USE("a use per unit", Limits.MAX_USE, Limits.MIN_USE, false),
    UTILITY("a utility (part-worths, stayOut, priceWeight)", Limits.MAX_UTILITY, 0, true),
    // A share's range is checked by shareProblem, with its own wording.
    SHARE("a share", Double.MAX_VALUE, 0, false);

    final String noun;
    final double max;
    final double minNonZero;
    final boolean signed;

    Figure(String noun, double max, double minNonZero, boolean signed) {
      this.noun = noun;
      this.max = max;
      this.minNonZero = minNonZero;
      this.signed = signed;
    }
  }

  /** A figure of the given kind: finite, of the right sign and inside its range; else the problem. */
  static String figureProblem(double x, Figure kind, String hint) {
    String p = kind.signed ? finiteProblem(x, hint) : nonNegativeProblem(x, hint);
    if (p != null) {
      return p;
    }
    double a = Math.abs(x);
    if (a > kind.max) {
      return "is too large: "
          + kind.noun
          + " must lie between "
          + (kind.signed ? "-" + sci(kind.max) + " and " : "0 and ")
          + sci(kind.max)
          + ", got "
          + Where.num(x)
          + " — no real catalog needs more, and the solver cannot work with it in floating point;"
          + " if the figures are this large, state them in a larger unit (thousands, tonnes)";
    }
    if (a > 0 && a < kind.minNonZero) {
      return "is too small: "
          + kind.noun
          + " must be 0 or at least "
          + sci(kind.minNonZero)
          + ", got "
          + Where.num(x)
          + " — state the resource in a smaller unit (grams rather than tonnes), or write 0";
    }
    return null;
  }

  /** A limit as people write powers of ten: 1e9, 1e-6. */
  private static String sci(double x) {
    int e = (int) Math.round(Math.log10(x));
    return Math.pow(10, e) == x ? "1e" + e : Where.num(x);
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

  /**
   * Text that would be written to a terminal: no control characters (escape codes, line breaks,
   * tabs) and no bidirectional overrides, which could rewrite what a person sees. Null when fine.
   */
  static String controlProblem(String text) {
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (Where.unprintable(c)) {
        return "contains the control character U+"
            + String.format(java.util.Locale.ROOT, "%04X", (int) c)
            + " at position "
            + (i + 1)
            + " — ids, labels and names are one line of plain text; remove it";
      }
    }
    return null;
  }

  /** Free text (a label, a name, a unit): not too long, no control characters; null when fine. */
  static String textProblem(String text) {
    if (text.length() > Limits.MAX_TEXT_LENGTH) {
      return "is "
          + text.length()
          + " characters long; labels, names and notes have at most "
          + Limits.MAX_TEXT_LENGTH
          + " — shorten it";
    }
    // Line breaks and tabs print harmlessly and a label may hold them; ids may not.
    return controlProblem(text.replace('\n', ' ').replace('\t', ' '));
  }

  /** A plain decimal number as written in a CSV cell, or null when the text is not one. */
  static Double decimal(String text) {
    return DECIMAL.matcher(text).matches() ? Double.valueOf(text) : null;
  }
}
