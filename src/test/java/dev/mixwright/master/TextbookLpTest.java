package dev.mixwright.master;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Textbook LPs solved through {@link RestrictedMaster}. The book figures (objective, solution, dual
 * values, reduced costs) are as recorded in the project's notes and from memory of the books, not
 * re-read against them; each was re-derived by hand from the LP as stated here (basis equations
 * solved for x and the duals). Checks that are not in a book are marked "derived by hand".
 *
 * <p>Rows of the form "x_j ≤ k" are written three ways where that means something: as a resource
 * row, as a segment row (demand k, the column in that segment) and as the column's upper bound —
 * the dual must then appear on that row, or as the column's reduced cost when it is a bound.
 */
class TextbookLpTest {
  private static final double EPS = 1e-9;
  private static final double INF = Double.POSITIVE_INFINITY;

  /** A column as the test wrote it, to recompute reduced costs from the returned duals. */
  private record Col(int segment, double margin, double[] use, double upper) {}

  /** Builds a master, keeping the column data for {@link #assertReducedCostsMatchDuals}. */
  private static final class Lp implements AutoCloseable {
    final RestrictedMaster master;
    final List<Col> cols = new ArrayList<>();

    Lp(double[] capacity, double[] demand) {
      master = new RestrictedMaster(capacity, demand);
    }

    Lp col(int segment, double margin, double[] use, double upper) {
      cols.add(new Col(segment, margin, use, upper));
      master.addColumn(segment, margin, use, upper);
      return this;
    }

    MasterSolution solve() {
      MasterSolution sol = master.solve();
      assertTrue(sol.isOptimal(), "status " + sol.status());
      assertReducedCostsMatchDuals(this, sol);
      return sol;
    }

    @Override
    public void close() {
      master.close();
    }
  }

  /** rc_j = m_j − a_j·π − μ_s(j): the reduced costs belong to the duals returned with them. */
  private static void assertReducedCostsMatchDuals(Lp lp, MasterSolution sol) {
    for (int j = 0; j < lp.cols.size(); j++) {
      Col c = lp.cols.get(j);
      double d = c.margin();
      for (int r = 0; r < c.use().length; r++) {
        d -= sol.resourceDual()[r] * c.use()[r];
      }
      if (c.segment() >= 0) {
        d -= sol.segmentDual()[c.segment()];
      }
      assertEquals(d, sol.reducedCost()[j], EPS, "reduced cost of column " + j);
    }
  }

  // ---- Wyndor Glass: Hillier & Lieberman, Introduction to Operations Research, ch. 3 (model) and
  // ch. 4-7 (simplex, duality and sensitivity): max 3x1 + 5x2; x1 ≤ 4; 2x2 ≤ 12; 3x1 + 2x2 ≤ 18.

  @Test
  void wyndorWithEveryRowAResource() {
    try (Lp lp = new Lp(new double[] {4, 12, 18}, new double[0])) {
      lp.col(-1, 3, new double[] {1, 0, 3}, INF).col(-1, 5, new double[] {0, 2, 2}, INF);
      MasterSolution sol = lp.solve();
      // Hillier & Lieberman, Wyndor Glass: z = 36 at x = (2, 6).
      assertEquals(36, sol.objective(), EPS);
      assertArrayEquals(new double[] {2, 6}, sol.x(), EPS);
      // Hillier & Lieberman, Wyndor Glass shadow prices: plant 1: 0, plant 2: 1.5, plant 3: 1.
      assertArrayEquals(new double[] {0, 1.5, 1}, sol.resourceDual(), EPS);
      // Both products basic: reduced costs 0 (derived by hand from the duals above).
      assertArrayEquals(new double[] {0, 0}, sol.reducedCost(), EPS);
      assertFalse(sol.atUpper()[0] || sol.atUpper()[1]);
    }
  }

