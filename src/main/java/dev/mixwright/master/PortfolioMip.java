package dev.mixwright.master;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPSolverParameters;
import com.google.ortools.linearsolver.MPVariable;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.BooleanSupplier;

/**
 * The integer portfolio over a pool of variants, on a MIP solver OR-Tools bundles (SCIP or CP-SAT
 * through MPSolver). The rows of {@link PortfolioLp} with y_v ∈ {0, 1}, plus tooling: a binary t_o
 * per costly option o used by some pool variant, y_v ≤ t_o for every such option of v, and − Σ_o
 * T_o t_o in the objective, so an option's tooling is paid once however many variants use it.
 *
 * <p>SCIP runs single-threaded: with more threads it switches to a concurrent mode that ended early
 * with an unknown status in a measurement here. Build, optionally hint, solve once; not thread-safe.
 */
public final class PortfolioMip implements PortfolioShape, AutoCloseable {
  private static final double FEASIBILITY_TOLERANCE = Rows.FEASIBILITY_TOLERANCE;

  /** The MIP engine. */
  public enum Engine {
    SCIP("SCIP"),
    CP_SAT("CP_SAT");

    private final String solverId;

    Engine(String solverId) {
      this.solverId = solverId;
    }

    /**
     * True when an optimal status and the bound hold for continuous sales. SCIP solves the model as
     * given; CP-SAT scales continuous variables to integers, and was measured here to report a bound
     * below the exact optimum of the continuous model, so its answers serve as incumbents only.
     */
    public boolean provesContinuous() {
      return this == SCIP;
    }

    /** Short name for options and reports. */
    public String word() {
      return name().toLowerCase(Locale.ROOT).replace("_", "");
    }

    public static Engine byWord(String w) {
      for (Engine e : values()) {
        if (e.word().equals(w.trim().toLowerCase(Locale.ROOT))) {
          return e;
        }
      }
      throw new IllegalArgumentException("unknown MIP solver '" + w + "'; choose scip or cpsat");
    }
  }

  private final Engine engine;
  private final Rows rows;
  private final MPSolver solver;
  private final MPObjective objective;
  private final double[] toolCost;
  private final Map<Integer, MPVariable> tools = new HashMap<>();
  private final List<MPVariable> ys = new ArrayList<>();
  private final List<MPVariable[]> xs = new ArrayList<>();
  private final List<int[]> segmentsOf = new ArrayList<>();
  /** Attraction entries: variant, entry, w (for the sales envelope rows). */
  private final List<double[]> attractions = new ArrayList<>();
  /** Sales envelope rows added (for their names). */
  private int envelopes;
  private final boolean wholeUnits;
  private final double[] demand;
  /** Stay-out x_s0 per choosing segment, null for a fixed one. */
  private final MPVariable[] stay;
  /** The worst scenario's rows ({@link #worstCase}), null otherwise. */
  private MPConstraint[] worstRows;

  /**
   * @param variantLimit K, {@code Integer.MAX_VALUE} for none
   * @param toolCost tooling cost per tool id (for the catalog: per flat choice)
   */
  public PortfolioMip(Engine engine, double[] capacity, double[] demand, int variantLimit, double[] toolCost) {
    this(engine, capacity, demand, variantLimit, toolCost, false);
  }

  /** As above; {@code wholeUnits}: every sales variable integer (the catalog's whole units). */
  public PortfolioMip(Engine engine, double[] capacity, double[] demand, int variantLimit, double[] toolCost,
      boolean wholeUnits) {
    this.engine = engine;
    this.wholeUnits = wholeUnits;
    this.toolCost = toolCost.clone();
    this.demand = demand.clone();
    this.stay = new MPVariable[demand.length];
    rows = new Rows(engine.solverId, capacity, demand, variantLimit);
    solver = rows.solver;
    objective = rows.objective;
    solver.setNumThreads(1);
    if (engine == Engine.SCIP) {
      // SCIP catches Ctrl-C by default and swallows it; leave it to the JVM, whose handler stops the
      // run (and this solve through interruptSolve) in the product's own way
      solver.setSolverSpecificParametersAsString("misc/catchctrlc = FALSE");
    }
  }

