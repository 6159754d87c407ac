package dev.mixwright.pricing;

import dev.mixwright.master.CpSatPricingModel;
import dev.mixwright.space.VariantSpace;
import java.util.Optional;

/**
 * General pricer on OR-Tools CP-SAT ({@link CpSatPricingModel}), the cross-check for the specialised
 * searches.
 *
 * <p>k best: solve, keep the optimum, forbid exactly that variant, solve again — until k are kept,
 * the optimum is at or below the threshold, or nothing is left. An excluded optimum is forbidden the
 * same way without being kept (keys cannot be turned back into variants up front), so a query costs
 * at most k + |excluded| solves. Exact when every solve ends OPTIMAL; optimality is that of CP-SAT's
 * scaled objective, which agrees with the double sums to about 1e-9 relative on the tests' data.
 */
public final class CpSatPricer extends SpacePricer {
  private final double timeLimitSeconds;
  private final int workers;
  private final int[] offset;

  /**
   * @param timeLimitSeconds wall time for all solves of one query, 0 for none; when it runs out the
   *     outcome is not exact and its bound is CP-SAT's best objective bound
   * @param workers CP-SAT search workers; 1 keeps results reproducible
   */
  public CpSatPricer(VariantSpace space, double timeLimitSeconds, int workers) {
    super(space, "cpsat");
    if (!(timeLimitSeconds >= 0) || workers < 1) {
      throw new IllegalArgumentException("timeLimitSeconds must be >= 0 and workers >= 1");
    }
    this.timeLimitSeconds = timeLimitSeconds;
    this.workers = workers;
    this.offset = space.offsets();
  }

  @Override
  PricingOutcome search(PricingQuery q) {
    long start = System.nanoTime();
    double[] w = q.weight();
    boolean[] usable = new boolean[w.length];
    for (int f = 0; f < w.length; f++) {
      usable[f] = QueryChecks.usable(space, w, f);
    }
    TopK top = new TopK(q.k(), space.groupCount());
    Optional<CpSatPricingModel> built = CpSatPricingModel.of(space, w, usable, workers);
    if (built.isEmpty()) {
      return QueryChecks.outcome(top, q.threshold(), true, Double.NEGATIVE_INFINITY, 0);
    }
    CpSatPricingModel model = built.get();
    boolean exact = true;
    double openBound = Double.NEGATIVE_INFINITY;
    long solves = 0;
    while (true) {
      if (solves > 0 && q.mayStop(top.size())) {
        exact = false; // cancelled between solves: nothing proven about what is left
        openBound = Double.POSITIVE_INFINITY;
        break;
      }
      double left = 0;
      if (timeLimitSeconds > 0) {
        left = timeLimitSeconds - (System.nanoTime() - start) / 1e9;
        if (left <= 0) {
          exact = false;
          openBound = Double.POSITIVE_INFINITY; // nothing proven about what is left
          break;
        }
      }
      CpSatPricingModel.Solve solve = model.solve(left);
      solves++;
      if (solve.status() == CpSatPricingModel.Status.INFEASIBLE) {
        break;
      }
      if (solve.status() != CpSatPricingModel.Status.OPTIMAL) {
        exact = false;
        openBound = Double.POSITIVE_INFINITY;
        if (solve.status().hasVariant()) {
          // every variant not yet forbidden scores at most CP-SAT's bound (the forbidden ones are kept
          // or excluded); widened by the precision CP-SAT scales a floating objective to (its
          // mip_wanted_precision, 1e-6 by default — the default recalled, not measured)
          double b = solve.bound() + q.constant();
          openBound = Double.isNaN(b) ? Double.POSITIVE_INFINITY : b + 1e-6 * (1 + Math.abs(b));
          int[] v = solve.choices();
          double s = QueryChecks.score(offset, w, q.constant(), v);
          if (s > top.cutoff(q.threshold()) && !q.excluded().contains(space.key(v))) {
            top.offer(v, s);
          }
        }
        break;
      }
      int[] v = solve.choices();
      double s = QueryChecks.score(offset, w, q.constant(), v);
      if (!(s > q.threshold())) {
        break;
      }
      if (!q.excluded().contains(space.key(v))) {
        top.offer(v, s);
        if (top.size() == q.k()) {
          break;
        }
      }
      model.forbid(v);
    }
    return QueryChecks.outcome(top, q.threshold(), exact, openBound, solves);
  }
}
