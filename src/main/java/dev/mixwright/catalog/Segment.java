package dev.mixwright.catalog;

import java.util.List;
import java.util.Map;

/**
 * A market. {@code demand}: units per period it buys at most, all variants together;
 * {@code maxShare}: the largest share of that demand one variant may take; {@code accepts}: groups a
 * variant sold here must match (group id to allowed choices; empty means any); {@code value}: what
 * this segment pays extra (or less) per unit for a choice, keyed {@code "group.option"}.
 */
public record Segment(
    String id,
    String label,
    double demand,
    double maxShare,
    Map<String, List<String>> accepts,
    Map<String, Double> value) {

  public Segment {
    accepts = Catalog.orderedCopy(accepts);
    value = Map.copyOf(value);
  }

  /** Upper bound of one column (one variant in this segment). */
  public double columnBound() {
    return maxShare * demand;
  }
}
