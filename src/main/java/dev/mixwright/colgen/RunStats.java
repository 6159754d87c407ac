package dev.mixwright.colgen;

/**
 * Where a run spent its effort, for benchmarks and logs: master re-solves and their wall time,
 * exact and heuristic pricing calls and their wall time, exact pricing rounds, rounds repeated
 * because smoothed duals mispriced, and columns retired and brought back.
 */
public record RunStats(
    int masterSolves, long masterNanos, int exactCalls, long exactNanos, int heuristicCalls,
    long heuristicNanos, int exactRounds, int mispricings, int retired, int revived) {}
