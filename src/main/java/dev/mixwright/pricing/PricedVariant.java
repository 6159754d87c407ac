package dev.mixwright.pricing;

/** A variant found by pricing, with its reduced cost in the segment priced. */
public record PricedVariant(int[] choices, double reducedCost) {}
