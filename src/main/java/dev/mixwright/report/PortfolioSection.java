package dev.mixwright.report;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.portfolio.LagrangianPortfolioBound;
import dev.mixwright.portfolio.OfferedVariant;
import dev.mixwright.portfolio.PortfolioOutcome;
import dev.mixwright.portfolio.PortfolioTerms;
import dev.mixwright.portfolio.RangeChange;
import dev.mixwright.portfolio.RelaxationResult;
import dev.mixwright.portfolio.ScenarioStage;
import dev.mixwright.runfolder.Json;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The {@code portfolio} section of result.json: the fields of PRODUCT.md (status, value, bound, gap,
 * variants with sales per segment, introductionCosts) and what a reviewer needs to check them: the
 * terms, the relaxation and its prices (which {@code explain} re-uses), the proof's threshold and
 * survivors, the MIP solver and the stage's time.
 */
public final class PortfolioSection {
  private PortfolioSection() {}

  public static RunResult.Portfolio of(VariantSpace space, PortfolioTerms terms, PortfolioOutcome o) {
    Catalog cat = space.catalog();
    List<RunResult.PortfolioVariant> variants = new ArrayList<>();
    Set<Integer> tools = new HashSet<>();
    Set<dev.mixwright.space.VariantKey> kept = new HashSet<>();
    o.range().kept().forEach(v -> kept.add(space.key(v.choices())));
    for (OfferedVariant v : o.offer().variants()) {
      Map<String, Double> sales = sales(cat, v);
      variants.add(new RunResult.PortfolioVariant(space.describe(v.choices()), sales, v.units(), v.margin(),
          kept.contains(space.key(v.choices())) ? 0.0 : terms.introductionCost()));
      for (int g = 0; g < v.choices().length; g++) {
        int f = space.offset(g) + v.choices()[g];
        if (terms.choiceCost()[f] > 0) {
          tools.add(f);
        }
      }
    }
    Map<String, Double> toolingPaid = null;
    if (!tools.isEmpty()) {
      toolingPaid = new LinkedHashMap<>();
      for (int g = 0; g < space.groupCount(); g++) {
        for (int k = 0; k < space.choiceCount(g); k++) {
          int f = space.offset(g) + k;
          if (tools.contains(f)) {
            toolingPaid.put(cat.groups().get(g).id() + "." + cat.groups().get(g).choiceId(k), terms.choiceCost()[f]);
          }
        }
      }
    }
    RunResult.Terms tn = new RunResult.Terms(terms.introductionCost(),
        terms.maxVariants() == PortfolioTerms.UNLIMITED ? null : terms.maxVariants(), terms.minLot(),
        terms.variantCap() == PortfolioTerms.UNLIMITED ? null : terms.variantCap());
    RunResult.Relaxation relaxation = null;
    RelaxationResult rx = o.relaxation();
    if (rx != null) {
      // the prices a variant can be tested against from the result alone: those of the bound before the
      // segment cuts, whose duals would add r·γ to the cuts' own variants (RelaxationResult)
      LagrangianPortfolioBound b = rx.plainBound();
      Map<String, Double> pr = new LinkedHashMap<>();
      for (int i = 0; i < b.resourcePrice().length; i++) {
        pr.put(cat.resources().get(i).id(), b.resourcePrice()[i]);
      }
      Map<String, Double> ps = new LinkedHashMap<>();
      for (int i = 0; i < b.segmentPrice().length; i++) {
        ps.put(cat.segments().get(i).id(), b.segmentPrice()[i]);
      }
      relaxation = new RunResult.Relaxation(rx.objective(), Json.num(rx.provenBound()), rx.converged(), rx.rounds(),
          Json.num(rx.lpPriceBound()), new RunResult.Prices(pr, ps), Json.num(b.lambda()),
          Json.num(b.valueAtLambda()), rx.elapsedMs());
    }
    return new RunResult.Portfolio(o.status(), o.reason(), o.result().value(), Json.num(o.result().bound()), Json.num(o.result().gap()),
        variants, o.offer().introductionCosts(), o.offer().toolingCosts(), toolingPaid, tn, Json.num(o.lpBound()), relaxation,
        new RunResult.Proof(Json.num(o.proof().threshold()), o.proof().added(), o.proof().complete(), o.proof().poolSize(),
            o.tree().nodes() == 0 ? null : new RunResult.Tree(o.tree().nodes(), o.tree().open(), o.tree().workers())),
        new RunResult.Solver(o.engine(), o.solver().solves(), o.solver().lastOptimal()), o.elapsedMs(),
        range(space, o.range(), r -> r.kept()), range(space, o.range(), null), range(space, o.range(), r -> r.added()),
        o.range().hasCurrentRange() ? o.range().discontinueCosts() : null,
        o.range().hasCurrentRange() ? Json.num(o.range().currentRangeValue()) : null, null, null, null);
  }

