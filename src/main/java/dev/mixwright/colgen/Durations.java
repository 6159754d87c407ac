package dev.mixwright.colgen;

import java.util.Locale;

/** Parses and prints durations the way people type them: {@code 90s}, {@code 10m}, {@code 2h}, {@code 1500ms}. */
public final class Durations {
  private Durations() {}

  /** Milliseconds, or throws IllegalArgumentException with the accepted forms. */
  public static long parse(String text) {
    String t = text.trim().toLowerCase(Locale.ROOT);
    try {
      if (t.endsWith("ms")) {
        return Math.round(Double.parseDouble(t.substring(0, t.length() - 2)));
      }
      double unit =
          switch (t.isEmpty() ? ' ' : t.charAt(t.length() - 1)) {
            case 's' -> 1000;
            case 'm' -> 60_000;
            case 'h' -> 3_600_000;
            default -> -1;
          };
      double v = unit < 0 ? Double.parseDouble(t) * 1000 : Double.parseDouble(t.substring(0, t.length() - 1)) * unit;
      if (!(v >= 0) || Double.isInfinite(v)) {
        throw new NumberFormatException();
      }
      return Math.round(v);
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException(
          "'" + text + "' is not a duration; write e.g. 90s, 10m, 2h or 1500ms");
    }
  }

  public static String format(long millis) {
    if (millis < 1000) {
      return millis + " ms";
    }
    if (millis < 120_000) {
      return String.format(Locale.ROOT, "%.1f s", millis / 1000.0);
    }
    if (millis < 7_200_000) {
      return String.format(Locale.ROOT, "%.1f min", millis / 60_000.0);
    }
    return String.format(Locale.ROOT, "%.1f h", millis / 3_600_000.0);
  }
}
