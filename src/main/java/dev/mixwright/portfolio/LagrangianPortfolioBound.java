package dev.mixwright.portfolio;

import java.util.Arrays;

/**
 * The Lagrangian bound on the value of the integer portfolio over the whole space at given prices π, μ ≥ 0 (any, not only
 * optimal ones). For a feasible portfolio S (|S| ≤ K, variants v with sales x_v), subtracting π·(b −
 * used) ≥ 0 and μ·(D − sold) ≥ 0 from its value,
 *
 * <pre>
 *   value(S) ≤ π·b + μ·D + Σ_{v ∈ S} ψ(v)  ≤  π·b + μ·D + λ·K + Σ_{all v} (ψ(v) − λ)⁺ =: L(λ)   for any λ ≥ 0
 * </pre>
 *
 * with ψ(v) = g(d(v)) − F ({@link VariantPricer}, no penalty). The sum runs over the whole space; it is
 * known exactly when every variant of ψ &gt; λ is listed: the pool (computed directly) plus the
 * pricer's k best outside it, with {@code rest} ≥ ψ of everything not listed, so λ ≥ max(0, rest).
 * L is convex piecewise linear in λ and smallest at the (K+1)-th largest listed value (clamped to
 * that range); with K unlimited only λ = 0 is allowed, so L is finite only when rest ≤ 0.
 *
 * <p>For the survivor test the same inequality gives, for a portfolio holding w, value(S) ≤ L(λ) −
 * (λ − ψ(w))⁺; with λ̂ = the K-th largest listed value (clamped) L(λ̂) is still the least L and the
 * excluded set is largest. Cost: one sort of the listed values.
 */
public record LagrangianPortfolioBound(
    double value, double lambda, double valueAtLambda, double[] resourcePrice, double[] segmentPrice,
    double[] poolBonus, double[] attractionBonus) {

  public LagrangianPortfolioBound(double value, double lambda, double valueAtLambda, double[] resourcePrice,
      double[] segmentPrice) {
    this(value, lambda, valueAtLambda, resourcePrice, segmentPrice, new double[0], null);
  }

  /**
   * The same bound, noting the sales envelopes' value per unit of attraction in each choosing segment
   * ({@link ChoicePrices#attractionBonus}, null for none); {@link #segmentPrice} then holds the
   * envelopes' price per unit sold ({@link ChoicePrices#columnPrice}), so that a query at this bound's
   * prices ({@link #query}) values every variant as the bound did.
   */
  LagrangianPortfolioBound withAttractionBonus(double[] bonus) {
    return new LagrangianPortfolioBound(value, lambda, valueAtLambda, resourcePrice, segmentPrice, poolBonus,
        bonus == null ? null : bonus.clone());
  }

  /** A pricing query at this bound's prices (its envelopes' attraction bonus included). */
  VariantQuery query(double charge, double[] penalty, double threshold, int k,
      java.util.Set<dev.mixwright.space.VariantKey> excluded, long deadlineNanos) {
    return new VariantQuery(resourcePrice, segmentPrice, charge, penalty, threshold, k, excluded, deadlineNanos)
        .withAttractionBonus(attractionBonus);
  }

  /**
   * The same bound, noting for pool variant i what its segment cuts' duals add to its value when
   * offered (r·γ summed over its cuts, {@link ChoicePrices#bonus}): ψ at the bound's prices with no cut
   * duals and β = 0, plus this, is at least the ψ the bound used ({@link LotValue} is nondecreasing in
   * every reduced cost, and the cut and attraction duals only lower them).
   */
  LagrangianPortfolioBound withPoolBonus(double[] bonus) {
    return new LagrangianPortfolioBound(value, lambda, valueAtLambda, resourcePrice, segmentPrice, bonus.clone(),
        attractionBonus);
  }

  /** r·γ over the segment cuts holding pool variant i at this bound's prices (0 for none). */
  public double poolBonusOf(int i) {
    return i >= 0 && i < poolBonus.length ? poolBonus[i] : 0.0;
  }

  /**
   * @param constant π·b + μ·D
   * @param listed ψ of every listed variant (pool and found; −∞ allowed)
   * @param rest an upper bound on ψ of every variant not listed
   * @param cap K, {@link PortfolioTerms#UNLIMITED} for none
   */
  public static LagrangianPortfolioBound of(double constant, double[] listed, double rest, int cap, double[] pi, double[] mu) {
    double lambdaMin = Math.max(0.0, rest);
    double[] sorted = listed.clone();
    Arrays.sort(sorted);
    int n = sorted.length;
    if (cap == PortfolioTerms.UNLIMITED) {
      if (lambdaMin > 0) {
        return new LagrangianPortfolioBound(Double.POSITIVE_INFINITY, 0, Double.POSITIVE_INFINITY, pi, mu);
      }
      double sum = constant;
      for (double x : sorted) {
        sum += Math.max(0.0, x);
      }
      return new LagrangianPortfolioBound(sum, 0, sum, pi, mu);
    }
    // values from the largest: sorted[n - 1 - i] is the (i+1)-th largest; with K = 0 nothing can be
    // offered and λ may rise to the largest value, which leaves L = π·b + μ·D
    double kPlus1 = cap < n ? sorted[n - 1 - cap] : Double.NEGATIVE_INFINITY;
    double kth = cap == 0 ? (n == 0 ? 0.0 : sorted[n - 1]) : cap <= n ? sorted[n - cap] : Double.NEGATIVE_INFINITY;
    double lamL = Math.max(lambdaMin, kPlus1);
    double lamHat = Math.max(lambdaMin, kth);
    double atL = at(constant, sorted, lamL, cap);
    double atHat = at(constant, sorted, lamHat, cap);
    return new LagrangianPortfolioBound(Math.min(atL, atHat), lamHat, atHat, pi, mu);
  }

  private static double at(double constant, double[] values, double lambda, int cap) {
    double sum = constant + lambda * cap;
    for (double x : values) {
      sum += Math.max(0.0, x - lambda);
    }
    return sum;
  }

  /** An upper bound on the value of any portfolio holding a variant of value ψ (before its tooling). */
  public double withVariant(double psi) {
    return valueAtLambda - Math.max(0.0, lambda - psi);
  }

  public boolean isFinite() {
    return Double.isFinite(value);
  }
}
