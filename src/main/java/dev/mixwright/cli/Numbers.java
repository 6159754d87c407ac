package dev.mixwright.cli;

import java.util.Locale;

/** Number formats for people. */
final class Numbers {
  private Numbers() {}

  static String money(double v) {
    if (!Double.isFinite(v)) {
      return "—";
    }
    return String.format(Locale.ROOT, "%,.2f", v);
  }

  static String qty(double v) {
    if (Math.abs(v - Math.rint(v)) < 1e-6) {
      return String.format(Locale.ROOT, "%,.0f", v);
    }
    return String.format(Locale.ROOT, "%,.2f", v);
  }

  static String percent(double gap) {
    if (!Double.isFinite(gap)) {
      return "—";
    }
    if (gap == 0) {
      return "0%";
    }
    if (gap < 1e-4) {
      return String.format(Locale.ROOT, "%.1e", gap);
    }
    return String.format(Locale.ROOT, "%.3f%%", gap * 100);
  }

  static String signed(double v) {
    return String.format(Locale.ROOT, "%+,.4f", v);
  }
}
