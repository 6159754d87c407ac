package dev.mixwright.space;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.testing.Cases;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/**
 * BudgetedCount, CountJob and SpaceSurvey against brute force (odometer over every combination of
 * choices, {@link BruteForce}) on seeded small catalogs; a failure names its seed. Budgets are
 * untimed or probe counts, never clock time, so every case is reproducible.
 */
class BudgetedCountProperties {

  private static VariantSpace space(java.util.Random rnd, int segments) {
    int wide = Cases.between(rnd, 0, 10);
    return new VariantSpace(SpaceCounterProperties.draw(
        rnd, new int[] {3, 12}, new int[] {2, 6}, new int[] {3, 40}, segments, wide));
  }

  /** With room to finish, the answer is the exact count, in all and per segment. */
  @Test
  void exactWhenTheCountCanFinish() {
    Cases.each(60, (seed, rnd) -> {
      VariantSpace space = space(rnd, 3);
      List<SpaceCount> all = new BudgetedCount(space).wholeAndSegments(0);
      assertEquals(SpaceCount.exact(BruteForce.buildable(space)), all.get(0)); // brute force
      for (int s = 0; s < space.segmentCount(); s++) {
        assertEquals(SpaceCount.exact(BruteForce.columns(space, s)), all.get(s + 1), "segment " + s); // brute force
      }
    });
  }

  /**
   * Tables too small to count exactly: lower ≤ truth ≤ upper always, and the lower bound holds only
   * variants proven buildable, so it is 0 only when the probes found none.
   */
  @Test
  void boundsEncloseTheTruth() {
    AtomicInteger bounded = new AtomicInteger();
    AtomicInteger aboveProbes = new AtomicInteger();
    Cases.each(300, (seed, rnd) -> {
      VariantSpace space = space(rnd, 2);
      long limit = Cases.between(rnd, 1, 32);
      long probes = Cases.between(rnd, 0, 300);
      SpaceCount c = new BudgetedCount(space, limit, seed, probes).count(BudgetedCount.wholeSpace(space), 0);
      BigInteger truth = BigInteger.valueOf(BruteForce.buildable(space)); // brute force
      assertTrue(c.lower().compareTo(truth) <= 0, c.text() + " lower above " + truth);
      assertTrue(c.upper().compareTo(truth) >= 0, c.text() + " upper below " + truth);
      if (!c.exact()) {
        bounded.incrementAndGet();
        if (c.lower().compareTo(BigInteger.valueOf(probes)) > 0) {
          aboveProbes.incrementAndGet(); // the conditioned counts proved more than the probes found
        }
      }
      int s = rnd.nextInt(space.segmentCount());
      SpaceCount cs = new BudgetedCount(space, limit, seed, probes).count(BudgetedCount.segment(space, s), 0);
      BigInteger ts = BigInteger.valueOf(BruteForce.columns(space, s)); // brute force
      assertTrue(cs.lower().compareTo(ts) <= 0 && cs.upper().compareTo(ts) >= 0, cs.text() + " vs " + ts);
    });
    assertTrue(bounded.get() >= 50, "only " + bounded + " cases were left with bounds");
    assertTrue(aboveProbes.get() >= 10, "only " + aboveProbes + " lower bounds above the number of probes");
  }

  /**
   * Knuth's estimator is unbiased, so over many probes its mean lies within a few standard errors of
   * the truth. 4000 probes per case and a margin of 5 standard errors (plus rounding of the six-digit
   * decimals): on these seeds the largest deviation is far below it.
   */
  @Test
  void estimateWithinFiveStandardErrors() {
    AtomicInteger estimated = new AtomicInteger();
    Cases.each(150, (seed, rnd) -> {
      VariantSpace space = space(rnd, 1);
      SpaceCount c = new BudgetedCount(space, 1, seed, 4000).count(BudgetedCount.wholeSpace(space), 0);
      if (c.estimate().isEmpty()) {
        return; // exact, or bounds met before two probes
      }
      estimated.incrementAndGet();
      SpaceCount.Estimate e = c.estimate().get();
      BigDecimal truth = new BigDecimal(BruteForce.buildable(space)); // brute force
      double miss = e.value().subtract(truth).abs().doubleValue();
      double allowed = 5 * e.standardError().doubleValue() + 1e-5 * truth.doubleValue();
      assertTrue(miss <= allowed, e.text() + " misses " + truth + " by " + miss);
    });
    assertTrue(estimated.get() >= 40, "only " + estimated + " cases gave an estimate");
  }

