package dev.mixwright.explain;

import java.util.List;

/**
 * Why a variant pays or not in one segment at given shadow prices: {@code margin} (with the part of
 * each group), each resource's charge (use × shadow price), the segment's demand charge, and the
 * reduced cost = margin − Σ charges − segment charge. {@code problems} lists why the variant cannot
 * be sold in that segment at all (a rule or the segment's accepts), empty when it can.
 */
public record Explanation(
    int segment,
    int[] choices,
    double margin,
    List<MarginPart> marginParts,
    List<Charge> charges,
    double segmentCharge,
    double reducedCost,
    List<String> problems) {

  /** One group's contribution to the margin: the option's price − cost plus the segment's value for it. */
  public record MarginPart(String group, String option, double price, double cost, double segmentValue) {
    public double total() {
      return price - cost + segmentValue;
    }
  }

  /** One resource's charge: units used per unit of the variant × the resource's shadow price. */
  public record Charge(String resource, double use, double shadowPrice) {
    public double amount() {
      return use * shadowPrice;
    }
  }

  public boolean sellable() {
    return problems.isEmpty();
  }

  /** Price rise per unit at which the column's reduced cost reaches zero (0 when it already pays). */
  public double priceRiseToEnter() {
    return Math.max(0.0, -reducedCost);
  }
}
