package dev.mixwright.portfolio;

import dev.mixwright.colgen.Column;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.ValueBound;
import dev.mixwright.master.MipSolution;
import dev.mixwright.master.MipStatus;
import dev.mixwright.master.PortfolioMip;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Consumer;

/**
 * The integer stage after the LP stage: a portfolio of whole variants with an introduction cost F
 * each, at most K of them, each selling at least L in all, and tooling T_o paid once per option used.
 *
 * <pre>
 * (P)  max Σ_{v,s} m_vs x_vs − F Σ_v y_v − Σ_o T_o t_o
 *      s.t. resources and demands as in the LP stage,  x_vs ≤ u_s y_v,  Σ_s x_vs ≥ L y_v,
 *           Σ_v y_v ≤ K,  y_v ≤ t_o (o an option of v),  y, t ∈ {0, 1},  x ≥ 0
 * </pre>
 *
 * <ol>
 *   <li>Pool: the variants of the LP stage's columns. {@link Relaxation}: column generation on (P)
 *       with y relaxed, priced over the whole space; gives the bound B and its prices.
 *   <li>Incumbent: {@link Rounding} of the relaxation, then the MIP over the pool ({@link PortfolioMip},
 *       warm-started from it).
 *   <li>Quick proof, when few variants could be part of a better portfolio: they are listed by the
 *       exact pricer at the relaxation's prices, join the pool, and the MIP over the pool decides.
 *   <li>Otherwise: {@link BranchAndPrice} over the whole space, from that incumbent and the bound B, with
 *       the introduction y_v of a variant as the branching decision ({@link VariantBranching}); nodes
 *       are bounded by column generation with the exact variant pricer, and reduced-cost fixing bars
 *       the pool variants that cannot be part of a better portfolio below a node. A node whose
 *       survivors are few is retired; when only retired nodes are left, one MIP over their variants
 *       decides ({@link #proofOverRetired}).
 * </ol>
 *
 * The bound reported is the least of the LP stage's bound, B, and the tree's bound (the largest
 * bound of its open nodes, never below the incumbent) or, after the quick proof, the MIP's bound over
 * the pool; all are valid for the whole space. The status
 * is proven when the tree closed, so that the bound meets the value within the gap. Time: the
 * relaxation gets up to 30 % of the limit, the first MIP half of what is left but at most a fifth of
 * the limit, the quick proof's MIP half of what is left then, the tree the rest.
 */
public final class IntegerStage {

  private final VariantSpace space;
  private final PortfolioTerms terms;
  private final PortfolioSettings settings;
  private final List<PortfolioListener> listeners = new ArrayList<>();
  private StageClock clock;
  private final java.util.concurrent.atomic.AtomicInteger mipSolves = new java.util.concurrent.atomic.AtomicInteger();
  private StopCriterion stop = StopCriterion.never();
  private int workers = BranchAndPrice.defaultWorkers();
  private boolean quickProof = true;
  private boolean nodeMips = true;
  private BranchAndPrice.NodeMasters nodeMasters = BranchAndPrice.NodeMasters.DEFAULT;
  private BranchAndPrice.Retirement retirement = BranchAndPrice.Retirement.DEFAULT;
  private Checkpoint warm;
  private Consumer<Checkpoint> checkpoints = c -> {};

  public IntegerStage(VariantSpace space, PortfolioSettings settings) {
    this.space = space;
    this.terms = PortfolioTerms.of(space);
    this.settings = settings;
  }

  /**
   * An outer criterion, e.g. {@link StopCriterion#signal} for Ctrl-C: once it fires the stage ends
   * within about a tenth of a second with the best portfolio so far, marked heuristic. The settings'
   * time limit applies besides it.
   */
  public IntegerStage stopWhen(StopCriterion criterion) {
    this.stop = criterion;
    return this;
  }

  /** Threads of the branch-and-price tree (default: one per core, at most two); for tests. */
  IntegerStage workers(int n) {
    if (n < 1) {
      throw new IllegalArgumentException("workers must be >= 1");
    }
    this.workers = n;
    return this;
  }

  /** Whether the quick proof over the pool may settle the stage before the tree; for tests of the tree. */
  IntegerStage quickProof(boolean on) {
    this.quickProof = on;
    return this;
  }

