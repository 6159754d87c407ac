package dev.mixwright.portfolio;

import dev.mixwright.pricing.ReducedCosts;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;

/**
 * Brute-force references for the portfolio tests: every buildable variant by an odometer, and the
 * best lot value g(d) by listing the vertices of {0 ≤ x ≤ u, Σ x ≥ L} (every coordinate at 0 or its
 * bound, except at most one that makes Σ x = L), independent of {@link LotValue}'s greedy.
 */
final class BruteVariants {
  private BruteVariants() {}

  /** Every buildable variant that some segment accepts, in odometer order. */
  static List<int[]> all(VariantSpace space) {
    List<int[]> out = new ArrayList<>();
    int groups = space.groupCount();
    for (int g = 0; g < groups; g++) {
      if (space.choiceCount(g) == 0) {
        return out;
      }
    }
    int[] v = new int[groups];
    while (true) {
      if (space.isBuildable(v)) {
        boolean any = false;
        for (int s = 0; s < space.segmentCount() && !any; s++) {
          any = space.isColumn(v, s);
        }
        if (any) {
          out.add(v.clone());
        }
      }
      int g = groups - 1;
      while (g >= 0 && ++v[g] == space.choiceCount(g)) {
        v[g] = 0;
        g--;
      }
      if (g < 0) {
        return out;
      }
    }
  }

  /** max Σ d_s x_s over 0 ≤ x ≤ u (x_s = 0 where d_s = −∞), Σ x ≥ L, by listing vertices. */
  static double lotValue(double[] d, double[] u, double minLot) {
    int n = d.length;
    double best = Double.NEGATIVE_INFINITY;
    boolean anyAlive = false;
    for (double x : d) {
      anyAlive |= x != Double.NEGATIVE_INFINITY;
    }
    if (!anyAlive) {
      return Double.NEGATIVE_INFINITY;
    }
    for (int mask = 0; mask < (1 << n); mask++) {
      for (int free = -1; free < n; free++) {
        double sold = 0;
        double val = 0;
        boolean ok = true;
        for (int s = 0; s < n && ok; s++) {
          if (s == free || (mask & (1 << s)) == 0) {
            continue;
          }
          if (d[s] == Double.NEGATIVE_INFINITY) {
            ok = false;
          } else {
            sold += u[s];
            val += u[s] * d[s];
          }
        }
        if (!ok || (free >= 0 && ((mask & (1 << free)) != 0 || d[free] == Double.NEGATIVE_INFINITY))) {
          continue;
        }
        if (free >= 0) {
          double x = minLot - sold;
          if (x < 0 || x > u[free]) {
            continue;
          }
          sold += x;
          val += x * d[free];
        }
        if (sold >= minLot - 1e-9 * (1 + minLot)) {
          best = Math.max(best, val);
        }
      }
    }
    return best;
  }

  /** ψ(v) at prices (π, μ): brute-force lot value − charge − penalties. */
  static double value(VariantSpace space, PortfolioTerms t, int[] v, double[] pi, double[] mu, double charge,
      double[] penalty) {
    return value(space, t, v, pi, mu, charge, penalty, null);
  }

  /** The same, less {@code accept[s]} for every segment s that accepts v ({@code accept} null for none). */
  static double value(VariantSpace space, PortfolioTerms t, int[] v, double[] pi, double[] mu, double charge,
      double[] penalty, double[] accept) {
    double[] d = new double[space.segmentCount()];
    for (int s = 0; s < d.length; s++) {
      d[s] = space.isColumn(v, s) ? ReducedCosts.of(space, v, s, pi, mu[s]) : Double.NEGATIVE_INFINITY;
    }
    double p = 0;
    if (penalty != null) {
      for (int g = 0; g < v.length; g++) {
        p += penalty[space.offset(g) + v[g]];
      }
    }
    for (int s = 0; accept != null && s < d.length; s++) {
      p += space.isColumn(v, s) ? accept[s] : 0.0;
    }
    return lotValue(d, caps(space, t, v), t.minLot()) - charge - p;
  }

  /**
   * Per segment the most v can sell there in any portfolio: the column bound, and in a segment that
   * chooses at most buyers·w/(1+w), w = exp(u_s(v) − stayOut_s) — the logit share of v offered alone
   * (Train, "Discrete Choice Methods with Simulation", ch. 3: P = w/(1 + w) against the stay-out;
   * more offered variants only lower it). Written out here, not taken from the pricer's code.
   */
  static double[] caps(VariantSpace space, PortfolioTerms t, int[] v) {
    double[] u = t.columnBound().clone();
    for (int s = 0; s < u.length; s++) {
      if (space.chooses(s)) {
        double w = Math.exp(space.utility(v, s) - space.stayOut(s));
        u[s] = Math.min(u[s], Double.isInfinite(w) ? space.buyers(s) : space.buyers(s) * w / (1 + w));
      }
    }
    return u;
  }
}
