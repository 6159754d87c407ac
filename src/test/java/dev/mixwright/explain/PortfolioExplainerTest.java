package dev.mixwright.explain;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.portfolio.LotValue;
import dev.mixwright.portfolio.PortfolioTerms;
import dev.mixwright.portfolio.VariantPricer;
import dev.mixwright.portfolio.VariantQuery;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/**
 * {@code explain}'s verdict on a variant outside the portfolio values it as the integer stage's proof
 * does: ψ(v) with, in a segment that chooses, the variant's own logit cap buyers·w/(1 + w) rather
 * than the segment's column bound (which only the segments with a fixed demand use). Otherwise a
 * variant the stage's survivor test rules out could be reported as one that might still pay. On
 * random choosing catalogs at random prices, every sellable variant.
 */
class PortfolioExplainerTest {

  @Test
  void verdictValuesAVariantWithTheStagesCaps() {
    AtomicInteger capped = new AtomicInteger();
    Cases.each(20, (seed, rnd) -> {
      Catalog tiny = RandomChoiceCatalogs.tiny(seed, rnd.nextBoolean());
      double f = 100 + rnd.nextInt(2000);
      double lot = rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40);
      Catalog c = new Catalog(tiny.format(), tiny.name(), tiny.currency(), tiny.period(), tiny.resources(),
          tiny.groups(), tiny.rules(), tiny.segments(), Optional.of(new PortfolioSpec(f, 3, lot)));
      VariantSpace space = new VariantSpace(c);
      PortfolioTerms terms = PortfolioTerms.of(space);
      double[] pi = new double[space.resourceCount()];
      for (int r = 0; r < pi.length; r++) {
        pi[r] = rnd.nextDouble() * 5;
      }
      double[] mu = new double[space.segmentCount()];
      for (int s = 0; s < mu.length; s++) {
        mu[s] = rnd.nextDouble() * 20;
      }
      PortfolioExplainer.Facts facts = new PortfolioExplainer.Facts(false, 0, List.of(), List.of(), pi, mu, 0,
          Double.NaN);
      VariantQuery at = new VariantQuery(pi, mu, f, null, Double.NEGATIVE_INFINITY, 1, null, 0);
      PortfolioExplainer explainer = new PortfolioExplainer(space);
      for (int[] v : EnumeratedMip.sellable(space)) {
        PortfolioVerdict verdict = explainer.explain(v, facts);
        double stage = VariantPricer.value(space, terms, v, at);
        assertEquals(stage, verdict.psi(), 1e-7 * (1 + Math.abs(stage)), "ψ of " + java.util.Arrays.toString(v));
        double uncapped = LotValue.best(VariantPricer.reducedCosts(space, v, pi, mu), terms.columnBound(),
            terms.minLot()) - f;
        assertTrue(verdict.psi() <= uncapped + 1e-7 * (1 + Math.abs(uncapped)), "a cap can only lower ψ");
        if (verdict.psi() < uncapped - 1e-6 * (1 + Math.abs(uncapped))) {
          capped.incrementAndGet();
        }
      }
    });
    System.out.println("explain: logit caps lowered ψ for " + capped + " variants");
    assertTrue(capped.get() > 0, "some variant's logit cap should bind, or the test shows nothing");
  }
}