  /**
   * Whether a node of the tree that retires is decided at once by a MIP over its members ({@link
   * BranchAndPrice.MemberMip}); off, retired nodes wait for the proof set's MIP. For tests.
   */
  IntegerStage nodeMips(boolean on) {
    this.nodeMips = on;
    return this;
  }

  /** When the tree's nodes with decisions left may retire; for tests of retirement. */
  IntegerStage retirement(BranchAndPrice.Retirement r) {
    this.retirement = r;
    return this;
  }

  /** What the tree's workers keep in their masters between nodes; for tests of the restricted masters. */
  IntegerStage nodeMasters(BranchAndPrice.NodeMasters m) {
    this.nodeMasters = m;
    return this;
  }

  public IntegerStage addListener(PortfolioListener l) {
    listeners.add(l);
    return this;
  }

  // ---- warm start and checkpoint entry point (resume after a kill; used by run.PortfolioStep) ----

  /**
   * The stage's progress that a later session can start from: the pool's variants, the incumbent's
   * variants (a subset of the pool; empty before the first) with its value, and the bound proven for
   * the whole space so far (+∞ for none).
   */
  public record Checkpoint(List<int[]> pool, List<int[]> incumbent, double value, double bound) {
    public Checkpoint {
      pool = List.copyOf(pool);
      incumbent = List.copyOf(incumbent);
    }
  }

  /**
   * Starts from an earlier session's progress of the same catalog and terms: its variants join the
   * pool, its incumbent competes with the rounding, its bound caps the bound. The proof runs as
   * without it, so a warm start changes where the search begins, never what it proves.
   */
  public IntegerStage warmStart(Checkpoint c) {
    this.warm = c;
    return this;
  }

  /**
   * Hands the progress to {@code sink} after the relaxation, the rounding, the first MIP and every
   * proof pass.
   */
  public IntegerStage checkpointTo(Consumer<Checkpoint> sink) {
    this.checkpoints = sink;
    return this;
  }

  /** {@code inc} null: no incumbent yet in this session, so the warm one (if any) is kept. */
  private void checkpoint(Pool pool, Plan inc, double bound) {
    List<int[]> vs = new ArrayList<>(pool.size());
    pool.all().forEach(v -> vs.add(v.choices()));
    if (inc == null && warm != null) {
      checkpoints.accept(new Checkpoint(vs, warm.incumbent(), warm.value(), bound));
      return;
    }
    List<int[]> members = new ArrayList<>();
    if (inc != null) {
      for (int i : inc.members()) {
        members.add(pool.get(i).choices());
      }
    }
    checkpoints.accept(new Checkpoint(vs, members, inc == null ? Double.NEGATIVE_INFINITY : inc.value(), bound));
  }

  /** The warm incumbent's plan in this pool (its variants re-found by key), or null when none or no longer feasible. */
  private Plan warmIncumbent(Pool pool) {
    if (warm == null || warm.incumbent().isEmpty()) {
      return null;
    }
    Map<VariantKey, Integer> index = new HashMap<>();
    for (int i = 0; i < pool.size(); i++) {
      index.put(pool.get(i).key(), i);
    }
    int[] members = new int[warm.incumbent().size()];
    for (int j = 0; j < members.length; j++) {
      Integer i = index.get(space.key(warm.incumbent().get(j)));
      if (i == null) {
        return null;
      }
      members[j] = i;
    }
    return FixedPortfolio.solve(pool, terms, members);
  }

  // ---- end of the warm start and checkpoint entry point ----

  private void emit(PortfolioEvent.Kind kind, double value, double bound, int pool, int count, String note) {
    PortfolioEvent e = new PortfolioEvent(kind, clock.elapsedMs(), value, bound, pool, count, note);
    listeners.forEach(l -> l.event(e));
  }

  /**
   * The search for a proven portfolio as it goes: the incumbent, the bound proven before the proof,
   * what the last MIP over the pool proved, and the survivor enumeration's threshold and result.
   */
  private static final class Search {
    final double bound;
    Plan incumbent;
    boolean mipOptimal;
    double mipBound = Double.POSITIVE_INFINITY;
    boolean complete;
    double theta = Double.NaN;
    int added;
    String reason = "";
    double treeBound = Double.POSITIVE_INFINITY;
    boolean closed;
    boolean survivorsProve;
    /** The branch-and-price tree's size when it ran; none when it did not. */
    PortfolioOutcome.Tree tree = new PortfolioOutcome.Tree(0, 0, 0);