  @Test
  void wyndorPlantOneAsSegmentRow() {
    // x1 ≤ 4 as the demand of a segment holding only doors.
    try (Lp lp = new Lp(new double[] {12, 18}, new double[] {4})) {
      lp.col(0, 3, new double[] {0, 3}, INF).col(-1, 5, new double[] {2, 2}, INF);
      MasterSolution sol = lp.solve();
      // Hillier & Lieberman, Wyndor Glass: z = 36, x = (2, 6).
      assertEquals(36, sol.objective(), EPS);
      assertArrayEquals(new double[] {2, 6}, sol.x(), EPS);
      // Hillier & Lieberman, Wyndor Glass: plant 1's shadow price 0 now sits on the segment row.
      assertArrayEquals(new double[] {0}, sol.segmentDual(), EPS);
      // Hillier & Lieberman, Wyndor Glass: plant 2: 1.5, plant 3: 1.
      assertArrayEquals(new double[] {1.5, 1}, sol.resourceDual(), EPS);
    }
  }

  @Test
  void wyndorBindingPlantTwoAsSegmentRowOnScaledColumn() {
    // Plant 2 (2x2 ≤ 12) binds. In y = 2x2 (hours of plant 2) it reads y ≤ 12, a segment row with
    // coefficient 1: windows earn 2.5 and use 1 h of plant 3 per unit of y.
    try (Lp lp = new Lp(new double[] {4, 18}, new double[] {12})) {
      lp.col(-1, 3, new double[] {1, 3}, INF).col(0, 2.5, new double[] {0, 1}, INF);
      MasterSolution sol = lp.solve();
      // Hillier & Lieberman, Wyndor Glass: z = 36, x = (2, 6), i.e. y = 12.
      assertEquals(36, sol.objective(), EPS);
      assertArrayEquals(new double[] {2, 12}, sol.x(), EPS);
      // Hillier & Lieberman, Wyndor Glass: plant 2's shadow price 1.5, here on the segment row.
      assertArrayEquals(new double[] {1.5}, sol.segmentDual(), EPS);
      // Hillier & Lieberman, Wyndor Glass: plant 1: 0, plant 3: 1.
      assertArrayEquals(new double[] {0, 1}, sol.resourceDual(), EPS);
    }
  }

  @Test
  void wyndorBindingPlantTwoAsUpperBoundKeepsPositiveReducedCost() {
    // The same y ≤ 12 as the column's bound: no row carries it, so its price shows up as the
    // column's reduced cost, which stays positive at the bound.
    try (Lp lp = new Lp(new double[] {4, 18}, new double[0])) {
      lp.col(-1, 3, new double[] {1, 3}, INF).col(-1, 2.5, new double[] {0, 1}, 12);
      MasterSolution sol = lp.solve();
      // Hillier & Lieberman, Wyndor Glass: z = 36, x = (2, 6).
      assertEquals(36, sol.objective(), EPS);
      assertArrayEquals(new double[] {2, 12}, sol.x(), EPS);
      // Hillier & Lieberman, Wyndor Glass: plant 1: 0, plant 3: 1.
      assertArrayEquals(new double[] {0, 1}, sol.resourceDual(), EPS);
      // Hillier & Lieberman, Wyndor Glass: plant 2's shadow price 1.5 = 2.5 − 1·1 (derived by hand).
      assertEquals(1.5, sol.reducedCost()[1], EPS);
      assertTrue(sol.reducedCost()[1] > 0);
      assertTrue(sol.atUpper()[1], "windows sit at their bound");
      assertFalse(sol.atUpper()[0], "doors are basic");
    }
  }

  // ---- Dakota Furniture: Winston, Operations Research: Applications and Algorithms, ch. 6
  // (sensitivity analysis): max 60x1 + 30x2 + 20x3 (desks, tables, chairs); lumber 8/6/1 ≤ 48;
  // finishing 4/2/1.5 ≤ 20; carpentry 2/1.5/0.5 ≤ 8; x2 ≤ 5.

  private static final double[] DESK = {8, 4, 2};
  private static final double[] TABLE = {6, 2, 1.5};
  private static final double[] CHAIR = {1, 1.5, 0.5};

  private static double[] with(double[] a, double last) {
    double[] b = Arrays.copyOf(a, a.length + 1);
    b[a.length] = last;
    return b;
  }

