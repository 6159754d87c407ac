package dev.mixwright.pricing;

import com.google.ortools.sat.BoolVar;
import com.google.ortools.sat.CpModel;
import com.google.ortools.sat.CpSolver;
import com.google.ortools.sat.CpSolverStatus;
import com.google.ortools.sat.DoubleLinearExpr;
import com.google.ortools.sat.Literal;
import dev.mixwright.master.Natives;
import dev.mixwright.space.Nogood;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;

/**
 * General pricer on OR-Tools CP-SAT, the cross-check for the specialised search.
 *
 * <p>Model: a Boolean x_f per usable choice f; exactly one per group; the objective max constant +
 * Σ w_f x_f (floating coefficients; CP-SAT scales them to integers internally). A nogood says "not
 * every group g of it holds a member choice". Because each group holds exactly one choice, "g holds
 * no member" is the disjunction of g's usable non-member choices, so the nogood is the single
 * clause ∨_{g in nogood} ∨_{f in g, f not member} x_f — no helper variables, and it propagates as
 * soon as all but one group are fixed to members (the negated member literals would be wrong when a
 * group has several member choices).
 *
 * <p>k best: solve, keep the optimum, forbid exactly that variant by a clause, solve again — until k
 * are kept, the optimum is at or below the threshold, or nothing is left. An excluded optimum is
 * forbidden the same way without being kept (keys cannot be turned back into variants up front), so
 * a query costs at most k + |excluded| solves. Exact when every solve ends OPTIMAL; optimality is
 * that of CP-SAT's scaled objective, which agrees with the double sums to about 1e-9 relative on
 * the tests' data.
 */
public final class CpSatPricer implements Pricer {
  private final VariantSpace space;
  private final double timeLimitSeconds;
  private final int workers;
  private final int[] offset;

  public CpSatPricer(VariantSpace space) {
    this(space, 0, 1);
  }

  /**
   * @param timeLimitSeconds wall time for all solves of one query, 0 for none; when it runs out the
   *     outcome is not exact and its bound is CP-SAT's best objective bound
   * @param workers CP-SAT search workers; 1 keeps results reproducible
   */
  public CpSatPricer(VariantSpace space, double timeLimitSeconds, int workers) {
    if (!(timeLimitSeconds >= 0) || workers < 1) {
      throw new IllegalArgumentException("timeLimitSeconds must be >= 0 and workers >= 1");
    }
    Natives.load();
    this.space = space;
    this.timeLimitSeconds = timeLimitSeconds;
    this.workers = workers;
    this.offset = space.offsets();
  }

  @Override
  public String name() {
    return "cpsat";
  }

  @Override
  public PricingOutcome price(PricingQuery q) {
    long start = System.nanoTime();
    QueryChecks.check(space, q);
    int groups = space.groupCount();
    double[] w = q.weight();
    TopK top = new TopK(q.k(), groups);
    PricingOutcome nothing = QueryChecks.outcome(top, q.threshold(), true, Double.NEGATIVE_INFINITY, 0);

    CpModel model = new CpModel();
    BoolVar[] x = new BoolVar[space.totalChoices()];
    List<Literal> objLits = new ArrayList<>();
    List<Double> objCoef = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      List<Literal> one = new ArrayList<>();
      for (int c = 0; c < space.choiceCount(g); c++) {
        int f = offset[g] + c;
        if (QueryChecks.usable(space, w, f)) {
          x[f] = model.newBoolVar("c" + f);
          one.add(x[f]);
          objLits.add(x[f]);
          objCoef.add(w[f]);
        }
      }
      if (one.isEmpty()) {
        return nothing;
      }
      model.addExactlyOne(one);
    }
    for (Nogood n : space.nogoods()) {
      List<Literal> clause = new ArrayList<>();
      boolean vacuous = false;
      for (int g : n.groups()) {
        boolean anyMember = false;
        for (int c = 0; c < space.choiceCount(g); c++) {
          int f = offset[g] + c;
          if (x[f] == null) {
            continue;
          }
          if (n.member()[f]) {
            anyMember = true;
          } else {
            clause.add(x[f]);
          }
        }
        vacuous |= !anyMember;
      }
      if (vacuous) {
        continue; // some group can never match here
      }
      if (clause.isEmpty()) {
        return nothing; // every usable combination matches this nogood: nothing is buildable
      }
      model.addBoolOr(clause);
    }
    double[] coef = new double[objCoef.size()];
    for (int i = 0; i < coef.length; i++) {
      coef[i] = objCoef.get(i);
    }
    model.maximize(DoubleLinearExpr.weightedSum(objLits.toArray(new Literal[0]), coef));

    boolean exact = true;
    double openBound = Double.NEGATIVE_INFINITY;
    long solves = 0;
    int[] v = new int[groups];
    while (true) {
      CpSolver solver = new CpSolver();
      // CP-SAT's own SIGINT handler calls back into an unset C++ function from the JVM and aborts the
      // process (measured: Ctrl-C during a solve ends it with SIGABRT); the command handles Ctrl-C.
      solver.getParameters().setNumWorkers(workers).setAbsoluteGapLimit(0.0).setRandomSeed(1)
          .setCatchSigintSignal(false);
      if (timeLimitSeconds > 0) {
        double left = timeLimitSeconds - (System.nanoTime() - start) / 1e9;
        if (left <= 0) {
          exact = false;
          openBound = Double.POSITIVE_INFINITY; // nothing proven about what is left
          break;
        }
        solver.getParameters().setMaxTimeInSeconds(left);
      }
      CpSolverStatus status = solver.solve(model);
      solves++;
      if (status == CpSolverStatus.INFEASIBLE) {
        break;
      }
      if (status == CpSolverStatus.MODEL_INVALID) {
        throw new IllegalStateException("CP-SAT rejected the pricing model: " + solver.getSolutionInfo());
      }
      if (status != CpSolverStatus.OPTIMAL) {
        exact = false;
        openBound = Double.POSITIVE_INFINITY; // UNKNOWN: the reported bound is a placeholder (0), not a proof
        if (status == CpSolverStatus.FEASIBLE) {
          // every variant not yet forbidden scores at most CP-SAT's bound (the forbidden ones are kept
          // or excluded); widened by the precision CP-SAT scales a floating objective to (its
          // mip_wanted_precision, 1e-6 by default — the default recalled, not measured)
          double b = solver.bestObjectiveBound() + q.constant();
          openBound = Double.isNaN(b) ? Double.POSITIVE_INFINITY : b + 1e-6 * (1 + Math.abs(b));
          read(solver, x, v);
          double s = QueryChecks.score(offset, w, q.constant(), v);
          if (s > top.cutoff(q.threshold()) && !q.excluded().contains(space.key(v))) {
            top.offer(v, s);
          }
        }
        break;
      }
      read(solver, x, v);
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
      Literal[] forbid = new Literal[groups];
      for (int g = 0; g < groups; g++) {
        forbid[g] = x[offset[g] + v[g]].not();
      }
      model.addBoolOr(forbid);
    }
    return QueryChecks.outcome(top, q.threshold(), exact, openBound, solves);
  }

  private void read(CpSolver solver, BoolVar[] x, int[] v) {
    for (int g = 0; g < v.length; g++) {
      v[g] = -1;
      for (int c = 0; c < space.choiceCount(g); c++) {
        BoolVar b = x[offset[g] + c];
        if (b != null && solver.booleanValue(b)) {
          v[g] = c;
          break;
        }
      }
    }
  }
}
