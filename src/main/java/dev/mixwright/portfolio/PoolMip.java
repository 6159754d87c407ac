package dev.mixwright.portfolio;

import dev.mixwright.master.MipSolution;
import dev.mixwright.master.MipStatus;
import dev.mixwright.master.PortfolioMip;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.BooleanSupplier;

/**
 * The MIP of (P) over some of the pool's variants ({@link PortfolioMip}, the engine of the settings):
 * the first MIP over the pool, the quick proof's, the proof set's, and a retired tree node's over its
 * members ({@link #forNodes}). Its best portfolio is re-solved as a fixed portfolio ({@link
 * FixedPortfolio}), so every plan it gives passes the exact LP of its offer.
 */
final class PoolMip {
  private PoolMip() {}

  /**
   * How one solve ended: its status (FAILED when its portfolio failed the fixed-portfolio LP), the plan
   * (null for none), its bound (the discontinue costs of today's range included; +∞ without a solution)
   * and the solver's own answer.
   */
  record Run(MipStatus status, Plan plan, double bound, MipSolution solution) {}

  /**
   * The MIP over pool variants {@code over} with {@code on} (pool indices among them) offered, and the
   * pinned ones; {@code hint} (may be null) starts the solver.
   */
  static Run solve(Pool pool, PortfolioTerms terms, PortfolioSettings settings, BooleanSupplier stop, int[] over,
      int[] on, Plan hint, long timeMs) {
    return solve(pool, terms, settings, stop, over, on, hint, timeMs, Double.NEGATIVE_INFINITY);
  }

  static Run solve(Pool pool, PortfolioTerms terms, PortfolioSettings settings, BooleanSupplier stop, int[] over,
      int[] on, Plan hint, long timeMs, double floor) {
    try (PortfolioMip m = new PortfolioMip(settings.engine(), terms.capacity(), terms.demand(), terms.variantCap(),
        terms.choiceCost(), terms.wholeUnits())) {
      pool.choice().enter(m);
      Map<Integer, Integer> at = new HashMap<>();
      for (int j = 0; j < over.length; j++) {
        PoolVariant v = pool.get(over[j]);
        int i = m.addVariant(v.segments(), v.margin(), v.use(), v.upper(), v.fixedCost(), terms.minLot(),
            v.tools());
        pool.choice().attract(m, i, v);
        if (v.pinned()) {
          m.fixIntroduction(i, 1, 1);
        }
        at.put(over[j], j);
      }
      if (settings.engine().provesContinuous()) {
        // the sales envelope tangents found so far: valid for every portfolio, they give SCIP's LP what the
        // relaxation knows about a choosing segment's offer (CP-SAT, which scales every row to integers,
        // is left with the model as it was)
        pool.choice().envelope().enter(m);
      }
      for (int i : on) {
        m.fixIntroduction(at.get(i), 1, 1);
      }
      double[] y = new double[over.length];
      double[][] x = new double[over.length][];
      for (int j = 0; j < over.length; j++) {
        x[j] = new double[pool.get(over[j]).segments().length];
      }
      for (int j = 0; hint != null && j < hint.members().length; j++) {
        Integer i = at.get(hint.members()[j]);
        if (i != null) {
          y[i] = 1;
          x[i] = hint.sales().get(j);
        }
      }
      m.hint(y, x);
      if (floor > Double.NEGATIVE_INFINITY) {
        m.objectiveFloor(floor - pool.current().constant());
      }
      MipSolution sol = m.solve(timeMs, settings.gap(), stop);
      Plan plan = null;
      if (sol.status().hasSolution()) {
        List<Integer> members = new ArrayList<>();
        for (int i = 0; i < sol.y().length; i++) {
          if (sol.y()[i] > 0.5) {
            members.add(over[i]);
          }
        }
        plan = FixedPortfolio.solve(pool, terms, members.stream().mapToInt(Integer::intValue).toArray());
      }
      MipStatus status = sol.status();
      if (status.hasSolution() && plan == null) {
        // the MIP's choice failed the exact LP of its portfolio (round-off at a minimum lot): use nothing of it
        status = MipStatus.FAILED;
      }
      // the MIP's objective leaves out the discontinue costs of the current range (a constant)
      double mb = status.hasSolution() ? sol.bound() + pool.current().constant() : Double.POSITIVE_INFINITY;
      return new Run(status, plan, mb, sol);
    }
  }

  /**
   * The MIP that decides a retired node of the tree ({@link BranchAndPrice.MemberMip}): over its members
   * with its offered variants fixed; {@code counted} runs once per solve.
   */
  static BranchAndPrice.MemberMip forNodes(Pool pool, PortfolioTerms terms, PortfolioSettings settings,
      BooleanSupplier stop, Runnable counted) {
    return (over, on, ms, floor) -> {
      counted.run();
      Run run = solve(pool, terms, settings, stop, over, on, null, ms, floor);
      if (run.status() == MipStatus.INFEASIBLE) {
        return new BranchAndPrice.MemberMip.Result(null, floor, true);
      }
      return run.status().hasSolution()
          ? new BranchAndPrice.MemberMip.Result(run.plan(), run.bound(), run.status() == MipStatus.OPTIMAL)
          : null;
    };
  }
}
