package dev.mixwright.choice;

/**
 * The multinomial logit with a stay-out alternative (Train, <i>Discrete Choice Methods with
 * Simulation</i>, 2nd ed. 2009, ch. 3; Ben-Akiva &amp; Lerman, <i>Discrete Choice Analysis</i>, 1985),
 * on primitive arrays. A variant's utility is additive over the groups, u(v) = Σ_g util[offset(g) +
 * v_g], its attraction w(v) = exp(u(v) − stayOut), and offered the set S a buyer takes v ∈ S with
 * probability w(v) / (1 + Σ_S w). Shares are computed from log-attractions with the log-sum-exp
 * shift, so neither huge nor tiny attractions overflow or lose the others: O(|S|) per call.
 */
public final class Logit {
  private Logit() {}

  /** u(v) = Σ_g util[offset[g] + v[g]]; {@code offset} as {@code VariantSpace.offsets()}. */
  public static double utility(double[] choiceUtility, int[] offset, int[] v) {
    double u = 0;
    for (int g = 0; g < v.length; g++) {
      u += choiceUtility[offset[g] + v[g]];
    }
    return u;
  }

  /** w = exp(u − stayOut): how many times likelier a buyer takes the variant than staying out. */
  public static double attraction(double utility, double stayOut) {
    return Math.exp(utility - stayOut);
  }

  /** log(Σ exp(x_i)), shifted by the largest x so that no term overflows; −∞ for no terms. */
  public static double logSumExp(double[] x) {
    double m = Double.NEGATIVE_INFINITY;
    for (double xi : x) {
      m = Math.max(m, xi);
    }
    if (m == Double.NEGATIVE_INFINITY || m == Double.POSITIVE_INFINITY) {
      return m;
    }
    double sum = 0;
    for (double xi : x) {
      sum += Math.exp(xi - m);
    }
    return m + Math.log(sum);
  }

  /**
   * Expected sales of each offered variant, buyers · w_i / (1 + Σ w), given log-attractions
   * {@code logW[i] = u_i − stayOut}. The stay-out alternative has log-attraction 0.
   */
  public static double[] sales(double buyers, double[] logW) {
    double[] out = new double[logW.length];
    double logDenominator = logDenominator(logW);
    for (int i = 0; i < logW.length; i++) {
      out[i] = buyers * Math.exp(logW[i] - logDenominator);
    }
    return out;
  }

  /** The buyers who take none of the offered variants: buyers / (1 + Σ w). */
  public static double stayingOut(double buyers, double[] logW) {
    return buyers * Math.exp(-logDenominator(logW));
  }

  /** log(1 + Σ exp(logW_i)), stay-out included. */
  public static double logDenominator(double[] logW) {
    double[] withStayOut = new double[logW.length + 1];
    System.arraycopy(logW, 0, withStayOut, 0, logW.length);
    return logSumExp(withStayOut);
  }

  /**
   * R* = max over offer sets S of Σ_S w_i r_i / (1 + Σ_S w_i), the best revenue per buyer a segment
   * gives when offered any subset of these n alternatives (attractions w, revenues r). The best set
   * is {r &gt; R*} (revenue-ordered; Talluri &amp; van Ryzin 2004, Management Science 50(1)): f(S) ≤ R*
   * ⟺ Σ_S w (r − R*) ≤ R*, largest at S = {r &gt; R*}. R* is the root of g(μ) = Σ w (r − μ)^+ − μ
   * (convex, decreasing), found by Newton's step μ ← f({r &gt; μ}) from μ = 0: each step is the value
   * of a set, so it never passes R*, it rises while g(μ) &gt; 0, and it stops when the set repeats.
   * O(n) per step, no sort; 0 when no r is positive.
   */
  public static double bestOfferValue(double[] r, double[] w, int n) {
    double mu = 0;
    int count = -1;
    while (true) {
      double sw = 0;
      double swr = 0;
      int c = 0;
      for (int i = 0; i < n; i++) {
        if (r[i] > mu) {
          sw += w[i];
          swr += w[i] * r[i];
          c++;
        }
      }
      double next = swr / (1 + sw);
      if (c == count || !(next > mu)) {
        return mu;
      }
      mu = next;
      count = c;
    }
  }
}
