package dev.mixwright.testing;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPSolverParameters;
import com.google.ortools.linearsolver.MPVariable;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CurrentVariant;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.master.Natives;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Independent reference for the integer portfolio over the whole variant space, for tests only:
 * every buildable variant listed by an odometer, the MIP of PRODUCT.md written out from the catalog
 * figures and handed to SCIP (bundled with OR-Tools) in one piece — no pool, no pricing, no bound of
 * the project's own.
 *
 * <pre>
 *   max Σ m_vs x_vs − F Σ y_v − Σ_o T_o t_o
 *   Σ a_rv x_vs ≤ b_r,  Σ_v x_vs ≤ D_s,  x_vs ≤ u_s y_v,  Σ_s x_vs ≥ L y_v,  Σ y_v ≤ K,  y_v ≤ t_o (o in v)
 *   y, t ∈ {0,1} (or [0,1] for the relaxation),  x ≥ 0
 * </pre>
 *
 * For a segment s that chooses, its demand row becomes Σ_v x_vs + x_s0 = buyers_s with a stay-out
 * x_s0 ≥ 0, and every x_vs gets x_vs ≤ exp(u_s(v) − stayOut_s)·x_s0 (the sales-based LP of Gallego,
 * Ratliff &amp; Shebalov 2015, Operations Research 63(1)), its link x_vs ≤ buyers_s·y_v: no tighter
 * cap of the project's own.
 *
 * With a current range (PRODUCT.md "Current range"), written from the spec's words and not from the
 * project's reformulation: a current variant c pays no F, dropping it costs disc_c (objective term
 * −disc_c·(1 − y_c)), a pinned one has y_c = 1, and a variant holding every option of an exclude
 * entry is left out of the listing (checked here on the option ids, not through the space's nogoods).
 */
public final class EnumeratedMip {
  private EnumeratedMip() {}

  /** The optimum ({@code optimal} false when SCIP stopped at its time limit) and, for a MIP, what it offers. */
  public record Result(double value, double bound, boolean optimal, List<int[]> offered) {}

  public static Result solve(VariantSpace space, boolean relaxed, long timeLimitMs) {
    Natives.load();
    Catalog c = space.catalog();
    PortfolioSpec p = c.portfolio().orElseThrow();
    List<int[]> variants = sellable(space);
    int groups = space.groupCount();
    MPSolver solver = MPSolver.createSolver(relaxed ? "GLOP" : "SCIP");
    MPSolverParameters params = new MPSolverParameters();
    try {
      solver.setNumThreads(1);
      if (timeLimitMs > 0) {
        solver.setTimeLimit(timeLimitMs);
      }
      MPObjective obj = solver.objective();
      obj.setMaximization();
      MPConstraint[] res = new MPConstraint[c.resources().size()];
      for (int r = 0; r < res.length; r++) {
        res[r] = solver.makeConstraint(Double.NEGATIVE_INFINITY, c.resources().get(r).capacity());
      }
      MPConstraint[] dem = new MPConstraint[c.segments().size()];
      for (int s = 0; s < dem.length; s++) {
        dem[s] = solver.makeConstraint(Double.NEGATIVE_INFINITY, c.segments().get(s).demand());
      }
      MPVariable[] stay = new MPVariable[dem.length];
      for (int s = 0; s < dem.length; s++) {
        if (c.segments().get(s).chooses()) {
          dem[s].setLb(c.segments().get(s).demand());
          stay[s] = solver.makeNumVar(0, Double.POSITIVE_INFINITY, "");
          dem[s].setCoefficient(stay[s], 1);
        }
      }
      MPConstraint limit = p.maxVariants() == Integer.MAX_VALUE ? null
          : solver.makeConstraint(Double.NEGATIVE_INFINITY, p.maxVariants());
      Map<Integer, MPVariable> tools = new HashMap<>();
      List<MPVariable> ys = new ArrayList<>();
      Map<String, CurrentVariant> current = new HashMap<>();
      for (CurrentVariant cv : c.current()) {
        current.put(java.util.Arrays.toString(space.parse(cv.variant())), cv);
      }
      double constant = 0;
      java.util.Set<String> listed = new java.util.HashSet<>();
      for (int[] w : variants) {
        listed.add(java.util.Arrays.toString(w));
      }
      for (Map.Entry<String, CurrentVariant> e : current.entrySet()) {
        if (!listed.contains(e.getKey()) && !e.getValue().keep()) {
          constant -= e.getValue().discontinue(); // no segment takes it: dropped
        }
      }
      for (int[] w : variants) {
        CurrentVariant cur = current.get(java.util.Arrays.toString(w));
        MPVariable y = relaxed ? solver.makeNumVar(0, 1, "") : solver.makeBoolVar("");
        ys.add(y);
        if (cur == null) {
          obj.setCoefficient(y, -p.introductionCost());
        } else {
          // −disc·(1 − y) = −disc + disc·y
          obj.setCoefficient(y, cur.discontinue());
          constant -= cur.discontinue();
          if (cur.keep()) {
            y.setLb(1);
          }
        }
        if (limit != null) {
          limit.setCoefficient(y, 1);
        }
        MPConstraint lot = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0);
        lot.setCoefficient(y, p.minLot());
        double[] a = space.use(w);
        for (int s = 0; s < dem.length; s++) {
          if (!space.isColumn(w, s)) {
            continue;
          }
          double u = c.segments().get(s).maxShare() * c.segments().get(s).demand();
          MPVariable x = p.wholeUnits() && !relaxed ? solver.makeIntVar(0, Double.POSITIVE_INFINITY, "")
              : solver.makeNumVar(0, Double.POSITIVE_INFINITY, "");
          obj.setCoefficient(x, space.margin(w, s));
          for (int r = 0; r < res.length; r++) {
            res[r].setCoefficient(x, a[r]);
          }
          dem[s].setCoefficient(x, 1);
          MPConstraint link = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0);
          link.setCoefficient(x, 1);
          link.setCoefficient(y, -u);
          lot.setCoefficient(x, -1);
          if (stay[s] != null) {
            MPConstraint logit = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0);
            logit.setCoefficient(x, 1);
            logit.setCoefficient(stay[s], -Math.exp(space.utility(w, s) - space.stayOut(s)));
          }
        }
        needTooling(solver, obj, tools, space, w, y, relaxed);
      }
      params.setDoubleParam(MPSolverParameters.DoubleParam.RELATIVE_MIP_GAP, 1e-9);
      MPSolver.ResultStatus st = solver.solve(params);
      if (st != MPSolver.ResultStatus.OPTIMAL && st != MPSolver.ResultStatus.FEASIBLE) {
        throw new IllegalStateException("the enumerated portfolio model ended " + st);
      }
      List<int[]> offered = new ArrayList<>();
      for (int i = 0; i < ys.size(); i++) {
        if (ys.get(i).solutionValue() > 0.5) {
          offered.add(variants.get(i));
        }
      }
      double value = obj.value() + constant;
      double bound = (relaxed ? obj.value() : obj.bestBound()) + constant;
      return new Result(value, bound, st == MPSolver.ResultStatus.OPTIMAL, offered);
    } finally {
      params.delete();
      solver.delete();
    }
  }

  /** Every buildable variant some segment takes and no exclude entry bars, listed by an odometer. */
  public static List<int[]> sellable(VariantSpace space) {
    List<int[]> variants = new ArrayList<>();
    int groups = space.groupCount();
    int[] v = new int[groups];
    boolean any = true;
    for (int g = 0; g < groups; g++) {
      any &= space.choiceCount(g) > 0;
    }
    while (any) {
      boolean sold = false;
      for (int s = 0; s < space.segmentCount(); s++) {
        sold |= space.isColumn(v, s);
      }
      if (sold && !excluded(space, v)) {
        variants.add(v.clone());
      }
      if (!Odometer.next(space, v)) {
        break;
      }
    }
    return variants;
  }

  /** True when v holds every option of some exclude entry (an option named without a price covers its price points). */
  public static boolean excluded(VariantSpace space, int[] v) {
    Catalog c = space.catalog();
    for (Map<String, String> entry : c.exclude()) {
      boolean all = true;
      for (Map.Entry<String, String> e : entry.entrySet()) {
        int g = c.groupIndex(e.getKey());
        String held = space.optionId(g, space.optionOf(space.offset(g) + v[g]));
        String named = e.getValue();
        int mark = named.indexOf(Option.PRICE_MARK);
        all &= held.equals(mark > 0 ? named.substring(0, mark) : named);
      }
      if (all) {
        return true;
      }
    }
    return false;
  }

  /**
   * Tooling of variant w (introduced when y is 1): each of its options with tooling needs that
   * option's variable, one per option for the whole model and paid once (−tooling in the objective),
   * binary, or between 0 and 1 when {@code relaxed}.
   */
  static void needTooling(MPSolver solver, MPObjective obj, Map<Integer, MPVariable> tools, VariantSpace space,
      int[] w, MPVariable y, boolean relaxed) {
    Catalog c = space.catalog();
    for (int g = 0; g < w.length; g++) {
      if (w[g] >= c.groups().get(g).options().size()) {
        continue; // none
      }
      Option o = c.groups().get(g).options().get(w[g]);
      if (o.tooling() <= 0) {
        continue;
      }
      MPVariable t = tools.computeIfAbsent(space.offset(g) + w[g], kk -> {
        MPVariable z = relaxed ? solver.makeNumVar(0, 1, "") : solver.makeBoolVar("");
        obj.setCoefficient(z, -o.tooling());
        return z;
      });
      MPConstraint need = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0);
      need.setCoefficient(y, 1);
      need.setCoefficient(t, -1);
    }
  }
}
