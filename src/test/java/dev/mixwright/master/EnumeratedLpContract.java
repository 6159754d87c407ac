package dev.mixwright.master;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.ConcurrentHashMap;
import org.junit.jupiter.api.Test;

/**
 * What every solver wrapper in {@code master} must do on the full product-mix LP: on seeded random
 * small catalogs ({@link RandomCatalogs#enumerable}, invented data) with every (variant, segment)
 * column handed to it, its answer is checked against {@link EnumeratedLp}, the independent
 * reference that solves the same LP, and its dual, with Apache Commons Math 3.6.1's
 * {@code SimplexSolver}:
 *
 * <ul>
 *   <li>the objective equals the reference optimum;
 *   <li>where the wrapper exposes its point: it is primal feasible against the reference's own copy
 *       of the column data (bounds, capacity rows, demand rows) and its margin equals the objective;
 *   <li>where it exposes duals: they are dual feasible (π, μ ≥ 0, with w_j = max(0, d_j) every such
 *       point is) and their dual value equals the optimum (strong duality); with a point as well,
 *       complementary slackness holds on rows and columns.
 * </ul>
 *
 * One subclass per wrapper says how to hand it the columns and read its answer.
 */
abstract class EnumeratedLpContract {
  /** Relative tolerance on objectives and dual values. */
  static final double REL = 1e-6;
  /** Largest full LP drawn: the dense reference's time grows as n² (measured there: 0.1 s at 280). */
  private static final int MAX_COLUMNS = 400;

  /** Catalog and reference per seed, shared by the subclasses (surefire runs them in one JVM). */
  private static final Map<Long, Fixture> FIXTURES = new ConcurrentHashMap<>();

  record Fixture(VariantSpace space, EnumeratedLp.Reference ref) {
    double[] capacity() {
      return ref.capacity().clone();
    }

    double[] demand() {
      return ref.demand().clone();
    }

    List<EnumeratedLp.Column> columns() {
      return ref.columns();
    }
  }

  /**
   * What a wrapper returned for the full LP. {@code x} is aligned with the fixture's columns, null
   * when the wrapper exposes no point; the duals are null when it exposes none.
   */
  record Answer(String status, boolean optimal, double objective, double[] x, double[] resourceDual,
      double[] segmentDual) {}

  /** Hands the wrapper every column of the fixture, solves, and reads its answer. */
  protected abstract Answer solveAll(Fixture f);

  /** Catalogs per wrapper. */
  protected int cases() {
    return 100;
  }

  static Fixture fixture(long seed) {
    return FIXTURES.computeIfAbsent(seed, s -> {
      VariantSpace space =
          new VariantSpace(RandomCatalogs.enumerable(new Random(s), MAX_COLUMNS));
      return new Fixture(space, EnumeratedLp.solve(space));
    });
  }

  @Test
  void solvesTheFullLpAsTheEnumeratedReferenceDoes() {
    Cases.each(cases(), (seed, rnd) -> {
      Fixture f = fixture(seed);
      check(f, solveAll(f));
    });
  }

  /** Every check of the contract on one answer. */
  static void check(Fixture f, Answer a) {
    EnumeratedLp.Reference ref = f.ref();
    assertTrue(a.optimal(), () -> "status " + a.status());
    double z = ref.objective();
    double zTol = REL * Math.max(1, Math.abs(z));
    // The optimum of Apache Commons Math's SimplexSolver on the enumerated LP (and its dual).
    assertEquals(z, a.objective(), zTol, "objective against the enumerated LP");
    if (a.x() != null) {
      checkPrimal(ref, a.x(), a.objective(), zTol);
    }
    if (a.resourceDual() != null) {
      checkDual(ref, a.resourceDual(), a.segmentDual(), zTol);
      if (a.x() != null) {
        checkComplementarySlackness(ref, a.x(), a.resourceDual(), a.segmentDual());
      }
    }
  }

  private static double rowTol(double rhs) {
    return REL * Math.max(1, Math.abs(rhs));
  }

  private static void checkPrimal(EnumeratedLp.Reference ref, double[] x, double objective, double zTol) {
    List<EnumeratedLp.Column> cols = ref.columns();
    assertEquals(cols.size(), x.length, "one value per column");
    double[] used = new double[ref.capacity().length];
    double[] sold = new double[ref.demand().length];
    double margin = 0;
    for (int j = 0; j < x.length; j++) {
      EnumeratedLp.Column c = cols.get(j);
      double v = x[j];
      int jj = j;
      assertTrue(v >= -rowTol(c.upper()) && v <= c.upper() + rowTol(c.upper()),
          () -> "column " + jj + " at " + v + " outside [0, " + c.upper() + "]");
      for (int r = 0; r < used.length; r++) {
        used[r] += c.use()[r] * v;
      }
      sold[c.segment()] += v;
      margin += c.margin() * v;
    }
    for (int r = 0; r < used.length; r++) {
      double cap = ref.capacity()[r];
      assertTrue(used[r] <= cap + rowTol(cap), "resource " + r + " uses " + used[r] + " of " + cap);
    }
    for (int s = 0; s < sold.length; s++) {
      double d = ref.demand()[s];
      assertTrue(sold[s] <= d + rowTol(d), "segment " + s + " sells " + sold[s] + " of " + d);
    }
    assertEquals(objective, margin, zTol, "the point's margin against the reported objective");
  }