    Search(double bound) {
      this.bound = bound;
    }
  }

  /**
   * Prices the bound may use: a buyers row's dual is free in sign in the sales-based LP, and the
   * whole-space bound, which relaxes it to Σ_v x_sv ≤ buyers_s, holds for μ_s ≥ 0 only.
   */
  private static double[] atLeastZero(double[] mu) {
    double[] out = mu.clone();
    for (int s = 0; s < out.length; s++) {
      out[s] = Math.max(0.0, out[s]);
    }
    return out;
  }

  public PortfolioOutcome run(SolveOutcome lp) {
    clock = new StageClock(settings.timeLimitMs(), stop);
    mipSolves.set(0);
    CurrentRange current = new CurrentRange(space);
    Pool pool = new Pool(space, terms, current);
    // current variants are always in the pool, so the pricer (which skips the pool and charges F)
    // only ever prices new variants, and every bound sees a current variant with its own fixed cost
    for (int i = 0; i < current.size(); i++) {
      pool.add(current.variant(i));
    }
    if (!lp.status().isInfeasible()) {
      for (Column c : lp.master().columns()) {
        pool.add(c.choices());
      }
      if (warm != null) {
        warm.pool().forEach(pool::add);
      }
    }
    if (pool.size() == 0 || terms.variantCap() == 0) {
      return nothingToOffer(pool, current);
    }
    double lpBound = Double.isFinite(lp.result().bound()) ? lp.result().bound() : Double.POSITIVE_INFINITY;
    VariantPricer pricer = new VariantPricer(space, terms, Long.MAX_VALUE).stopWhen(clock.signalFlag());
    PortfolioListener fan = e -> listeners.forEach(l -> l.event(e));
    // Columns came from the LP stage, so its duals are known: they are the relaxation's first prices.
    RelaxationResult rx = new Relaxation(space, terms, pricer, settings, fan, clock, clock.phase(0.3))
        .run(pool, lp.duals().resource(), atLeastZero(lp.duals().segment()));
    double warmBound = warm == null ? Double.POSITIVE_INFINITY : warm.bound();
    Search search = new Search(Math.min(Math.min(lpBound, rx.provenBound()), warmBound));
    checkpoint(pool, null, search.bound);
    int relaxed = pool.size();
    firstIncumbent(pool, rx, search);
    checkpoint(pool, search.incumbent, search.bound);
    if (quickProof) {
      survivors(pool, pricer, rx.bound(), search);
      checkpoint(pool, search.incumbent, search.bound);
    }
    if (!search.survivorsProve) {
      tree(pool, search, rx.bound());
      checkpoint(pool, search.incumbent, Math.min(search.bound, search.treeBound));
    }
    search.added = pool.size() - relaxed;
    return outcome(pool, lpBound, rx, search);
  }

