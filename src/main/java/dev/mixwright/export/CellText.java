package dev.mixwright.export;

/**
 * Text of a table cell from names a catalog chose. A spreadsheet opening a CSV file evaluates a cell
 * that starts with {@code =}, {@code +}, {@code -} or {@code @} (and a tab or carriage return before
 * one of them) as a formula; the OWASP "CSV Injection" guidance recommends prefixing such a cell with
 * a single quote so that it shows as text. Numbers are never passed through here: they are written
 * as numbers, and a negative number is not text.
 */
final class CellText {
  private CellText() {}

  /** The text, with a leading single quote when a spreadsheet would read it as a formula. */
  static String guarded(String s) {
    if (s == null || s.isEmpty()) {
      return s == null ? "" : s;
    }
    char c = s.charAt(0);
    return c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r' ? "'" + s : s;
  }

  /** A guarded text as one CSV field (RFC 4180: quoted when it holds a comma, quote or line break). */
  static String csvText(String s) {
    String g = guarded(s);
    if (g.indexOf(',') >= 0 || g.indexOf('"') >= 0 || g.indexOf('\n') >= 0 || g.indexOf('\r') >= 0) {
      return '"' + g.replace("\"", "\"\"") + '"';
    }
    return g;
  }

  /**
   * A number as plain decimal text (never {@code 1.5E7}), rounded to 6 decimals so that round-off of
   * the LP ({@code 2999.9999999999995}) reads as the figure it is; empty when not finite.
   */
  static String plain(double v) {
    if (!Double.isFinite(v)) {
      return "";
    }
    String t = java.math.BigDecimal.valueOf(v).setScale(6, java.math.RoundingMode.HALF_EVEN)
        .stripTrailingZeros().toPlainString();
    return t.equals("-0") ? "0" : t;
  }
}