  @Test
  void dakotaWithEveryRowAResource() {
    try (Lp lp = new Lp(new double[] {48, 20, 8, 5}, new double[0])) {
      lp.col(-1, 60, with(DESK, 0), INF).col(-1, 30, with(TABLE, 1), INF).col(-1, 20, with(CHAIR, 0), INF);
      MasterSolution sol = lp.solve();
      // Winston, Dakota Furniture: z = 280 at (desks, tables, chairs) = (2, 0, 8).
      assertEquals(280, sol.objective(), EPS);
      assertArrayEquals(new double[] {2, 0, 8}, sol.x(), EPS);
      // Winston, Dakota Furniture shadow prices: lumber 0, finishing 10, carpentry 10, table limit 0.
      assertArrayEquals(new double[] {0, 10, 10, 0}, sol.resourceDual(), EPS);
      // Winston, Dakota Furniture: tables' reduced cost −5 (desks and chairs basic: 0).
      assertArrayEquals(new double[] {0, -5, 0}, sol.reducedCost(), EPS);
    }
  }

  @Test
  void dakotaTableLimitAsSegmentRow() {
    try (Lp lp = new Lp(new double[] {48, 20, 8}, new double[] {5})) {
      lp.col(-1, 60, DESK, INF).col(0, 30, TABLE, INF).col(-1, 20, CHAIR, INF);
      MasterSolution sol = lp.solve();
      // Winston, Dakota Furniture: z = 280, x = (2, 0, 8).
      assertEquals(280, sol.objective(), EPS);
      assertArrayEquals(new double[] {2, 0, 8}, sol.x(), EPS);
      // Winston, Dakota Furniture: lumber 0, finishing 10, carpentry 10; table limit 0 on its row.
      assertArrayEquals(new double[] {0, 10, 10}, sol.resourceDual(), EPS);
      assertArrayEquals(new double[] {0}, sol.segmentDual(), EPS);
      // Winston, Dakota Furniture: tables' reduced cost −5.
      assertEquals(-5, sol.reducedCost()[1], EPS);
    }
  }

  @Test
  void dakotaTableLimitAsUpperBound() {
    try (Lp lp = new Lp(new double[] {48, 20, 8}, new double[0])) {
      lp.col(-1, 60, DESK, INF).col(-1, 30, TABLE, 5).col(-1, 20, CHAIR, INF);
      MasterSolution sol = lp.solve();
      // Winston, Dakota Furniture: z = 280, x = (2, 0, 8), duals 0, 10, 10.
      assertEquals(280, sol.objective(), EPS);
      assertArrayEquals(new double[] {2, 0, 8}, sol.x(), EPS);
      assertArrayEquals(new double[] {0, 10, 10}, sol.resourceDual(), EPS);
      // Winston, Dakota Furniture: tables' reduced cost −5; at zero, not at their bound of 5.
      assertEquals(-5, sol.reducedCost()[1], EPS);
      assertFalse(sol.atUpper()[1]);
    }
  }

  private static MasterSolution dakotaAtTablePrice(double tableMargin) {
    try (Lp lp = new Lp(new double[] {48, 20, 8}, new double[] {5})) {
      lp.col(-1, 60, DESK, INF).col(0, tableMargin, TABLE, INF).col(-1, 20, CHAIR, INF);
      return lp.solve();
    }
  }

  @Test
  void dakotaTablesEnterAtPriceThirtyFive() {
    // Winston, Dakota Furniture: tables enter once their price reaches 30 + 5 = 35. The optimum at
    // x = (2, 0, 8) is non-degenerate (derived by hand), so the duals are unique and the switch is
    // sharp on both sides.
    double eps = 1e-3;
    MasterSolution above = dakotaAtTablePrice(35 + eps);
    assertTrue(above.x()[1] > 1e-6, "tables are made at 35 + eps: x2 = " + above.x()[1]);
    assertTrue(above.objective() > 280 + 1e-9);
    MasterSolution below = dakotaAtTablePrice(35 - eps);
    assertEquals(0, below.x()[1], EPS);
    assertEquals(280, below.objective(), EPS);
    // Winston, Dakota Furniture: the reduced cost moves one for one with the price: −5 + (5 − eps).
    assertEquals(-eps, below.reducedCost()[1], 1e-7);
  }

