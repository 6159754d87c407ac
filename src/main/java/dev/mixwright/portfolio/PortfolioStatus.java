package dev.mixwright.portfolio;

import java.util.Locale;

/** Whether the integer portfolio is proven optimal over the whole space. */
public enum PortfolioStatus {
  /** Optimal over the whole space (to the relative gap of the settings). */
  PROVEN,
  /** Feasible, with a valid bound, but not proven optimal. */
  HEURISTIC;

  public String word() {
    return name().toLowerCase(Locale.ROOT);
  }

  public boolean isProven() {
    return this == PROVEN;
  }
}
