package dev.mixwright.portfolio;

import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.Arrays;

/**
 * A variant in the integer stage's pool, with what the masters need: the segments that accept it,
 * its unit margin and column bound in each, its resource use per unit, the flat choices it uses
 * that carry a tooling cost, its fixed cost F_v ({@link CurrentRange}: the introduction cost for a
 * new variant, −discontinue for a current one), whether it is pinned (y fixed at 1), and per segment
 * its logit attraction w_s(v) where s chooses (0 where it does not).
 */
public record PoolVariant(
    int[] choices, VariantKey key, int[] segments, double[] margin, double[] upper, double[] use, int[] tools,
    double fixedCost, boolean pinned, double[] attraction) {

  /** A new variant: fixed cost F, not pinned. */
  public static PoolVariant of(VariantSpace space, PortfolioTerms terms, int[] v) {
    return of(space, terms, v, terms.introductionCost(), false);
  }

  static PoolVariant of(VariantSpace space, PortfolioTerms terms, int[] v, double fixedCost, boolean pinned) {
    int[] v2 = v.clone();
    int n = 0;
    int[] segs = new int[space.segmentCount()];
    for (int s = 0; s < segs.length; s++) {
      if (space.isColumn(v2, s)) {
        segs[n++] = s;
      }
    }
    segs = Arrays.copyOf(segs, n);
    double[] m = new double[n];
    double[] u = new double[n];
    double[] w = new double[n];
    for (int k = 0; k < n; k++) {
      m[k] = space.margin(v2, segs[k]);
      u[k] = terms.columnBound()[segs[k]];
      if (space.chooses(segs[k])) {
        u[k] = Math.min(u[k], ChoiceRows.capOf(space, v2, segs[k]));
        w[k] = ChoiceRows.attractionOf(space, v2, segs[k]);
      }
    }
    int[] tools = new int[v2.length];
    int t = 0;
    for (int g = 0; g < v2.length; g++) {
      int f = space.offset(g) + v2[g];
      if (terms.choiceCost()[f] > 0) {
        tools[t++] = f;
      }
    }
    return new PoolVariant(v2, space.key(v2), segs, m, u, space.use(v2), Arrays.copyOf(tools, t),
        fixedCost, pinned, w);
  }

  /** True when some segment accepts it, so that it can be offered at all. */
  public boolean sellable() {
    return segments.length > 0;
  }
}
