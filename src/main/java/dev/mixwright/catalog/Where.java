package dev.mixwright.catalog;

import com.fasterxml.jackson.databind.JsonNode;
import java.math.BigDecimal;
import java.util.Collection;
import java.util.regex.Pattern;

/** Input paths and the small pieces of wording that problem messages share. */
public final class Where {
  private static final Pattern PLAIN_KEY = Pattern.compile("[A-Za-z0-9_\\-]+");

  private Where() {}

  /** {@code parent.key}, or {@code parent["odd key"]} when the key would not read as one step. */
  public static String field(String parent, String key) {
    if (PLAIN_KEY.matcher(key).matches()) {
      return parent.isEmpty() ? key : parent + "." + key;
    }
    String quoted = "[\"" + key.replace("\\", "\\\\").replace("\"", "\\\"") + "\"]";
    return parent + quoted;
  }

  public static String index(String parent, int i) {
    return parent + "[" + i + "]";
  }

  /** A number as people write it: 14000, 1.6, 0.000001 (no exponent for ordinary magnitudes). */
  public static String num(double x) {
    if (Double.isNaN(x) || Double.isInfinite(x)) {
      return Double.toString(x);
    }
    if (x == Math.rint(x) && Math.abs(x) < 1e15) {
      return Long.toString((long) x);
    }
    double a = Math.abs(x);
    if (a >= 1e-6 && a < 1e15) {
      return new BigDecimal(Double.toString(x)).stripTrailingZeros().toPlainString();
    }
    return Double.toString(x);
  }

  /** What a value was, for "got ..." in a message. */
  public static String describe(JsonNode v) {
    if (v == null || v.isMissingNode() || v.isNull()) {
      return "nothing";
    }
    if (v.isTextual()) {
      return quote(v.textValue());
    }
    if (v.isNumber()) {
      return "the number " + num(v.doubleValue());
    }
    if (v.isBoolean()) {
      return "the boolean " + v.booleanValue();
    }
    if (v.isArray()) {
      return "a list";
    }
    if (v.isObject()) {
      return "a mapping";
    }
    return v.getNodeType().toString().toLowerCase(java.util.Locale.ROOT);
  }

  /**
   * Control characters (C0, DEL, C1: terminal escape codes, line breaks) and the bidirectional
   * controls that can make a terminal show text other than what it holds.
   */
  static boolean unprintable(char c) {
    return c < 0x20
        || (c >= 0x7f && c <= 0x9f)
        || c == '\u2028'
        || c == '\u2029'
        || (c >= '\u202a' && c <= '\u202e')
        || (c >= '\u2066' && c <= '\u2069')
        || c == '\ufeff';
  }

  /**
   * Text safe to print on one terminal line: each unprintable character shown as {@code \\u001B},
   * and at most {@code max} characters (the cut marked with {@code ...}). Every problem message
   * passes through here, so text from a catalog or a table it names never reaches a terminal raw
   * and never more than a short excerpt of it.
   */
  public static String printable(String s, int max) {
    StringBuilder b = new StringBuilder(Math.min(s.length(), max) + 16);
    for (int i = 0; i < s.length(); i++) {
      if (b.length() >= max) {
        b.append("...");
        break;
      }
      char c = s.charAt(i);
      if (unprintable(c)) {
        b.append(String.format(java.util.Locale.ROOT, "\\u%04X", (int) c));
      } else {
        b.append(c);
      }
    }
    return b.toString();
  }

  static String quote(String s) {
    String shown = printable(s, 40);
    return "\"" + shown + "\"";
  }

  /**
   * {@code a, b, c} — or {@code (none)} for an empty list. Each item is cut to a short printable
   * excerpt, so one over-long id does not fill every message that lists its neighbours.
   */
  public static String list(Collection<String> items) {
    if (items.isEmpty()) {
      return "(none)";
    }
    StringBuilder b = new StringBuilder();
    for (String item : items) {
      if (b.length() > 0) {
        b.append(", ");
      }
      b.append(printable(item, Limits.MAX_ID_LENGTH));
    }
    return b.toString();
  }

  /**
   * The candidate closest to a misspelt word, or null when none is close enough to be a likely
   * typo: equal ignoring case, or within edit distance 1 (short words) or 2 (words of 5+ letters).
   */
  public static String closest(String word, Collection<String> candidates) {
    String best = null;
    int bestDistance = Integer.MAX_VALUE;
    int allowed = word.length() >= 5 ? 2 : 1;
    if (word.length() > Limits.MAX_ID_LENGTH + allowed) {
      return null; // too long to be an id: refused on its own, and the edit distance would be slow
    }
    for (String c : candidates) {
      if (Math.abs(c.length() - word.length()) > allowed) {
        continue; // the edit distance is at least the difference in length
      }
      int d = c.equalsIgnoreCase(word) ? 0 : editDistance(word, c);
      if (d < bestDistance) {
        bestDistance = d;
        best = c;
      }
    }
    return bestDistance <= allowed ? best : null;
  }

  /** {@code " — did you mean 'x'?"} or the empty string. */
  public static String didYouMean(String word, Collection<String> candidates) {
    String c = closest(word, candidates);
    return c == null ? "" : " — did you mean '" + c + "'?";
  }

  // Edit distance with adjacent transpositions (optimal string alignment), O(|a|·|b|): "brazign" is
  // one step from "brazing". Words here are short ids and field names.
  private static int editDistance(String a, String b) {
    int[][] d = new int[a.length() + 1][b.length() + 1];
    for (int i = 0; i <= a.length(); i++) {
      d[i][0] = i;
    }
    for (int j = 0; j <= b.length(); j++) {
      d[0][j] = j;
    }
    for (int i = 1; i <= a.length(); i++) {
      for (int j = 1; j <= b.length(); j++) {
        int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
        d[i][j] = Math.min(d[i - 1][j - 1] + cost, Math.min(d[i - 1][j], d[i][j - 1]) + 1);
        if (i > 1
            && j > 1
            && a.charAt(i - 1) == b.charAt(j - 2)
            && a.charAt(i - 2) == b.charAt(j - 1)) {
          d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
        }
      }
    }
    return d[a.length()][b.length()];
  }
}
