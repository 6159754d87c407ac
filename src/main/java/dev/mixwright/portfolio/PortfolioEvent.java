package dev.mixwright.portfolio;

/**
 * One step of the integer stage, for the log and the progress line. {@code kind}: {@code relaxation}
 * (a round of the relaxation's column generation: {@code value} its objective, {@code bound} the
 * bound after it), {@code incumbent} (a better portfolio: {@code value}, {@code bound} the best bound
 * so far), {@code mip} (a MIP solve over the pool: {@code value}, {@code bound} the solver's bound
 * over the pool only), {@code survivors} (an enumeration: {@code count} found, {@code value} the
 * threshold), {@code end}. {@code pool}: variants in the pool. {@code note}: words for people.
 */
public record PortfolioEvent(
    String kind, long elapsedMs, double value, double bound, int pool, int count, String note) {}