  /**
   * The section of a range chosen across scenarios: the range with its sales per segment as the
   * weighted mean over the scenarios (the scenarios' own figures are in {@code scenarios}); no
   * relaxation prices, which are per scenario.
   */
  public static RunResult.Portfolio ofScenarios(VariantSpace space, PortfolioTerms terms, ScenarioStage.Outcome o,
      String engine) {
    Catalog cat = space.catalog();
    List<RunResult.PortfolioVariant> variants = new ArrayList<>();
    Set<dev.mixwright.space.VariantKey> kept = new HashSet<>();
    o.change().kept().forEach(v -> kept.add(space.key(v.choices())));
    for (OfferedVariant mean : o.mean()) {
      variants.add(new RunResult.PortfolioVariant(space.describe(mean.choices()), sales(cat, mean), mean.units(),
          mean.margin(), kept.contains(space.key(mean.choices())) ? 0.0 : terms.introductionCost()));
    }
    variants.sort((a, b) -> Double.compare(b.margin(), a.margin()));
    RunResult.Terms tn = new RunResult.Terms(terms.introductionCost(),
        terms.maxVariants() == PortfolioTerms.UNLIMITED ? null : terms.maxVariants(), terms.minLot(),
        terms.variantCap() == PortfolioTerms.UNLIMITED ? null : terms.variantCap());
    return new RunResult.Portfolio(o.status(), o.reason(), o.value(), Json.num(o.bound()), Json.num(o.gap()),
        variants, o.introductionCosts(), o.toolingCosts(), null, tn, null, null,
        new RunResult.Proof(Json.num(o.survivorThreshold()), o.survivorsAdded(), o.survivorsComplete(), o.poolSize(), null),
        new RunResult.Solver(engine, o.mipSolves(), o.status().isProven()), o.elapsedMs(),
        range(space, o.change(), r -> r.kept()), range(space, o.change(), null), range(space, o.change(), r -> r.added()),
        o.change().hasCurrentRange() ? o.change().discontinueCosts() : null,
        o.change().hasCurrentRange() ? Json.num(o.change().currentRangeValue()) : null, null, null, null);
  }

  /** Kept or added (with sales) or, with no getter, dropped (options only); null without a current range. */
  private static List<RunResult.RangeVariant> range(VariantSpace space, RangeChange r,
      java.util.function.Function<RangeChange, List<OfferedVariant>> which) {
    if (!r.hasCurrentRange()) {
      return null;
    }
    List<RunResult.RangeVariant> out = new ArrayList<>();
    if (which == null) {
      r.dropped().forEach(v -> out.add(new RunResult.RangeVariant(space.describe(v), null)));
    } else {
      which.apply(r).forEach(v -> out.add(new RunResult.RangeVariant(space.describe(v.choices()),
          sales(space.catalog(), v))));
    }
    return out;
  }

  private static Map<String, Double> sales(Catalog cat, OfferedVariant v) {
    Map<String, Double> sales = new LinkedHashMap<>();
    for (int s = 0; s < v.sales().length; s++) {
      if (v.sales()[s] > ResultWriter.QUANTITY_EPS) {
        sales.put(cat.segments().get(s).id(), v.sales()[s]);
      }
    }
    return sales;
  }
}
