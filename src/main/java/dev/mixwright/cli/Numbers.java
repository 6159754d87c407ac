package dev.mixwright.cli;

import dev.mixwright.report.Figures;

/** The commands' short name for {@link Figures}' formats, the one number format of every view. */
final class Numbers {
  private Numbers() {}

  static String money(double v) {
    return Figures.money(v);
  }

  static String units(double v) {
    return Figures.units(v);
  }

  static String price(double v) {
    return Figures.price(v);
  }

  static String qty(double v) {
    return Figures.qty(v);
  }

  static String percent(double gap) {
    return Figures.percent(gap);
  }

  static String signed(double v) {
    return Figures.signed(v);
  }
}
