package dev.mixwright.pricing;

import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.Set;

/**
 * One query as a k-best search sees it: the weights, the k best leaves so far and the pruning level
 * they set, the nodes spent and the bound of what a stopped search left open. Every exact search
 * keeps its leaves here, so that they score, exclude and report alike.
 */
final class QueryRun {
  final double[] w;
  final double constant;
  final double threshold;
  private final VariantSpace space;
  private final int[] offset;
  private final Set<VariantKey> excluded;
  private final Cancellation cancel;
  private final PricingQuery query;
  private final TopK top;
  /** Nodes spent, counted by the search. */
  long nodes;
  /** The largest bound of a part the search left unexplored; -∞ while none. */
  double openBound = Double.NEGATIVE_INFINITY;

  QueryRun(VariantSpace space, PricingQuery q) {
    this.space = space;
    this.offset = space.offsets();
    this.w = q.weight();
    this.constant = q.constant();
    this.threshold = q.threshold();
    this.excluded = q.excluded();
    this.cancel = q.cancel();
    this.query = q;
    this.top = new TopK(q.k(), space.groupCount());
  }

  /** Scores at or below this can be pruned: the threshold, or the k-th best once k are held. */
  double cutoff() {
    return top.cutoff(threshold);
  }

  /**
   * Whether the search for the k best must stop before its next node: the node limit is reached, or
   * the query's {@link Cancellation} asks (looked at every 4096 nodes, a few microseconds apart) and
   * {@link PricingQuery#mayStop} allows it.
   */
  boolean spent(long limit) {
    return nodes >= limit || ((nodes & 0xFFF) == 0 && query.mayStop(top.size()));
  }

  /**
   * {@link #spent} for a search that only proves bounds (it finds no variant to return), which may
   * stop on cancellation whatever it holds.
   */
  boolean boundSpent(long limit) {
    return nodes >= limit || ((nodes & 0xFFF) == 0 && cancel.requested());
  }

  /** Whether a search that holds what this one holds may stop now; see {@link PricingQuery#mayStop}. */
  boolean mayStop() {
    return query.mayStop(top.size());
  }

  /** Records a part left unexplored whose variants score at most {@code bound}. */
  void leaveOpen(double bound) {
    openBound = Math.max(openBound, bound);
  }

  /** Offers a buildable variant: kept when it beats the cutoff and is not excluded. */
  void leaf(int[] v) {
    double s = QueryChecks.score(offset, w, constant, v);
    if (s > top.cutoff(threshold) && (excluded.isEmpty() || !excluded.contains(space.key(v)))) {
      top.offer(v, s);
    }
  }

  PricingOutcome outcome(boolean complete) {
    return QueryChecks.outcome(top, threshold, complete, openBound, nodes);
  }
}
