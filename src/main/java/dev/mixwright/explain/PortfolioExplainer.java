package dev.mixwright.explain;

import dev.mixwright.catalog.CurrentVariant;
import dev.mixwright.portfolio.LotValue;
import dev.mixwright.portfolio.PortfolioTerms;
import dev.mixwright.portfolio.VariantPricer;
import dev.mixwright.space.VariantSpace;
import java.util.Arrays;
import java.util.List;
import java.util.function.DoubleFunction;

/**
 * Explains a variant against a run's integer portfolio with the argument of the proof
 * ({@link dev.mixwright.portfolio.LagrangianBound}): at the relaxation's prices π, μ and variant-limit
 * price λ̂ with bound B(λ̂), a portfolio holding v is worth at most B(λ̂) − (λ̂ − ψ(v))⁺ − tooling(v).
 */
public final class PortfolioExplainer {
  private final VariantSpace space;
  private final PortfolioTerms terms;

  public PortfolioExplainer(VariantSpace space) {
    this.space = space;
    this.terms = PortfolioTerms.of(space);
  }

  /** A run's integer portfolio as far as explanations need it. */
  public record Facts(
      boolean proven,
      double value,
      List<int[]> offered,
      List<double[]> offeredSales,
      double[] resourcePrice,
      double[] segmentPrice,
      double lambda,
      double boundAtLambda) {}

  public PortfolioVerdict explain(int[] v, Facts f) {
    for (int i = 0; i < f.offered().size(); i++) {
      if (Arrays.equals(f.offered().get(i), v)) {
        double[] sales = f.offeredSales().get(i);
        double m = 0;
        for (int s = 0; s < sales.length; s++) {
          if (sales[s] > 0) {
            m += sales[s] * space.margin(v, s);
          }
        }
        return new PortfolioVerdict(true, sales.clone(), m, new double[0], Double.NaN, Double.NaN,
            terms.toolingOf(space, v), Double.NaN, f.value(), false, f.proven());
      }
    }
    double[] d = VariantPricer.reducedCosts(space, v, f.resourcePrice(), f.segmentPrice());
    // the caps the stage's own pricer and bounds take: for a choosing segment the logit cap of v
    double g = LotValue.best(d, VariantPricer.caps(space, terms, v), terms.minLot());
    double psi = g - fixedCost(v);
    double tooling = terms.toolingOf(space, v);
    double with = Double.isFinite(f.boundAtLambda())
        ? f.boundAtLambda() - Math.max(0.0, f.lambda() - psi) - tooling
        : Double.POSITIVE_INFINITY;
    boolean ruledOut = !space.isBuildable(v) || psi == Double.NEGATIVE_INFINITY
        || with <= f.value() + 1e-7 * (1 + Math.abs(f.value()));
    return new PortfolioVerdict(false, new double[space.segmentCount()], 0, d, g, psi, tooling, with, f.value(),
        ruledOut, f.proven());
  }

  /** F for a new variant; for one on sale today −discontinue (0 when pinned): keeping it saves that cost. */
  private double fixedCost(int[] v) {
    for (CurrentVariant c : space.catalog().current()) {
      if (Arrays.equals(space.parse(c.variant()), v)) {
        return c.keep() ? 0.0 : -c.discontinue();
      }
    }
    return terms.introductionCost();
  }

  /**
   * Words for a variant on sale today, empty for a new one ({@code money} writes a sum of money): whether the portfolio keeps it and, when
   * it drops it, its value in the plan (its best lot at the prices of the relaxation) against the
   * discontinue cost it saves, and what a new variant would pay to be introduced instead.
   */
  public List<String> currentRangeWords(int[] v, PortfolioVerdict verdict, DoubleFunction<String> money) {
    for (CurrentVariant c : space.catalog().current()) {
      if (!Arrays.equals(space.parse(c.variant()), v)) {
        continue;
      }
      String intro = money.apply(terms.introductionCost());
      String disc = money.apply(c.discontinue());
      if (verdict.offered()) {
        return List.of("on sale today and kept" + (c.keep() ? " (pinned)" : "") + ": it pays no introduction cost"
            + " (a new variant pays " + intro + "), and dropping it would cost " + disc);
      }
      if (!space.isBuildable(v)) {
        return List.of("on sale today and dropped: an exclude entry or a rule bars it from the new range;"
            + " dropping it costs " + disc);
      }
      return List.of("on sale today and dropped: its best lot earns " + money.apply(verdict.lotValue()) + " at the"
          + " prices of the upper limit on any range's value; keeping it would save the discontinue cost " + disc
          + ", so it is worth " + money.apply(verdict.psi()) + " kept, against the variants introduced elsewhere at "
          + intro + " each; a portfolio keeping it is worth at most " + money.apply(verdict.boundWith())
          + ", and the portfolio found, " + money.apply(verdict.portfolioValue()) + ", pays the " + disc);
    }
    return List.of();
  }

  public PortfolioTerms terms() {
    return terms;
  }
}