  /**
   * The quick proof, when it applies: by {@link LagrangianPortfolioBound}, a portfolio holding w is
   * worth at most B(λ̂) − (λ̂ − ψ(w))⁺ − tooling(w), so only variants with ψ(w) − tooling(w) &gt; θ =
   * value − B(λ̂) + λ̂ can be part of a better portfolio (the reduced-cost argument of Barnhart et al.
   * 1998 at the relaxation's prices). When the exact pricer lists all of them outside the pool within
   * the survivor limit, they join the pool, and a MIP solved to optimality over it is optimal over the
   * whole space. When they are more, nothing is added and the tree takes over.
   */
  private void survivors(Pool pool, VariantPricer pricer, LagrangianPortfolioBound b, Search s) {
    if (!b.isFinite() || clock.signalled().isPresent() || !settings.engine().provesContinuous()) {
      return;
    }
    double[] tooling = terms.hasTooling() ? terms.choiceCost() : null;
    s.theta = s.incumbent.value() - b.valueAtLambda() + b.lambda();
    double slack = 1e-7 * (1 + Math.abs(s.incumbent.value()));
    PricingOutcome out = pricer.price(b.query(terms.introductionCost(), tooling, s.theta - slack,
        settings.survivorLimit() + 1, pool.keys(), clock.phase(0.2).deadlineNanos()));
    s.complete = out.exact() && out.found().size() <= settings.survivorLimit();
    emit(PortfolioEvent.Kind.SURVIVORS, s.theta, s.bound, pool.size(), out.found().size(), s.complete
        ? "every variant that could be part of a better portfolio is listed"
        : "too many variants could be part of a better portfolio to prove it over the pool");
    if (!s.complete) {
      return;
    }
    int before = pool.size();
    for (var f : out.found()) {
      pool.add(f.choices());
    }
    // half the time left: where the survivors are few, this MIP proves faster than the tree (the starter
    // demo's 1,091 variants in 13–20 s); where they are many (1,618 on the dense family at 10^12), it
    // did not finish in all the time left and the tree never ran, which then got further in 38 s
    // (docs/portfolio.md). Stopped early, its bound still counts, and the tree takes the rest.
    PoolMip.Run again = mip(pool, passing(pool, before, b, s), s.incumbent, Math.max(1, clock.msLeft() / 2));
    if (again.plan() != null && again.plan().value() > s.incumbent.value() + 1e-9 * (1 + Math.abs(s.incumbent.value()))) {
      s.incumbent = again.plan();
      emit(PortfolioEvent.Kind.INCUMBENT, s.incumbent.value(), s.bound, pool.size(), s.incumbent.members().length,
          "MIP over the pool with survivors");
    }
    s.mipOptimal = again.status() == MipStatus.OPTIMAL;
    // every portfolio better than the incumbent lies in the pool, so the MIP's bound over the pool
    // bounds the whole space even when it stopped early
    s.mipBound = again.status().hasSolution() ? again.bound() : Double.POSITIVE_INFINITY;
    if (!s.mipOptimal) {
      s.reason = "the MIP over the pool with every variant that could be part of a better portfolio was not"
          + " solved to optimality in the time limit";
    } else {
      // every portfolio better than the incumbent lies in the pool, where the MIP bounds it
      s.survivorsProve = true;
      s.treeBound = Math.max(s.incumbent.value(), again.bound());
    }
  }

  /**
   * The pool variants a portfolio better than the incumbent may hold: the survivors (pool indices from
   * {@code firstSurvivor} on), the incumbent's and pinned variants, and every earlier pool variant w
   * that passes the survivor test B(λ̂) − (λ̂ − ψ(w))⁺ − tooling(w) &gt; incumbent at the bound's prices.
   * ψ is taken with β = 0 and the per-segment caps, which is at least the ψ the bound used
   * ({@link ChoicePrices}), so a variant failing the test cannot be part of a better portfolio and the
   * MIP over the rest still decides the whole space; it is smaller, so SCIP proves it sooner.
   */
  private int[] passing(Pool pool, int firstSurvivor, LagrangianPortfolioBound b, Search s) {
    java.util.TreeSet<Integer> keep = new java.util.TreeSet<>();
    for (int i = firstSurvivor; i < pool.size(); i++) {
      keep.add(i);
    }
    for (int i : s.incumbent.members()) {
      keep.add(i);
    }
    for (int i : pool.pinned()) {
      keep.add(i);
    }
    for (int i = 0; i < firstSurvivor; i++) {
      if (mayImprove(pool.get(i), i, b, s.incumbent)) {
        keep.add(i);
      }
    }
    return keep.stream().mapToInt(Integer::intValue).toArray();
  }

  /**
   * The survivor test of a pool variant at the bound's prices: B(λ̂) − (λ̂ − ψ(w))⁺ − tooling(w) above
   * the incumbent (less a little, so whatever fails is worth at most it). ψ is taken with β = 0 and
   * the per-segment caps, at least the ψ the bound used ({@link ChoicePrices}), so a variant that fails
   * cannot be part of a portfolio better than the incumbent anywhere in the space.
   */
  private boolean mayImprove(PoolVariant v, int i, LagrangianPortfolioBound b, Plan incumbent) {
    double z = incumbent.value() - 1e-7 * (1 + Math.abs(incumbent.value()));
    VariantQuery at = b.query(0.0, null, Double.NEGATIVE_INFINITY, 1, null, 0);
    // the segment cuts' r·γ is the one term that raises a pool variant's value in the bound
    double psi = VariantPricer.value(space, terms, v.choices(), at) - v.fixedCost() + b.poolBonusOf(i);
    return b.withVariant(psi) - terms.toolingOf(space, v.choices()) > z;
  }

