package dev.mixwright.portfolio;

import java.util.List;

/**
 * The end of the integer stage.
 *
 * <ul>
 *   <li>{@code value}: the portfolio's profit, Σ margin · sales − introduction costs − tooling;
 *       {@code bound}: an upper bound on the best portfolio over the whole space; {@code gap}:
 *       (bound − value) / max(1, |value|).
 *   <li>{@code variants}: what is offered; {@code introductionCosts}: introduction cost × their number
 *       plus {@code toolingCosts}, the tooling of the options they use, each paid once.
 *   <li>{@code lpBound}: the LP stage's bound; {@code relaxation}: the relaxed portfolio master's
 *       column generation, whose {@link LagrangianBound} (prices included) also proves which variants
 *       cannot be part of a better portfolio.
 *   <li>{@code survivorThreshold}: variants of ψ − tooling at or below it (at the bound's prices)
 *       cannot be part of a portfolio better than {@code value}; {@code survivorsAdded}: how many
 *       above it the proof enumerated into the pool; {@code survivorsComplete}: all of them were.
 *   <li>{@code engine}, {@code mipSolves}, {@code mipOptimal}: the MIP runs over the pool, the last of
 *       them solved to optimality; {@code poolSize}: variants in the final pool.
 * </ul>
 */
public record PortfolioOutcome(
    PortfolioStatus status,
    String reason,
    double value,
    double bound,
    double gap,
    List<OfferedVariant> variants,
    double introductionCosts,
    double toolingCosts,
    double lpBound,
    RelaxationResult relaxation,
    double survivorThreshold,
    int survivorsAdded,
    boolean survivorsComplete,
    String engine,
    int mipSolves,
    boolean mipOptimal,
    int poolSize,
    long elapsedMs) {

  public PortfolioOutcome {
    variants = List.copyOf(variants);
  }
}
