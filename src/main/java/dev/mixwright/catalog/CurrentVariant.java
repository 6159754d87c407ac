package dev.mixwright.catalog;

import java.util.Map;

/**
 * A variant on sale today (the catalog's {@code current} section): its choices as written (group →
 * option, {@code option@price} for a price point; an optional group left out holds {@code none}), the
 * one-off cost of discontinuing it, and whether the portfolio must keep it.
 */
public record CurrentVariant(Map<String, String> variant, double discontinue, boolean keep) {
  public CurrentVariant {
    variant = Catalog.orderedChoices(variant);
  }
}
