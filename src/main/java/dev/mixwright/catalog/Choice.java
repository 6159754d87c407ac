package dev.mixwright.catalog;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * How the buyers of a segment that chooses decide (multinomial logit; Train, <i>Discrete Choice
 * Methods with Simulation</i>, 2nd ed. 2009, ch. 3). {@code buyers}: potential buyers per period;
 * {@code stayOut}: the utility of buying none of the offered variants; {@code priceWeight}: utility
 * per currency unit of the price the segment pays (negative); {@code utility}: part-worth of a
 * choice, keyed {@code "group.option"} ({@code none} for the absent choice of an optional group),
 * absent keys meaning 0. A part-worth names the option without a price point and applies to every
 * point of it.
 *
 * <p>{@code utility} holds the inline entries and the rows of the segment's {@code utilityFile}
 * together (the reader refuses a key given in both); the file name itself is not kept, as with
 * option tables, so the canonical writer puts every part-worth inline.
 */
public record Choice(double buyers, double stayOut, double priceWeight, Map<String, Double> utility) {

  public Choice {
    utility = utility.isEmpty() ? Map.of() : Collections.unmodifiableMap(new LinkedHashMap<>(utility));
  }

  /** The part-worth of a choice, 0 when the catalog gives none. */
  public double partWorth(String groupId, String choiceId) {
    return utility.getOrDefault(groupId + "." + choiceId, 0.0);
  }
}
