package dev.mixwright.catalog;

/**
 * The integer stage's terms: a fixed cost per distinct variant offered, the most variants offered
 * ({@code Integer.MAX_VALUE} when unlimited), and the least a variant offered is built, all segments
 * together.
 */
public record PortfolioSpec(double introductionCost, int maxVariants, double minLot) {}
