package dev.mixwright.portfolio;

import dev.mixwright.colgen.Column;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.ValueBound;
import dev.mixwright.master.MipSolution;
import dev.mixwright.master.MipStatus;
import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioLpSolution;
import dev.mixwright.master.PortfolioMip;
import dev.mixwright.master.PortfolioShape;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * One range for a set of scenarios: the two-stage stochastic form of the integer stage (Birge &amp;
 * Louveaux, "Introduction to Stochastic Programming", two-stage recourse model). The introductions
 * y_v are decided once and paid once; the sales x^k are decided per scenario k with its own figures:
 *
 * <pre>
 * (S)  max  Σ_k p_k Σ_{v,s} m^k_vs x^k_vs − F Σ_v y_v − tooling         (mean)
 *      or   t − F Σ_v y_v − tooling,  t ≤ Σ_{v,s} m^k_vs x^k_vs ∀k        (worst case, epigraph)
 *      s.t. per k: resources and demands of scenario k, x^k_vs ≤ u^k_s y_v, Σ_s x^k_vs ≥ L^k y_v;
 *           Σ_v y_v ≤ K,  y binary
 * </pre>
 *
 * The masters stack the scenarios' rows ({@link PortfolioLp#addScenarioVariant}). For the relaxation
 * and its bound a variant's value sums over the scenarios: at prices π^k, μ^k ≥ 0 and scenario weights
 * ω (ω = p for the mean; for the worst case any ω ≥ 0 with Σ ω = 1, since t ≤ Σ_k ω_k margin_k),
 * ψ(v) = Σ_k g_k(ω_k m^k(v) − π^k a^k(v) − μ^k) − F, and value(S) ≤ Σ_k (π^k b^k + μ^k D^k) + Σ_{v∈S} ψ(v),
 * so {@link LagrangianPortfolioBound} holds for the whole space with the constant summed over the
 * scenarios; the exact {@link VariantPricer} over the scenarios prices it. Steps, as in
 * {@link IntegerStage}: column generation on the relaxed stacked master (the worst case takes ω from
 * the epigraph rows' duals), an incumbent (each scenario's own best range evaluated in every scenario,
 * then the MIP over the pool), the quick proof (every variant that could be part of a better range
 * listed by the pricer, joined to the pool, the MIP over it solved to optimality). Branch-and-price is
 * left to the single-scenario stage: when the quick proof does not settle it, the range is heuristic
 * with the Lagrangian bound. Cost: per round one stacked GLOP solve (n scenarios × the pool's blocks)
 * and one pricing call of n times the single-scenario work.
 */
public final class ScenarioStage {

  /** What the range maximises across the scenarios. */
  public enum Aim {
    MEAN,
    WORST;

    public boolean isWorst() {
      return this == WORST;
    }
  }

  private final List<VariantSpace> spaces;
  private final List<PortfolioTerms> terms;
  private final double[] weight;
  private final Aim aim;
  private final PortfolioSettings settings;
  private final int scenarios;
  private final int resourceCount;
  private final int segmentCount;
  private final List<Pool> pools = new ArrayList<>();
  private StopCriterion stop = StopCriterion.never();
  private StageClock clock;

  /**
   * @param spaces one per scenario, of one catalog's structure (groups, rules, segments, the range on
   *     sale today) with the scenario's figures
   * @param weights normalised, aligned with {@code spaces}
   */
  public ScenarioStage(List<VariantSpace> spaces, double[] weights, Aim aim, PortfolioSettings settings) {
    if (spaces.isEmpty() || spaces.size() != weights.length) {
      throw new IllegalArgumentException("one weight per scenario, and at least one scenario");
    }
    this.spaces = List.copyOf(spaces);
    this.weight = weights.clone();
    this.aim = aim;
    this.settings = settings;
    this.scenarios = spaces.size();
    this.resourceCount = spaces.get(0).resourceCount();
    this.segmentCount = spaces.get(0).segmentCount();
    List<PortfolioTerms> t = new ArrayList<>();
    for (VariantSpace s : spaces) {
      t.add(PortfolioTerms.of(s));
    }
    this.terms = List.copyOf(t);
    for (int k = 0; k < scenarios; k++) {
      pools.add(new Pool(spaces.get(k), terms.get(k)));
    }
  }

  public ScenarioStage stopWhen(StopCriterion criterion) {
    this.stop = criterion;
    return this;
  }

  /** The range chosen, what it earns in each scenario, and what proves it. */
  public record Outcome(PortfolioStatus status, String reason, ValueBound result, List<int[]> range,
      double[] scenarioValue, List<List<OfferedVariant>> plans, double introductionCosts, double toolingCosts,
      double relaxationObjective, int rounds, boolean converged, double survivorThreshold, int survivorsAdded,
      boolean survivorsComplete, int poolSize, int mipSolves, long elapsedMs, List<OfferedVariant> mean,
      RangeChange change) {

    public double value() {
      return result.value();
    }

    public double bound() {
      return result.bound();
    }

    public double gap() {
      return result.gap();
    }
  }

  /** The objective of a range from its value in each scenario. */
  double objective(double[] perScenario) {
    if (aim.isWorst()) {
      return Arrays.stream(perScenario).min().orElse(0);
    }
    double v = 0;
    for (int k = 0; k < scenarios; k++) {
      v += weight[k] * perScenario[k];
    }
    return v;
  }

  /** The scenarios' plans of one range; null when some scenario cannot meet its lots. */
  private record Evaluated(int[] members, Plan[] plans, double[] values, double objective) {}

  private Evaluated evaluate(int[] chosen) {
    int[] members = withPinned(chosen);
    Plan[] plans = new Plan[scenarios];
    double[] values = new double[scenarios];
    for (int k = 0; k < scenarios; k++) {
      plans[k] = FixedPortfolio.solve(pools.get(k), terms.get(k), members);
      if (plans[k] == null) {
        return null;
      }
      values[k] = plans[k].value();
    }
    return new Evaluated(members.clone(), plans, values, objective(values));
  }

  /** The range with today's pinned variants in it (they are never dropped), each once, in pool order. */
  private int[] withPinned(int[] chosen) {
    return java.util.stream.IntStream.concat(Arrays.stream(chosen), Arrays.stream(pools.get(0).pinned())).distinct()
        .sorted().toArray();
  }

  /** −Σ disc over today's unpinned variants: what every range's value holds besides its own terms. */
  private double currentConstant() {
    return pools.get(0).current().constant();
  }

  private boolean add(int[] v) {
    boolean added = false;
    for (Pool p : pools) {
      added = p.add(v);
    }
    return added;
  }

  /** The pool index of v (added to every scenario's pool when new), −1 when no segment takes it. */
  private int indexOf(int[] v) {
    add(v);
    return pools.get(0).indexOrAdd(v);
  }

  private int variantCap() {
    int cap = PortfolioTerms.UNLIMITED;
    for (PortfolioTerms t : terms) {
      cap = Math.min(cap, t.variantCap());
    }
    return cap;
  }

  /**
   * Chooses the range. {@code lps}: each scenario's LP stage (its columns seed the pool, its duals the
   * first prices); {@code alone}: each scenario's own best range (candidates for the incumbent), or
   * empty lists when unknown.
   */
  public Outcome run(List<SolveOutcome> lps, List<List<int[]>> alone) {
    double[] none = new double[scenarios];
    Arrays.fill(none, Double.POSITIVE_INFINITY);
    return run(lps, alone, none);
  }

  /**
   * What the stage takes from a scenario's LP stage: its columns' choices (they seed the pool) and
   * its shadow prices, π by resource and μ by segment (the first prices; both null when the LP had
   * none, as when nothing can be sold). Small and serialisable, so that a scenario solved on another
   * machine hands in no more than this.
   */
  public record Start(List<int[]> columns, double[] resourcePrices, double[] segmentPrices)
      implements java.io.Serializable {
    private static final long serialVersionUID = 1L;

    public Start {
      columns = List.copyOf(columns);
    }

    public static Start of(SolveOutcome lp) {
      if (lp.status().isInfeasible()) {
        return new Start(List.of(), null, null);
      }
      List<int[]> cols = lp.master().columns().stream().map(Column::choices).toList();
      boolean priced = lp.duals() != null && lp.duals().known();
      return new Start(cols, priced ? lp.duals().resource() : null, priced ? lp.duals().segment() : null);
    }
  }

  /**
   * As {@link #run(List, List)}, with {@code aloneBounds}: per scenario a bound on its own best range
   * (+∞ for none). No range earns more in scenario k than the best range for k alone, so the
   * wait-and-see value Σ_k p_k aloneBound_k (the worst case: min_k aloneBound_k) bounds the range
   * across the set too (Birge &amp; Louveaux: the wait-and-see solution is worth at least the
   * recourse problem's optimum; recalled from memory).
   */
  public Outcome run(List<SolveOutcome> lps, List<List<int[]>> alone, double[] aloneBounds) {
    return choose(lps.stream().map(Start::of).toList(), alone, aloneBounds);
  }

  /** As {@link #run(List, List, double[])}, from what each scenario's LP stage hands in. */
  public Outcome choose(List<Start> lps, List<List<int[]>> alone, double[] aloneBounds) {
    clock = new StageClock(settings.timeLimitMs(), stop);
    // today's variants join first, so the pricer (which skips the pool and charges F) prices new
    // variants only, and every bound sees a current one with its own fixed cost (CurrentRange)
    CurrentRange today = pools.get(0).current();
    for (int i = 0; i < today.size(); i++) {
      add(today.variant(i));
    }
    seed(lps, alone);
    if (evaluate(new int[0]) == null) {
      throw new IllegalArgumentException("the variants of today's range marked keep cannot meet the minimum lot in"
          + " every scenario, so no range can");
    }
    int cap = variantCap();
    if (pools.get(0).size() == 0 || cap == 0) {
      Evaluated none = evaluate(new int[0]);
      return outcome(PortfolioStatus.PROVEN, "", none, none.objective(), null, Double.NaN, 0, true);
    }
    VariantPricer pricer = new VariantPricer(spaces, terms, Long.MAX_VALUE).stopWhen(clock.signalFlag());
    double[][] start = startingPrices(lps);
    Relaxed rx = relax(pricer, start[0], start[1], weight.clone(), cap);

    // incumbent: the best of each scenario's own range, then the MIP over the pool from it
    Evaluated inc = bestOwnRange(alone);
    MipRun first = mip(inc, clock.msLeft() == 0 ? 0 : Math.max(1, clock.msLeft() / 2));
    if (first.best() != null && first.best().objective() > inc.objective()) {
      inc = first.best();
    }
    Proof p = quickProof(pricer, rx, inc, Math.min(rx.best().value(), objective(aloneBounds)));
    boolean closed = new ValueBound(p.incumbent().objective(), p.bound(), terms.get(0).gapFloor())
        .within(settings.gap());
    return closed
        ? outcome(PortfolioStatus.PROVEN, "", p.incumbent(), p.bound(), rx, p.theta(), p.added(), p.complete())
        : outcome(PortfolioStatus.HEURISTIC, p.reason() + " (branch-and-price runs for one scenario only)",
            p.incumbent(), p.bound(), rx, p.theta(), p.added(), p.complete());
  }

  /** The pools start with every scenario's LP columns and each scenario's own best range. */
  private void seed(List<Start> lps, List<List<int[]>> alone) {
    for (Start lp : lps) {
      lp.columns().forEach(this::add);
    }
    for (List<int[]> range : alone) {
      range.forEach(this::add);
    }
  }

  /** The LP stages' shadow prices, stacked by scenario and scaled to each scenario's weight: {π, μ}. */
  private double[][] startingPrices(List<Start> lps) {
    double[] pi0 = new double[scenarios * resourceCount];
    double[] mu0 = new double[scenarios * segmentCount];
    for (int k = 0; k < lps.size(); k++) {
      Start lp = lps.get(k);
      if (lp.resourcePrices() != null) {
        System.arraycopy(lp.resourcePrices(), 0, pi0, k * resourceCount, resourceCount);
        for (int s = 0; s < segmentCount; s++) {
          // the LP stage's margins are unweighted: scale its prices to the scenario's weight
          mu0[k * segmentCount + s] = Math.max(0.0, lp.segmentPrices()[s]) * weight[k];
        }
        for (int r = 0; r < resourceCount; r++) {
          pi0[k * resourceCount + r] *= weight[k];
        }
      }
    }
    return new double[][] {pi0, mu0};
  }

  /** The best across the set of the scenarios' own best ranges (the empty range when none does better). */
  private Evaluated bestOwnRange(List<List<int[]>> alone) {
    Evaluated inc = evaluate(new int[0]);
    for (List<int[]> range : alone) {
      int[] members = range.stream().mapToInt(this::indexOf).filter(i -> i >= 0).toArray();
      Evaluated e = evaluate(members);
      if (e != null && e.objective() > inc.objective()) {
        inc = e;
      }
    }
    return inc;
  }

  /**
   * The quick proof: every variant whose ψ at the relaxation's prices could make a range better than the
   * incumbent is listed into the pool and the MIP over the pool solved again; when it is optimal, its
   * bound holds for the whole space. {@code reason} says why it did not prove, when it did not.
   */
  private record Proof(Evaluated incumbent, double bound, double theta, int added, boolean complete, String reason) {}

  private Proof quickProof(VariantPricer pricer, Relaxed rx, Evaluated inc, double bound) {
    LagrangianPortfolioBound b = rx.best();
    if (!b.isFinite() || !settings.engine().provesContinuous() || clock.signalled().isPresent()) {
      return new Proof(inc, bound, Double.NaN, 0, false, clock.signalled().orElse(b.isFinite()
          ? "the MIP solver proves no bound for continuous sales" : "the relaxation found no finite bound"));
    }
    PortfolioTerms t0 = terms.get(0);
    double theta = inc.objective() - b.valueAtLambda() + b.lambda();
    double slack = 1e-7 * (1 + Math.abs(inc.objective()));
    PricingOutcome out = pricer.price(new VariantQuery(b.resourcePrice(), b.segmentPrice(),
        t0.introductionCost(), t0.hasTooling() ? t0.choiceCost() : null, theta - slack,
        settings.survivorLimit() + 1, pools.get(0).keys(), clock.phase(0.2).deadlineNanos(), rx.weights()));
    boolean complete = out.exact() && out.found().size() <= settings.survivorLimit();
    if (!complete) {
      return new Proof(inc, bound, theta, 0, false, out.exact()
          ? "too many variants could be part of a better range to prove it over the pool"
          : "the listing of the variants that could be part of a better range was cut short");
    }
    int before = pools.get(0).size();
    for (PricedVariant f : out.found()) {
      add(f.choices());
    }
    int added = pools.get(0).size() - before;
    MipRun again = mip(inc, clock.msLeft());
    if (again.best() != null && again.best().objective() > inc.objective()) {
      inc = again.best();
    }
    if (again.status() == MipStatus.OPTIMAL) {
      // every range better than the incumbent lies in the pool, where the MIP bounds it; the status
      // follows from the gap, so a MIP that disagrees with the exact evaluation (round-off at a lot)
      // cannot claim a proof
      return new Proof(inc, Math.min(bound, Math.max(inc.objective(), again.bound())), theta, added, true, "");
    }
    return new Proof(inc, again.status().hasSolution() ? Math.min(bound, again.bound()) : bound, theta, added, true,
        "the MIP over the pool with every variant that could be part of a better range was not solved to"
            + " optimality in the time limit");
  }

  private Outcome outcome(PortfolioStatus status, String reason, Evaluated e, double bound, Relaxed rx,
      double theta, int added, boolean complete) {
    List<int[]> range = new ArrayList<>();
    for (int i : e.members()) {
      range.add(pools.get(0).get(i).choices().clone());
    }
    List<List<OfferedVariant>> plans = new ArrayList<>();
    for (int k = 0; k < scenarios; k++) {
      plans.add(IntegerStage.offered(spaces.get(k), pools.get(k), e.plans()[k]));
    }
    double intro = e.members().length == 0 ? 0 : e.plans()[0].introduction();
    double tooling = e.members().length == 0 ? 0 : e.plans()[0].tooling();
    double bnd = Math.max(bound, e.objective());
    List<OfferedVariant> mean = weightedMean(range, plans);
    RangeChange change = RangeChange.of(spaces.get(0), pools.get(0).current(), mean, todaysRange());
    return new Outcome(status, reason, new ValueBound(e.objective(), bnd), range, e.values(), plans, intro, tooling,
        rx == null ? e.objective() : rx.objective(), rx == null ? 0 : rx.rounds(), rx == null || rx.converged(),
        theta, added, complete, pools.get(0).size(), mipSolves, clock.elapsedMs(), mean, change);
  }

  private int mipSolves;

  /**
   * Today's range as one fixed range across the scenarios (every current variant some segment takes,
   * nothing else, no variant limit), valued by the set's aim; NaN without a current range or when it
   * does not fit its lots in some scenario. A variant the catalog excludes from new ranges is left out
   * here, where the single-scenario stage still sells it.
   */
  private double todaysRange() {
    CurrentRange cr = pools.get(0).current();
    if (cr.isEmpty()) {
      return Double.NaN;
    }
    int[] m = Pool.members(cr.variants(), this::indexOf);
    double[] values = new double[scenarios];
    for (int k = 0; k < scenarios; k++) {
      Plan p = FixedPortfolio.solve(pools.get(k), terms.get(k), m, false);
      if (p == null) {
        return Double.NaN;
      }
      values[k] = p.value();
    }
    return objective(values);
  }

  /** Each variant of the range with its sales and margin as the weighted mean over the scenarios' plans. */
  private List<OfferedVariant> weightedMean(List<int[]> range, List<List<OfferedVariant>> plans) {
    List<OfferedVariant> out = new ArrayList<>();
    for (int[] v : range) {
      double[] sales = new double[spaces.get(0).segmentCount()];
      double margin = 0;
      for (int k = 0; k < scenarios; k++) {
        for (OfferedVariant w : plans.get(k)) {
          if (Arrays.equals(w.choices(), v)) {
            for (int s = 0; s < sales.length; s++) {
              sales[s] += weight[k] * w.sales()[s];
            }
            margin += weight[k] * w.margin();
          }
        }
      }
      out.add(new OfferedVariant(v, sales, margin));
    }
    return out;
  }

  // ---------------------------------------------------------------- relaxation

  private record Relaxed(LagrangianPortfolioBound best, double[] weights, double objective, int rounds,
      boolean converged) {}

  private static final int BOUND_DEPTH = 64;

  /** The Lagrangian bound at stacked prices and scenario weights ω: one pricing call for the k best outside the pool. */
  private Relaxation.Probe bound(VariantPricer pricer, double[] pi, double[] mu, double[] omega, int k, int cap,
      long deadline) {
    PortfolioTerms t0 = terms.get(0);
    Pool p0 = pools.get(0);
    VariantQuery q = new VariantQuery(pi, mu, t0.introductionCost(), null, 0.0, k, p0.keys(), deadline, omega);
    PricingOutcome out = pricer.price(q);
    double[] listed = new double[p0.size() + out.found().size()];
    for (int i = 0; i < p0.size(); i++) {
      listed[i] = VariantPricer.value(spaces, terms, p0.get(i).choices(), q);
    }
    for (int i = 0; i < out.found().size(); i++) {
      listed[p0.size() + i] = out.found().get(i).reducedCost();
    }
    double constant = currentConstant();
    for (int s = 0; s < scenarios; s++) {
      constant += terms.get(s).rowValue(Arrays.copyOfRange(pi, s * resourceCount, (s + 1) * resourceCount),
          Arrays.copyOfRange(mu, s * segmentCount, (s + 1) * segmentCount));
    }
    return new Relaxation.Probe(LagrangianPortfolioBound.of(constant, listed, out.restBound(), cap, pi.clone(),
        mu.clone()), out.found(), out.exact());
  }

  /** Column generation on the relaxed stacked master, priced over the whole space (see the class comment). */
  private Relaxed relax(VariantPricer pricer, double[] pi0, double[] mu0, double[] omega0, int cap) {
    StageClock.Phase phase = clock.phase(0.3);
    StopCriterion until = StopCriterion.anyOf(phase.stop(), StopCriterion.iterationLimit(settings.relaxationRounds()));
    int k = Math.max(settings.perRound(), cap == PortfolioTerms.UNLIMITED ? BOUND_DEPTH : Math.min(cap, BOUND_DEPTH));
    LagrangianPortfolioBound best = bound(pricer, pi0, mu0, omega0, k, cap, phase.deadlineNanos()).bound();
    double[] bestOmega = omega0;
    try (PortfolioLp lp = stackedLp(cap)) {
      for (int i = 0; i < pools.get(0).size(); i++) {
        addBlock(lp, i);
      }
      int round = 0;
      double z;
      boolean converged = false;
      while (true) {
        round++;
        PortfolioLpSolution sol = lp.solve();
        if (!sol.isOptimal()) {
          throw new IllegalStateException("the relaxed range master across scenarios ended " + sol.status()
              + "; it is feasible and bounded by construction, so this is a solver fault");
        }
        z = sol.objective() + currentConstant();
        double[] omega = aim.isWorst() ? simplex(lp.worstCaseDuals()) : weight;
        Relaxation.Probe probe = bound(pricer, sol.resourceDual(), sol.segmentDual(), omega, k, cap,
            phase.deadlineNanos());
        boolean exact = probe.exact();
        if (probe.bound().value() < best.value()) {
          best = probe.bound();
          bestOmega = omega;
        }
        double entry = sol.limitDual() + 1e-9 * (1 + Math.abs(z));
        List<PricedVariant> entering = new ArrayList<>();
        for (PricedVariant f : probe.found()) {
          if (f.reducedCost() > entry && entering.size() < settings.perRound()) {
            entering.add(f);
          }
        }
        if (entering.isEmpty() && exact) {
          converged = true;
          break;
        }
        if (ValueBound.gap(z, best.value()) <= settings.gap() || until.fired(clock.now(round))) {
          break;
        }
        for (PricedVariant f : entering) {
          if (add(f.choices())) {
            addBlock(lp, pools.get(0).size() - 1);
          }
        }
      }
      return new Relaxed(best, bestOmega, z, round, converged);
    }
  }

  /** Duals of the epigraph rows as weights: clamped and scaled onto the simplex (uniform when all vanish). */
  private double[] simplex(double[] rho) {
    double sum = 0;
    double[] out = new double[scenarios];
    for (int i = 0; i < scenarios; i++) {
      out[i] = Math.max(0.0, i < rho.length ? rho[i] : 0.0);
      sum += out[i];
    }
    for (int i = 0; i < scenarios; i++) {
      out[i] = sum > 0 ? out[i] / sum : 1.0 / scenarios;
    }
    return out;
  }

  // ---------------------------------------------------------------- stacked masters

  private double[] stackedCapacity() {
    double[] out = new double[scenarios * resourceCount];
    for (int k = 0; k < scenarios; k++) {
      System.arraycopy(terms.get(k).capacity(), 0, out, k * resourceCount, resourceCount);
    }
    return out;
  }

  private double[] stackedDemand() {
    double[] out = new double[scenarios * segmentCount];
    for (int k = 0; k < scenarios; k++) {
      System.arraycopy(terms.get(k).demand(), 0, out, k * segmentCount, segmentCount);
    }
    return out;
  }

  /** The stacked rows' shape: the worst case when asked, and each scenario's choosing segments. */
  private void shape(PortfolioShape m) {
    if (aim.isWorst()) {
      m.worstCase(scenarios);
    }
    for (int k = 0; k < scenarios; k++) {
      for (int s = 0; s < segmentCount; s++) {
        if (spaces.get(k).chooses(s)) {
          m.chooseIn(k * segmentCount + s);
        }
      }
    }
  }

  private PortfolioLp stackedLp(int cap) {
    PortfolioLp lp = new PortfolioLp(stackedCapacity(), stackedDemand(), cap);
    shape(lp);
    return lp;
  }

  /** Pool variant i's entries over every scenario, in the stacked rows. */
  private record Entries(int[] segments, double[] margin, double[][] use, double[] upper, double[] minLot, int[] lotOf,
      int[] tools, double fixedCost, double[] attraction) {}

  private Entries entries(int i) {
    int n = 0;
    for (Pool p : pools) {
      n += p.get(i).segments().length;
    }
    int[] segs = new int[n];
    double[] margin = new double[n];
    double[][] use = new double[n][];
    double[] upper = new double[n];
    int[] lotOf = new int[n];
    double[] attraction = new double[n];
    double[] minLot = new double[scenarios];
    int j = 0;
    for (int k = 0; k < scenarios; k++) {
      PoolVariant v = pools.get(k).get(i);
      double[] stacked = new double[scenarios * resourceCount];
      System.arraycopy(v.use(), 0, stacked, k * resourceCount, resourceCount);
      minLot[k] = terms.get(k).minLot();
      for (int e = 0; e < v.segments().length; e++, j++) {
        segs[j] = k * segmentCount + v.segments()[e];
        margin[j] = aim.isWorst() ? v.margin()[e] : weight[k] * v.margin()[e];
        use[j] = stacked;
        upper[j] = v.upper()[e];
        lotOf[j] = k;
        // the scenario's own logit: a price change moves a choosing segment's attraction
        attraction[j] = spaces.get(k).chooses(v.segments()[e])
            ? pools.get(k).choice().attraction(v.choices(), v.segments()[e]) : Double.NaN;
      }
    }
    PoolVariant first = pools.get(0).get(i);
    return new Entries(segs, margin, use, upper, minLot, lotOf, first.tools(), first.fixedCost(), attraction);
  }

  private void addBlock(PortfolioLp lp, int i) {
    Entries e = entries(i);
    int b = lp.addScenarioVariant(e.segments(), e.margin(), e.use(), e.upper(), e.fixedCost(), e.minLot(), e.lotOf());
    for (int j = 0; j < e.attraction().length; j++) {
      if (!Double.isNaN(e.attraction()[j])) {
        lp.addAttraction(b, j, e.attraction()[j]);
      }
    }
  }

  private record MipRun(MipStatus status, Evaluated best, double bound) {}

  /** The stacked MIP over the pool, hinted with {@code hint}; its range re-evaluated exactly per scenario. */
  private MipRun mip(Evaluated hint, long timeMs) {
    mipSolves++;
    PortfolioTerms t0 = terms.get(0);
    int n = pools.get(0).size();
    try (PortfolioMip m = new PortfolioMip(settings.engine(), stackedCapacity(), stackedDemand(), variantCap(),
        t0.choiceCost(), t0.wholeUnits())) {
      shape(m);
      for (int i = 0; i < n; i++) {
        Entries e = entries(i);
        int b = m.addScenarioVariant(e.segments(), e.margin(), e.use(), e.upper(), e.fixedCost(), e.minLot(), e.lotOf(),
            e.tools());
        if (pools.get(0).get(i).pinned()) {
          m.fixIntroduction(b, 1, 1);
        }
        for (int j = 0; j < e.attraction().length; j++) {
          if (!Double.isNaN(e.attraction()[j])) {
            m.addAttraction(b, j, e.attraction()[j]);
          }
        }
      }
      double[] y = new double[n];
      for (int i : hint.members()) {
        y[i] = 1;
      }
      m.hint(y, null);
      MipSolution sol = m.solve(timeMs, settings.gap(), clock.signalFlag());
      if (!sol.status().hasSolution()) {
        return new MipRun(sol.status(), null, Double.POSITIVE_INFINITY);
      }
      int[] members = java.util.stream.IntStream.range(0, n).filter(i -> sol.y()[i] > 0.5).toArray();
      Evaluated e = evaluate(members);
      // a range the exact per-scenario LPs refuse (round-off at a lot) is not used; the MIP's
      // objective leaves out the discontinue costs of today's range (a constant)
      return new MipRun(e == null ? MipStatus.FAILED : sol.status(), e, sol.bound() + currentConstant());
    }
  }

  /**
   * The value of a fixed range in one scenario: the LP of that range's sales (whole units: the small
   * MIP), less its introductions and tooling; empty when the scenario cannot meet its lots.
   */
  public static Optional<Double> valueOf(VariantSpace space, List<int[]> range) {
    PortfolioTerms t = PortfolioTerms.of(space);
    Pool pool = new Pool(space, t);
    Plan p = FixedPortfolio.solve(pool, t, Pool.members(range, pool::indexOrAdd));
    return p == null ? Optional.empty() : Optional.of(p.value());
  }
}
