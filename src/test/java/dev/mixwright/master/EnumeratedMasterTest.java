package dev.mixwright.master;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomCatalogs;
import java.util.List;
import java.util.Random;
import java.util.Set;
import java.util.stream.LongStream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The GLOP master on the fully enumerated LP of random catalogs (invented data), against the
 * independent reference {@link EnumeratedLp} (Apache Commons Math SimplexSolver on the same LP with
 * every bound an explicit row, and on its dual). Checked per catalog: equal objectives, GLOP's
 * reduced costs obey the optimality conditions for bounded variables and belong to its duals, and
 * those duals are optimal for the full LP (their dual value equals the objective).
 */
class EnumeratedMasterTest {
  /** Relative tolerance on objectives and dual values. */
  private static final double REL = 1e-6;
  /** Reduced-cost tolerance, times the largest |margin|. */
  private static final double RC = 1e-7;
  /** Above this the dense reference gets slow (about 1 s at 900 columns); redraw instead. */
  private static final int MAX_TEST_COLUMNS = 600;

  static LongStream smallSeeds() {
    return LongStream.rangeClosed(1, 120);
  }

  static LongStream variedSeeds() {
    return LongStream.rangeClosed(1, 60);
  }

  /** {@link RandomCatalogs#enumerable} from the stream of {@link Cases#seed}. */
  static VariantSpace varied(long seed) {
    return new VariantSpace(RandomCatalogs.enumerable(new Random(Cases.seed((int) seed)), MAX_TEST_COLUMNS));
  }

  private static double[] capacities(VariantSpace space) {
    return space.catalog().resources().stream().mapToDouble(r -> r.capacity()).toArray();
  }

  private static double[] demands(VariantSpace space) {
    return space.catalog().segments().stream().mapToDouble(s -> s.demand()).toArray();
  }

  private static double marginScale(EnumeratedLp.Reference ref) {
    double m = 1;
    for (EnumeratedLp.Column c : ref.columns()) {
      m = Math.max(m, Math.abs(c.margin()));
    }
    return m;
  }

  private static void addColumns(RestrictedMaster master, EnumeratedLp.Reference ref, int from, int to) {
    for (int j = from; j < to; j++) {
      EnumeratedLp.Column c = ref.columns().get(j);
      assertEquals(j, master.addColumn(c.segment(), c.margin(), c.use(), c.upper()));
    }
  }

  /** Everything a solved full master must satisfy against the reference. */
  private static void assertOptimalFullMaster(EnumeratedLp.Reference ref, MasterSolution sol) {
    assertTrue(sol.isOptimal(), "status " + sol.status());
    double z = ref.objective();
    double zTol = REL * Math.max(1, Math.abs(z));
    // Apache Commons Math SimplexSolver (the reference) and GLOP agree on the optimum.
    assertEquals(z, sol.objective(), zTol, "objective");
    double rcTol = RC * marginScale(ref);
    double[] pi = sol.resourceDual();
    double[] mu = sol.segmentDual();
    for (int j = 0; j < ref.columnCount(); j++) {
      EnumeratedLp.Column c = ref.columns().get(j);
      double x = sol.x()[j];
      double rc = sol.reducedCost()[j];
      double xTol = 1e-9 * Math.max(1, c.upper());
      String at = "column " + j + " (x " + x + ", upper " + c.upper() + ", rc " + rc + ")";
      // The reduced cost GLOP reports is the one its duals give (LP duality, d = m − a·π − μ).
      assertEquals(ref.reducedCost(j, pi, mu), rc, rcTol, at);
      if (x > xTol && x < c.upper() - xTol) {
        assertTrue(Math.abs(rc) <= rcTol, "basic column with nonzero reduced cost: " + at);
      } else if (x <= xTol) {
        assertTrue(rc <= rcTol, "column at zero that would pay: " + at);
      } else {
        assertTrue(rc >= -rcTol, "column at its bound that loses: " + at);
      }
      if (sol.atUpper()[j]) {
        assertEquals(c.upper(), x, xTol, "at upper bound: " + at);
      }
    }
    // GLOP's duals are optimal for the full LP: their dual value (best w) equals the objective.
    assertEquals(z, ref.dualBound(pi, mu), zTol, "dual value at GLOP's duals");
    // Every column is in the master, so the Lasdon-type bound adds nothing.
    List<Set<VariantKey>> all = EnumeratedLp.keysBySegment(ref.columns(), mu.length);
    assertEquals(sol.objective(), ref.lasdonBound(sol.objective(), pi, mu, all), 0.0);
  }

  private static void checkFullMaster(VariantSpace space) {
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
    try (RestrictedMaster master = new RestrictedMaster(capacities(space), demands(space))) {
      addColumns(master, ref, 0, ref.columnCount());
      assertOptimalFullMaster(ref, master.solve());
    }
  }

  @ParameterizedTest(name = "RandomCatalogs.small({0})")
  @MethodSource("smallSeeds")
  void fullMasterOnSmallCatalogs(long seed) {
    checkFullMaster(new VariantSpace(RandomCatalogs.small(seed)));
  }

  @ParameterizedTest(name = "varied seed {0}")
  @MethodSource("variedSeeds")
  void fullMasterOnVariedCatalogs(long seed) {
    checkFullMaster(varied(seed));
  }

  /**
   * Columns in three batches with a solve after each: the last solve equals the reference, and
   * every intermediate one gives valid bounds on the full optimum — the Lasdon-type bound at its
   * optimal duals (Lasdon 1970; Lübbecke &amp; Desrosiers 2005) and the Lagrangian bound at its
   * resource duals.
   */
  @ParameterizedTest(name = "varied seed {0}")
  @MethodSource("variedSeeds")
  void columnsAddedInBatchesReachTheReference(long seed) {
    VariantSpace space = varied(seed);
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
    int n = ref.columnCount();
    double z = ref.objective();
    double zTol = REL * Math.max(1, Math.abs(z));
    try (RestrictedMaster master = new RestrictedMaster(capacities(space), demands(space))) {
      int[] cuts = {n / 3, (2 * n) / 3, n};
      int from = 0;
      for (int cut : cuts) {
        addColumns(master, ref, from, cut);
        from = cut;
        MasterSolution sol = master.solve();
        assertTrue(sol.isOptimal());
        List<Set<VariantKey>> in =
            EnumeratedLp.keysBySegment(ref.columns().subList(0, cut), space.segmentCount());
        double lasdon = ref.lasdonBound(sol.objective(), sol.resourceDual(), sol.segmentDual(), in);
        assertTrue(sol.objective() <= z + zTol, "restricted master above the full optimum");
        assertTrue(lasdon >= z - zTol, "Lasdon-type bound " + lasdon + " below optimum " + z);
        assertTrue(ref.lagrangianBound(sol.resourceDual()) >= z - zTol, "Lagrangian bound");
        if (cut == n) {
          assertOptimalFullMaster(ref, sol);
          assertEquals(sol.objective(), lasdon, 0.0);
        }
      }
    }
  }
}