  /**
   * The branch-and-price tree over the rest of the time, from the incumbent so far; {@code root} is
   * the relaxation's bound, whose survivor test thins the proof set of retired nodes.
   */
  private void tree(Pool pool, Search s, LagrangianPortfolioBound root) {
    Optional<String> signalled = clock.signalled();
    if (signalled.isPresent()) {
      s.reason = signalled.get();
      return;
    }
    PortfolioListener fan = e -> listeners.forEach(l -> l.event(e));
    BranchAndPrice bp = new BranchAndPrice(space, terms, pool, settings, clock, clock.phase(1.0), fan, workers,
        nodeMasters).retirement(retirement);
    if (nodeMips && settings.engine().provesContinuous()) {
      // a retired node's members, its offered ones fixed: SCIP's own cuts on the shared resources
      bp.memberMip(PoolMip.forNodes(pool, terms, settings, clock.signalFlag(), () -> mipSolves.incrementAndGet()));
    }
    BranchAndPrice.Result r = bp.run(s.incumbent, s.bound);
    s.incumbent = r.incumbent();
    s.treeBound = r.bound();
    s.closed = r.closed() && r.retired() == 0;
    s.tree = new PortfolioOutcome.Tree(r.nodes(), r.open(), r.workers());
    if (!r.closed()) {
      s.reason = r.reason(); // the tree ran last: what stopped it is what left the stage heuristic
    }
    String retired = (r.retired() == 0 ? "" : "; " + r.retired() + " nodes retired to a proof set of "
        + r.proofSet().length + " variants") + (r.reopened() == 0 ? "" : "; " + r.reopened()
        + " retired nodes went back to the open list, as they held the tree's bound")
        + (r.segmentSplits() == 0 ? "" : "; " + r.segmentSplits()
        + " nodes split on a segment's count")
        + (r.pairSplits() == 0 ? "" : "; " + r.pairSplits()
        + " on how many of a choosing segment's variants use one option")
        + (r.closedByMip() == 0 ? "" : "; " + r.closedByMip() + " nodes closed by a MIP over their members");
    emit(PortfolioEvent.Kind.TREE, r.incumbent().value(), Math.min(s.bound, r.bound()), pool.size(), (int) Math.min(
        Integer.MAX_VALUE, r.nodes()), (r.closed()
        ? r.retired() == 0 ? "branch-and-price closed the tree: no portfolio is better than the incumbent"
            : "branch-and-price left only retired nodes"
        : r.reason()) + retired);
    if (r.closed() && r.retired() > 0) {
      proofOverRetired(pool, r, s, root);
    }
  }

  /**
   * The tree closed with retired nodes ({@link BranchAndPrice}): every portfolio better than the
   * incumbent lies in one of them and is made of the proof set's variants, so a MIP over the proof set
   * (and the incumbent's variants) decides the whole space; stopped early, its bound over that set
   * still bounds every better portfolio. The proof set is the union of every retired node's survivors
   * at the node's own prices; a variant that also fails the root's survivor test against the final
   * incumbent ({@link #mayImprove}) is in no better portfolio anywhere, so it is left out, and the
   * MIP is smaller (both tests are valid, so their intersection is).
   */
  private void proofOverRetired(Pool pool, BranchAndPrice.Result r, Search s, LagrangianPortfolioBound root) {
    java.util.TreeSet<Integer> over = new java.util.TreeSet<>();
    for (int i : r.proofSet()) {
      if (!root.isFinite() || mayImprove(pool.get(i), i, root, s.incumbent)) {
        over.add(i);
      }
    }
    for (int i : s.incumbent.members()) {
      over.add(i);
    }
    PoolMip.Run run = mip(pool, over.stream().mapToInt(Integer::intValue).toArray(), s.incumbent, clock.msLeft());
    if (run.plan() != null && run.plan().value() > s.incumbent.value() + 1e-9 * (1 + Math.abs(s.incumbent.value()))) {
      s.incumbent = run.plan();
      emit(PortfolioEvent.Kind.INCUMBENT, s.incumbent.value(), s.bound, pool.size(), s.incumbent.members().length,
          "MIP over the variants of the retired nodes of the tree");
    }
    // a better portfolio lies in the proof set, where the MIP bounds it; any other is worth at most the floor
    double floor = Math.max(s.incumbent.value(), r.floor());
    if (run.status() == MipStatus.OPTIMAL && settings.engine().provesContinuous()) {
      s.closed = true;
      s.treeBound = Math.min(s.treeBound, Math.max(floor, run.bound()));
    } else {
      if (run.status().hasSolution() && settings.engine().provesContinuous()) {
        s.treeBound = Math.min(s.treeBound, Math.max(floor, run.bound()));
      }
      if (s.reason.isEmpty()) {
        s.reason = "the MIP over the variants the branch-and-price tree left was not solved to optimality in the"
            + " time limit";
      }
    }
  }

