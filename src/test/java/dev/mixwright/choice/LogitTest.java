package dev.mixwright.choice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

class LogitTest {
  /**
   * Two alternatives as attractive as staying out: each takes a third (Train, <i>Discrete Choice
   * Methods with Simulation</i>, 2nd ed. 2009, ch. 3, the logit formula P = e^V / Σ e^V).
   */
  @Test
  void equalAttractionsSplitEvenly() {
    double[] sales = Logit.sales(900, new double[] {0, 0});
    assertEquals(300, sales[0], 1e-9);
    assertEquals(300, sales[1], 1e-9);
    assertEquals(300, Logit.stayingOut(900, new double[] {0, 0}), 1e-9);
  }

  @Test
  void salesMatchThePlainFormulaAndAddUpToTheBuyers() {
    Random rnd = new Random(7);
    for (int t = 0; t < 200; t++) {
      int n = 1 + rnd.nextInt(6);
      double[] logW = new double[n];
      double sum = 0;
      for (int i = 0; i < n; i++) {
        logW[i] = -5 + 10 * rnd.nextDouble();
        sum += Math.exp(logW[i]);
      }
      double buyers = 1 + rnd.nextInt(1000);
      double[] sales = Logit.sales(buyers, logW);
      double total = Logit.stayingOut(buyers, logW);
      for (int i = 0; i < n; i++) {
        assertEquals(buyers * Math.exp(logW[i]) / (1 + sum), sales[i], 1e-9 * buyers, "trial " + t);
        total += sales[i];
      }
      assertEquals(buyers, total, 1e-9 * buyers, "trial " + t);
    }
  }

  /** exp(800) overflows a double; the shifted form does not. */
  @Test
  void hugeAndTinyAttractionsStayFinite() {
    double[] sales = Logit.sales(100, new double[] {800, 799, -800});
    assertEquals(100 / (1 + Math.exp(-1)), sales[0], 1e-9);
    assertEquals(100 * Math.exp(-1) / (1 + Math.exp(-1)), sales[1], 1e-9);
    assertTrue(sales[2] >= 0 && sales[2] < 1e-300);
    assertEquals(800 + Math.log(1 + Math.exp(-1)), Logit.logSumExp(new double[] {800, 799}), 1e-12);
    assertEquals(100, Logit.stayingOut(100, new double[0]), 0);
  }

  @Test
  void utilityIsTheSumOverGroups() {
    double[] util = {0.5, -1, 2, 0.25, 3};
    int[] offset = {0, 2, 5};
    assertEquals(-1 + 0.25, Logit.utility(util, offset, new int[] {1, 1}), 0);
    assertEquals(Math.exp(2.5 - 1), Logit.attraction(2.5, 1), 1e-12);
  }

  /**
   * The revenue-ordered value equals the best revenue per buyer over every subset, enumerated here
   * by brute force (2^n subsets, the multinomial logit's Σ_S w r / (1 + Σ_S w)), on seeded random
   * alternatives with negative, tied and tiny values among them.
   */
  @Test
  void bestOfferValueIsTheBestOverEverySubset() {
    for (long seed = 0; seed < 300; seed++) {
      Random rnd = new Random(seed);
      int n = 1 + rnd.nextInt(10);
      double[] r = new double[n];
      double[] w = new double[n];
      for (int i = 0; i < n; i++) {
        r[i] = rnd.nextInt(4) == 0 ? r[Math.max(0, i - 1)] : 100 * rnd.nextGaussian();
        w[i] = Math.exp(4 * rnd.nextGaussian());
      }
      double best = 0;
      for (int mask = 1; mask < (1 << n); mask++) {
        double sw = 0;
        double swr = 0;
        for (int i = 0; i < n; i++) {
          if ((mask & (1 << i)) != 0) {
            sw += w[i];
            swr += w[i] * r[i];
          }
        }
        best = Math.max(best, swr / (1 + sw));
      }
      long s0 = seed;
      // source: enumeration of every offer set
      assertEquals(best, Logit.bestOfferValue(r, w, n), 1e-9 * Math.max(1, best), () -> "seed " + s0);
    }
  }
}
