package dev.mixwright.explain;

import java.util.List;

/**
 * What a variant sells in a segment that chooses, and whose buyers it takes, by the multinomial
 * logit: the plan's other offers in the segment ({@code others}, with their attractions, summing to
 * {@code othersAttraction} W) and the variant's own attraction w. Added to them it sells {@code
 * sales} = buyers · w / (1 + W + w); each other offer u loses buyers · w_u · (1/(1 + W) − 1/(1 + W + w))
 * and staying out loses buyers · (1/(1 + W) − 1/(1 + W + w)): the logit's proportional substitution,
 * every alternative losing the same fraction of its sales (Train, <i>Discrete Choice Methods with
 * Simulation</i>, 2nd ed. 2009, ch. 3). These are the logit's figures; the plan may sell less where a
 * resource binds. {@code offered}: the variant is one of the plan's offers (then it is not among
 * {@code others}).
 */
public record Substitution(
    int segment,
    double buyers,
    double attraction,
    double othersAttraction,
    double sales,
    double share,
    List<Taken> others,
    double fromStayingOut,
    boolean offered) {

  public Substitution {
    others = List.copyOf(others);
  }

  /**
   * One other offer: its variant, attraction, logit sales without the variant ({@code salesWithout})
   * and the buyers the variant takes from it.
   */
  public record Taken(int[] choices, double attraction, double salesWithout, double taken) {}

  /**
   * The fraction of its buyers every other alternative loses when a variant of attraction w joins
   * offers of total attraction W: 1/(1 + W) − 1/(1 + W + w) = w / ((1 + W)(1 + W + w)), applied to
   * buyers · w_u for an offer u and to buyers for staying out.
   */
  public static double lostFraction(double w, double othersAttraction) {
    return w / ((1 + othersAttraction) * (1 + othersAttraction + w));
  }

  /** Buyers who stay out without the variant: buyers / (1 + W). */
  public double stayingOutWithout() {
    return buyers / (1 + othersAttraction);
  }
}
