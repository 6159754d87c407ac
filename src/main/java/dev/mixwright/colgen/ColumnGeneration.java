package dev.mixwright.colgen;

import dev.mixwright.master.MasterSolution;
import dev.mixwright.master.RestrictedMaster;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.pricing.PricingQuery;
import dev.mixwright.pricing.ReducedCosts;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
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
 * Bound for any resource prices y ≥ 0 (see {@link LagrangianBound}), used at every exact round and
 * the only one valid at smoothed duals:
 *   UB(y) = Σ_r y_r·capacity_r + Σ_s K_s(y),  K_s = continuous knapsack of segment s by m_j − a_j·y
 * </pre>
 *
 * <p>Accelerations, each a switch of {@link SolveSettings}: k columns per segment per round; a
 * heuristic pricer tried first; Wentges smoothing (Wentges 1997, ITOR 4(2)) — price at
 * α·y_best + (1 − α)·π_RM, where y_best gave the best Lagrangian bound so far — with the mispricing
 * safeguard of Pessoa, Sadykov, Uchoa &amp; Vanderbeck 2018 (INFORMS JOC 30(2)): when no column
 * found at the smoothed point pays at the master's duals, price again with α_k = max(0, 1 − k(1 −
 * α)), down to the master's own duals; and retirement of columns idle for some rounds (bounds set to
 * 0; pricing may bring them back). The master re-solves warm from its last basis.
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
  private long[] counters = new long[10];
  private RunStats stats;
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

  /** What the last {@link #run} spent its effort on; null before the first run. */
  public RunStats stats() {
    return stats;
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
    LagrangianBound lagrangian = new LagrangianBound(capacity, demand);
    counters = new long[10];

    List<IterationRecord> history = new ArrayList<>();
    try (RestrictedMaster master = new RestrictedMaster(capacity, demand)) {
      Pool pool = new Pool(master, segCount);
      for (Column c : warmStart) {
        pool.add(c);
      }
      // Seed: the best column per segment at zero duals, whatever its sign, so every segment that
      // accepts a variant is represented from the first solve. Segments the warm start already
      // covers need none.
      double[] zero = new double[resCount];
      int warmCount = pool.size();
      for (int s = 0; s < segCount; s++) {
        if (!pool.active(s).isEmpty()) {
          continue;
        }
        PricingOutcome o = priceExact(ReducedCosts.query(space, s, zero, 0, 1, Double.NEGATIVE_INFINITY, pool.active(s)));
        for (PricedVariant pv : o.found()) {
          pool.add(column(s, pv.choices(), upper[s], 0, pv.reducedCost()));
        }
      }
      listeners.forEach(l -> l.started(pool.size()));
      if (pool.size() == 0) {
        SolveOutcome out = new SolveOutcome(RunStatus.INFEASIBLE,
            "no segment accepts any buildable variant", 0, 0, 0, 0, pool.columns, new double[0],
            new double[0], new double[resCount], new double[segCount], history, elapsedMs());
        finishStats();
        listeners.forEach(l -> l.ended(out));
        return out;
      }

      MasterSolution sol = solveOrFail(master);
      List<Column> seeded = List.copyOf(pool.columns.subList(warmCount, pool.size()));
      double z0 = sol.objective();
      long t0 = elapsedMs();
      double b0 = priorBound;
      listeners.forEach(l -> l.columnsAdded(seeded, z0, b0, t0));
      double bestBound = priorBound;
      // Wentges's stability centre: the dual point with the best Lagrangian bound so far.
      double[] centerPi = null;
      double[] centerMu = null;
      double centerBound = Double.POSITIVE_INFINITY;
      int iteration = priorIterations;
      RunStatus status;
      String reason = "";
      while (true) {
        iteration++;
        double[] pi = sol.resourceDual();
        double[] mu = sol.segmentDual();
        List<Column> found = new ArrayList<>();
        double roundBound = Double.POSITIVE_INFINITY;
        // The Lasdon-type bound at this round's own master duals: only it may end the run on the
        // gap, so that the duals reported price every column outside the master to within the
        // tolerance. The best bound (the Lagrangian one included) can be tighter at degenerate duals
        // that leave a paying column outside: seen with a column at its upper bound equal to the
        // segment's demand, where μ = 0 left the next variant at d = 132.
        double ownBound = Double.POSITIVE_INFINITY;
        boolean allExact;
        double alpha;
        int mispriced = 0;
        while (true) {
          // Mispricing safeguard (Pessoa, Sadykov, Uchoa & Vanderbeck 2018, INFORMS JOC 30(2)):
          // after k mispricings in a row, α_k = max(0, 1 − (k+1)(1 − α)); α_k = 0 prices at the
          // master's duals, which is plain column generation and terminates.
          alpha = centerPi == null ? 0 : Math.max(0, 1 - (mispriced + 1) * (1 - settings.smoothing()));
          double[] y = mix(alpha, centerPi, pi);
          double[] nu = mix(alpha, centerMu, mu);
          List<PricingOutcome> outcomes = new ArrayList<>();
          allExact = true;
          for (int s = 0; s < segCount; s++) {
            PricingOutcome o = null;
            if (settings.heuristicFirst() && heuristic != null) {
              long h0 = System.nanoTime();
              o = heuristic.price(ReducedCosts.query(space, s, y, nu[s], settings.perRound(), 0.0, pool.active(s)));
              counters[C_HEUR_CALLS]++;
              counters[C_HEUR_NANOS] += System.nanoTime() - h0;
              if (o.best() <= entryTolerance) {
                o = null;
              }
            }
            if (o == null) {
              // Threshold 0, so that the bound uses the best reduced cost itself; only columns that
              // pay more than the round-off tolerance enter.
              o = priceExact(ReducedCosts.query(space, s, y, nu[s], settings.perRound(), 0.0, pool.active(s)));
            }
            allExact &= o.exact();
            outcomes.add(o);
          }
          if (allExact) {
            counters[C_EXACT_ROUNDS]++;
            double[] outside = new double[segCount];
            double lasdon = sol.objective();
            for (int s = 0; s < segCount; s++) {
              double ub = outcomes.get(s).upperBound();
              outside[s] = ub + nu[s];
              lasdon += demand[s] * Math.max(0.0, ub);
            }
            double lag = pool.lagrangianBound(lagrangian, y, outside);
            // The Lasdon-type bound holds only at the master's optimal duals.
            roundBound = alpha == 0 ? Math.min(lag, lasdon) : lag;
            ownBound = alpha == 0 ? lasdon : Double.POSITIVE_INFINITY;
            if (settings.smoothing() > 0 && lag < centerBound) {
              centerBound = lag;
              centerPi = y;
              centerMu = nu;
            }
          }
          found.clear();
          for (int s = 0; s < segCount; s++) {
            for (PricedVariant pv : outcomes.get(s).found()) {
              // At a smoothed point a column may price out positive yet not pay at the master's duals.
              double d = alpha == 0 ? pv.reducedCost() : ReducedCosts.of(space, pv.choices(), s, pi, mu[s]);
              if (d > entryTolerance) {
                found.add(column(s, pv.choices(), upper[s], iteration, d));
              }
            }
          }
          if (alpha > 0 && found.isEmpty()) {
            mispriced++;
            counters[C_MISPRICED]++;
            continue;
          }
          break;
        }
        bestBound = Math.min(bestBound, roundBound);
        double gap = SolveOutcome.gap(sol.objective(), bestBound);
        IterationRecord rec = new IterationRecord(iteration, sol.objective(), bestBound, gap,
            pool.size(), found.size(), allExact, elapsedMs());
        history.add(rec);
        listeners.forEach(l -> l.iteration(rec));
        boolean dualsProven = SolveOutcome.gap(sol.objective(), ownBound) <= settings.gapTolerance();
        if (dualsProven || (found.isEmpty() && allExact)) {
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
          pool.add(c);
        }
        sol = solveOrFail(master);
        if (settings.retireAfter() > 0) {
          pool.retireIdle(sol, settings.retireAfter());
        }
        double z = sol.objective();
        double b = bestBound;
        long t = elapsedMs();
        listeners.forEach(l -> l.columnsAdded(found, z, b, t));
      }
      SolveOutcome out = new SolveOutcome(status, reason, sol.objective(), bestBound,
          SolveOutcome.gap(sol.objective(), bestBound), iteration, pool.columns, sol.x(),
          sol.reducedCost(), sol.resourceDual(), sol.segmentDual(), history, elapsedMs());
      finishStats();
      listeners.forEach(l -> l.ended(out));
      return out;
    }
  }

  private static final int C_MASTER = 0;
  private static final int C_MASTER_NANOS = 1;
  private static final int C_EXACT_CALLS = 2;
  private static final int C_EXACT_NANOS = 3;
  private static final int C_HEUR_CALLS = 4;
  private static final int C_HEUR_NANOS = 5;
  private static final int C_EXACT_ROUNDS = 6;
  private static final int C_MISPRICED = 7;
  private static final int C_RETIRED = 8;
  private static final int C_REVIVED = 9;

  private void finishStats() {
    long[] c = counters;
    stats = new RunStats((int) c[C_MASTER], c[C_MASTER_NANOS], (int) c[C_EXACT_CALLS], c[C_EXACT_NANOS],
        (int) c[C_HEUR_CALLS], c[C_HEUR_NANOS], (int) c[C_EXACT_ROUNDS], (int) c[C_MISPRICED],
        (int) c[C_RETIRED], (int) c[C_REVIVED]);
  }

  private PricingOutcome priceExact(PricingQuery q) {
    long t = System.nanoTime();
    PricingOutcome o = exact.price(q);
    counters[C_EXACT_CALLS]++;
    counters[C_EXACT_NANOS] += System.nanoTime() - t;
    return o;
  }

  /** α·center + (1 − α)·current, or current itself when there is no centre or α is 0. */
  private static double[] mix(double alpha, double[] center, double[] current) {
    if (center == null || alpha == 0) {
      return current;
    }
    double[] y = new double[current.length];
    for (int i = 0; i < y.length; i++) {
      y[i] = Math.max(0.0, alpha * center[i] + (1 - alpha) * current[i]);
    }
    return y;
  }

  /**
   * The master's columns with what the loop needs beside the LP: per segment the keys pricing must
   * skip (the active columns), where each known variant sits, and the figures for the Lagrangian
   * bound. A retired column keeps its place (bounds 0, so x stays aligned with the columns) and
   * leaves the skip set; found again, it is revived instead of added twice.
   */
  private final class Pool {
    final RestrictedMaster master;
    final List<Column> columns = new ArrayList<>();
    final List<Set<VariantKey>> active = new ArrayList<>();
    final List<Map<VariantKey, Integer>> index = new ArrayList<>();
    int[] segment = new int[64];
    double[] margin = new double[64];
    double[][] use = new double[64][];
    double[] bound = new double[64];
    int[] idle = new int[64];

    Pool(RestrictedMaster master, int segments) {
      this.master = master;
      for (int s = 0; s < segments; s++) {
        active.add(new HashSet<>());
        index.add(new HashMap<>());
      }
    }

    int size() {
      return columns.size();
    }

    Set<VariantKey> active(int s) {
      return active.get(s);
    }

    /** Adds the column, or revives it when it was retired; a column already active is ignored. */
    void add(Column c) {
      VariantKey key = space.key(c.choices());
      Integer j = index.get(c.segment()).get(key);
      if (j != null) {
        if (active.get(c.segment()).add(key)) {
          master.setColumnBounds(j, 0, c.upper());
          bound[j] = c.upper();
          idle[j] = 0;
          counters[C_REVIVED]++;
        }
        return;
      }
      int n = columns.size();
      if (n == segment.length) {
        int cap = 2 * n;
        segment = Arrays.copyOf(segment, cap);
        margin = Arrays.copyOf(margin, cap);
        use = Arrays.copyOf(use, cap);
        bound = Arrays.copyOf(bound, cap);
        idle = Arrays.copyOf(idle, cap);
      }
      master.addColumn(c.segment(), c.margin(), c.use(), c.upper());
      columns.add(c);
      segment[n] = c.segment();
      margin[n] = c.margin();
      use[n] = c.use();
      bound[n] = c.upper();
      active.get(c.segment()).add(key);
      index.get(c.segment()).put(key, n);
    }

    double lagrangianBound(LagrangianBound lb, double[] y, double[] outside) {
      return lb.bound(y, segment, margin, use, bound, columns.size(), outside);
    }

    /**
     * Retires columns at zero that do not pay at the current duals and have sat at zero for
     * {@code after} rounds. The solution stays optimal without a re-solve: x is unchanged and
     * fewer columns only drop dual constraints.
     */
    void retireIdle(MasterSolution sol, int after) {
      double[] x = sol.x();
      double[] rc = sol.reducedCost();
      for (int j = 0; j < columns.size(); j++) {
        if (bound[j] == 0) {
          continue;
        }
        if (x[j] > 0) {
          idle[j] = 0;
        } else if (++idle[j] >= after && rc[j] < 0) {
          Column c = columns.get(j);
          master.setColumnBounds(j, 0, 0);
          bound[j] = 0;
          active.get(c.segment()).remove(space.key(c.choices()));
          counters[C_RETIRED]++;
        }
      }
    }
  }

  private Column column(int s, int[] choices, double upper, int iteration, double reducedCost) {
    int[] v = Arrays.copyOf(choices, choices.length);
    return new Column(s, v, space.margin(v, s), space.use(v), upper, iteration, reducedCost);
  }

  private MasterSolution solveOrFail(RestrictedMaster master) {
    long t = System.nanoTime();
    MasterSolution sol = master.solve();
    counters[C_MASTER]++;
    counters[C_MASTER_NANOS] += System.nanoTime() - t;
    if (!sol.isOptimal()) {
      // x = 0 is feasible and the columns are bounded, so anything else is a solver fault.
      throw new IllegalStateException("the master LP solve ended " + sol.status()
          + "; it is feasible and bounded by construction, so this is a solver fault");
    }
    return sol;
  }
}
