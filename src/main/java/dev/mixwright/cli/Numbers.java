package dev.mixwright.cli;

import java.util.Locale;

/**
 * Number formats for people, one per kind of figure, each with thousands separators and a fixed
 * number of decimals, so a column of figures of one kind lines up and reads alike everywhere:
 *
 * <ul>
 *   <li>{@link #money}: 2 decimals — objective, bounds, margins, costs;
 *   <li>{@link #units}: whole units — quantities sold, demand, capacities, lots (an LP plan's
 *       fractions of a unit are round-off for a planner; the files keep them);
 *   <li>{@link #price}: 4 decimals — shadow prices and reduced costs, money per unit of a resource
 *       or segment, often small;
 *   <li>{@link #percent}: 3 decimals — gaps and shares; a gap below 0.0005% shows as 0.000%.
 * </ul>
 *
 * {@link #qty} is for a figure whose kind the caller does not know (a catalog field in a comparison):
 * whole when whole, else 2 decimals. Not finite: "—".
 */
final class Numbers {
  private Numbers() {}

  static String money(double v) {
    return fixed(v, "%,.2f");
  }

  static String units(double v) {
    return fixed(v, "%,.0f");
  }

  static String price(double v) {
    return fixed(v, "%,.4f");
  }

  static String qty(double v) {
    if (Double.isFinite(v) && Math.abs(v - Math.rint(v)) < 1e-6) {
      return fixed(v, "%,.0f");
    }
    return fixed(v, "%,.2f");
  }

  static String percent(double gap) {
    if (!Double.isFinite(gap)) {
      return "—";
    }
    return fixed(Math.abs(gap) < 5e-6 ? 0.0 : gap * 100, "%.3f") + "%";
  }

  static String signed(double v) {
    return fixed(v, "%+,.4f");
  }

  private static String fixed(double v, String format) {
    if (!Double.isFinite(v)) {
      return "—";
    }
    String s = String.format(Locale.ROOT, format, v);
    // -0.00 is 0.00 to a reader
    return s.matches("-[0.,]*") ? s.substring(1) : s;
  }
}
