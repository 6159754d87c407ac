package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomCatalogs;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The Lagrangian bound against {@link EnumeratedLp} (every column listed, the LP and its dual
 * solved by Apache Commons Math SimplexSolver; its {@code lagrangianBound} fills each segment's
 * knapsack from the whole list).
 */
class LagrangianLpBoundTest {

  /** The enumerated columns as the arrays {@link LagrangianLpBound#bound} takes, the first n of them. */
  private static double bound(EnumeratedLp.Reference ref, double[] y, boolean[] inMaster) {
    List<EnumeratedLp.Column> cols = ref.columns();
    int n = cols.size();
    int[] seg = new int[n];
    double[] m = new double[n];
    double[][] a = new double[n][];
    double[] u = new double[n];
    double[] outside = new double[ref.demand().length];
    Arrays.fill(outside, Double.NEGATIVE_INFINITY);
    int k = 0;
    for (int j = 0; j < n; j++) {
      EnumeratedLp.Column c = cols.get(j);
      if (inMaster[j]) {
        seg[k] = c.segment();
        m[k] = c.margin();
        a[k] = c.use();
        u[k] = c.upper();
        k++;
      } else {
        double e = c.margin();
        for (int r = 0; r < y.length; r++) {
          e -= c.use()[r] * y[r];
        }
        outside[c.segment()] = Math.max(outside[c.segment()], e);
      }
    }
    return new LagrangianLpBound(ref.capacity(), ref.demand()).bound(y, seg, m, a, u, k, outside);
  }

  private static double[] randomPrices(Random rnd, int n) {
    double[] y = new double[n];
    for (int r = 0; r < n; r++) {
      y[r] = rnd.nextDouble() < 0.3 ? 0 : rnd.nextDouble() * 30;
    }
    return y;
  }

  @Test
  void withEveryColumnInsideItEqualsTheEnumeratedBound() {
    for (long seed = 0; seed < 40; seed++) {
      Catalog c = RandomCatalogs.small(seed);
      EnumeratedLp.Reference ref = EnumeratedLp.solve(new VariantSpace(c));
      Random rnd = new Random(seed);
      boolean[] all = new boolean[ref.columnCount()];
      Arrays.fill(all, true);
      for (int t = 0; t < 5; t++) {
        double[] y = randomPrices(rnd, ref.capacity().length);
        double want = ref.lagrangianBound(y);
        assertEquals(want, bound(ref, y, all), 1e-9 * Math.max(1, Math.abs(want)), "seed " + seed);
        // weak duality: any y gives a bound on the LP optimum
        assertTrue(want >= ref.objective() - 1e-7 * Math.max(1, ref.objective()));
      }
      // at the optimal resource duals the bound is the optimum (strong duality)
      double atOptimum = bound(ref, ref.resourceDual(), all);
      assertEquals(ref.objective(), atOptimum, 1e-6 * Math.max(1, ref.objective()), "seed " + seed);
    }
  }

  @Test
  void columnsOutsideAreCoveredByTheirBestValue() {
    for (long seed = 0; seed < 40; seed++) {
      Catalog c = RandomCatalogs.small(seed);
      EnumeratedLp.Reference ref = EnumeratedLp.solve(new VariantSpace(c));
      Random rnd = new Random(100 + seed);
      for (int t = 0; t < 5; t++) {
        boolean[] some = new boolean[ref.columnCount()];
        for (int j = 0; j < some.length; j++) {
          some[j] = rnd.nextBoolean();
        }
        double[] y = t == 0 ? ref.resourceDual() : randomPrices(rnd, ref.capacity().length);
        double b = bound(ref, y, some);
        // t0 over the columns left out can only loosen the bound of the full list, never cut under it
        double full = ref.lagrangianBound(y);
        assertTrue(b >= full - 1e-9 * Math.max(1, Math.abs(full)), "seed " + seed + ": " + b + " < " + full);
        assertTrue(b >= ref.objective() - 1e-7 * Math.max(1, ref.objective()), "seed " + seed);
      }
    }
  }
}
