package dev.mixwright.testing;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Rule;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Sanity checks of the reference itself: textbook figures through the whole chain (catalog,
 * variant space, enumeration, Apache Commons Math SimplexSolver on the primal and the dual LP), and
 * the bound helpers against weak and strong duality. Book figures are as recorded in the project's
 * notes and from memory of the books, not re-read against them.
 */
class EnumeratedLpTest {
  private static final double EPS = 1e-7;

  private static double xOf(EnumeratedLp.Reference ref, VariantSpace space, String segment, String product) {
    int s = space.catalog().segmentIndex(segment);
    int j = ref.indexOf(s, space.key(space.parse(Map.of("product", product))));
    assertTrue(j >= 0, product + " is a column of " + segment);
    return ref.x()[j];
  }

  private static int col(EnumeratedLp.Reference ref, VariantSpace space, String segment, String product) {
    return ref.indexOf(space.catalog().segmentIndex(segment),
        space.key(space.parse(Map.of("product", product))));
  }

  @Test
  void wyndorThroughTheReference() {
    VariantSpace space = new VariantSpace(TextbookCatalogs.wyndor());
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
    assertEquals(2, ref.columnCount());
    // Hillier & Lieberman, Introduction to Operations Research, ch. 3, Wyndor Glass: z = 36, x = (2, 6).
    assertEquals(36, ref.objective(), EPS);
    assertEquals(2, xOf(ref, space, "market", "doors"), EPS);
    assertEquals(6, xOf(ref, space, "market", "windows"), EPS);
    // Hillier & Lieberman, Wyndor Glass shadow prices 0, 1.5, 1; the market row does not bind.
    assertArrayEquals(new double[] {0, 1.5, 1}, ref.resourceDual(), EPS);
    assertArrayEquals(new double[] {0}, ref.segmentDual(), EPS);
  }

  @ParameterizedTest(name = "table limit as bound: {0}")
  @ValueSource(booleans = {false, true})
  void dakotaThroughTheReference(boolean limitAsBound) {
    VariantSpace space = new VariantSpace(TextbookCatalogs.dakota(30, limitAsBound));
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
    // Tables only in "tables", desks and chairs only in "others".
    assertEquals(3, ref.columnCount());
    // Winston, Operations Research: Applications and Algorithms, ch. 6, Dakota Furniture:
    // z = 280 at (desks, tables, chairs) = (2, 0, 8).
    assertEquals(280, ref.objective(), EPS);
    assertEquals(2, xOf(ref, space, "others", "desk"), EPS);
    assertEquals(0, xOf(ref, space, "tables", "table"), EPS);
    assertEquals(8, xOf(ref, space, "others", "chair"), EPS);
    // Winston, Dakota Furniture: lumber 0, finishing 10, carpentry 10; the table limit's dual 0
    // (on the tables segment row, or absent when it is a bound).
    assertArrayEquals(new double[] {0, 10, 10}, ref.resourceDual(), EPS);
    assertArrayEquals(new double[] {0, 0}, ref.segmentDual(), EPS);
    // Winston, Dakota Furniture: tables' reduced cost −5.
    int table = col(ref, space, "tables", "table");
    assertEquals(-5, ref.reducedCost(table, ref.resourceDual(), ref.segmentDual()), EPS);
  }

  @Test
  void dakotaTablesEnterAtThirtyFive() {
    // Winston, Dakota Furniture: tables enter once their price reaches 35.
    double eps = 1e-3;
    VariantSpace above = new VariantSpace(TextbookCatalogs.dakota(35 + eps, false));
    EnumeratedLp.Reference ra = EnumeratedLp.solve(above);
    assertTrue(xOf(ra, above, "tables", "table") > 1e-6);
    assertTrue(ra.objective() > 280 + 1e-9);
    VariantSpace below = new VariantSpace(TextbookCatalogs.dakota(35 - eps, false));
    EnumeratedLp.Reference rb = EnumeratedLp.solve(below);
    assertEquals(0, xOf(rb, below, "tables", "table"), EPS);
    assertEquals(280, rb.objective(), EPS);
  }

  @Test
  void nothingBuildableGivesZero() {
    Catalog w = TextbookCatalogs.wyndor();
    // A single-group rule that forbids both products (invented for this test).
    Rule noProducts = new Rule(null, Map.of(), Map.of(), Map.of("product", List.of("doors", "windows")));
    Catalog empty = new Catalog(w.format(), w.name(), w.currency(), w.period(), w.resources(),
        w.groups(), List.of(noProducts), w.segments(), w.portfolio());
    EnumeratedLp.Reference ref = EnumeratedLp.solve(new VariantSpace(empty));
    assertEquals(0, ref.columnCount());
    assertEquals(0, ref.objective());
    assertEquals(3, ref.resourceDual().length);
    assertEquals(1, ref.segmentDual().length);
    List<Set<VariantKey>> none = List.of(new HashSet<>());
    assertEquals(Double.NEGATIVE_INFINITY, ref.maxReducedCost(new double[3], new double[1], none)[0]);
    assertEquals(0, ref.lasdonBound(0, new double[3], new double[1], none));
  }

