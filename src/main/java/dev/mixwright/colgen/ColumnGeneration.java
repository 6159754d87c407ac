package dev.mixwright.colgen;

import dev.mixwright.master.MasterSolution;
import dev.mixwright.master.RestrictedMaster;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.pricing.ReducedCosts;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Column generation over the whole variant space (Dantzig–Wolfe style pricing of a product-mix LP).
 *
 * <pre>
 * Master (restricted to the columns found so far; j = (variant v, segment s)):
 *   max Σ_j m_j x_j
 *   s.t. Σ_j a_rj x_j ≤ capacity_r   (π_r ≥ 0)      Σ_{j∈s} x_j ≤ demand_s   (μ_s ≥ 0)
 *        0 ≤ x_j ≤ maxShare_s · demand_s
 * Pricing, per segment s, over every buildable variant v accepted by s:
 *   max d(v, s) = m(v, s) − Σ_r π_r a_r(v) − μ_s      (k best, outside the master's columns of s)
 * Bound (Lasdon 1970; Lübbecke & Desrosiers 2005, Operations Research 53(6)), at optimal master duals:
 *   z_LP ≤ z_RM + Σ_s demand_s · max(0, d̄_s)
 *   d̄_s = an upper bound on d over the columns of s NOT in the master. Master columns at their upper
 *   bound keep d > 0 legitimately; counting them would leave a gap that never closes.
 * </pre>
 *
 * Each round costs one warm-started master re-solve plus one pricing call per segment; the number of
 * rounds is not bounded polynomially in general but is small in practice (measured in
 * docs/performance.md). The loop stops when the gap meets the target, when exact pricing finds no
 * column of positive reduced cost (the optimum is then proven), or when a {@link StopCriterion} fires.
 */
public final class ColumnGeneration {
  private final VariantSpace space;
  private final Pricer exact;
  private final Pricer heuristic;
  private final SolveSettings settings;
  private final StopCriterion stop;
  private final long startNanos;
  private final List<ColGenListener> listeners = new ArrayList<>();
  private int priorIterations;
  private double priorBound = Double.POSITIVE_INFINITY;

  /**
   * @param exact a pricer whose outcomes carry a valid upper bound (the last round relies on it)
   * @param heuristic optional faster pricer tried first when {@code settings.heuristicFirst()}; may be null
   * @param stop extra stopping criteria (time and iteration limits of the settings are added)
   * @param startNanos {@code System.nanoTime()} when the run began (catalog loading included)
   */
  public ColumnGeneration(
      VariantSpace space, Pricer exact, Pricer heuristic, SolveSettings settings, StopCriterion stop,
      long startNanos) {
    this.space = space;
    this.exact = exact;
    this.heuristic = heuristic;
    this.settings = settings;
    List<StopCriterion> all = new ArrayList<>();
    all.add(stop == null ? StopCriterion.never() : stop);
    if (settings.timeLimitMs() > 0) {
      all.add(StopCriterion.timeLimit(settings.timeLimitMs()));
    }
    if (settings.maxIterations() > 0) {
      all.add(StopCriterion.iterationLimit(settings.maxIterations()));
    }
    this.stop = StopCriterion.anyOf(all.toArray(new StopCriterion[0]));
    this.startNanos = startNanos;
  }

  public ColumnGeneration(VariantSpace space, Pricer exact, SolveSettings settings) {
    this(space, exact, null, settings, null, System.nanoTime());
  }

  public ColumnGeneration addListener(ColGenListener l) {
    listeners.add(l);
    return this;
  }

  /**
   * Continues an earlier run of the same catalog: rounds are numbered on from {@code iterationsDone}
   * and {@code provenBound} (any bound proven earlier; +∞ for none) is kept as the best bound. Pass
   * the earlier run's columns to {@link #run(List)}. Only valid when the catalog is unchanged: a
   * bound proven for other figures proves nothing here.
   */
  public ColumnGeneration continuing(int iterationsDone, double provenBound) {
    if (iterationsDone < 0 || Double.isNaN(provenBound)) {
      throw new IllegalArgumentException("iterations done must be >= 0 and the bound a number");
    }
    this.priorIterations = iterationsDone;
    this.priorBound = provenBound;
    return this;
  }

  private long elapsedMs() {
    return (System.nanoTime() - startNanos) / 1_000_000;
  }

  public SolveOutcome run() {
    return run(List.of());
  }

  /** Runs the loop, starting from {@code warmStart} columns (e.g. from an earlier run) plus the seed. */
  public SolveOutcome run(List<Column> warmStart) {
    int segCount = space.segmentCount();
    int resCount = space.resourceCount();
    double[] capacity = new double[resCount];
    for (int r = 0; r < resCount; r++) {
      capacity[r] = space.catalog().resources().get(r).capacity();
    }
    double[] demand = new double[segCount];
    double[] upper = new double[segCount];
    for (int s = 0; s < segCount; s++) {
      demand[s] = space.catalog().segments().get(s).demand();
      upper[s] = space.catalog().segments().get(s).columnBound();
    }
    double marginScale = 1.0;
    for (int f = 0; f < space.totalChoices(); f++) {
      marginScale = Math.max(marginScale, Math.abs(space.choiceMargin(f)));
    }
    // A column must pay more than this to enter; tiny against any catalog's margins, large against
    // GLOP's round-off.
    double entryTolerance = 1e-9 * marginScale * Math.max(1, space.groupCount());

    List<Column> columns = new ArrayList<>();
    List<Set<VariantKey>> inMaster = new ArrayList<>();
    for (int s = 0; s < segCount; s++) {
      inMaster.add(new HashSet<>());
    }
    List<IterationRecord> history = new ArrayList<>();

    try (RestrictedMaster master = new RestrictedMaster(capacity, demand)) {
      for (Column c : warmStart) {
        if (inMaster.get(c.segment()).add(space.key(c.choices()))) {
          master.addColumn(c.segment(), c.margin(), c.use(), c.upper());
          columns.add(c);
        }
      }
      // Seed: the best column per segment at zero duals, whatever its sign, so every segment that
      // accepts a variant is represented from the first solve. Segments the warm start already
      // covers need none.
      double[] zero = new double[resCount];
      boolean anyColumn = !columns.isEmpty();
      int warmCount = columns.size();
      for (int s = 0; s < segCount; s++) {
        if (!inMaster.get(s).isEmpty()) {
          continue;
        }
        PricingOutcome o = exact.price(ReducedCosts.query(space, s, zero, 0, 1, Double.NEGATIVE_INFINITY, inMaster.get(s)));
        for (PricedVariant pv : o.found()) {
          Column c = column(s, pv.choices(), upper[s], 0, pv.reducedCost());
          inMaster.get(s).add(space.key(pv.choices()));
          master.addColumn(s, c.margin(), c.use(), c.upper());
          columns.add(c);
          anyColumn = true;
        }
      }
      listeners.forEach(l -> l.started(columns.size()));
      if (!anyColumn) {
        SolveOutcome out = new SolveOutcome(RunStatus.INFEASIBLE,
            "no segment accepts any buildable variant", 0, 0, 0, 0, columns, new double[0],
            new double[0], new double[resCount], new double[segCount], history, elapsedMs());
        listeners.forEach(l -> l.ended(out));
        return out;
      }

      MasterSolution sol = solveOrFail(master);
      List<Column> seeded = List.copyOf(columns.subList(warmCount, columns.size()));
      double z0 = sol.objective();
      long t0 = elapsedMs();
      double b0 = priorBound;
      listeners.forEach(l -> l.columnsAdded(seeded, z0, b0, t0));
      double bestBound = priorBound;
      int iteration = priorIterations;
      RunStatus status;
      String reason = "";
      while (true) {
        iteration++;
        double[] pi = sol.resourceDual();
        double[] mu = sol.segmentDual();
        List<Column> found = new ArrayList<>();
        double roundBound = sol.objective();
        boolean allExact = true;
        for (int s = 0; s < segCount; s++) {
          PricingOutcome o = null;
          if (settings.heuristicFirst() && heuristic != null) {
            o = heuristic.price(ReducedCosts.query(space, s, pi, mu[s], settings.perRound(), 0.0, inMaster.get(s)));
            if (o.best() <= entryTolerance) {
              o = null;
            }
          }
          if (o == null) {
            // Threshold 0, so that the bound uses the best reduced cost itself; only columns that pay
            // more than the round-off tolerance enter.
            o = exact.price(ReducedCosts.query(space, s, pi, mu[s], settings.perRound(), 0.0, inMaster.get(s)));
          }
          allExact &= o.exact();
          roundBound += demand[s] * Math.max(0.0, o.upperBound());
          for (PricedVariant pv : o.found()) {
            if (pv.reducedCost() > entryTolerance) {
              found.add(column(s, pv.choices(), upper[s], iteration, pv.reducedCost()));
            }
          }
        }
        bestBound = Math.min(bestBound, roundBound);
        double gap = SolveOutcome.gap(sol.objective(), bestBound);
        IterationRecord rec = new IterationRecord(iteration, sol.objective(), bestBound, gap,
            columns.size(), found.size(), allExact, elapsedMs());
        history.add(rec);
        listeners.forEach(l -> l.iteration(rec));
        if (gap <= settings.gapTolerance() || (found.isEmpty() && allExact)) {
          status = RunStatus.OPTIMAL;
          break;
        }
        if (found.isEmpty()) {
          // Only possible with a pricer that proves nothing and finds nothing: give up honestly.
          status = RunStatus.STOPPED;
          reason = "pricing found no column and could not prove the bound";
          break;
        }
        Optional<String> why = stop.check(rec);
        if (why.isPresent()) {
          status = RunStatus.STOPPED;
          reason = why.get();
          break;
        }
        for (Column c : found) {
          inMaster.get(c.segment()).add(space.key(c.choices()));
          master.addColumn(c.segment(), c.margin(), c.use(), c.upper());
          columns.add(c);
        }
        sol = solveOrFail(master);
        double z = sol.objective();
        double b = bestBound;
        long t = elapsedMs();
        listeners.forEach(l -> l.columnsAdded(found, z, b, t));
      }
      SolveOutcome out = new SolveOutcome(status, reason, sol.objective(), bestBound,
          SolveOutcome.gap(sol.objective(), bestBound), iteration, columns, sol.x(),
          sol.reducedCost(), sol.resourceDual(), sol.segmentDual(), history, elapsedMs());
      listeners.forEach(l -> l.ended(out));
      return out;
    }
  }

  private Column column(int s, int[] choices, double upper, int iteration, double reducedCost) {
    int[] v = Arrays.copyOf(choices, choices.length);
    return new Column(s, v, space.margin(v, s), space.use(v), upper, iteration, reducedCost);
  }

  private static MasterSolution solveOrFail(RestrictedMaster master) {
    MasterSolution sol = master.solve();
    if (!sol.isOptimal()) {
      // x = 0 is feasible and the columns are bounded, so anything else is a solver fault.
      throw new IllegalStateException("the master LP solve ended " + sol.status()
          + "; it is feasible and bounded by construction, so this is a solver fault");
    }
    return sol;
  }
}
