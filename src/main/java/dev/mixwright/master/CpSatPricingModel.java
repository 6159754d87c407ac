package dev.mixwright.master;

import com.google.ortools.sat.BoolVar;
import com.google.ortools.sat.CpModel;
import com.google.ortools.sat.CpSolver;
import com.google.ortools.sat.CpSolverStatus;
import com.google.ortools.sat.DoubleLinearExpr;
import com.google.ortools.sat.Literal;
import dev.mixwright.space.Nogood;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * One pricing problem as an OR-Tools CP-SAT model: maximise Σ w_f x_f over buildable variants, with
 * variants already met forbidden one by one, so that repeated solves list the best ones in turn.
 *
 * <p>Model: a Boolean x_f per usable choice f; exactly one per group; the objective Σ w_f x_f
 * (floating coefficients; CP-SAT scales them to integers internally). A nogood says "not every group
 * g of it holds a member choice". Because each group holds exactly one choice, "g holds no member" is
 * the disjunction of g's usable non-member choices, so the nogood is the single clause ∨_{g in
 * nogood} ∨_{f in g, f not member} x_f — no helper variables, and it propagates as soon as all but
 * one group are fixed to members (the negated member literals would be wrong when a group has several
 * member choices). Forbidding a variant v adds the clause ∨_g ¬x_{v_g}.
 */
public final class CpSatPricingModel {
  /** How one solve ended. */
  public enum Status {
    /** The best variant not yet forbidden, proven. */
    OPTIMAL,
    /** A variant in hand and a proven bound, but stopped by the time limit. */
    FEASIBLE,
    /** No variant is left. */
    INFEASIBLE,
    /** Stopped with nothing proven. */
    UNKNOWN;

    public boolean hasVariant() {
      return this == OPTIMAL || this == FEASIBLE;
    }
  }

  /**
   * A solve's answer: {@code choices} (by group) when {@link Status#hasVariant}, else null;
   * {@code bound} ≥ the objective of every variant not forbidden when FEASIBLE (CP-SAT's best
   * objective bound), NaN otherwise.
   */
  public record Solve(Status status, int[] choices, double bound) {}

  private final VariantSpace space;
  private final int[] offset;
  private final int workers;
  private final CpModel model = new CpModel();
  private final BoolVar[] x;

  private CpSatPricingModel(VariantSpace space, int workers) {
    this.space = space;
    this.offset = space.offsets();
    this.workers = workers;
    this.x = new BoolVar[space.totalChoices()];
  }

  /**
   * The model over the choices marked {@code usable} with objective weights {@code weight} (read at
   * usable choices only); empty when nothing is buildable from them, which the model's constraints
   * show without a solve.
   *
   * @param workers CP-SAT search workers; 1 keeps results reproducible
   */
  public static Optional<CpSatPricingModel> of(VariantSpace space, double[] weight, boolean[] usable, int workers) {
    if (workers < 1) {
      throw new IllegalArgumentException("workers must be >= 1");
    }
    Natives.load();
    CpSatPricingModel m = new CpSatPricingModel(space, workers);
    return m.build(weight, usable) ? Optional.of(m) : Optional.empty();
  }

  private boolean build(double[] w, boolean[] usable) {
    List<Literal> objLits = new ArrayList<>();
    List<Double> objCoef = new ArrayList<>();
    for (int g = 0; g < space.groupCount(); g++) {
      List<Literal> one = new ArrayList<>();
      for (int f = offset[g]; f < offset[g + 1]; f++) {
        if (usable[f]) {
          x[f] = model.newBoolVar("c" + f);
          one.add(x[f]);
          objLits.add(x[f]);
          objCoef.add(w[f]);
        }
      }
      if (one.isEmpty()) {
        return false;
      }
      model.addExactlyOne(one);
    }
    for (Nogood n : space.nogoods()) {
      List<Literal> clause = new ArrayList<>();
      boolean vacuous = false;
      for (int g : n.groups()) {
        boolean anyMember = false;
        for (int f = offset[g]; f < offset[g + 1]; f++) {
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
        return false; // every usable combination matches this nogood: nothing is buildable
      }
      model.addBoolOr(clause);
    }
    double[] coef = new double[objCoef.size()];
    for (int i = 0; i < coef.length; i++) {
      coef[i] = objCoef.get(i);
    }
    model.maximize(DoubleLinearExpr.weightedSum(objLits.toArray(new Literal[0]), coef));
    return true;
  }

  /** Solves for the best variant not yet forbidden; {@code seconds} of wall time, 0 for no limit. */
  public Solve solve(double seconds) {
    CpSolver solver = new CpSolver();
    // CP-SAT's own SIGINT handler calls back into an unset C++ function from the JVM and aborts the
    // process (measured: Ctrl-C during a solve ends it with SIGABRT); the command handles Ctrl-C.
    solver.getParameters().setNumWorkers(workers).setAbsoluteGapLimit(0.0).setRandomSeed(1)
        .setCatchSigintSignal(false);
    if (seconds > 0) {
      solver.getParameters().setMaxTimeInSeconds(seconds);
    }
    CpSolverStatus status = solver.solve(model);
    return switch (status) {
      case OPTIMAL -> new Solve(Status.OPTIMAL, read(solver), Double.NaN);
      case FEASIBLE -> new Solve(Status.FEASIBLE, read(solver), solver.bestObjectiveBound());
      case INFEASIBLE -> new Solve(Status.INFEASIBLE, null, Double.NaN);
      case MODEL_INVALID -> throw new IllegalStateException(
          "CP-SAT rejected the pricing model: " + solver.getSolutionInfo());
      // UNKNOWN: the reported bound is a placeholder (0), not a proof
      default -> new Solve(Status.UNKNOWN, null, Double.NaN);
    };
  }

  /** Forbids exactly this variant (choices by group, each usable) in later solves. */
  public void forbid(int[] v) {
    Literal[] clause = new Literal[v.length];
    for (int g = 0; g < v.length; g++) {
      clause[g] = x[offset[g] + v[g]].not();
    }
    model.addBoolOr(clause);
  }

  private int[] read(CpSolver solver) {
    int[] v = new int[space.groupCount()];
    for (int g = 0; g < v.length; g++) {
      v[g] = -1;
      for (int f = offset[g]; f < offset[g + 1]; f++) {
        if (x[f] != null && solver.booleanValue(x[f])) {
          v[g] = f - offset[g];
          break;
        }
      }
    }
    return v;
  }
}
