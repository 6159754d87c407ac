package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

/**
 * An exact search that may be stopped after a number of nodes, keeping a valid upper bound; the
 * policy of {@link BranchAndBoundPricer} runs such searches on budgets of its own.
 */
abstract class NodeLimitedPricer extends SpacePricer {
  private final long nodeLimit;

  /**
   * @param nodeLimit most search nodes per query; when reached the outcome is not exact but keeps a
   *     valid upper bound. {@code Long.MAX_VALUE} for none.
   */
  NodeLimitedPricer(VariantSpace space, String name, long nodeLimit) {
    super(space, name);
    if (nodeLimit < 1) {
      throw new IllegalArgumentException("nodeLimit must be >= 1");
    }
    this.nodeLimit = nodeLimit;
  }

  @Override
  final PricingOutcome search(PricingQuery q) {
    return price(q, nodeLimit);
  }

  /** {@link #search(PricingQuery)} on a node budget of its own, for a query already checked. */
  abstract PricingOutcome price(PricingQuery q, long nodeBudget);
}
