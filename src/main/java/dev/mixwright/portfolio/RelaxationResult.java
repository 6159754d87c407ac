package dev.mixwright.portfolio;

/**
 * The end of the relaxation's column generation. {@code objective}: the relaxed master's optimum over
 * the final pool. {@code bound}: the best {@link LagrangianPortfolioBound} found (valid for the integer
 * portfolio over the whole space), with its prices. {@code converged}: exact pricing found no variant
 * that would improve the relaxed master, so {@code objective} is the relaxation's optimum over the
 * whole space. {@code y}: the relaxed introductions per pool variant (pool order) at the end.
 * {@code lpPriceBound}: the bound at the LP stage's shadow prices, for comparison.
 */
public record RelaxationResult(
    double objective,
    LagrangianPortfolioBound bound,
    boolean converged,
    int rounds,
    double[] y,
    double lpPriceBound,
    long elapsedMs) {}
