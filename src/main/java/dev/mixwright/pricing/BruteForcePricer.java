package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

/**
 * Reference pricer for small spaces: an odometer over every combination of usable choices, each
 * checked against the rules with {@link VariantSpace#isBuildable}. Exact by construction; time
 * Θ(Π_g |usable choices of g| · (groups + rule size)), so it refuses spaces above a size limit.
 */
public final class BruteForcePricer implements Pricer {
  /** Default most combinations one query may enumerate. */
  public static final long DEFAULT_MAX_COMBINATIONS = 20_000_000L;

  private final VariantSpace space;
  private final long maxCombinations;
  private final int[] offset;

  public BruteForcePricer(VariantSpace space) {
    this(space, DEFAULT_MAX_COMBINATIONS);
  }

  /** @param maxCombinations most combinations of usable choices one query may enumerate (≥ 1) */
  public BruteForcePricer(VariantSpace space, long maxCombinations) {
    if (maxCombinations < 1) {
      throw new IllegalArgumentException("maxCombinations must be >= 1");
    }
    this.space = space;
    this.maxCombinations = maxCombinations;
    this.offset = space.offsets();
  }

  @Override
  public String name() {
    return "brute";
  }

  @Override
  public PricingOutcome price(PricingQuery q) {
    QueryChecks.check(space, q);
    int groups = space.groupCount();
    double[] w = q.weight();
    int[][] usable = new int[groups][];
    long combinations = 1;
    for (int g = 0; g < groups; g++) {
      int n = 0;
      int[] list = new int[space.choiceCount(g)];
      for (int c = 0; c < list.length; c++) {
        if (QueryChecks.usable(space, w, offset[g] + c)) {
          list[n++] = c;
        }
      }
      usable[g] = java.util.Arrays.copyOf(list, n);
      if (n == 0) {
        return QueryChecks.outcome(new TopK(1, groups), q.threshold(), true, Double.NEGATIVE_INFINITY, 0);
      }
      combinations = combinations > Long.MAX_VALUE / n ? Long.MAX_VALUE : combinations * n;
    }
    if (combinations > maxCombinations) {
      throw new IllegalStateException(
          "brute-force pricing would enumerate "
              + (combinations == Long.MAX_VALUE ? "more than 2^63" : combinations)
              + " combinations, above its limit of "
              + maxCombinations
              + "; use the bnb pricer for spaces this large");
    }
    TopK top = new TopK(q.k(), groups);
    int[] digit = new int[groups];
    int[] v = new int[groups];
    for (int g = 0; g < groups; g++) {
      v[g] = usable[g][0];
    }
    long seen = 0;
    while (true) {
      seen++;
      if (space.isBuildable(v)) {
        double s = QueryChecks.score(offset, w, q.constant(), v);
        if (s > top.cutoff(q.threshold()) && !q.excluded().contains(space.key(v))) {
          top.offer(v, s);
        }
      }
      int g = groups - 1;
      while (g >= 0 && ++digit[g] == usable[g].length) {
        digit[g] = 0;
        v[g] = usable[g][0];
        g--;
      }
      if (g < 0) {
        break;
      }
      v[g] = usable[g][digit[g]];
    }
    return QueryChecks.outcome(top, q.threshold(), true, Double.NEGATIVE_INFINITY, seen);
  }
}
