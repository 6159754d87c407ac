package dev.mixwright.portfolio;

import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioLpSolution;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/** The best sales for a fixed set of offered variants: an LP with every introduction at 1. */
final class FixedPortfolio {
  private FixedPortfolio() {}

  /** The plan of offering exactly {@code members}, or null when their minimum lots cannot all be met. */
  static Plan solve(Pool pool, PortfolioTerms terms, int[] members) {
    int[] m = members.clone();
    Arrays.sort(m);
    if (m.length == 0) {
      return Plan.empty();
    }
    if (m.length > terms.maxVariants()) {
      return null;
    }
    try (PortfolioLp lp = new PortfolioLp(terms.capacity(), terms.demand(), PortfolioTerms.UNLIMITED)) {
      Set<Integer> tools = new HashSet<>();
      for (int i : m) {
        PoolVariant v = pool.get(i);
        int j = lp.addVariant(v.segments(), v.margin(), v.use(), v.upper(), terms.introductionCost(), terms.minLot());
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
      double intro = terms.introductionCost() * m.length;
      return new Plan(m, sales, sol.objective() - tooling, intro, tooling);
    }
  }
}
