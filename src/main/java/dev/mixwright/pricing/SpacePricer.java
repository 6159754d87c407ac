package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

/**
 * The common part of every pricer over one {@link VariantSpace}: its name, and a query checked
 * against the space in one place before the search sees it.
 */
abstract class SpacePricer implements Pricer {
  final VariantSpace space;
  private final String name;

  SpacePricer(VariantSpace space, String name) {
    this.space = space;
    this.name = name;
  }

  @Override
  public final String name() {
    return name;
  }

  @Override
  public final PricingOutcome price(PricingQuery q) {
    QueryChecks.check(space, q);
    return search(q);
  }

  /** The search of this pricer, for a query already checked against the space. */
  abstract PricingOutcome search(PricingQuery q);
}
