package dev.mixwright.explain;

import dev.mixwright.portfolio.LotValue;
import dev.mixwright.portfolio.PortfolioTerms;
import dev.mixwright.portfolio.VariantPricer;
import dev.mixwright.space.VariantSpace;
import java.util.Arrays;
import java.util.List;

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
    double g = LotValue.best(d, terms.columnBound(), terms.minLot());
    double psi = g - terms.introductionCost();
    double tooling = terms.toolingOf(space, v);
    double with = Double.isFinite(f.boundAtLambda())
        ? f.boundAtLambda() - Math.max(0.0, f.lambda() - psi) - tooling
        : Double.POSITIVE_INFINITY;
    boolean ruledOut = !space.isBuildable(v) || psi == Double.NEGATIVE_INFINITY
        || with <= f.value() + 1e-7 * (1 + Math.abs(f.value()));
    return new PortfolioVerdict(false, new double[space.segmentCount()], 0, d, g, psi, tooling, with, f.value(),
        ruledOut, f.proven());
  }

  public PortfolioTerms terms() {
    return terms;
  }
}
