package dev.mixwright.testing;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPSolverParameters;
import com.google.ortools.linearsolver.MPVariable;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CurrentVariant;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.master.Natives;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Independent reference for one range across scenarios, for tests only: the two-stage stochastic
 * MIP (Birge &amp; Louveaux, "Introduction to Stochastic Programming", the two-stage recourse model,
 * recalled from memory) written out in one piece from the catalogs' figures — every buildable
 * variant, every scenario — and handed to SCIP. No pool, pricing or bound of the project's own.
 *
 * <pre>
 *   max Σ_k p_k Σ m^k_vs x^k_vs − F Σ y_v − Σ_o T_o t_o       (or t − F Σ y − Σ T t, t ≤ Σ m^k x^k ∀k)
 *   per k: Σ a^k_rv x^k_vs ≤ b^k_r,  Σ_v x^k_vs ≤ D^k_s,  x^k_vs ≤ u^k_s y_v,  Σ_s x^k_vs ≥ L^k y_v
 *   Σ y_v ≤ K,  y_v ≤ t_o (o in v),  y, t ∈ {0,1},  x ≥ 0
 * </pre>
 *
 * Scenario catalogs share groups, rules, segments and today's range; figures differ. Today's range
 * as in {@link EnumeratedMip} (from the spec's words): a current variant pays no F, dropping it costs
 * its discontinue cost (−disc·(1 − y)), a pinned one has y = 1. No segments that choose.
 */
public final class EnumeratedScenarioMip {
  private EnumeratedScenarioMip() {}

  public record Result(double value, double bound, boolean optimal) {}

  public static Result solve(List<VariantSpace> spaces, double[] weight, boolean worst, long timeLimitMs) {
    Natives.load();
    VariantSpace first = spaces.get(0);
    // no exclude entries here (scenario catalogs drop them), so the listing is every sellable variant
    List<int[]> variants = EnumeratedMip.sellable(first);
    int groups = first.groupCount();
    MPSolver solver = MPSolver.createSolver("SCIP");
    MPSolverParameters params = new MPSolverParameters();
    try {
      solver.setNumThreads(1);
      if (timeLimitMs > 0) {
        solver.setTimeLimit(timeLimitMs);
      }
      MPObjective obj = solver.objective();
      obj.setMaximization();
      PortfolioSpec p = first.catalog().portfolio().orElseThrow();
      MPConstraint[] epi = new MPConstraint[spaces.size()];
      if (worst) {
        MPVariable t = solver.makeNumVar(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, "t");
        obj.setCoefficient(t, 1);
        for (int k = 0; k < epi.length; k++) {
          epi[k] = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0);
          epi[k].setCoefficient(t, 1);
        }
      }
      List<MPConstraint[]> res = new ArrayList<>();
      List<MPConstraint[]> dem = new ArrayList<>();
      for (VariantSpace sp : spaces) {
        Catalog c = sp.catalog();
        MPConstraint[] r = new MPConstraint[c.resources().size()];
        for (int i = 0; i < r.length; i++) {
          r[i] = solver.makeConstraint(Double.NEGATIVE_INFINITY, c.resources().get(i).capacity());
        }
        MPConstraint[] d = new MPConstraint[c.segments().size()];
        for (int i = 0; i < d.length; i++) {
          d[i] = solver.makeConstraint(Double.NEGATIVE_INFINITY, c.segments().get(i).demand());
        }
        res.add(r);
        dem.add(d);
      }
      MPConstraint limit = p.maxVariants() == Integer.MAX_VALUE ? null
          : solver.makeConstraint(Double.NEGATIVE_INFINITY, p.maxVariants());
      Map<Integer, MPVariable> tools = new HashMap<>();
      Map<String, CurrentVariant> current = new HashMap<>();
      for (CurrentVariant cv : first.catalog().current()) {
        current.put(Arrays.toString(first.parse(cv.variant())), cv);
      }
      double constant = 0;
      Set<String> listed = new HashSet<>();
      variants.forEach(w -> listed.add(Arrays.toString(w)));
      for (Map.Entry<String, CurrentVariant> e : current.entrySet()) {
        if (!listed.contains(e.getKey()) && !e.getValue().keep()) {
          constant -= e.getValue().discontinue(); // no segment takes it: dropped
        }
      }
      for (int[] w : variants) {
        MPVariable y = solver.makeBoolVar("");
        CurrentVariant cur = current.get(Arrays.toString(w));
        if (cur == null) {
          obj.setCoefficient(y, -p.introductionCost());
        } else {
          obj.setCoefficient(y, cur.discontinue()); // −disc·(1 − y) = −disc + disc·y
          constant -= cur.discontinue();
          if (cur.keep()) {
            y.setLb(1);
          }
        }
        if (limit != null) {
          limit.setCoefficient(y, 1);
        }
        for (int k = 0; k < spaces.size(); k++) {
          VariantSpace sp = spaces.get(k);
          Catalog c = sp.catalog();
          PortfolioSpec pk = c.portfolio().orElseThrow();
          MPConstraint lot = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0);
          lot.setCoefficient(y, pk.minLot());
          double[] a = sp.use(w);
          for (int s = 0; s < c.segments().size(); s++) {
            if (!sp.isColumn(w, s)) {
              continue;
            }
            double u = c.segments().get(s).maxShare() * c.segments().get(s).demand();
            MPVariable x = pk.wholeUnits() ? solver.makeIntVar(0, Double.POSITIVE_INFINITY, "")
                : solver.makeNumVar(0, Double.POSITIVE_INFINITY, "");
            if (worst) {
              epi[k].setCoefficient(x, -sp.margin(w, s));
            } else {
              obj.setCoefficient(x, weight[k] * sp.margin(w, s));
            }
            for (int r = 0; r < a.length; r++) {
              res.get(k)[r].setCoefficient(x, a[r]);
            }
            dem.get(k)[s].setCoefficient(x, 1);
            MPConstraint link = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0);
            link.setCoefficient(x, 1);
            link.setCoefficient(y, -u);
            lot.setCoefficient(x, -1);
          }
        }
        EnumeratedMip.needTooling(solver, obj, tools, first, w, y, false);
      }
      params.setDoubleParam(MPSolverParameters.DoubleParam.RELATIVE_MIP_GAP, 1e-9);
      MPSolver.ResultStatus st = solver.solve(params);
      if (st != MPSolver.ResultStatus.OPTIMAL && st != MPSolver.ResultStatus.FEASIBLE) {
        throw new IllegalStateException("the enumerated two-stage model ended " + st);
      }
      return new Result(obj.value() + constant, obj.bestBound() + constant, st == MPSolver.ResultStatus.OPTIMAL);
    } finally {
      params.delete();
      solver.delete();
    }
  }
}
