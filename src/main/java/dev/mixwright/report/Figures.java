package dev.mixwright.report;

import java.math.BigDecimal;
import java.math.MathContext;

/**
 * The rounding rule of figures written for people: a figure that is a sum of catalog figures (a unit
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
}
