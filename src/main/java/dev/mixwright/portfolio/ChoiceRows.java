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
 * the portfolio's. Fixed segments are left as they are. The pricer over the whole space keeps the
 * looser cap buyers_s (see docs/portfolio.md for why its bound still holds).
 */
final class ChoiceRows {
  private final VariantSpace space;

  ChoiceRows(VariantSpace space) {
    this.space = space;
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
    return Logit.attraction(space.utility(v, s), space.stayOut(s));
  }

  /**
   * U = buyers·w/(1+w): x ≤ w·x_0 and x_0 ≤ buyers − x give x ≤ w·(buyers − x), so one variant never
   * sells more than this in s, whatever else is offered.
   */
  static double cap(double buyers, double w) {
    return w >= 1e300 ? buyers : buyers * w / (1 + w);
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
        lp.addAttraction(i, k, attraction(v.choices(), v.segments()[k]));
      }
    }
  }

  void attract(PortfolioMip mip, int i, PoolVariant v) {
    for (int k = 0; k < v.segments().length; k++) {
      if (space.chooses(v.segments()[k])) {
        mip.addAttraction(i, k, attraction(v.choices(), v.segments()[k]));
      }
    }
  }
}
