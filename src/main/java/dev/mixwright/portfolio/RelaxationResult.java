package dev.mixwright.portfolio;

/**
 * The end of the relaxation's column generation. {@code objective}: the relaxed master's optimum over
 * the final pool. {@code bound}: the best {@link LagrangianPortfolioBound} found (valid for the integer
 * portfolio over the whole space), with its prices. {@code converged}: exact pricing found no variant
 * that would improve the relaxed master, so {@code objective} is the relaxation's optimum over the
 * whole space. {@code y}: the relaxed introductions per pool variant (pool order) at the end.
 * {@code lpPriceBound}: the bound at the LP stage's shadow prices, for comparison. {@code segmentCuts}:
 * the cuts on segments' demand rows the master holds ({@link SegmentCuts}); with any, {@code objective}
 * is the optimum of the relaxation with them, which is tighter than the plain relaxation. {@code
 * plainBound}: the best bound before the first cut (the same as {@code bound} without cuts); at its prices
 * every variant's value is the ψ of docs/portfolio.md, with no cut dual, so a variant's test against it
 * (the run's explanations) needs nothing but the variant ({@link #bound}'s prices also hold the r·γ of
 * the cuts' variants, which only the stage knows).
 *
 * <p>{@code converged} is set only when no variant outside the pool has ψ above the variant limit's
 * price λ at the master's duals (the pricer's ψ is an upper bound on what the variant's block can
 * earn, its caps being the looser buyers_s for choosing segments): then those duals, with zero on
 * the rows of absent variants, are feasible for the dual of the relaxation over the whole space,
 * and {@code objective} is that relaxation's optimum. Every integer portfolio is feasible in that
 * relaxation (y ∈ {0, 1} relaxed to [0, 1]), so the objective is then itself a bound valid for the
 * whole space, often far below the Lagrangian bound when segments choose: {@link #provenBound}.
 */
public record RelaxationResult(
    double objective,
    LagrangianPortfolioBound bound,
    boolean converged,
    int rounds,
    double[] y,
    double lpPriceBound,
    long elapsedMs,
    int segmentCuts,
    LagrangianPortfolioBound plainBound) {

  /** The least bound on the integer portfolio over the whole space this relaxation proves. */
  public double provenBound() {
    return converged ? Math.min(objective, bound.value()) : bound.value();
  }
}