  // ---- Custom molder: Bradley, Hax & Magnanti, Applied Mathematical Programming, ch. 3:
  // max 5x1 + 4.5x2 + 6x3; 6x1 + 5x2 + 8x3 ≤ 60 (production hours); 10x1 + 20x2 + 10x3 ≤ 150
  // (warehouse); x1 ≤ 8 (demand for the first product).

  private static final double[] M1 = {6, 10};
  private static final double[] M2 = {5, 20};
  private static final double[] M3 = {8, 10};

  private static void assertMolderOptimum(MasterSolution sol) {
    // Bradley, Hax & Magnanti, ch. 3 custom molder: z = 360/7 at x = (45/7, 30/7, 0).
    assertEquals(360.0 / 7, sol.objective(), EPS);
    assertArrayEquals(new double[] {45.0 / 7, 30.0 / 7, 0}, sol.x(), EPS);
    // Bradley, Hax & Magnanti, ch. 3: shadow prices 11/14 (hours) and 1/35 (warehouse).
    assertEquals(11.0 / 14, sol.resourceDual()[0], EPS);
    assertEquals(1.0 / 35, sol.resourceDual()[1], EPS);
    // Bradley, Hax & Magnanti, ch. 3: the third product's reduced cost −4/7.
    assertEquals(-4.0 / 7, sol.reducedCost()[2], EPS);
  }

  @Test
  void molderWithDemandLimitAsResourceRow() {
    try (Lp lp = new Lp(new double[] {60, 150, 8}, new double[0])) {
      lp.col(-1, 5, with(M1, 1), INF).col(-1, 4.5, with(M2, 0), INF).col(-1, 6, with(M3, 0), INF);
      MasterSolution sol = lp.solve();
      assertMolderOptimum(sol);
      // Bradley, Hax & Magnanti, ch. 3: the demand limit x1 ≤ 8 has shadow price 0.
      assertEquals(0, sol.resourceDual()[2], EPS);
    }
  }

  @Test
  void molderWithDemandLimitAsSegmentRow() {
    try (Lp lp = new Lp(new double[] {60, 150}, new double[] {8})) {
      lp.col(0, 5, M1, INF).col(-1, 4.5, M2, INF).col(-1, 6, M3, INF);
      MasterSolution sol = lp.solve();
      assertMolderOptimum(sol);
      // Bradley, Hax & Magnanti, ch. 3: the demand limit's shadow price 0, on the segment row.
      assertArrayEquals(new double[] {0}, sol.segmentDual(), EPS);
    }
  }

  @Test
  void molderWithDemandLimitAsUpperBound() {
    try (Lp lp = new Lp(new double[] {60, 150}, new double[0])) {
      lp.col(-1, 5, M1, 8).col(-1, 4.5, M2, INF).col(-1, 6, M3, INF);
      MasterSolution sol = lp.solve();
      assertMolderOptimum(sol);
      // x1 = 45/7 < 8 is basic: reduced cost 0, not at its bound (derived by hand).
      assertEquals(0, sol.reducedCost()[0], EPS);
      assertFalse(sol.atUpper()[0]);
    }
  }

  // ---- Giapetto: Winston, Operations Research: Applications and Algorithms (ch. 3 model, ch. 6
  // sensitivity): max 3x1 + 2x2 (soldiers, trains); finishing 2x1 + x2 ≤ 100; carpentry
  // x1 + x2 ≤ 80; soldier demand x1 ≤ 40.

