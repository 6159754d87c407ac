package dev.mixwright.colgen;

/**
 * One round of the loop: master objective at this round's duals, the bound proven by this round's
 * pricing (the best so far), the relative gap, columns in the master, columns added this round, and
 * whether the pricing was exact (only exact rounds can tighten the bound).
 */
public record IterationRecord(
    int iteration, double objective, double bound, double gap, int columns, int added,
    boolean exactPricing, long elapsedMs) implements Progress {}
