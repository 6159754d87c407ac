package dev.mixwright.portfolio;

import dev.mixwright.master.MipSolution;
import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioLpSolution;
import dev.mixwright.master.PortfolioMip;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * The best sales for a fixed set of offered variants: an LP with every introduction at 1, or, when
 * the catalog sells whole units, the same model with integer sales on SCIP (at most K variants, so a
 * small MIP).
 */
final class FixedPortfolio {
  private FixedPortfolio() {}

  /** The plan of offering exactly {@code members}, or null when their minimum lots cannot all be met. */
  static Plan solve(Pool pool, PortfolioTerms terms, int[] members) {
    return solve(pool, terms, members, true);
  }

  /** With {@code limited} false the variant limit is not checked: today's range may hold more than it. */
  static Plan solve(Pool pool, PortfolioTerms terms, int[] members, boolean limited) {
    int[] m = members.clone();
    Arrays.sort(m);
    if (m.length == 0) {
      return Plan.empty(pool);
    }
    if (limited && m.length > terms.maxVariants()) {
      return null;
    }
    if (terms.wholeUnits()) {
      return wholeUnits(pool, terms, m);
    }
    try (PortfolioLp lp = new PortfolioLp(terms.capacity(), terms.demand(), PortfolioTerms.UNLIMITED)) {
      pool.choice().enter(lp);
      Set<Integer> tools = new HashSet<>();
      for (int i : m) {
        PoolVariant v = pool.get(i);
        int j = lp.addVariant(v.segments(), v.margin(), v.use(), v.upper(), v.fixedCost(), terms.minLot());
        pool.choice().attract(lp, j, v);
        lp.fixIntroduction(j, 1, 1);
        for (int t : v.tools()) {
          tools.add(t);
        }
      }
      PortfolioLpSolution sol = lp.solve();
      if (!sol.isOptimal()) {
        return null; // infeasible: the lots do not fit the capacities or demands
      }
      double tooling = 0;
      for (int t : tools) {
        tooling += terms.choiceCost()[t];
      }
      List<double[]> sales = new ArrayList<>();
      for (double[] x : sol.x()) {
        sales.add(x.clone());
      }
      double intro = introduction(pool, m);
      return new Plan(m, sales, sol.objective() - tooling + pool.current().constant(), intro, tooling);
    }
  }

  private static Plan wholeUnits(Pool pool, PortfolioTerms terms, int[] m) {
    try (PortfolioMip mip = new PortfolioMip(PortfolioMip.Engine.SCIP, terms.capacity(), terms.demand(),
        PortfolioTerms.UNLIMITED, terms.choiceCost(), true)) {
      pool.choice().enter(mip);
      for (int i : m) {
        PoolVariant v = pool.get(i);
        int j = mip.addVariant(v.segments(), v.margin(), v.use(), v.upper(), v.fixedCost(), terms.minLot(),
            v.tools());
        pool.choice().attract(mip, j, v);
        mip.fixIntroduction(j, 1, 1);
      }
      // K variants with a few integer sales each: quick; a plan found within the limit is feasible
      // either way, and only serves as an incumbent
      MipSolution sol = mip.solve(10_000, 0.0);
      if (!sol.status().hasSolution()) {
        return null;
      }
      List<double[]> sales = new ArrayList<>();
      double value = 0;
      Set<Integer> tools = new HashSet<>();
      for (int j = 0; j < m.length; j++) {
        PoolVariant v = pool.get(m[j]);
        double[] x = sol.x()[j].clone();
        for (int k = 0; k < x.length; k++) {
          x[k] = Math.rint(x[k]);
          value += v.margin()[k] * x[k];
        }
        sales.add(x);
        for (int t : v.tools()) {
          tools.add(t);
        }
      }
      double tooling = 0;
      for (int t : tools) {
        tooling += terms.choiceCost()[t];
      }
      double intro = introduction(pool, m);
      double fixed = 0;
      for (int i : m) {
        fixed += pool.get(i).fixedCost();
      }
      return new Plan(m, sales, value - fixed - tooling + pool.current().constant(), intro, tooling);
    }
  }

  /** Introduction costs paid: F for every new variant (a current one pays none). */
  private static double introduction(Pool pool, int[] m) {
    double intro = 0;
    for (int i : m) {
      intro += Math.max(0.0, pool.get(i).fixedCost());
    }
    return intro;
  }
}
