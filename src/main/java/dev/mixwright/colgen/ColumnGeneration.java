package dev.mixwright.colgen;

import dev.mixwright.master.MasterSolution;
import dev.mixwright.master.RestrictedMaster;
import dev.mixwright.pricing.Cancellation;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.pricing.PricingQuery;
import dev.mixwright.pricing.ReducedCosts;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

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
 * Bound for any resource prices y ≥ 0 (see {@link LagrangianLpBound}), used at every exact round and
 * the only one valid at smoothed duals:
 *   UB(y) = Σ_r y_r·capacity_r + Σ_s K_s(y),  K_s = continuous knapsack of segment s by m_j − a_j·y
 *
 * Segments that choose (sales-based LP, Gallego, Ratliff &amp; Shebalov 2015, Operations Research
 * 63(1):212–232): instead of the demand row, Σ_{j∈s} x_j + x_s0 = buyers_s (μ_s free) and per column
 * of s in the master its own row x_j − w_j·x_s0 ≤ 0 (β_j ≥ 0); x_s0 ≥ 0 has margin 0.
 *   Dual of the full LP: column j needs π·a_j + μ_s + β_j ≥ m_j; x_s0 needs μ_s − Σ_{j∈s} w_j β_j ≥ 0.
 *   Give every absent column β_j = 0. Then x_s0's dual row holds already (it involves the present
 *   rows only, and the master's duals satisfy it), and an absent column's holds iff
 *   d_j = m_j − π·a_j − μ_s ≤ 0. So pricing keeps its shape: weights m − π·a, constant −μ_s, every
 *   column of s in the master excluded (its own β prices it; it may keep d &gt; 0 legitimately).
 *   Bound: for any x feasible in the full LP, the relaxed rows have the signs of their duals
 *   (π·(b − A x) ≥ 0, β_j·(w_j x_s0 − x_j) ≥ 0, the buyers row is met), so
 *     Σ m x ≤ π·b + Σ_s μ_s·buyers_s + Σ_present (m_j − π·a_j − μ_s − β_j) x_j
 *             + Σ_s (Σ_present w_j β_j − μ_s) x_s0 + Σ_absent d_j x_j
 *   The first two terms are the master's dual objective = z_RM; the present columns' and x_s0's
 *   coefficients are ≤ 0 by the master's dual feasibility; and Σ_absent x_j ≤ buyers_s. Hence
 *     z_LP ≤ z_RM + Σ_s buyers_s · max(0, d̄_s),   the Lasdon-type bound with κ_s = buyers_s.
 *   The Lagrangian bound stays valid unchanged: every feasible x of a choosing segment has
 *   Σ_j x_j ≤ buyers_s, which is the knapsack with demand = buyers and each item bounded by buyers
 *   (the Segment's maxShare 1), a relaxation of the segment's choice rows. It is weak for such
 *   segments, which is why smoothing earns little with them; it is never wrong. Choosing columns
 *   are never retired (their row carries β), see {@link MasterPool}.
 *   Entering columns of a choosing segment are chosen per {@link ChoiceEntry}; by default every
 *   paying column of a batch that doubles while it comes back full (the best offer set at fixed
 *   prices is revenue-ordered, so it is the top of the max-d list and may run to thousands).
 *   {@link RestrictedMaster} solves the SBLP over the master's columns by Dantzig–Wolfe over offer
 *   sets rather than row by row, and returns duals (π, μ, β) with exactly the properties used
 *   above (its class comment), so nothing here depends on how it is solved.
 *   The master may stop its inner rounds with some slack ({@link #masterSlack}); its duals are then
 *   still feasible for the SBLP over its columns, with objective z_D ≥ z_RM (its dualObjective), and
 *   the argument above holds with z_D in place of z_RM, which is what the bound uses. A round that
 *   finds nothing at such duals solves the master to the end and prices again.
 * </pre>
 *
 * <p>Accelerations, each a switch of {@link SolveSettings}: k columns per segment per round; a
 * heuristic pricer tried first; Wentges smoothing with the mispricing safeguard ({@link
 * DualSmoothing}): when no column found at the smoothed point pays at the master's duals, the round
 * prices again nearer to the master's own duals; and retirement of columns idle for some rounds
 * ({@link MasterPool}). The master re-solves warm from its last basis.
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
  private final double[] capacity;
  private final double[] demand;
  private final double[] upper;
  private final boolean[] chooses;
  private ChoiceEntry choiceEntry = ChoiceEntry.DEFAULT;
  /** Passes of {@link #rateSearch} per choosing segment and round. */
  private static final int RATE_PASSES = 3;
  /** Per segment, the columns the last round's rate search proposed (empty for fixed segments). */
  private final List<List<PricedVariant>> rateFound = new ArrayList<>();
  /** Per segment, the columns asked of the pricer this round (grows for choosing segments, see {@link ChoiceEntry#GROWING}). */
  private int[] batch;
  private final LagrangianLpBound lagrangian;
  /**
   * A column must pay more than this to enter; tiny against any catalog's margins, large against
   * GLOP's round-off.
   */
  private final double entryTolerance;
  /** Differences below this are round-off for this catalog; see {@link ValueBound#floorOf}. */
  private final double gapFloor;
  private LoopCounters counters = new LoopCounters();
  /** Rounds ended so far, for the stop criteria asked inside a round. */
  private volatile int roundsDone;
  /**
   * The stop criteria (time limit, signal) asked from inside each pricing search, so that a limit
   * ends a round over a huge space within a few thousand search nodes and not at the round's end.
   * Asked at the rounds already ended, so an iteration limit never cuts the round it allows.
   */
  private final Cancellation cancel = Cancellation.signalOr(this::limitReached);
  private RunStats stats;
  private int priorIterations;
  private double priorBound = Double.POSITIVE_INFINITY;

  /**
   * @param exact a pricer whose outcomes carry a valid upper bound (the last round relies on it)
   * @param heuristic optional faster pricer tried first when {@code settings.heuristicFirst()}; may be null
   * @param stop extra stopping criteria, {@link StopCriterion#never()} for none (the time and
   *     iteration limits of the settings are added)
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
    int segCount = space.segmentCount();
    this.capacity = new double[space.resourceCount()];
    for (int r = 0; r < capacity.length; r++) {
      capacity[r] = space.catalog().resources().get(r).capacity();
    }
    this.demand = new double[segCount];
    this.upper = new double[segCount];
    this.chooses = new boolean[segCount];
    for (int s = 0; s < segCount; s++) {
      chooses[s] = space.chooses(s);
      demand[s] = space.catalog().segments().get(s).demand();
      upper[s] = space.catalog().segments().get(s).columnBound();
    }
    double marginScale = 1.0;
    for (int f = 0; f < space.totalChoices(); f++) {
      marginScale = Math.max(marginScale, Math.abs(space.choiceMargin(f)));
    }
    this.entryTolerance = 1e-9 * marginScale * Math.max(1, space.groupCount());
    this.lagrangian = new LagrangianLpBound(capacity, demand);
    this.gapFloor = ValueBound.floorOf(space);
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

  /** How the columns of choosing segments enter (default {@link ChoiceEntry#DEFAULT}). */
  public ColumnGeneration withChoiceEntry(ChoiceEntry entry) {
    this.choiceEntry = entry;
    return this;
  }

  private long elapsedMs() {
    return (System.nanoTime() - startNanos) / 1_000_000;
  }

  /**
   * Whether a stop criterion (the time limit, a signal, the caller's own) fires now, at the rounds
   * ended so far: for work before the loop (the survey of what is sellable) and inside its rounds.
   */
  public boolean limitReached() {
    return stop.fired(Progress.at(roundsDone, elapsedMs()));
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
    counters = new LoopCounters();
    roundsDone = priorIterations;
    batch = new int[space.segmentCount()];
    for (int s = 0; s < batch.length; s++) {
      batch[s] = chooses[s] ? choiceEntry.asked(settings.perRound()) : settings.perRound();
    }
    try (RestrictedMaster master = new RestrictedMaster(capacity, demand, chooses)) {
      MasterPool pool = new MasterPool(space, master, counters);
      int warmCount = seed(pool, warmStart);
      listeners.forEach(l -> l.started(pool.size()));
      if (pool.size() == 0) {
        return ended(SolveOutcome.infeasible("no segment accepts any buildable variant", elapsedMs()));
      }
      return loop(master, pool, warmCount);
    }
  }

  /**
   * Adds the warm start, then per segment the warm start leaves empty the best column at zero duals,
   * whatever its sign, so every segment that accepts a variant is represented from the first solve.
   * Returns how many columns the warm start gave.
   */
  private int seed(MasterPool pool, List<Column> warmStart) {
    warmStart.forEach(pool::add);
    int warmCount = pool.size();
    double[] zero = new double[space.resourceCount()];
    for (int s = 0; s < space.segmentCount(); s++) {
      if (!pool.active(s).isEmpty()) {
        continue;
      }
      PricingOutcome o = priceExact(ReducedCosts.query(space, s, zero, 0, 1, Double.NEGATIVE_INFINITY, pool.active(s)));
      for (PricedVariant pv : o.found()) {
        pool.add(column(s, pv.choices(), 0, pv.reducedCost()));
      }
    }
    return warmCount;
  }

  /** Master and pricing in turn until the bound is proven or a criterion stops the run. */
  private SolveOutcome loop(RestrictedMaster master, MasterPool pool, int warmCount) {
    MasterSolution sol = solveOrFail(master);
    announce(List.copyOf(pool.columns().subList(warmCount, pool.size())), sol, priorBound);
    DualSmoothing smoothing = new DualSmoothing(settings.smoothing());
    List<IterationRecord> history = new ArrayList<>();
    double bestBound = priorBound;
    int iteration = priorIterations;
    while (true) {
      iteration++;
      Round round = price(pool, sol, smoothing, iteration);
      if (round.found().isEmpty() && sol.dualObjective() > sol.objective()) {
        // nothing pays at the duals of a master solved with slack: its shortfall may be all that
        // keeps the bound above the objective, so solve it to the end and price again
        sol = solveOrFail(master, 0.0);
        round = price(pool, sol, smoothing, iteration);
      }
      bestBound = Math.min(bestBound, round.bound().best());
      IterationRecord rec = new IterationRecord(iteration, sol.objective(), bestBound,
          ValueBound.gap(sol.objective(), bestBound, gapFloor), pool.size(), round.found().size(), round.exact(),
          elapsedMs());
      history.add(rec);
      listeners.forEach(l -> l.iteration(rec));
      roundsDone = iteration;
      Optional<Ending> end = verdict(sol, round, rec);
      if (end.isPresent()) {
        return ended(new SolveOutcome(end.get().status(), end.get().reason(),
            new ValueBound(sol.objective(), bestBound, gapFloor), iteration,
            new MasterColumns(pool.columns(), sol.x(), sol.reducedCost(), sol.columnDual(), sol.stayingOut()),
            new Duals(sol.resourceDual(), sol.segmentDual()), history, elapsedMs()));
      }
      round.found().forEach(pool::add);
      sol = solveOrFail(master, masterSlack(sol.objective(), bestBound));
      if (settings.retireAfter() > 0) {
        pool.retireIdle(sol, settings.retireAfter());
      }
      announce(round.found(), sol, bestBound);
    }
  }

  /** How a run ends; {@code reason} is empty when it ends optimal. */
  private record Ending(RunStatus status, String reason) {}

  /** One round's pricing: the columns that enter, whether every segment was priced exactly, the bound. */
  private record Round(List<Column> found, boolean exact, RoundBound bound) {}

  private Optional<Ending> verdict(MasterSolution sol, Round round, IterationRecord rec) {
    boolean dualsProven = new ValueBound(sol.objective(), round.bound().lasdon(), gapFloor)
        .within(settings.gapTolerance());
    // Optimal only when the bound itself meets the objective: an exact round that finds nothing to
    // enter proves no more than its bound (columns paying less than the entry tolerance stay out).
    if (dualsProven || (round.found().isEmpty() && round.exact()
        && new ValueBound(sol.objective(), rec.bound(), gapFloor).within(settings.gapTolerance()))) {
      return Optional.of(new Ending(RunStatus.OPTIMAL, ""));
    }
    if (round.found().isEmpty() && round.exact()) {
      return Optional.of(new Ending(RunStatus.STOPPED, "no column pays enough to enter, yet the proven bound "
          + rec.bound() + " stays " + Math.round(rec.gap() * 1000) / 10.0 + " % above the objective; the LP"
          + " optimum is not proven"));
    }
    Optional<Ending> stopped = stop.check(rec).map(why -> new Ending(RunStatus.STOPPED, why));
    if (stopped.isEmpty() && round.found().isEmpty()) {
      // Only possible with a pricer that proves nothing and finds nothing: give up honestly.
      return Optional.of(new Ending(RunStatus.STOPPED, "pricing found no column and could not prove the bound"));
    }
    return stopped;
  }

  /**
   * Prices every segment at the (smoothed) duals of {@code sol}; when smoothing found nothing that
   * pays at the master's own duals, prices again nearer to them. A bound proven by an earlier,
   * mispriced attempt stays valid (the Lagrangian bound holds at any prices), so it is kept when the
   * last attempt proves none.
   */
  private Round price(MasterPool pool, MasterSolution sol, DualSmoothing smoothing, int iteration) {
    double[] pi = sol.resourceDual();
    double[] mu = sol.segmentDual();
    RoundBound bound = RoundBound.NONE;
    for (int mispriced = 0; ; mispriced++) {
      double alpha = smoothing.alpha(mispriced);
      double[] y = smoothing.resourcePoint(alpha, pi);
      double[] nu = smoothing.segmentPoint(alpha, mu);
      List<PricingOutcome> outcomes = priceSegments(pool, y, nu);
      boolean allExact = outcomes.stream().allMatch(PricingOutcome::exact);
      if (allExact) {
        counters.exactRound();
        bound = bound(pool, sol, outcomes, y, nu, alpha);
        smoothing.offer(bound.lagrangian(), y, nu);
      }
      List<Column> found = entering(pool, outcomes, alpha, pi, mu, iteration);
      if (alpha > 0 && found.isEmpty() && !cancel.requested()) {
        counters.mispriced();
        continue;
      }
      return new Round(found, allExact, bound);
    }
  }

  /** One pricing call per segment at (y, ν): the heuristic first when asked, exact where it finds nothing. */
  private List<PricingOutcome> priceSegments(MasterPool pool, double[] y, double[] nu) {
    List<PricingOutcome> outcomes = new ArrayList<>();
    rateFound.clear();
    for (int s = 0; s < space.segmentCount(); s++) {
      // Threshold 0, so that the bound uses the best reduced cost itself; only columns that pay more
      // than the round-off tolerance enter.
      int k = batch[s];
      PricingQuery q = ReducedCosts.query(space, s, y, nu[s], k, 0.0, pool.active(s));
      PricingOutcome o = null;
      if (settings.heuristicFirst() && heuristic != null) {
        long h0 = System.nanoTime();
        o = heuristic.price(q.until(cancel));
        counters.heuristicPriced(System.nanoTime() - h0);
        if (o.best() <= entryTolerance) {
          o = null;
        }
      }
      o = o != null ? o : priceExact(q);
      outcomes.add(o);
      if (chooses[s] && choiceEntry.grows() && o.found().size() >= k
          && o.found().get(k - 1).reducedCost() > entryTolerance) {
        batch[s] = choiceEntry.grown(k, settings.perRound());
      }
      rateFound.add(chooses[s] && choiceEntry.searchesRate() && o.best() > entryTolerance
          ? rateSearch(pool, s, y, nu[s], q.weight(), o.best())
          : List.of());
    }
    return outcomes;
  }

  /**
   * Columns of choosing segment s with a high rate w·d, found by pricing u(v) + d(v)/D for a scale D
   * (both terms additive over the groups, so the pricers answer it as they are). Why: log(w·d) =
   * u − stayOut + log d, and its first-order change is δu + δd/d, so at the column of best rate
   * D = its own d; starting from D = the best d, each pass sets D to the d of the best-rate column
   * found, a fixed-point iteration that stops when D settles (at most {@link #RATE_PASSES} passes).
   * Plain max-d pricing stays the exact test: this only proposes columns, each with its true d at
   * (y, ν), and only those that pay enter. O(passes) pricing calls.
   */
  private List<PricedVariant> rateSearch(MasterPool pool, int s, double[] y, double nu, double[] dWeight, double bestD) {
    double[] util = space.choiceUtilities(s);
    List<PricedVariant> out = new ArrayList<>();
    java.util.Set<dev.mixwright.space.VariantKey> seen = new java.util.HashSet<>();
    double scale = bestD;
    for (int pass = 0; pass < RATE_PASSES; pass++) {
      double[] w = new double[dWeight.length];
      for (int f = 0; f < w.length; f++) {
        w[f] = dWeight[f] == Double.NEGATIVE_INFINITY ? Double.NEGATIVE_INFINITY : util[f] + dWeight[f] / scale;
      }
      PricingOutcome o = priceExact(new PricingQuery(s, w, -nu / scale, choiceEntry.asked(settings.perRound()),
          Double.NEGATIVE_INFINITY, pool.active(s)));
      double bestRate = 0;
      double next = scale;
      for (PricedVariant pv : o.found()) {
        double d = ReducedCosts.of(space, pv.choices(), s, y, nu);
        if (d > entryTolerance && seen.add(space.key(pv.choices()))) {
          out.add(new PricedVariant(pv.choices(), d));
          double rate = MasterPool.attraction(space, pv.choices(), s) * d;
          if (rate > bestRate) {
            bestRate = rate;
            next = d;
          }
        }
      }
      if (Math.abs(next - scale) <= 1e-3 * scale) {
        break;
      }
      scale = next;
    }
    return out;
  }


  /** The bounds an exact round at (y, ν) proves; see {@link RoundBound}. */
  private RoundBound bound(MasterPool pool, MasterSolution sol, List<PricingOutcome> outcomes, double[] y,
      double[] nu, double alpha) {
    double[] outside = new double[demand.length];
    double lasdon = sol.dualObjective();
    for (int s = 0; s < demand.length; s++) {
      double ub = outcomes.get(s).upperBound();
      outside[s] = ub + nu[s];
      lasdon += demand[s] * Math.max(0.0, ub);
    }
    return RoundBound.at(alpha, lasdon, pool.lagrangianBound(lagrangian, y, outside));
  }

  /** The columns found that pay at the master's own duals (π, μ). */
  private List<Column> entering(MasterPool pool, List<PricingOutcome> outcomes, double alpha, double[] pi, double[] mu,
      int iteration) {
    List<Column> found = new ArrayList<>();
    for (int s = 0; s < outcomes.size(); s++) {
      List<Column> paying = new ArrayList<>();
      List<PricedVariant> candidates = new ArrayList<>(outcomes.get(s).found());
      if (s < rateFound.size()) {
        java.util.Set<dev.mixwright.space.VariantKey> seen = new java.util.HashSet<>();
        candidates.forEach(pv -> seen.add(space.key(pv.choices())));
        for (PricedVariant pv : rateFound.get(s)) {
          if (seen.add(space.key(pv.choices()))) {
            candidates.add(pv);
          }
        }
      }
      for (PricedVariant pv : candidates) {
        // At a smoothed point a column may price out positive yet not pay at the master's duals.
        double d = alpha == 0 ? pv.reducedCost() : ReducedCosts.of(space, pv.choices(), s, pi, mu[s]);
        if (d > entryTolerance) {
          paying.add(column(s, pv.choices(), iteration, d));
        }
      }
      found.addAll(chooses[s] ? choosingEntering(pool, paying, s, pi, mu[s]) : paying);
    }
    return found;
  }

  /** The paying columns of choosing segment s that enter, per {@link ChoiceEntry}. */
  private List<Column> choosingEntering(MasterPool pool, List<Column> paying, int s, double[] pi, double mu) {
    if (choiceEntry.grows()) {
      return offered(pool, paying, s, pi, mu);
    }
    int keep = choiceEntry.entering(settings.perRound());
    if (choiceEntry.byRate()) {
      double[] rate = new double[paying.size()];
      Integer[] order = new Integer[paying.size()];
      for (int i = 0; i < order.length; i++) {
        Column c = paying.get(i);
        rate[i] = MasterPool.attraction(space, c.choices(), s) * c.reducedCostAtEntry();
        order[i] = i;
      }
      Arrays.sort(order, (p, q) -> Double.compare(rate[q], rate[p]));
      List<Column> out = new ArrayList<>();
      for (int i = 0; i < Math.min(keep, order.length); i++) {
        out.add(paying.get(order[i]));
      }
      return out;
    }
    return paying.subList(0, Math.min(keep, paying.size()));
  }

  /**
   * The paying columns that the best offer set at the master's prices π would hold if they all
   * entered: r = d + μ above R* of the segment's columns and these ({@link MasterPool#bestOfferValue};
   * revenue-ordered, Talluri &amp; van Ryzin 2004). The others pay at μ but would sell nothing at π, so
   * they wait for a later round, where pricing finds them again if they still pay. Never empty when
   * some column pays: the one of largest r lies above R* (were all r ≤ R*, the best set would hold
   * the master's columns only, whose value R* ≤ μ is below that r).
   */
  private List<Column> offered(MasterPool pool, List<Column> paying, int s, double[] pi, double mu) {
    double[] r = new double[paying.size()];
    double[] w = new double[paying.size()];
    for (int i = 0; i < r.length; i++) {
      r[i] = paying.get(i).reducedCostAtEntry() + mu;
      w[i] = MasterPool.attraction(space, paying.get(i).choices(), s);
    }
    double best = pool.bestOfferValue(s, pi, r, w);
    List<Column> out = new ArrayList<>();
    for (int i = 0; i < r.length; i++) {
      if (r[i] > best) {
        out.add(paying.get(i));
      }
    }
    return out.isEmpty() ? paying : out;
  }

  private void announce(List<Column> columns, MasterSolution sol, double bound) {
    double z = sol.objective();
    long t = elapsedMs();
    listeners.forEach(l -> l.columnsAdded(columns, z, bound, t));
  }

  private SolveOutcome ended(SolveOutcome out) {
    stats = counters.snapshot();
    listeners.forEach(l -> l.ended(out));
    return out;
  }

  private PricingOutcome priceExact(PricingQuery q) {
    long t = System.nanoTime();
    PricingOutcome o = exact.price(q.until(cancel));
    counters.exactPriced(System.nanoTime() - t);
    return o;
  }

  private Column column(int s, int[] choices, int iteration, double reducedCost) {
    int[] v = Arrays.copyOf(choices, choices.length);
    return new Column(s, v, space.margin(v, s), space.use(v), upper[s], iteration, reducedCost);
  }

  /**
   * How much the master's choosing part may leave unpaid ({@link RestrictedMaster#solve(double)}): a
   * share {@link #MASTER_SLACK} of the gap proven so far, 0 before any bound. Its inner
   * Dantzig–Wolfe rounds tail off (measured: 50 to 80 per solve at 10^5 columns, most of the run),
   * and early in the loop their last digits buy nothing the next round's pricing would not redo; the
   * shortfall is added to the bound, so the loop's argument and its stop on the gap are unchanged.
   */
  private static double masterSlack(double objective, double bound) {
    return Double.isFinite(bound) ? Math.max(0.0, MASTER_SLACK * (bound - objective)) : 0.0;
  }

  /** Share of the proven gap a master solve may leave unpaid; see {@link #masterSlack}. */
  static final double MASTER_SLACK = 0.02;

  private MasterSolution solveOrFail(RestrictedMaster master) {
    return solveOrFail(master, 0.0);
  }

  private MasterSolution solveOrFail(RestrictedMaster master, double slack) {
    long t = System.nanoTime();
    MasterSolution sol = master.solve(slack);
    counters.masterSolved(System.nanoTime() - t);
    if (!sol.isOptimal()) {
      // x = 0 is feasible and the columns are bounded, so anything else is a solver fault.
      throw new IllegalStateException("the master LP solve ended " + sol.status()
          + "; it is feasible and bounded by construction, so this is a solver fault");
    }
    return sol;
  }
}
