package dev.mixwright.pricing;

/**
 * A variant found by pricing, with its score: the reduced cost of the column in the segment priced
 * (column generation), or its value ψ over all segments at once in the portfolio relaxation, the
 * reduced cost of a variant there.
 */
public record PricedVariant(int[] choices, double reducedCost) {}
