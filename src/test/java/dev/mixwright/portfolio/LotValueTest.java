package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

class LotValueTest {

  @Test
  void greedyMatchesTheVertexListing() {
    Random rnd = new Random(7);
    for (int i = 0; i < 3000; i++) {
      int n = 1 + rnd.nextInt(5);
      double[] d = new double[n];
      double[] u = new double[n];
      for (int s = 0; s < n; s++) {
        d[s] = rnd.nextDouble() < 0.15 ? Double.NEGATIVE_INFINITY : rnd.nextInt(200) - 120 + rnd.nextDouble();
        u[s] = 1 + rnd.nextInt(50);
      }
      double minLot = rnd.nextBoolean() ? 0 : rnd.nextInt(120);
      double expected = BruteVariants.lotValue(d, u, minLot); // brute force over the vertices
      double got = LotValue.best(d, u, minLot);
      if (expected == Double.NEGATIVE_INFINITY) {
        assertEquals(Double.NEGATIVE_INFINITY, got, "case " + i);
      } else {
        assertEquals(expected, got, 1e-9 * (1 + Math.abs(expected)), "case " + i);
      }
    }
  }

  @Test
  void handCheckedCases() {
    double[] u = {10, 20};
    // both pay: sell both at their bounds, 10·5 + 20·2 = 90
    assertEquals(90, LotValue.best(new double[] {5, 2}, u, 0), 1e-12);
    // one pays: without a lot sell only it (10·5 = 50); with a lot of 25 add 15 of the other at −1: 35
    assertEquals(50, LotValue.best(new double[] {5, -1}, u, 0), 1e-12);
    assertEquals(35, LotValue.best(new double[] {5, -1}, u, 25), 1e-12);
    // the lot cannot be reached: 30 < 31
    assertEquals(Double.NEGATIVE_INFINITY, LotValue.best(new double[] {5, -1}, u, 31));
    // no segment takes it
    assertEquals(Double.NEGATIVE_INFINITY,
        LotValue.best(new double[] {Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY}, u, 0));
    // nothing pays and no lot: sell nothing
    assertEquals(0, LotValue.best(new double[] {-3, -1}, u, 0), 1e-12);
  }
}
