package dev.mixwright.pricing;

import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.Set;

/** Builds pricing queries from dual values: reduced cost d = m − Σ_r π_r a_r − μ_s. */
public final class ReducedCosts {
  private ReducedCosts() {}

  /** Per-choice weights of segment s at resource duals π (a choice not usable in s gets −∞). */
  public static double[] weights(VariantSpace space, int s, double[] pi) {
    int n = space.totalChoices();
    int rc = space.resourceCount();
    double[] w = new double[n];
    for (int f = 0; f < n; f++) {
      if (!space.allowedIn(s, f)) {
        w[f] = Double.NEGATIVE_INFINITY;
        continue;
      }
      double x = space.choiceMargin(f) + space.choiceValue(s, f);
      for (int r = 0; r < rc; r++) {
        x -= pi[r] * space.choiceUse(f, r);
      }
      w[f] = x;
    }
    return w;
  }

  public static PricingQuery query(
      VariantSpace space, int s, double[] pi, double mu, int k, double threshold, Set<VariantKey> excluded) {
    return new PricingQuery(s, weights(space, s, pi), -mu, k, threshold, excluded);
  }

  /** Reduced cost of variant v in segment s, computed directly from the catalog figures. */
  public static double of(VariantSpace space, int[] v, int s, double[] pi, double mu) {
    double d = space.margin(v, s) - mu;
    double[] a = space.use(v);
    for (int r = 0; r < a.length; r++) {
      d -= pi[r] * a[r];
    }
    return d;
  }
}