  private static void checkDual(EnumeratedLp.Reference ref, double[] pi, double[] mu, double zTol) {
    assertNotNull(mu, "segment duals with the resource duals");
    assertEquals(ref.capacity().length, pi.length, "one π per resource");
    assertEquals(ref.demand().length, mu.length, "one μ per segment");
    for (double p : pi) {
      assertTrue(p >= 0 && Double.isFinite(p), "π " + p);
    }
    for (double m : mu) {
      assertTrue(m >= 0 && Double.isFinite(m), "μ " + m);
    }
    // Weak duality makes the dual value an upper bound for any π, μ ≥ 0; meeting the optimum proves
    // these duals optimal for the enumerated LP.
    assertEquals(ref.objective(), ref.dualBound(pi, mu), zTol, "dual value at the wrapper's duals");
  }

  /**
   * Any optimal point and any optimal duals of one LP are complementary: a row with a positive dual
   * is tight, a column strictly between its bounds has reduced cost 0, one at 0 has d ≤ 0 and one at
   * its bound d ≥ 0.
   */
  private static void checkComplementarySlackness(EnumeratedLp.Reference ref, double[] x, double[] pi,
      double[] mu) {
    List<EnumeratedLp.Column> cols = ref.columns();
    double scale = 1;
    for (EnumeratedLp.Column c : cols) {
      scale = Math.max(scale, Math.abs(c.margin()));
    }
    double dTol = REL * scale;
    double[] used = new double[pi.length];
    double[] sold = new double[mu.length];
    for (int j = 0; j < x.length; j++) {
      EnumeratedLp.Column c = cols.get(j);
      for (int r = 0; r < used.length; r++) {
        used[r] += c.use()[r] * x[j];
      }
      sold[c.segment()] += x[j];
      double d = ref.reducedCost(j, pi, mu);
      double xTol = REL * Math.max(1, c.upper());
      String at = "column " + j + " (x " + x[j] + ", upper " + c.upper() + ", d " + d + ")";
      if (x[j] > xTol) {
        assertTrue(d >= -dTol, "sells a column that loses at these duals: " + at);
      }
      if (x[j] < c.upper() - xTol) {
        assertTrue(d <= dTol, "leaves room in a column that pays at these duals: " + at);
      }
    }
    for (int r = 0; r < pi.length; r++) {
      double cap = ref.capacity()[r];
      if (pi[r] > dTol) {
        assertEquals(cap, used[r], rowTol(cap), "resource " + r + " has π " + pi[r] + " but slack");
      }
    }
    for (int s = 0; s < mu.length; s++) {
      double d = ref.demand()[s];
      if (mu[s] > dTol) {
        assertEquals(d, sold[s], rowTol(d), "segment " + s + " has μ " + mu[s] + " but slack");
      }
    }
  }

  /**
   * The columns grouped by variant, in order of first appearance: the blocks of the portfolio
   * models, each with the enumerated column index of its sales per segment.
   */
  record Block(int[] choices, int[] segments, double[] margin, double[] use, double[] upper, int[] column) {}

  static List<Block> blocks(List<EnumeratedLp.Column> cols) {
    Map<VariantKey, List<Integer>> byVariant = new LinkedHashMap<>();
    for (int j = 0; j < cols.size(); j++) {
      byVariant.computeIfAbsent(cols.get(j).key(), k -> new ArrayList<>()).add(j);
    }
    List<Block> out = new ArrayList<>();
    for (List<Integer> js : byVariant.values()) {
      int n = js.size();
      int[] seg = new int[n];
      double[] m = new double[n];
      double[] u = new double[n];
      int[] col = new int[n];
      for (int k = 0; k < n; k++) {
        EnumeratedLp.Column c = cols.get(js.get(k));
        seg[k] = c.segment();
        m[k] = c.margin();
        u[k] = c.upper();
        col[k] = js.get(k);
      }
      EnumeratedLp.Column first = cols.get(js.get(0));
      out.add(new Block(first.choices(), seg, m, first.use(), u, col));
    }
    return out;
  }

  /** Sales x[i][k] of block i in segment k, back on the enumerated columns. */
  static double[] onColumns(List<Block> blocks, double[][] x, int columns) {
    double[] out = new double[columns];
    for (int i = 0; i < blocks.size(); i++) {
      int[] col = blocks.get(i).column();
      assertEquals(col.length, x[i].length, "sales per segment of block " + i);
      for (int k = 0; k < col.length; k++) {
        out[col[k]] = x[i][k];
      }
    }
    return out;
  }
}