  /**
   * Adds a pool variant (arguments as {@link PortfolioLp#addVariant}) with the tool ids it needs;
   * returns its index.
   */
  public int addVariant(int[] segments, double[] margin, double[] use, double[] upper, double fixedCost,
      double minLot, int[] toolIds) {
    double[][] each = new double[segments.length][];
    java.util.Arrays.fill(each, use);
    return addScenarioVariant(segments, margin, each, upper, fixedCost, new double[] {minLot},
        new int[segments.length], toolIds);
  }

  /** As {@link PortfolioLp#worstCase}: the objective is the worst scenario's margin less the fixed costs. */
  public void worstCase(int scenarios) {
    if (!ys.isEmpty()) {
      throw new IllegalStateException("call worstCase before adding variants");
    }
    worstRows = rows.epigraph(scenarios);
  }

  /** As {@link PortfolioLp#addScenarioVariant}, with the tool ids the variant needs. */
  public int addScenarioVariant(int[] segments, double[] margin, double[][] use, double[] upper, double fixedCost,
      double[] minLot, int[] lotOf, int[] toolIds) {
    int i = ys.size();
    MPVariable y = solver.makeBoolVar("y" + i);
    MPVariable[] x = rows.addBlock(i, y, segments, margin, use, upper, fixedCost, minLot, lotOf, worstRows);
    if (wholeUnits) {
      for (MPVariable xk : x) {
        xk.setInteger(true);
        xk.setUb(Math.floor(xk.ub() + 1e-9)); // a share limit of 12.5 units sells at most 12
      }
    }
    for (int t : toolIds) {
      if (toolCost[t] <= 0) {
        continue;
      }
      MPVariable z = tools.computeIfAbsent(t, id -> {
        MPVariable v = solver.makeBoolVar("t" + id);
        objective.setCoefficient(v, -toolCost[id]);
        return v;
      });
      MPConstraint needs = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0.0, "tool" + i + "_" + t);
      needs.setCoefficient(y, 1.0);
      needs.setCoefficient(z, -1.0);
    }
    ys.add(y);
    xs.add(x);
    segmentsOf.add(segments.clone());
    return i;
  }

  /** As {@link PortfolioLp#chooseIn}: segment s's row becomes its buyers row with a stay-out. */
  public void chooseIn(int s) {
    stay[s] = rows.makeBuyersRow(s, demand[s]);
  }

  /** As {@link PortfolioLp#addAttraction}: x_vs − w·x_s0 ≤ 0 for entry k of variant i. */
  public void addAttraction(int i, int k, double attraction) {
    if (stay[rowsSegment(i, k)] == null) {
      throw new IllegalArgumentException("segment " + rowsSegment(i, k) + " does not choose");
    }
    rows.addAttractionRow("w" + i + "_" + k, xs.get(i)[k], stay[rowsSegment(i, k)], attraction);
    attractions.add(new double[] {i, k, attraction});
  }

  /**
   * As {@link PortfolioLp#addEnvelope}: Σ_v x_vs − slope·Σ_v w_sv·y_v ≤ rhs over the attraction entries of
   * choosing segment s added so far (call after the variants).
   */
  public void addEnvelope(int segment, double slope, double rhs) {
    if (stay[segment] == null) {
      throw new IllegalArgumentException("segment " + segment + " does not choose");
    }
    MPConstraint c = solver.makeConstraint(Double.NEGATIVE_INFINITY, rhs, "env" + segment + "_" + envelopes++);
    for (double[] a : attractions) {
      int i = (int) a[0];
      int k = (int) a[1];
      if (rowsSegment(i, k) == segment) {
        c.setCoefficient(xs.get(i)[k], 1.0);
        c.setCoefficient(ys.get(i), c.getCoefficient(ys.get(i)) - slope * a[2]);
      }
    }
  }

  private int rowsSegment(int i, int k) {
    return segmentsOf.get(i)[k];
  }

  /** Bounds on y_i: {@code 1, 1} offers the variant, {@code 0, 0} leaves it out. */
  /**
   * Keeps only the portfolios whose objective is at least {@code floor}: a row with the objective's
   * coefficients. When the caller only needs to know whether anything beats a value, this lets the
   * solver prune on it from the start; the model is then infeasible when nothing does.
   */
  public void objectiveFloor(double floor) {
    com.google.ortools.linearsolver.MPConstraint row = solver.makeConstraint(floor - objective.offset(),
        Double.POSITIVE_INFINITY, "objective_floor");
    for (com.google.ortools.linearsolver.MPVariable v : solver.variables()) {
      double c = objective.getCoefficient(v);
      if (c != 0) {
        row.setCoefficient(v, c);
      }
    }
  }

  public void fixIntroduction(int i, double lower, double upper) {
    ys.get(i).setBounds(lower, upper);
  }

  /** A starting solution: y per variant, x per variant and listed segment (null entries for none). */
  public void hint(double[] y, double[][] x) {
    List<MPVariable> vars = new ArrayList<>();
    List<Double> vals = new ArrayList<>();
    for (int i = 0; i < y.length; i++) {
      vars.add(ys.get(i));
      vals.add(y[i]);
      if (x != null && x[i] != null) {
        for (int k = 0; k < x[i].length; k++) {
          vars.add(xs.get(i)[k]);
          vals.add(x[i][k]);
        }
      }
    }
    double[] v = new double[vals.size()];
    for (int j = 0; j < v.length; j++) {
      v[j] = vals.get(j);
    }
    solver.setHint(vars.toArray(new MPVariable[0]), v);
  }

  /**
   * Solves within {@code timeLimitMs} (0 for none) to the relative gap given. y comes back rounded
   * to 0 or 1; the caller re-solves the LP of that portfolio for exact quantities.
   */
  public MipSolution solve(long timeLimitMs, double relativeGap) {
    return solve(timeLimitMs, relativeGap, () -> false);
  }

  /**
   * As {@link #solve(long, double)}, and interrupted (ending as with a time limit) once {@code stop}
   * turns true; a daemon thread polls it every 100 ms while the solver runs.
   */
  public MipSolution solve(long timeLimitMs, double relativeGap, BooleanSupplier stop) {
    if (timeLimitMs > 0) {
      solver.setTimeLimit(timeLimitMs);
    }
    MPSolverParameters p = new MPSolverParameters();
    java.util.concurrent.atomic.AtomicBoolean done = new java.util.concurrent.atomic.AtomicBoolean();
    Thread watch = new Thread(() -> {
      while (!done.get()) {
        if (stop.getAsBoolean()) {
          solver.interruptSolve();
          return;
        }
        try {
          Thread.sleep(100);
        } catch (InterruptedException e) {
          return;
        }
      }
    }, "mixwright-mip-stop");
    watch.setDaemon(true);
    watch.start();
    try {
      p.setDoubleParam(MPSolverParameters.DoubleParam.RELATIVE_MIP_GAP, relativeGap);
      long t0 = System.nanoTime();
      MPSolver.ResultStatus rs = solver.solve(p);
      long wall = (System.nanoTime() - t0) / 1_000_000;
      MipStatus status =
          switch (rs) {
            case OPTIMAL -> MipStatus.OPTIMAL;
            case FEASIBLE -> MipStatus.FEASIBLE;
            case NOT_SOLVED -> MipStatus.NO_SOLUTION;
            case INFEASIBLE -> MipStatus.INFEASIBLE;
            default -> MipStatus.FAILED;
          };
      if (status != MipStatus.OPTIMAL && status != MipStatus.FEASIBLE) {
        return new MipSolution(status, Double.NaN, Double.NaN, new double[0], new double[0][], solver.nodes(), wall);
      }
      int n = ys.size();
      double[] y = new double[n];
      double[][] x = new double[n][];
      for (int i = 0; i < n; i++) {
        double yi = ys.get(i).solutionValue();
        if (Math.abs(yi - Math.rint(yi)) > FEASIBILITY_TOLERANCE) {
          return new MipSolution(MipStatus.FAILED, Double.NaN, Double.NaN, new double[0], new double[0][],
              solver.nodes(), wall);
        }
        y[i] = Math.rint(yi);
        x[i] = new double[xs.get(i).length];
        for (int k = 0; k < x[i].length; k++) {
          x[i][k] = xs.get(i)[k].solutionValue();
        }
      }
      double bound = objective.bestBound();
      double value = objective.value();
      if (status == MipStatus.OPTIMAL && !(bound >= value)) {
        bound = value; // some engines report no separate bound once optimal
      }
      return new MipSolution(status, value, bound, y, x, solver.nodes(), wall);
    } finally {
      done.set(true);
      watch.interrupt();
      try {
        watch.join();
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
      p.delete();
    }
  }

  public Engine engine() {
    return engine;
  }

  @Override
  public void close() {
    rows.close();
  }
}
