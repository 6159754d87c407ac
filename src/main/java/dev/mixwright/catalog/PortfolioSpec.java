package dev.mixwright.catalog;

/**
 * The integer stage's terms: a fixed cost per distinct variant offered, the most variants offered
 * ({@code Integer.MAX_VALUE} when unlimited), the least a variant offered is built, all segments
 * together, and whether sales must be whole units ({@code wholeUnits}; false: any quantity).
 */
public record PortfolioSpec(double introductionCost, int maxVariants, double minLot, boolean wholeUnits) {

  /** Terms with sales in any quantity. */
  public PortfolioSpec(double introductionCost, int maxVariants, double minLot) {
    this(introductionCost, maxVariants, minLot, false);
  }
}
