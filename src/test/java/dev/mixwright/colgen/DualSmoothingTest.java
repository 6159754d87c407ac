package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;

import org.junit.jupiter.api.Test;

/**
 * Wentges smoothing and the mispricing schedule α_k = max(0, 1 − (k+1)(1 − α)) of Pessoa, Sadykov,
 * Uchoa &amp; Vanderbeck 2018 (INFORMS JOC 30(2), section 3), worked by hand.
 */
class DualSmoothingTest {

  @Test
  void withoutACentreItPricesAtTheMastersDuals() {
    DualSmoothing s = new DualSmoothing(0.8);
    double[] pi = {4, 2};
    assertEquals(0.0, s.alpha(0));
    assertSame(pi, s.resourcePoint(s.alpha(0), pi));
  }

  @Test
  void mispricingsWalkTheWeightDownToZero() {
    DualSmoothing s = new DualSmoothing(0.8);
    s.offer(100, new double[] {10, 0}, new double[] {5});
    assertEquals(0.8, s.alpha(0), 1e-12);
    assertEquals(0.6, s.alpha(1), 1e-12);
    assertEquals(0.2, s.alpha(3), 1e-12);
    assertEquals(0.0, s.alpha(4), 1e-12);
    assertEquals(0.0, s.alpha(9), 1e-12);
    // 0.5·(10, 0) + 0.5·(2, 4) = (6, 2);  0.5·5 + 0.5·1 = 3
    assertArrayEquals(new double[] {6, 2}, s.resourcePoint(0.5, new double[] {2, 4}), 1e-12);
    assertArrayEquals(new double[] {3}, s.segmentPoint(0.5, new double[] {1}), 1e-12);
  }

  @Test
  void theCentreMovesOnlyToABetterBound() {
    DualSmoothing s = new DualSmoothing(0.5);
    s.offer(100, new double[] {10}, new double[] {0});
    s.offer(120, new double[] {99}, new double[] {0});
    assertArrayEquals(new double[] {6}, s.resourcePoint(0.5, new double[] {2}), 1e-12);
    s.offer(90, new double[] {20}, new double[] {0});
    assertArrayEquals(new double[] {11}, s.resourcePoint(0.5, new double[] {2}), 1e-12);
  }

  @Test
  void withoutSmoothingThereIsNeverACentre() {
    DualSmoothing s = new DualSmoothing(0);
    s.offer(100, new double[] {10}, new double[] {0});
    assertEquals(0.0, s.alpha(0));
  }
}
