package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;

/**
 * Reference pricer for small spaces: an odometer over every combination of usable choices, each
 * checked against the rules with {@link VariantSpace#isBuildable}. Exact by construction; time
 * Θ(Π_g |usable choices of g| · (groups + rule size)), so it refuses spaces above a size limit.
 */
public final class BruteForcePricer extends SpacePricer {
  /** Default most combinations one query may enumerate. */
  public static final long DEFAULT_MAX_COMBINATIONS = 20_000_000L;

  private final long maxCombinations;

  public BruteForcePricer(VariantSpace space) {
    this(space, DEFAULT_MAX_COMBINATIONS);
  }

  /** @param maxCombinations most combinations of usable choices one query may enumerate (≥ 1) */
  public BruteForcePricer(VariantSpace space, long maxCombinations) {
    super(space, "brute");
    if (maxCombinations < 1) {
      throw new IllegalArgumentException("maxCombinations must be >= 1");
    }
    this.maxCombinations = maxCombinations;
  }

  @Override
  PricingOutcome search(PricingQuery q) {
    int groups = space.groupCount();
    double[] w = q.weight();
    int[][] usable = new int[groups][];
    long combinations = 1;
    for (int g = 0; g < groups; g++) {
      usable[g] = QueryChecks.usableChoices(space, w, g);
      int n = usable[g].length;
      if (n == 0) {
        return new QueryRun(space, q).outcome(true);
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
    QueryRun run = new QueryRun(space, q);
    int[] digit = new int[groups];
    int[] v = new int[groups];
    for (int g = 0; g < groups; g++) {
      v[g] = usable[g][0];
    }
    while (true) {
      run.nodes++;
      if (space.isBuildable(v)) {
        run.leaf(v);
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
    return run.outcome(true);
  }
}
