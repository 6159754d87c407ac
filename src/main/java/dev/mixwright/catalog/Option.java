package dev.mixwright.catalog;

import java.util.Map;

/**
 * One choice of an option group: what it adds to list price and variable cost, and how much of each
 * shared resource one unit with this option uses (resource id to amount; absent means zero).
 * {@code tooling}: a one-off cost of the integer stage, paid once if any offered variant uses this
 * option (0 when the catalog gives none).
 */
public record Option(
    String id, String label, double price, double cost, Map<String, Double> uses, double tooling) {
  public Option {
    uses = Map.copyOf(uses);
  }

  public Option(String id, String label, double price, double cost, Map<String, Double> uses) {
    this(id, label, price, cost, uses, 0.0);
  }

  /**
   * This option with another price and cost and every other field kept. Scenarios change options
   * only through here, so a field added to this record is carried over in one place.
   */
  public Option withPriceAndCost(double newPrice, double newCost) {
    return new Option(id, label, newPrice, newCost, uses, tooling);
  }

  public double margin() {
    return price - cost;
  }
}
