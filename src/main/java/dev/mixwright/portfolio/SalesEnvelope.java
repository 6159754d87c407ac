package dev.mixwright.portfolio;

import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioLpSolution;
import dev.mixwright.master.PortfolioMip;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;

/**
 * Tangents of a choosing segment's sales envelope, cuts of the relaxed masters that hold every variant
 * of the space (docs/portfolio.md, "A choosing segment's sales envelope").
 *
 * <p>In an integer portfolio S, segment s (N buyers) sells x_sv ≤ w_sv·x_s0 of each offered variant
 * and Σ_v x_sv + x_s0 = N, so its total T_s = Σ_v x_sv satisfies T_s ≤ W·(N − T_s), i.e.
 * T_s ≤ N·h(W) with W = Σ_{v ∈ S, s accepts v} w_sv and h(W) = W/(1+W). h is concave, so every tangent
 * lies above it: h(W) ≤ h(W₀) + h'(W₀)·(W − W₀) with h'(W₀) = 1/(1+W₀)². With W = Σ_v w_sv·y_v for
 * y ∈ {0,1}:
 *
 * <pre>
 *   Σ_v x_sv − slope·Σ_v w_sv·y_v ≤ rhs,    slope = N/(1+W₀)²,  rhs = N·W₀²/(1+W₀)²,
 * </pre>
 *
 * valid for every integer portfolio and every W₀ ≥ 0, whatever is sold less than its logit share (it
 * bounds the total from above only). The relaxation, whose y may be fractional, can spread a
 * segment's offer over several variants at small y and sell each up to y times its own cap: at the
 * range demo's root retrofit sold 23,107 with Σ w·y = 19.3, where N·h(19.3) = 22,817. A tangent at the
 * relaxation's own W₀ = Σ w·y cuts that point off when T_s &gt; N·h(W₀).
 *
 * <p>Every variant the segment accepts enters the row, with coefficients of its own (1 on its sales
 * there, −slope·w_sv on its introduction), so a variant priced in later joins it, and the pricer
 * values a variant with the row's dual γ on each unit it sells in s and γ·slope·w_sv when offered
 * ({@link VariantQuery#attractionBonus}). The relaxation priced to the end with the tangents is still
 * a relaxation over the whole space.
 *
 * <p>One list per pool ({@link ChoiceRows#envelope}), shared by every master (the relaxation's and the
 * tree's workers') and the MIPs over the pool: a tangent once found is valid everywhere, and each master
 * adds, in the list's order, the ones it does not hold yet ({@link #sync}). Thread-safe.
 */
final class SalesEnvelope {
  /**
   * Most tangents per segment, a cap on the rows every master holds (the range demo adds 8 at its root;
   * 100 instead of 40 changed nothing there: docs/portfolio.md, Results).
   */
  static final int MOST_PER_SEGMENT = 40;

  private final double[] buyers;
  private final boolean[] chooses;
  private final List<double[]> tangents = new ArrayList<>(); // {segment, W₀}
  private final int[] perSegment;

  private SalesEnvelope(boolean[] chooses, double[] buyers) {
    this.chooses = chooses;
    this.buyers = buyers;
    this.perSegment = new int[buyers.length];
  }

  /** Largest attraction a segment may have for its tangents' coefficients slope·w to stay meaningful. */
  static final double MOST_ATTRACTION = 1e12;

  /**
   * Over the segments of {@code space} that choose, with their buyers (the masters' buyers rows); a
   * segment where some variant could have an attraction above {@link #MOST_ATTRACTION} (its utility far
   * above the stay-out, found from the best utility share per group) gets no tangents: it buys nearly
   * all it can from any offer, and exp(u − stayOut) may overflow.
   */
  static SalesEnvelope of(VariantSpace space) {
    boolean[] ch = new boolean[space.segmentCount()];
    double[] n = new double[ch.length];
    for (int s = 0; s < ch.length; s++) {
      n[s] = space.buyers(s);
      if (space.chooses(s)) {
        double[] u = space.choiceUtilities(s);
        double best = 0;
        for (int g = 0; g < space.groupCount(); g++) {
          double top = Double.NEGATIVE_INFINITY;
          for (int f = space.offset(g); f < space.offset(g) + space.choiceCount(g); f++) {
            top = Math.max(top, u[f]);
          }
          best += top;
        }
        ch[s] = ChoiceRows.attractionAt(space, s, best) <= MOST_ATTRACTION;
      }
    }
    return new SalesEnvelope(ch, n);
  }

  /** Slope N/(1+W₀)² of the tangent at W₀. */
  static double slope(double buyers, double w0) {
    return buyers / ((1 + w0) * (1 + w0));
  }

  /** Right-hand side N·W₀²/(1+W₀)² of the tangent at W₀. */
  static double rhs(double buyers, double w0) {
    return buyers * w0 * w0 / ((1 + w0) * (1 + w0));
  }

  /** N·W/(1+W): the most segment s sells when the offered variants' attractions sum to W. */
  static double envelope(double buyers, double w) {
    return buyers * w / (1 + w);
  }

  synchronized int size() {
    return tangents.size();
  }

  /** Adds to {@code lp} the tangents it does not hold yet, in the list's order. */
  void sync(PortfolioLp lp) {
    List<double[]> missing;
    synchronized (this) {
      missing = new ArrayList<>(tangents.subList(Math.min(lp.envelopeCount(), tangents.size()), tangents.size()));
    }
    for (double[] t : missing) {
      int s = (int) t[0];
      lp.addEnvelope(s, slope(buyers[s], t[1]), rhs(buyers[s], t[1]));
    }
  }

  /** Adds every tangent so far to {@code mip} (after its variants and their attraction rows). */
  void enter(PortfolioMip mip) {
    List<double[]> all;
    synchronized (this) {
      all = new ArrayList<>(tangents);
    }
    for (double[] t : all) {
      int s = (int) t[0];
      mip.addEnvelope(s, slope(buyers[s], t[1]), rhs(buyers[s], t[1]));
    }
  }

  /**
   * At an optimal solution of {@code lp} (which holds every tangent so far): per choosing segment whose
   * total exceeds N·h(W) at its own W = Σ w·y by more than a hundred-thousandth of its buyers, a tangent
   * at that W, added to the list and to {@code lp}; returns how many.
   */
  int separate(PortfolioLp lp, PortfolioLpSolution sol) {
    PortfolioLp.ChoosingTotals t = lp.choosingTotals(sol);
    int added = 0;
    synchronized (this) {
      for (int s = 0; s < buyers.length; s++) {
        if (!chooses[s] || perSegment[s] >= MOST_PER_SEGMENT) {
          continue;
        }
        double w = t.attraction()[s];
        if (t.sold()[s] - envelope(buyers[s], w) <= 1e-5 * buyers[s] || held(s, w)) {
          continue;
        }
        tangents.add(new double[] {s, w});
        perSegment[s]++;
        added++;
      }
    }
    if (added > 0) {
      sync(lp);
    }
    return added;
  }

  /** True when a tangent of s at (nearly) W₀ is in the list already. */
  private boolean held(int s, double w) {
    for (double[] t : tangents) {
      if ((int) t[0] == s && Math.abs(t[1] - w) <= 1e-6 * (1 + w)) {
        return true;
      }
    }
    return false;
  }
}
