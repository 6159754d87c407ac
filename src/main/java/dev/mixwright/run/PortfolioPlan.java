package dev.mixwright.run;

import dev.mixwright.portfolio.PortfolioSettings;

/**
 * Whether a run goes on to the integer stage when its catalog has a portfolio section, and with
 * which settings.
 */
public record PortfolioPlan(boolean run, PortfolioSettings settings) {
  public static PortfolioPlan defaults() {
    return new PortfolioPlan(true, PortfolioSettings.defaults());
  }
}
