package dev.mixwright.master;

/**
 * A solved {@link PortfolioMip}: objective, the solver's best bound over the pool, y (0 or 1) and x
 * per pool variant; empty arrays unless {@link MipStatus#hasSolution()}. {@code nodes} and
 * {@code wallMs} for logs.
 */
public record MipSolution(
    MipStatus status, double objective, double bound, double[] y, double[][] x, long nodes, long wallMs) {}
