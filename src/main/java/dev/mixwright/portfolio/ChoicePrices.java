package dev.mixwright.portfolio;

import dev.mixwright.master.PortfolioLp;

/**
 * The duals of a relaxed master's attraction rows, for a Lagrangian bound that keeps what the master
 * knows about segments that choose. Relax, besides resources (π ≥ 0) and segment rows (μ), every
 * attraction row x_sv − w_sv·x_s0 ≤ 0 of a master variant with its β_sv ≥ 0 (Gallego, Ratliff &amp;
 * Shebalov 2015, Operations Research 63(1), the sales-based rows; the Lagrangian argument of
 * Geoffrion 1974, Mathematical Programming Study 2). For any portfolio S and its sales,
 *
 * <pre>
 *   value(S) ≤ π·b + Σ_s μ_s·D_s + Σ_{s chooses} D_s·(Σ_v w_sv β_sv − μ_s)⁺ + Σ_{v ∈ S} ψ_β(v),
 *   ψ_β(v) = max { Σ_s (m_vs − π·a_v − μ_s − β_sv) x_s : 0 ≤ x_s ≤ cap_vs, Σ_s x_s ≥ L } − F_v,
 * </pre>
 *
 * because the buyers row holds with equality (D_s = buyers_s, so μ_s may be any number), each
 * relaxed attraction row is ≤ 0 (β ≥ 0), and the stay-out x_s0 ∈ [0, buyers_s] is left with the
 * coefficient Σ_v w_sv β_sv − μ_s. The per-variant cap may be any valid cap: for a master variant its
 * own cap_vs = min(maxShare·D_s, buyers_s·w/(1+w)) ({@link ChoiceRows#cap}, valid whatever else is
 * offered); for a variant outside the master β_sv = 0 and the pricer takes the same cap (inside its
 * search the cap of an optimistic utility, an upper bound on ψ_β since {@link LotValue} is
 * nondecreasing in every reduced cost and in every cap). At the master's optimal duals this is LP duality on the master's own rows,
 * so over the pool the bound meets the master's objective; with β = 0 (the old bound) a variant of
 * a choosing segment was valued as if it could take all the segment's buyers. The sales envelopes of
 * {@link SalesEnvelope} are relaxed the same way at their duals γ_c ≥ 0: γ_c on every column of their
 * segment, γ_c·slope_c·w_sv added to the value of every variant v the segment accepts when offered (in
 * the master or not: an envelope holds them all), and γ_c·rhs_c to the constant. Cost: O(pool · S · R)
 * per bound.
 */
