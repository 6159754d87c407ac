package dev.mixwright.colgen;

/**
 * Which columns of a segment that chooses enter the master in a round, out of those that pay. The
 * pricer is asked for {@code asked} × perRound columns by reduced cost d; {@code entering} ×
 * perRound of them enter, ranked by d itself or by w·d — the rate at which raising a column's sales
 * along its row x_j ≤ w_j·x_s0 improves the master (a column of attraction w can sell only w times
 * what stays out, so a high d on a tiny w buys little). Exactness does not depend on the choice: the
 * loop stops on the sign test and the bound in every mode. Fixed segments are not affected.
 */
public enum ChoiceEntry {
  /** The perRound best by d, as for a fixed segment. */
  BY_REDUCED_COST(1, 1, false, false),
  /** The 3 × perRound best by d all enter. */
  MORE_BY_REDUCED_COST(3, 3, false, false),
  /** Of the 3 × perRound best by d, the perRound best by w·d enter. */
  BY_RATE(3, 1, true, false),
  /**
   * As {@link #BY_RATE}, the candidates widened by a search for high w·d (pricing u + d/D, see
   * {@code ColumnGeneration.rateSearch}); 2 × perRound enter.
   */
  RATE_SEARCH(3, 2, true, true, false),
  /**
   * The paying columns of the 3 × perRound asked that the best offer set at the master's prices
   * would hold enter ({@code ColumnGeneration.offered}), and a segment whose batch came back full
   * of paying columns is asked for twice as many in the next round (up to {@link #GROWTH_CAP} ×
   * perRound). Why: at fixed resource prices the best offer set of a multinomial-logit segment is
   * revenue-ordered (Talluri &amp; van Ryzin 2004, Management Science 50(1)), i.e. the best columns
   * by d form one prefix, which can run to thousands; entering it by doubling takes O(log n) rounds
   * instead of n / (2 × perRound).
   */
  GROWING(3, 3, false, false, true);

  /** Measured on the choosing benchmark pairs: docs/choice.md and docs/performance.md. */
  public static final ChoiceEntry DEFAULT = GROWING;

  /**
   * Largest batch of a growing segment, in multiples of perRound. Measured on the 1.34·10^9-variant
   * benchmark pair (one run each, machine loaded; docs/performance.md): 256 proved the optimum in
   * 59 s and 73 rounds, 1024 in 32 s and 31 rounds, 4096 in 48 s and 20 rounds (more columns that
   * end up selling nothing, each priced and kept).
   */
  static final int GROWTH_CAP = 1024;

  private final int asked;
  private final int entering;
  private final boolean byRate;
  private final boolean searchesRate;
  private final boolean grows;

  ChoiceEntry(int asked, int entering, boolean byRate, boolean searchesRate) {
    this(asked, entering, byRate, searchesRate, false);
  }

  ChoiceEntry(int asked, int entering, boolean byRate, boolean searchesRate, boolean grows) {
    this.asked = asked;
    this.entering = entering;
    this.byRate = byRate;
    this.searchesRate = searchesRate;
    this.grows = grows;
  }

  /** True when a segment's batch doubles while it comes back full of paying columns; all paying enter. */
  boolean grows() {
    return grows;
  }

  /** The batch after one that came back full, given perRound. */
  int grown(int batch, int perRound) {
    return (int) Math.min((long) batch * 2, (long) GROWTH_CAP * perRound);
  }

  /** True when extra pricing calls look for columns of high w·d. */
  boolean searchesRate() {
    return searchesRate;
  }

  /** Columns asked of the pricer for a choosing segment, given perRound. */
  int asked(int perRound) {
    return asked * perRound;
  }

  /** Columns of a choosing segment that may enter in a round, given perRound. */
  int entering(int perRound) {
    return entering * perRound;
  }

  /** True when the entering columns are ranked by w·d rather than d. */
  boolean byRate() {
    return byRate;
  }
}
