package dev.mixwright.portfolio;

import java.util.Locale;

/**
 * One step of the integer stage, for the log and the progress line: what {@code value} and
 * {@code bound} mean depends on the {@link Kind}. {@code pool}: variants in the pool. {@code count}:
 * variants the step concerns. {@code note}: words for people.
 */
public record PortfolioEvent(
    Kind kind, long elapsedMs, double value, double bound, int pool, int count, String note) {

  /** The kinds of step. */
  public enum Kind {
    /** A round of the relaxation's column generation: value its objective, bound the bound after it. */
    RELAXATION,
    /** A better portfolio: value, bound the best bound so far. */
    INCUMBENT,
    /** A MIP solve over the pool: value, bound the solver's bound over the pool only. */
    MIP,
    /** An enumeration of the variants that could be part of a better portfolio: count found, value the threshold. */
    SURVIVORS,
    /** The branch-and-price tree ended: value the incumbent, bound the tree's, count the nodes solved. */
    TREE,
    /** The stage ended: value and bound are the outcome's. */
    END;

    /** The word written to the log. */
    public String word() {
      return name().toLowerCase(Locale.ROOT);
    }

    /** Steps whose value is that of a feasible portfolio. */
    public boolean isPortfolio() {
      return this == INCUMBENT || this == END;
    }
  }
}