  @Test
  void giapettoThreeWays() {
    MasterSolution asRow;
    try (Lp lp = new Lp(new double[] {100, 80, 40}, new double[0])) {
      lp.col(-1, 3, new double[] {2, 1, 1}, INF).col(-1, 2, new double[] {1, 1, 0}, INF);
      asRow = lp.solve();
    }
    MasterSolution asSegment;
    try (Lp lp = new Lp(new double[] {100, 80}, new double[] {40})) {
      lp.col(0, 3, new double[] {2, 1}, INF).col(-1, 2, new double[] {1, 1}, INF);
      asSegment = lp.solve();
    }
    MasterSolution asBound;
    try (Lp lp = new Lp(new double[] {100, 80}, new double[0])) {
      lp.col(-1, 3, new double[] {2, 1}, 40).col(-1, 2, new double[] {1, 1}, INF);
      asBound = lp.solve();
    }
    for (MasterSolution sol : List.of(asRow, asSegment, asBound)) {
      // Winston, Giapetto: z = 180 at (soldiers, trains) = (20, 60).
      assertEquals(180, sol.objective(), EPS);
      assertArrayEquals(new double[] {20, 60}, sol.x(), EPS);
      // Winston, Giapetto: finishing 1, carpentry 1.
      assertEquals(1, sol.resourceDual()[0], EPS);
      assertEquals(1, sol.resourceDual()[1], EPS);
      assertArrayEquals(new double[] {0, 0}, sol.reducedCost(), EPS);
    }
    // Winston, Giapetto: the soldier demand limit's dual 0, on whichever row carries it.
    assertEquals(0, asRow.resourceDual()[2], EPS);
    assertArrayEquals(new double[] {0}, asSegment.segmentDual(), EPS);
    assertFalse(asBound.atUpper()[0]);
  }

  // ---- Incremental columns

  @Test
  void columnAddedAfterSolveGivesSameResultAsAllAtOnce() {
    MasterSolution whole;
    try (Lp lp = new Lp(new double[] {60, 150}, new double[] {8})) {
      lp.col(0, 5, M1, INF).col(-1, 4.5, M2, INF).col(-1, 6, M3, INF);
      whole = lp.solve();
    }
    try (Lp lp = new Lp(new double[] {60, 150}, new double[] {8})) {
      lp.col(0, 5, M1, INF);
      MasterSolution first = lp.solve();
      // Only product 1: x1 = 8 (its demand) — derived by hand; z = 40 < 360/7.
      assertEquals(40, first.objective(), EPS);
      lp.col(-1, 4.5, M2, INF);
      MasterSolution second = lp.solve();
      lp.col(-1, 6, M3, INF);
      MasterSolution third = lp.solve();
      assertMolderOptimum(third);
      assertEquals(360.0 / 7, second.objective(), EPS, "product 3 does not pay (reduced cost −4/7)");
      assertEquals(whole.objective(), third.objective(), EPS);
      assertArrayEquals(whole.x(), third.x(), EPS);
      assertArrayEquals(whole.reducedCost(), third.reducedCost(), EPS);
      assertArrayEquals(whole.resourceDual(), third.resourceDual(), EPS);
      assertArrayEquals(whole.segmentDual(), third.segmentDual(), EPS);
      assertArrayEquals(whole.atUpper(), third.atUpper());
    }
  }

  @Test
  void wyndorColumnAddedAfterSolve() {
    try (Lp lp = new Lp(new double[] {4, 12, 18}, new double[0])) {
      lp.col(-1, 3, new double[] {1, 0, 3}, INF);
      MasterSolution first = lp.solve();
      // Doors only: x1 = 4 (plant 1), z = 12, plant 1's dual 3 (derived by hand).
      assertEquals(12, first.objective(), EPS);
      assertArrayEquals(new double[] {3, 0, 0}, first.resourceDual(), EPS);
      lp.col(-1, 5, new double[] {0, 2, 2}, INF);
      MasterSolution second = lp.solve();
      // Hillier & Lieberman, Wyndor Glass: z = 36, x = (2, 6), duals 0, 1.5, 1.
      assertEquals(36, second.objective(), EPS);
      assertArrayEquals(new double[] {2, 6}, second.x(), EPS);
      assertArrayEquals(new double[] {0, 1.5, 1}, second.resourceDual(), EPS);
    }
  }

  // ---- Degenerate and zero-capacity cases (not from a book: derived by hand from the dual LP)