  /** A stop signal that is already raised still gives true bounds. */
  @Test
  void stoppedAtOnceStillBounds() {
    Cases.each(60, (seed, rnd) -> {
      VariantSpace space = space(rnd, 1);
      SpaceCount c = new BudgetedCount(space).count(BudgetedCount.wholeSpace(space), 0, () -> true, x -> {});
      BigInteger truth = BigInteger.valueOf(BruteForce.buildable(space)); // brute force
      assertTrue(c.lower().compareTo(truth) <= 0 && c.upper().compareTo(truth) >= 0, c.text() + " vs " + truth);
    });
  }

  /** On its own thread the count ends with the same answer, and what it says meanwhile is bounds. */
  @Test
  void countJobAnswersTheExactCount() {
    Cases.each(20, (seed, rnd) -> {
      VariantSpace space = space(rnd, 1);
      BigInteger truth = BigInteger.valueOf(BruteForce.buildable(space)); // brute force
      try (CountJob job = CountJob.whole(space, 0)) {
        SpaceCount early = job.current();
        assertTrue(early.lower().compareTo(truth) <= 0 && early.upper().compareTo(truth) >= 0);
        assertEquals(SpaceCount.exact(truth), job.result().get());
        assertEquals(SpaceCount.exact(truth), job.await(0));
        assertTrue(job.done());
      }
    });
  }

  /** Whether anything is buildable, and whether each segment accepts something, by search. */
  @Test
  void surveyAgreesWithBruteForce() {
    AtomicInteger emptySegments = new AtomicInteger();
    Cases.each(100, (seed, rnd) -> {
      VariantSpace space = space(rnd, 4);
      SpaceSurvey survey = SpaceSurvey.of(space);
      assertEquals(BruteForce.buildable(space) > 0, survey.whole().found()); // brute force
      boolean any = false;
      for (int s = 0; s < space.segmentCount(); s++) {
        boolean sells = BruteForce.columns(space, s) > 0; // brute force
        assertEquals(sells ? Existence.FOUND : Existence.NONE, survey.segments().get(s), "segment " + s);
        any |= sells;
        if (!sells) {
          emptySegments.incrementAndGet();
        }
      }
      assertEquals(!any, survey.nothingSellable());
    });
    assertTrue(emptySegments.get() >= 5, "only " + emptySegments + " segments that sell nothing");
  }

  @Test
  void countsTextAndChecks() {
    SpaceCount b = SpaceCount.between(BigInteger.TWO, BigInteger.TEN,
        java.util.Optional.of(new SpaceCount.Estimate(new BigDecimal("12.5"), BigDecimal.ONE, 10)));
    assertEquals(new BigDecimal("10"), b.estimate().orElseThrow().value(), "clamped into the bounds");
    assertEquals(SpaceCount.exact(7), SpaceCount.between(BigInteger.valueOf(7), BigInteger.valueOf(7),
        java.util.Optional.empty()));
    assertEquals("at most 9", SpaceCount.atMost(BigInteger.valueOf(9)).text());
    assertTrue(b.text().startsWith("between 2 and 10, about 10 ± 1"), b.text());
    org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
        () -> SpaceCount.between(BigInteger.TEN, BigInteger.TWO, java.util.Optional.empty()));
    // 2.5 · e^1000 (Wolfram-free check: log10 = log10 2.5 + 1000 / ln 10 = 434.6925..., by hand)
    BigDecimal big = BudgetedCount.Mean.scaled(2.5, 1000);
    assertEquals(434, big.precision() - big.scale() - 1);
  }
}
