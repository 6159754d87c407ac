package dev.mixwright.catalog;

import java.util.Map;

/**
 * One choice of an option group: what it adds to list price and variable cost, and how much of each
 * shared resource one unit with this option uses (resource id to amount; absent means zero).
 */
public record Option(String id, String label, double price, double cost, Map<String, Double> uses) {
  public Option {
    uses = Map.copyOf(uses);
  }

  public double margin() {
    return price - cost;
  }
}
