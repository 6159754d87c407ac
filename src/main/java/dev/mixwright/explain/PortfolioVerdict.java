package dev.mixwright.explain;

/**
 * Why a variant is in or out of the integer portfolio. {@code offered}: it is in, selling
 * {@code sales} per segment (aligned with the catalog's segments) for {@code margin}.
 * Otherwise the test of the proof: at the relaxation's prices its reduced cost per segment is
 * {@code reducedCost} (−∞ where the segment does not take it), its best lot earns {@code lotValue}
 * (−∞ when no lot of at least minLot fits), ψ = lotValue − introduction cost, and any portfolio
 * holding it is worth at most {@code boundWith} (after its own options' tooling); {@code ruledOut}
 * when that is at or below {@code portfolioValue}. {@code proven}: the run proved its portfolio
 * optimal, so a variant not ruled out was checked by the MIP.
 */
public record PortfolioVerdict(
    boolean offered,
    double[] sales,
    double margin,
    double[] reducedCost,
    double lotValue,
    double psi,
    double tooling,
    double boundWith,
    double portfolioValue,
    boolean ruledOut,
    boolean proven) {}
