package dev.mixwright.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.portfolio.LagrangianPortfolioBound;
import dev.mixwright.portfolio.OfferedVariant;
import dev.mixwright.portfolio.PortfolioOutcome;
import dev.mixwright.portfolio.PortfolioTerms;
import dev.mixwright.portfolio.RelaxationResult;
import dev.mixwright.space.VariantSpace;
import java.util.HashSet;
import java.util.Set;

/**
 * The {@code portfolio} section of result.json: the fields of PRODUCT.md (status, value, bound, gap,
 * variants with sales per segment, introductionCosts) and what a reviewer needs to check them: the
 * terms, the relaxation and its prices (which {@code explain} re-uses), the proof's threshold and
 * survivors, the MIP solver and the stage's time.
 */
public final class PortfolioSection {
  private PortfolioSection() {}

  public static ObjectNode put(ObjectNode result, VariantSpace space, PortfolioTerms terms, PortfolioOutcome o) {
    Catalog cat = space.catalog();
    ObjectNode n = result.putObject("portfolio");
    n.put("status", o.status().word());
    if (!o.reason().isEmpty()) {
      n.put("reason", o.reason());
    }
    n.put("value", o.value());
    ResultWriter.putNum(n, "bound", o.bound());
    ResultWriter.putNum(n, "gap", o.gap());
    ArrayNode vs = n.putArray("variants");
    Set<Integer> tools = new HashSet<>();
    for (OfferedVariant v : o.variants()) {
      ObjectNode e = vs.addObject();
      ObjectNode opts = e.putObject("options");
      space.describe(v.choices()).forEach(opts::put);
      ObjectNode sales = e.putObject("sales");
      for (int s = 0; s < v.sales().length; s++) {
        if (v.sales()[s] > ResultWriter.QUANTITY_EPS) {
          sales.put(cat.segments().get(s).id(), v.sales()[s]);
        }
      }
      e.put("units", v.units());
      e.put("margin", v.margin());
      e.put("introductionCost", terms.introductionCost());
      for (int g = 0; g < v.choices().length; g++) {
        int f = space.offset(g) + v.choices()[g];
        if (terms.choiceCost()[f] > 0) {
          tools.add(f);
        }
      }
    }
    n.put("introductionCosts", o.introductionCosts());
    n.put("toolingCosts", o.toolingCosts());
    if (!tools.isEmpty()) {
      ObjectNode t = n.putObject("toolingPaid");
      for (int g = 0; g < space.groupCount(); g++) {
        for (int k = 0; k < space.choiceCount(g); k++) {
          int f = space.offset(g) + k;
          if (tools.contains(f)) {
            t.put(cat.groups().get(g).id() + "." + cat.groups().get(g).choiceId(k), terms.choiceCost()[f]);
          }
        }
      }
    }
    ObjectNode tn = n.putObject("terms");
    tn.put("introductionCost", terms.introductionCost());
    if (terms.maxVariants() == PortfolioTerms.UNLIMITED) {
      tn.putNull("maxVariants");
    } else {
      tn.put("maxVariants", terms.maxVariants());
    }
    tn.put("minLot", terms.minLot());
    if (terms.variantCap() == PortfolioTerms.UNLIMITED) {
      tn.putNull("variantCap");
    } else {
      tn.put("variantCap", terms.variantCap());
    }
    ResultWriter.putNum(n, "lpBound", o.lpBound());
    RelaxationResult rx = o.relaxation();
    if (rx != null) {
      ObjectNode r = n.putObject("relaxation");
      r.put("objective", rx.objective());
      LagrangianPortfolioBound b = rx.bound();
      ResultWriter.putNum(r, "bound", b.value());
      r.put("converged", rx.converged());
      r.put("rounds", rx.rounds());
      ResultWriter.putNum(r, "boundAtLpPrices", rx.lpPriceBound());
      ObjectNode prices = r.putObject("prices");
      ObjectNode pr = prices.putObject("resources");
      for (int i = 0; i < b.resourcePrice().length; i++) {
        pr.put(cat.resources().get(i).id(), b.resourcePrice()[i]);
      }
      ObjectNode ps = prices.putObject("segments");
      for (int i = 0; i < b.segmentPrice().length; i++) {
        ps.put(cat.segments().get(i).id(), b.segmentPrice()[i]);
      }
      ResultWriter.putNum(r, "variantLimitPrice", b.lambda());
      ResultWriter.putNum(r, "boundAtVariantLimitPrice", b.valueAtLambda());
      r.put("elapsedMs", rx.elapsedMs());
    }
    ObjectNode p = n.putObject("proof");
    ResultWriter.putNum(p, "survivorThreshold", o.survivorThreshold());
    p.put("survivorsAdded", o.survivorsAdded());
    p.put("survivorsComplete", o.survivorsComplete());
    p.put("poolVariants", o.poolSize());
    ObjectNode sv = n.putObject("solver");
    sv.put("engine", o.engine());
    sv.put("mipSolves", o.mipSolves());
    sv.put("lastMipOptimal", o.mipOptimal());
    n.put("elapsedMs", o.elapsedMs());
    return n;
  }
}
