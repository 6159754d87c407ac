package dev.mixwright.catalog;

import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A market. {@code demand}: units per period it buys at most, all variants together;
 * {@code maxShare}: the largest share of that demand one variant may take; {@code accepts}: groups a
 * variant sold here must match (group id to allowed choices; empty means any); {@code value}: what
 * this segment pays extra (or less) per unit for a choice, keyed {@code "group.option"}.
 *
 * <p>A segment that chooses ({@link #chooses()}) has a {@link Choice} instead of a fixed demand: its
 * sales follow from what is offered to it. For such a segment {@code demand} is its number of
 * buyers and {@code maxShare} is 1, so that {@link #demand()} and {@link #columnBound()} stay valid
 * caps — no variant and no set of variants sells more than the segment's buyers — which is what the
 * Lasdon-type bound needs. Build one with {@link #choosing}.
 */
public record Segment(
    String id,
    String label,
    double demand,
    double maxShare,
    Map<String, List<String>> accepts,
    Map<String, Double> value,
    Optional<Choice> choice) {

  public Segment {
    accepts = Catalog.orderedCopy(accepts);
    value = Map.copyOf(value);
    if (choice.isPresent()
        && (Double.compare(demand, choice.get().buyers()) != 0 || maxShare != 1)) {
      throw new IllegalArgumentException(
          "segment '" + id + "' chooses: its demand must be its buyers and its maxShare 1");
    }
  }

  /** A segment with a fixed demand. */
  public Segment(
      String id,
      String label,
      double demand,
      double maxShare,
      Map<String, List<String>> accepts,
      Map<String, Double> value) {
    this(id, label, demand, maxShare, accepts, value, Optional.empty());
  }

  /** A segment that chooses: demand is its buyers, maxShare 1. */
  public static Segment choosing(
      String id,
      String label,
      Map<String, List<String>> accepts,
      Map<String, Double> value,
      Choice choice) {
    return new Segment(id, label, choice.buyers(), 1, accepts, value, Optional.of(choice));
  }

  /**
   * This segment with another demand and every other field kept; for a segment that chooses, the
   * demand is its number of buyers, so its choice section changes with it.
   */
  public Segment withDemand(double d) {
    return choice.isPresent()
        ? choosing(id, label, accepts, value, new Choice(d, choice.get().stayOut(), choice.get().priceWeight(),
            choice.get().utility()))
        : new Segment(id, label, d, maxShare, accepts, value, Optional.empty());
  }

  /** This segment (with a fixed demand) with another maxShare and every other field kept. */
  public Segment withMaxShare(double share) {
    return new Segment(id, label, demand, share, accepts, value, choice);
  }

  /** True when the segment's buyers choose by multinomial logit (it has a {@code choice} section). */
  public boolean chooses() {
    return choice.isPresent();
  }

  /** Upper bound of one column (one variant in this segment); a choosing segment's buyers. */
  public double columnBound() {
    return maxShare * demand;
  }
}
