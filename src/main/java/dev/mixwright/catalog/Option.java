package dev.mixwright.catalog;

import java.util.List;
import java.util.Map;

/**
 * One option of an option group: what it adds to list price and variable cost, and how much of each
 * shared resource one unit with this option uses (resource id to amount; absent means zero).
 * {@code tooling}: a one-off cost of the integer stage, paid once if any offered variant uses this
 * option (0 when the catalog gives none).
 *
 * <p>{@code prices} holds the option's price points in the order of the file: one entry when the
 * file gives {@code price}, several when it gives {@code prices: [760, 820, 880]}. Each point is a
 * choice of its own in the variant space (written {@code option@price}); the file form {@code price:
 * 760} and {@code prices: [760]} are the same option.
 */
public record Option(
    String id,
    String label,
    List<Double> prices,
    double cost,
    Map<String, Double> uses,
    double tooling) {

  public Option {
    prices = List.copyOf(prices);
    if (prices.isEmpty()) {
      throw new IllegalArgumentException("option '" + id + "' needs at least one price");
    }
    uses = Map.copyOf(uses);
  }

  public Option(String id, String label, double price, double cost, Map<String, Double> uses, double tooling) {
    this(id, label, List.of(price), cost, uses, tooling);
  }

  /**
   * This option with other price points and every other field kept. Scenarios change options only
   * through here and {@link #withCost}, so a field added to this record is carried over in one place.
   */
  public Option withPrices(List<Double> newPrices) {
    return new Option(id, label, newPrices, cost, uses, tooling);
  }

  /** This option with another cost and every other field kept. */
  public Option withCost(double newCost) {
    return new Option(id, label, prices, newCost, uses, tooling);
  }

  /**
   * The option's price; with several price points, the first listed. Code that handles variants
   * should take the price of the chosen point from {@code VariantSpace.choicePrice}.
   */
  public double price() {
    return prices.get(0);
  }

  /** Number of price points (1 for an option with a single {@code price}). */
  public int pricePointCount() {
    return prices.size();
  }

  public boolean hasPricePoints() {
    return prices.size() > 1;
  }

  /** Price minus cost at the first (or only) price point. */
  public double margin() {
    return price() - cost;
  }

  /**
   * How point k is written in a variant: {@code c12@5300} for an option with several price points,
   * the bare id otherwise.
   */
  public String pointId(int k) {
    return hasPricePoints() ? id + PRICE_MARK + Where.num(prices.get(k)) : id;
  }

  /** Separates an option id from its price point in a variant: {@code capacity=c12@5300}. */
  public static final char PRICE_MARK = '@';
}
