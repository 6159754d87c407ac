package dev.mixwright.colgen;

/**
 * A column of the master: variant {@code choices} sold in {@code segment}, with its unit margin,
 * resource use per unit and upper bound (maxShare · demand). {@code iteration} is the round that
 * added it (0 for the seed). {@code reducedCostAtEntry} is its reduced cost when it entered.
 */
public record Column(
    int segment, int[] choices, double margin, double[] use, double upper, int iteration,
    double reducedCostAtEntry) {}