  @Test
  void zeroCapacityRowStopsEverything() {
    // Wyndor with plant 3 closed (capacity 0): both products need it, so z = 0, x = 0. Dual
    // optimal set (derived by hand): π1 = π2 = 0 (their rows have slack), π3 ≥ max(3/3, 5/2) = 2.5.
    try (Lp lp = new Lp(new double[] {4, 12, 0}, new double[0])) {
      lp.col(-1, 3, new double[] {1, 0, 3}, INF).col(-1, 5, new double[] {0, 2, 2}, INF);
      MasterSolution sol = lp.solve();
      assertEquals(0, sol.objective(), EPS);
      assertArrayEquals(new double[] {0, 0}, sol.x(), EPS);
      assertEquals(0, sol.resourceDual()[0], EPS);
      assertEquals(0, sol.resourceDual()[1], EPS);
      assertTrue(sol.resourceDual()[2] >= 2.5 - EPS, "π3 = " + sol.resourceDual()[2]);
      for (double rc : sol.reducedCost()) {
        assertTrue(rc <= EPS, "no column pays at the duals: rc = " + rc);
      }
    }
  }

  @Test
  void zeroDemandSegmentKeepsItsColumnOut() {
    // Giapetto with the soldiers' segment at demand 0: only trains, x2 = 80 (carpentry), z = 160.
    // Derived by hand: finishing has slack so π = (0, 2); soldiers' rc = 3 − 2 − μ ≤ 0 needs μ ≥ 1.
    try (Lp lp = new Lp(new double[] {100, 80}, new double[] {0})) {
      lp.col(0, 3, new double[] {2, 1}, INF).col(-1, 2, new double[] {1, 1}, INF);
      MasterSolution sol = lp.solve();
      assertEquals(160, sol.objective(), EPS);
      assertArrayEquals(new double[] {0, 80}, sol.x(), EPS);
      assertArrayEquals(new double[] {0, 2}, sol.resourceDual(), EPS);
      assertTrue(sol.segmentDual()[0] >= 1 - EPS, "μ = " + sol.segmentDual()[0]);
      assertTrue(sol.reducedCost()[0] <= EPS);
    }
  }

  @Test
  void zeroUpperBoundRetiresColumn() {
    // Wyndor with windows fixed at 0 through setColumnBounds: doors alone, x1 = 4, z = 12
    // (derived by hand).
    try (Lp lp = new Lp(new double[] {4, 12, 18}, new double[0])) {
      lp.col(-1, 3, new double[] {1, 0, 3}, INF).col(-1, 5, new double[] {0, 2, 2}, INF);
      assertEquals(36, lp.solve().objective(), EPS);
      lp.master.setColumnBounds(1, 0, 0);
      MasterSolution sol = lp.solve();
      assertEquals(12, sol.objective(), EPS);
      assertArrayEquals(new double[] {4, 0}, sol.x(), EPS);
    }
  }

  @Test
  void degenerateVertexHasDualsOnTheOptimalFace() {
    // Giapetto with the soldier limit lowered to 20: at (20, 60) all three rows bind, one more than
    // the two variables, so the optimum is degenerate. Derived by hand: z = 180 still, and the dual
    // optimal set is y1 ∈ [0, 1], y2 = 2 − y1, y3 = 1 − y1 (x1, x2 > 0 make both dual rows tight).
    try (Lp lp = new Lp(new double[] {100, 80, 20}, new double[0])) {
      lp.col(-1, 3, new double[] {2, 1, 1}, INF).col(-1, 2, new double[] {1, 1, 0}, INF);
      MasterSolution sol = lp.solve();
      assertEquals(180, sol.objective(), EPS);
      assertArrayEquals(new double[] {20, 60}, sol.x(), EPS);
      double[] y = sol.resourceDual();
      assertEquals(2, y[0] + y[1], EPS);
      assertEquals(1, y[0] + y[2], EPS);
      for (double v : y) {
        assertTrue(v >= -EPS);
      }
      assertEquals(180, 100 * y[0] + 80 * y[1] + 20 * y[2], EPS, "strong duality");
    }
  }
}
