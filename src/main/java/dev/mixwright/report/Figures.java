package dev.mixwright.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Locale;

/**
 * Figures written for people, in one place so that the terminal, the HTML page, the comparison and
 * the sweep table read alike.
 *
 * <p>Formats, one per kind of figure, each with thousands separators and a fixed number of decimals,
 * so a column of figures of one kind lines up:
 *
 * <ul>
 *   <li>{@link #money}: 2 decimals — objective, bounds, margins, costs;
 *   <li>{@link #units}: whole units — quantities sold, demand, capacities, lots (an LP plan's
 *       fractions of a unit are round-off for a planner; the files keep them);
 *   <li>{@link #price}: 4 decimals — shadow prices and reduced costs, money per unit of a resource
 *       or segment, often small;
 *   <li>{@link #percent}: 3 decimals — gaps; a gap below 0.0005% shows as 0.000%;
 *   <li>{@link #share}: 1 decimal — shares of buyers and attach rates;
 *   <li>{@link #weight}: 3 decimals — a scenario's weight, a fraction of 1;
 *   <li>{@link #attraction}: 4 significant digits — a multinomial logit attraction w, which spans
 *       orders of magnitude;
 *   <li>{@link #signedPercent}: 3 decimals with a sign — a relative change.
 * </ul>
 *
 * {@link #qty} is for a figure whose kind the caller does not know (a catalog field in a comparison):
 * whole when whole, else 2 decimals. Not finite: "—".
 *
 * <p>The rounding rule of {@link #catalogSum}: a figure that is a sum of catalog figures (a unit
 * margin: prices, costs and segment values of the chosen options) is written rounded to 12
 * significant digits, so that 1540 from the catalog is not written 1540.0000000000002 by the round-off
 * of adding doubles. Twelve digits keep every figure a catalog plausibly gives (a price to the cent
 * up to 10^9) and drop the noise, which sits near the 16th digit. Figures the LP computes (quantities,
 * objective, duals) are written as computed.
 */
public final class Figures {
  private Figures() {}

  private static final MathContext DIGITS = new MathContext(12);

  public static double catalogSum(double v) {
    if (!Double.isFinite(v) || v == 0) {
      return v == 0 ? 0.0 : v;
    }
    return new BigDecimal(v).round(DIGITS).doubleValue();
  }

  public static String money(double v) {
    return fixed(v, "%,.2f");
  }

  /** Money that may be absent (a bound not proven yet): "—". */
  public static String money(Double v) {
    return v == null ? "—" : money(v.doubleValue());
  }

  public static String units(double v) {
    return fixed(v, "%,.0f");
  }

  public static String price(double v) {
    return fixed(v, "%,.4f");
  }

  public static String qty(double v) {
    if (Double.isFinite(v) && Math.abs(v - Math.rint(v)) < 1e-6) {
      return fixed(v, "%,.0f");
    }
    return fixed(v, "%,.2f");
  }

  public static String percent(double gap) {
    if (!Double.isFinite(gap)) {
      return "—";
    }
    return fixed(Math.abs(gap) < 5e-6 ? 0.0 : gap * 100, "%.3f") + "%";
  }

  /** A gap that may be absent (no bound yet): "—". */
  public static String percent(Double gap) {
    return gap == null ? "—" : percent(gap.doubleValue());
  }

  public static String share(double fraction) {
    return Double.isFinite(fraction) ? fixed(100 * fraction, "%.1f") + "%" : "—";
  }

  public static String weight(double w) {
    return fixed(w, "%.3f");
  }

  public static String attraction(double w) {
    return fixed(w, "%.4g");
  }

  /** A relative change (a fraction) in percent, with its sign: +1.250%. */
  public static String signedPercent(double fraction) {
    return Double.isFinite(fraction) ? fixed(100 * fraction, "%+,.3f") + "%" : "—";
  }

  /** Money rounded to whole units of the currency, where a line has little room (the live progress line). */
  public static String wholeMoney(double v) {
    return fixed(v, "%,.0f");
  }

  /** A change in money per unit, with its sign. */
  public static String signed(double v) {
    return fixed(v, "%+,.4f");
  }

  /** A change in money, with its sign. */
  public static String signedMoney(double v) {
    return fixed(v, "%+,.2f");
  }

  private static String fixed(double v, String format) {
    if (!Double.isFinite(v)) {
      return "—";
    }
    String s = String.format(Locale.ROOT, format, v);
    // -0.00 is 0.00 to a reader
    return s.matches("[-+][0.,]*") ? s.substring(1) : s;
  }
}