  /**
   * No segment takes any buildable variant, or no lot fits the demand: every portfolio that can be
   * offered is empty.
   */
  private PortfolioOutcome nothingToOffer(Pool pool, CurrentRange current) {
    double v = current.constant();
    emit(PortfolioEvent.Kind.END, v, v, 0, 0, pool.size() == 0
        ? "nothing can be sold: the empty portfolio is optimal"
        : "the minimum lot exceeds all demand together: the empty portfolio is optimal");
    return new PortfolioOutcome(PortfolioStatus.PROVEN, "", new ValueBound(v, v),
        new PortfolioOutcome.Offer(List.of(), 0, 0), 0, null,
        new PortfolioOutcome.SurvivorProof(Double.NaN, 0, true, 0),
        new PortfolioOutcome.MipRuns(settings.engine(), 0, true), new PortfolioOutcome.Tree(0, 0, 0),
        clock.elapsedMs(), RangeChange.of(space, pool, Plan.empty(pool), current.isEmpty() ? null : todaysRange(pool)));
  }

  /** Rounding of the relaxation, then a MIP over the pool warm-started from it. */
  private void firstIncumbent(Pool pool, RelaxationResult rx, Search s) {
    LagrangianPortfolioBound b = rx.bound();
    double[] score = new double[pool.size()];
    VariantQuery at = b.query(terms.introductionCost(), null, Double.NEGATIVE_INFINITY, 1, null, 0);
    for (int i = 0; i < score.length; i++) {
      score[i] = VariantPricer.value(space, terms, pool.get(i).choices(), at) + terms.introductionCost()
          - pool.get(i).fixedCost();
    }
    Plan inc = Rounding.greedy(pool, terms, rx.y(), score, clock, clock.phase(0.2));
    emit(PortfolioEvent.Kind.INCUMBENT, inc.value(), s.bound, pool.size(), inc.members().length,
        "rounding of the relaxation");
    Plan earlier = warmIncumbent(pool);
    if (earlier != null && earlier.value() > inc.value()) {
      inc = earlier;
      emit(PortfolioEvent.Kind.INCUMBENT, inc.value(), s.bound, pool.size(), inc.members().length,
          "incumbent of the earlier session");
    }
    checkpoint(pool, inc, s.bound); // before the MIP, which may run for most of the stage
    // at most a fifth of the stage: over the pool it finds the incumbent early and spends the rest on a
    // bound that holds for the pool only (dense family at 10^12: its final incumbent by 10 s, optimal
    // over 266 variants at 22 s), time the tree's bound over the whole space needs more
    PoolMip.Run mip = mip(pool, inc, Math.max(1, Math.min(clock.msLeft() / 2, clock.limitMs() / 5)));
    if (mip.plan() != null && mip.plan().value() > inc.value()) {
      inc = mip.plan();
      emit(PortfolioEvent.Kind.INCUMBENT, inc.value(), s.bound, pool.size(), inc.members().length,
          "MIP over the pool");
    }
    boolean proves = settings.engine().provesContinuous();
    s.incumbent = inc;
    s.mipOptimal = proves && mip.status() == MipStatus.OPTIMAL;
    s.mipBound = proves ? mip.bound() : Double.POSITIVE_INFINITY;
  }

