package dev.mixwright.portfolio;

import dev.mixwright.space.VariantKey;
import java.util.Set;

/**
 * One pricing problem of the portfolio relaxation: at resource prices π and segment prices μ, find up
 * to {@code k} buildable variants of value ψ(v) strictly above {@code threshold}, best first, none in
 * {@code excluded}, where
 *
 * <pre>
 *   ψ(v) = g(d_1(v), ..., d_S(v)) − charge − Σ_g penalty[choice of v in g]
 *   d_s(v) = margin(v, s) − Σ_r π_r use_r(v) − μ_s       (−∞ where s does not accept v)
 * </pre>
 *
 * and g is {@link LotValue#best}, less Σ_s {@code acceptCharge[s]} over the segments s that accept v
 * (the duals of a tree node's segment count rows: a charge when positive, a bonus when negative), and
 * less Σ_{s accepts v} Σ_g {@code pairCharge[s][choice of v in g]} (the duals of a node's count rows
 * on the variants that a segment accepts and that use a choice). {@code penalty}, {@code acceptCharge}
 * and {@code pairCharge} may be null (all zero). Plus Σ_{s accepts v} {@code attractionBonus[s]}·w_s(v)
 * over the choosing segments, w_s(v) = exp(u_s(v) − stayOut_s) (the duals of the sales envelopes of
 * {@link SalesEnvelope}; null for none). {@code deadlineNanos}: a
 * {@code System.nanoTime()} after which the search stops with a valid bound, 0 for none.
 *
 * <p>For a range across scenarios k = 1..n ({@link VariantPricer} built over n scenarios) the prices
 * stack the scenarios' rows (π of scenario k at [k·R, (k+1)·R), μ at [k·S, (k+1)·S)) and
 * ψ(v) = Σ_k g_k(d^k(v)) − charge − penalty, with d^k_s(v) = ω_k margin_k(v, s) − π^k·use_k(v) − μ^k_s and
 * ω = {@code scenarioWeight} (null: all 1).
 */
public record VariantQuery(
    double[] resourcePrice,
    double[] segmentPrice,
    double charge,
    double[] penalty,
    double threshold,
    int k,
    Set<VariantKey> excluded,
    long deadlineNanos,
    double[] scenarioWeight,
    double[] acceptCharge,
    double[][] pairCharge,
    double[] attractionBonus) {

  /** A query without charges on (segment, choice) pairs. */
  public VariantQuery(double[] resourcePrice, double[] segmentPrice, double charge, double[] penalty,
      double threshold, int k, Set<VariantKey> excluded, long deadlineNanos, double[] scenarioWeight,
      double[] acceptCharge) {
    this(resourcePrice, segmentPrice, charge, penalty, threshold, k, excluded, deadlineNanos, scenarioWeight,
        acceptCharge, null, null);
  }

  /** A query without acceptance charges. */
  public VariantQuery(double[] resourcePrice, double[] segmentPrice, double charge, double[] penalty,
      double threshold, int k, Set<VariantKey> excluded, long deadlineNanos, double[] scenarioWeight) {
    this(resourcePrice, segmentPrice, charge, penalty, threshold, k, excluded, deadlineNanos, scenarioWeight, null);
  }

  /** A query of one scenario (weight 1). */
  public VariantQuery(double[] resourcePrice, double[] segmentPrice, double charge, double[] penalty,
      double threshold, int k, Set<VariantKey> excluded, long deadlineNanos) {
    this(resourcePrice, segmentPrice, charge, penalty, threshold, k, excluded, deadlineNanos, null, null);
  }

  /** This query with a charge per segment that accepts the variant ({@code null}: none). */
  public VariantQuery withAcceptCharge(double[] perSegment) {
    return new VariantQuery(resourcePrice, segmentPrice, charge, penalty, threshold, k, excluded, deadlineNanos,
        scenarioWeight, perSegment, pairCharge, attractionBonus);
  }

  /**
   * This query with a charge per (segment s, flat choice f) on every variant that s accepts and that
   * uses f ({@code null}: none): [segment][flat].
   */
  public VariantQuery withPairCharge(double[][] perPair) {
    return new VariantQuery(resourcePrice, segmentPrice, charge, penalty, threshold, k, excluded, deadlineNanos,
        scenarioWeight, acceptCharge, perPair, attractionBonus);
  }

  /**
   * This query with a value per unit of attraction w_s(v) in each choosing segment s that accepts the
   * variant ({@code null}: none; entries ≥ 0).
   */
  public VariantQuery withAttractionBonus(double[] perSegment) {
    return new VariantQuery(resourcePrice, segmentPrice, charge, penalty, threshold, k, excluded, deadlineNanos,
        scenarioWeight, acceptCharge, pairCharge, perSegment);
  }

  /**
   * Σ over the segments s that {@code accepts} and the groups g of {@code pair[s][choice of v in g]}: what
   * pair charges take from ψ(v) (0 for {@code pair} null). {@code offsets}: the groups' flat offsets.
   */
  static double pairChargeOf(double[][] pair, int[] v, int[] offsets, java.util.function.IntPredicate accepts) {
    double c = 0;
    for (int s = 0; pair != null && s < pair.length; s++) {
      if (accepts.test(s)) {
        for (int g = 0; g < v.length; g++) {
          c += pair[s][offsets[g] + v[g]];
        }
      }
    }
    return c;
  }

  /** The weight of scenario k (1 when none are given). */
  public double weight(int k) {
    return scenarioWeight == null ? 1.0 : scenarioWeight[k];
  }

  public VariantQuery {
    if (k < 1) {
      throw new IllegalArgumentException("k must be >= 1");
    }
    if (Double.isNaN(threshold) || !Double.isFinite(charge)) {
      throw new IllegalArgumentException("threshold must be a number and charge finite");
    }
    excluded = excluded == null ? Set.of() : excluded;
  }
}
