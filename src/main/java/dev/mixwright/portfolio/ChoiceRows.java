package dev.mixwright.portfolio;

import dev.mixwright.choice.Logit;
import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioMip;
import dev.mixwright.space.VariantSpace;

/**
 * The rows the integer stage adds for segments that choose by multinomial logit, the sales-based
 * form of Gallego, Ratliff &amp; Shebalov (2015, Operations Research 63(1)) with introductions: per
 * choosing segment s a stay-out x_s0 with Σ_v x_sv + x_s0 = buyers_s, and per offered (v, s)
 * x_sv − w_s(v)·x_s0 ≤ 0. A variant not offered sells nothing through its link x_sv ≤ U_sv·y_v,
 * U_sv = buyers_s·w/(1+w) ({@link #cap}); so the variants that share a segment's buyers are exactly
 * the portfolio's. Fixed segments are left as they are. The pricer over the whole space values every
 * variant with the same cap ({@link #capOf}), and inside its search with the cap of an optimistic
 * utility ({@link #capAt}; see docs/portfolio.md, "The attraction rows in the bound").
 */
final class ChoiceRows {
  private final VariantSpace space;
  private final SalesEnvelope envelope;

  ChoiceRows(VariantSpace space) {
    this.space = space;
    this.envelope = SalesEnvelope.of(space);
  }

  /**
   * The tangents of the choosing segments' sales envelopes found so far for this pool ({@link
   * SalesEnvelope}): one list for the relaxation, the tree's masters and the MIPs over the pool.
   */
  SalesEnvelope envelope() {
    return envelope;
  }

  /** True when some segment chooses. */
  boolean any() {
    for (int s = 0; s < space.segmentCount(); s++) {
      if (space.chooses(s)) {
        return true;
      }
    }
    return false;
  }

  /** w_s(v) = exp(u_s(v) − stayOut_s) of a choosing segment s. */
  double attraction(int[] v, int s) {
    return attractionOf(space, v, s);
  }

  /**
   * w_s(v) of variant v in a choosing segment s: the one place pool variants, the masters and the
   * pricer get a variant's attraction from.
   */
  static double attractionOf(VariantSpace space, int[] v, int s) {
    return attractionAt(space, s, space.utility(v, s));
  }

  /** w of a choosing segment s at utility u: increasing in u. */
  static double attractionAt(VariantSpace space, int s, double utility) {
    return Logit.attraction(utility, space.stayOut(s));
  }

  /**
   * U = buyers·w/(1+w): x ≤ w·x_0 and x_0 ≤ buyers − x give x ≤ w·(buyers − x), so one variant never
   * sells more than this in s, whatever else is offered.
   */
  static double cap(double buyers, double w) {
    return w >= 1e300 ? buyers : buyers * w / (1 + w);
  }

  /**
   * U_s(v) of variant v in a choosing segment s: {@link #cap} at its own attraction. The one place
   * pool variants and the pricer get a variant's logit cap from, so that both agree to the last bit.
   */
  static double capOf(VariantSpace space, int[] v, int s) {
    return capAt(space, s, space.utility(v, s));
  }

  /**
   * {@link #cap} of a choosing segment s at utility u: increasing in u (w = exp(u − stayOut) is, and
   * w/(1+w) is increasing in w), so the cap at an upper bound on a variant's utility bounds its cap.
   */
  static double capAt(VariantSpace space, int s, double utility) {
    return cap(space.buyers(s), Logit.attraction(utility, space.stayOut(s)));
  }

  /** The buyers rows; before any variant enters. */
  void enter(PortfolioLp lp) {
    for (int s = 0; s < space.segmentCount(); s++) {
      if (space.chooses(s)) {
        lp.chooseIn(s);
      }
    }
  }

  void enter(PortfolioMip mip) {
    for (int s = 0; s < space.segmentCount(); s++) {
      if (space.chooses(s)) {
        mip.chooseIn(s);
      }
    }
  }

  /** The attraction rows of block i, which holds pool variant v. */
  void attract(PortfolioLp lp, int i, PoolVariant v) {
    for (int k = 0; k < v.segments().length; k++) {
      if (space.chooses(v.segments()[k])) {
        lp.addAttraction(i, k, v.attraction()[k]);
      }
    }
  }

  void attract(PortfolioMip mip, int i, PoolVariant v) {
    for (int k = 0; k < v.segments().length; k++) {
      if (space.chooses(v.segments()[k])) {
        mip.addAttraction(i, k, v.attraction()[k]);
      }
    }
  }
}