  private PortfolioOutcome outcome(Pool pool, double lpBound, RelaxationResult rx, Search s) {
    Plan inc = s.incumbent;
    double bound = Math.min(s.bound, s.treeBound);
    if (s.complete && Double.isFinite(s.mipBound)) {
      bound = Math.min(bound, Math.max(inc.value(), s.mipBound));
    }
    bound = Math.max(bound, inc.value());
    // the LP stage's rule: relative to the figures, never to an absolute 1
    ValueBound result = new ValueBound(inc.value(), bound, terms.gapFloor());
    boolean proven = (s.closed || s.survivorsProve) && result.within(settings.gap());
    String reason = proven ? "" : whyHeuristic(s.reason);
    PortfolioOutcome o = new PortfolioOutcome(proven ? PortfolioStatus.PROVEN : PortfolioStatus.HEURISTIC, reason,
        result,
        new PortfolioOutcome.Offer(offered(space, pool, inc), inc.introduction() + inc.tooling(), inc.tooling()),
        lpBound, rx, new PortfolioOutcome.SurvivorProof(s.theta, s.added, s.complete, pool.size()),
        new PortfolioOutcome.MipRuns(settings.engine(), mipSolves.get(), s.mipOptimal),
        s.tree, clock.elapsedMs(),
        RangeChange.of(space, pool, inc, pool.current().isEmpty() ? null : todaysRange(pool)));
    emit(PortfolioEvent.Kind.END, o.result().value(), o.result().bound(), pool.size(), o.offer().variants().size(), o.status().word()
        + (reason.isEmpty() ? "" : ": " + reason));
    return o;
  }

  /** The reason a portfolio stays heuristic: a signal first, else what the proof said, else the MIP. */
  private String whyHeuristic(String proofReason) {
    Optional<String> signalled = clock.signalled();
    if (signalled.isPresent()) {
      return signalled.get();
    }
    if (!proofReason.isEmpty()) {
      return proofReason;
    }
    return "the branch-and-price tree did not close";
  }

  private PoolMip.Run mip(Pool pool, Plan hint, long timeMs) {
    return mip(pool, java.util.stream.IntStream.range(0, pool.size()).toArray(), hint, timeMs);
  }

  /**
   * The MIP over the pool variants {@code over} (pool indices, ascending; they must hold the hint's members),
   * {@link PoolMip}, counted and recorded as an event.
   */
  private PoolMip.Run mip(Pool pool, int[] over, Plan hint, long timeMs) {
    mipSolves.incrementAndGet();
    PoolMip.Run run = PoolMip.solve(pool, terms, settings, clock.signalFlag(), over, new int[0], hint, timeMs);
    MipSolution sol = run.solution();
    emit(PortfolioEvent.Kind.MIP, run.plan() == null ? Double.NaN : run.plan().value(), run.bound(), pool.size(),
        sol.y().length, settings.engine().word() + " " + sol.status().name().toLowerCase(Locale.ROOT) + " in "
            + sol.wallMs() + " ms, " + sol.nodes() + " nodes (bound over the pool only)");
    return run;
  }

  /** Today's range as a fixed portfolio: every current variant some segment takes, nothing else; null when it does not fit. */
  private Plan todaysRange(Pool stagePool) {
    Pool pool = stagePool;
    if (!space.catalog().exclude().isEmpty()) {
      // a variant on sale today may be excluded from the new range; today's range still sells it
      var all = space.catalog();
      VariantSpace unbarred = new VariantSpace(all.withCurrentRange(all.current(), List.of()));
      pool = new Pool(unbarred, terms, new CurrentRange(unbarred));
    }
    return FixedPortfolio.solve(pool, terms, Pool.members(pool.current().variants(), pool::indexOrAdd), false);
  }

  static List<OfferedVariant> offered(VariantSpace space, Pool pool, Plan p) {
    List<OfferedVariant> out = new ArrayList<>();
    for (int j = 0; j < p.members().length; j++) {
      PoolVariant v = pool.get(p.members()[j]);
      double[] sales = new double[space.segmentCount()];
      double margin = 0;
      for (int k = 0; k < v.segments().length; k++) {
        double q = Math.max(0.0, p.sales().get(j)[k]);
        sales[v.segments()[k]] = q;
        margin += q * v.margin()[k];
      }
      out.add(new OfferedVariant(v.choices().clone(), sales, margin));
    }
    out.sort((a, c) -> Double.compare(c.margin(), a.margin()));
    return out;
  }

  public PortfolioTerms terms() {
    return terms;
  }
}
