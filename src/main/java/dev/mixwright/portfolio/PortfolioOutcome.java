package dev.mixwright.portfolio;

import dev.mixwright.colgen.ValueBound;
import dev.mixwright.master.PortfolioMip;
import java.util.List;

/**
 * The end of the integer stage.
 *
 * <ul>
 *   <li>{@code result}: the portfolio's profit, Σ margin · sales − introduction costs − tooling, and
 *       an upper bound on the best portfolio over the whole space.
 *   <li>{@code offer}: what is offered and what offering it costs.
 *   <li>{@code lpBound}: the LP stage's bound; {@code relaxation}: the relaxed portfolio master's
 *       column generation, whose {@link LagrangianPortfolioBound} (prices included) also proves which
 *       variants cannot be part of a better portfolio; null when there was nothing to relax.
 *   <li>{@code proof}: the enumeration of the variants that could be part of a better portfolio.
 *   <li>{@code solver}: the MIP runs over the pool.
 *   <li>{@code range}: what the portfolio keeps, drops and adds against the range on sale today.
 * </ul>
 */
public record PortfolioOutcome(
    PortfolioStatus status,
    String reason,
    ValueBound result,
    Offer offer,
    double lpBound,
    RelaxationResult relaxation,
    SurvivorProof proof,
    MipRuns solver,
    Tree tree,
    long elapsedMs,
    RangeChange range) {

  /**
   * The variants offered; {@code introductionCosts}: introduction cost × their number plus
   * {@code toolingCosts}, the tooling of the options they use, each paid once.
   */
  public record Offer(List<OfferedVariant> variants, double introductionCosts, double toolingCosts) {
    public Offer {
      variants = List.copyOf(variants);
    }
  }

  /**
   * Variants of ψ − tooling at or below {@code threshold} (at the bound's prices) cannot be part of a
   * portfolio better than the value; {@code added}: how many above it the proof enumerated into the
   * pool; {@code complete}: all of them were; {@code poolSize}: variants in the final pool.
   */
  public record SurvivorProof(double threshold, int added, boolean complete, int poolSize) {}

  /**
   * The branch-and-price tree: {@code nodes} solved, {@code open} left when it stopped (0 when it
   * closed), {@code workers} threads.
   */
  public record Tree(long nodes, int open, int workers) {}

  /** The MIP solves over the pool: how many, and whether the last was solved to optimality. */
  public record MipRuns(PortfolioMip.Engine engine, int solves, boolean lastOptimal) {}

  /** The MIP engine's word, as written to result.json. */
  public String engine() {
    return solver.engine().word();
  }
}