  @Test
  void inMasterSetsMustMatchSegments() {
    EnumeratedLp.Reference ref = EnumeratedLp.solve(new VariantSpace(TextbookCatalogs.wyndor()));
    assertThrows(IllegalArgumentException.class,
        () -> ref.maxReducedCost(new double[3], new double[1], List.of()));
  }

  @Test
  void maxReducedCostSkipsColumnsInTheMaster() {
    VariantSpace space = new VariantSpace(TextbookCatalogs.wyndor());
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
    double[] pi = {0, 0, 0};
    double[] mu = {0};
    // At zero prices the reduced costs are the margins 3 (doors) and 5 (windows).
    Set<VariantKey> in = new HashSet<>();
    assertEquals(5, ref.maxReducedCost(pi, mu, List.of(in))[0], EPS);
    in.add(space.key(space.parse(Map.of("product", "windows"))));
    assertEquals(3, ref.maxReducedCost(pi, mu, List.of(in))[0], EPS);
    in.add(space.key(space.parse(Map.of("product", "doors"))));
    assertEquals(Double.NEGATIVE_INFINITY, ref.maxReducedCost(pi, mu, List.of(in))[0]);
    // Lasdon-type bound with only doors in a master of value 12 (doors at plant 1's limit, duals
    // (3, 0, 0) — derived by hand): windows' d = 5 − 0 = 5, so 12 + 1000·5 ≥ 36.
    Set<VariantKey> doors = new HashSet<>(Set.of(space.key(space.parse(Map.of("product", "doors")))));
    assertEquals(12 + 1000 * 5.0, ref.lasdonBound(12, new double[] {3, 0, 0}, mu, List.of(doors)), EPS);
  }

  /** Catalogs small enough for the dense reference, drawn from a seed (invented data). */
  static Catalog smallCatalog(long seed) {
    Random rnd = new Random(seed);
    return RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3), 1 + rnd.nextInt(3),
        rnd.nextInt(6), false);
  }

  @ParameterizedTest(name = "seed {0}")
  @ValueSource(longs = {1, 2, 3, 4, 5, 6, 7, 8})
  void boundsObeyDuality(long seed) {
    VariantSpace space = new VariantSpace(smallCatalog(seed));
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
    double z = ref.objective();
    double tol = 1e-7 * Math.max(1, Math.abs(z));
    // Strong duality at the reference's own duals (LP duality theorem), in both bound forms.
    assertEquals(z, ref.dualBound(ref.resourceDual(), ref.segmentDual()), tol);
    assertEquals(z, ref.lagrangianBound(ref.resourceDual()), tol);
    // Weak duality at any prices ≥ 0.
    Random rnd = new Random(seed * 31 + 7);
    for (int t = 0; t < 20; t++) {
      double[] pi = new double[space.resourceCount()];
      double[] mu = new double[space.segmentCount()];
      for (int r = 0; r < pi.length; r++) {
        pi[r] = rnd.nextDouble() * 40;
      }
      for (int s = 0; s < mu.length; s++) {
        mu[s] = rnd.nextDouble() * 100;
      }
      assertTrue(ref.dualBound(pi, mu) >= z - tol);
      assertTrue(ref.lagrangianBound(pi) >= z - tol);
      // The Lagrangian form optimises μ out, so it is never weaker than the dual value at any μ.
      assertTrue(ref.lagrangianBound(pi) <= ref.dualBound(pi, mu) + tol);
    }
    // The reference's x is a feasible point with value z.
    double v = 0;
    for (int j = 0; j < ref.columnCount(); j++) {
      v += ref.columns().get(j).margin() * ref.x()[j];
    }
    assertEquals(z, v, tol);
    // An empty master (z_RM = 0) at zero duals: the Lasdon-type bound is Σ_s D_s·max margin_s ≥ z.
    List<Set<VariantKey>> none = new ArrayList<>();
    for (int s = 0; s < space.segmentCount(); s++) {
      none.add(Set.of());
    }
    assertTrue(ref.lasdonBound(0, new double[space.resourceCount()], new double[space.segmentCount()], none) >= z - tol);
  }
}