record ChoicePrices(double[][] beta, double[] stayOut, double[] bonus, double cutConstant, double[] envelopeUnit,
    double[] envelopeAttraction) {

  /** Attraction rows only, no segment cuts, no sales envelopes. */
  ChoicePrices(double[][] beta, double[] stayOut) {
    this(beta, stayOut, new double[0], 0.0, null, null);
  }

  /** No attraction rows priced: β = 0 (the bound of docs/portfolio.md, step 1). */
  static ChoicePrices none(int segments) {
    return new ChoicePrices(new double[0][], new double[segments]);
  }

  /**
   * β of the first {@code blocks} blocks of an optimally solved master (block i = pool variant i),
   * with the master's segment cuts ({@link SegmentCuts}) relaxed the same way at their duals γ_c ≥ 0:
   * a cut Σ_{v ∈ C} (x_vs − r·y_v) ≤ rhs adds γ_c·(rhs − lhs) ≥ 0 to the right-hand side, which is γ_c
   * on each of its columns (added to β), r·γ_c to the value of each of its variants when offered
   * ({@link #bonus}) and γ_c·rhs to the constant. A variant in no cut (every variant outside the master)
   * is valued as before.
   */
  static ChoicePrices of(PortfolioLp lp, int blocks) {
    double[][] beta = new double[blocks][];
    for (int i = 0; i < blocks; i++) {
      beta[i] = lp.attractionDuals(i);
    }
    double[] envUnit = null;
    double[] envAtt = null;
    double constant = 0;
    if (lp.envelopeCount() > 0) {
      PortfolioLp.EnvelopePrices env = lp.envelopePrices();
      envUnit = env.perUnit();
      envAtt = env.perAttraction();
      constant += env.constant();
    }
    if (lp.segmentCutCount() == 0) {
      return new ChoicePrices(beta, lp.stayOutDuals(), new double[0], constant, envUnit, envAtt);
    }
    PortfolioLp.SegmentCutPrices cut = lp.segmentCutPrices();
    for (int i = 0; i < blocks; i++) {
      if (i < cut.perEntry().length && cut.perEntry()[i] != null) {
        for (int k = 0; k < beta[i].length; k++) {
          beta[i][k] += cut.perEntry()[i][k];
        }
      }
    }
    return new ChoicePrices(beta, lp.stayOutDuals(), java.util.Arrays.copyOf(cut.bonus(), blocks),
        constant + cut.constant(), envUnit, envAtt);
  }

  /**
   * The price per unit sold in each segment that a variant's columns pay: μ_s plus the sales
   * envelopes' Σ γ_c ({@link SalesEnvelope}); μ itself where there are none. For the pricer's query and
   * the bound's record; the stay-out's share of the constant keeps μ ({@link #constant}).
   */
  double[] columnPrice(double[] mu) {
    if (envelopeUnit == null) {
      return mu;
    }
    double[] out = mu.clone();
    for (int s = 0; s < out.length; s++) {
      out[s] += envelopeUnit[s];
    }
    return out;
  }

  /** Per segment Σ γ_c·slope_c of the sales envelopes (the query's attraction bonus); null for none. */
  double[] attractionBonus() {
    return envelopeAttraction;
  }

  /** r·γ summed over the segment cuts that hold block i (0 for none). */
  double bonusOf(int i) {
    return i >= 0 && i < bonus.length ? bonus[i] : 0.0;
  }

  /**
   * Σ over choosing segments of D_s·(Σ_v w_sv β_sv − μ_s)⁺ (the stay-out's share of the constant), plus
   * Σ γ_c·rhs_c of the segment cuts.
   */
  double constant(PortfolioTerms terms, double[] mu) {
    double c = cutConstant;
    for (int s = 0; s < stayOut.length; s++) {
      if (stayOut[s] > mu[s]) {
        c += terms.demand()[s] * (stayOut[s] - mu[s]);
      }
    }
    return c;
  }

  /**
   * ψ_β of pool variant {@code v} held by block {@code i} of the master (−1 when the master does not
   * hold it: β = 0), with its own caps, less {@code
   * charge} and the penalties of its choices ({@code penalty} null for none); −∞ when its lot cannot
   * be sold.
   */
  double psi(int[] offsets, PoolVariant v, int i, double[] pi, double[] mu, double charge, double[] penalty,
      double minLot) {
    int n = v.segments().length;
    double[] d = new double[n];
    double piA = 0;
    for (int r = 0; r < pi.length; r++) {
      piA += pi[r] * v.use()[r];
    }
    double[] b = i >= 0 && i < beta.length ? beta[i] : null;
    double envelope = 0;
    for (int k = 0; k < n; k++) {
      int s = v.segments()[k];
      d[k] = v.margin()[k] - piA - mu[s] - (b == null ? 0.0 : b[k]);
      if (envelopeUnit != null) {
        // a sales envelope holds every variant its segment accepts, in the master or not
        d[k] -= envelopeUnit[s];
        envelope += envelopeAttraction[s] * v.attraction()[k];
      }
    }
    double p = 0;
    if (penalty != null) {
      for (int g = 0; g < v.choices().length; g++) {
        p += penalty[offsets[g] + v.choices()[g]];
      }
    }
    return LotValue.best(d, v.upper(), minLot) - charge - p + bonusOf(i) + envelope;
  }
}
