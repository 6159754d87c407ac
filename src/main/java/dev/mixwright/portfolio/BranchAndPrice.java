package dev.mixwright.portfolio;

import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.ValueBound;
import dev.mixwright.master.LpStatus;
import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioLpSolution;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.PriorityQueue;
import java.util.Set;
import java.util.concurrent.atomic.AtomicReference;

/**
 * The exact integer stage: branch-and-price on (P) (Barnhart, Johnson, Nemhauser, Savelsbergh &amp;
 * Vance 1998, "Branch-and-price: column generation for solving huge integer programs", Operations
 * Research 46(3); Desaulniers, Desrosiers &amp; Solomon (eds.) 2005, <i>Column Generation</i>).
 *
 * <p>Every node is the relaxation of {@link Relaxation} (one introduction y_v per variant, shared by its
 * segments) with some pool variants offered (y_v = 1) and some barred (y_v = 0), solved by column
 * generation with the exact {@link VariantPricer}. The node bound is the Lagrangian bound of {@link
 * LagrangianPortfolioBound} restricted to the node: for a portfolio S ⊇ I (offered), S ∩ O = ∅ (barred),
 *
 * <pre>
 *   value(S) ≤ π·b + μ·D + Σ_{v∈I} ψ(v) − tooling(I) + λ·(K − |I|) + Σ_{v free} (ψ(v) − λ)⁺
 * </pre>
 *
 * valid at any prices π, μ ≥ 0 and any λ ≥ max(0, rest), because the tooling of the options of
 * offered variants is certainly paid. The node's count rows at their duals δ (≥ 0 at an upper side, ≤ 0
 * at a lower) add Σ_c δ_c·side_c and turn every ψ(v) into ψ(v) − Σ δ_c over the counts v enters (its
 * choices, the total, the segments that accept it). With segments that choose, the master's variants are valued
 * with their own attraction rows' duals and caps, and the constant gains the stay-out's term
 * ({@link ChoicePrices}), so at a node's optimal duals the bound meets the node's objective. The free variants are the pool's undecided ones and the whole
 * space outside the pool; the pricer lists the latter above the threshold and bounds the rest, so
 * bounds hold while column generation is still running, and a node is pruned as soon as its bound
 * falls to the incumbent (plus the gap tolerance). At a solved node, reduced-cost fixing bars every
 * free pool variant w with bound-with-w − tooling(w) ≤ incumbent in both children (the same
 * inequality with λ and ψ(w), as in the survivor test of {@link IntegerStage}).
 *
 * <p>Branching: {@link VariantBranching}. Node order: best bound first. The global bound is the
 * largest bound of the open and running nodes (and of the nodes pruned within the tolerance), never
 * less than the incumbent. Incumbents: the caller's, the LP of the node's offered variants plus those
 * at y ≥ ½ ({@link FixedPortfolio}), and integral node solutions.
 *
 * <p>Two workers when the machine has two cores, each with its own GLOP master and pricer (OR-Tools
 * solvers are not thread-safe); they share the pool, the open nodes and the incumbent under one lock.
 * Cost: a node is a few warm-started GLOP solves and exact pricing calls; the tree is exponential in
 * the worst case ((P) is NP-hard), so time limits and the stop signal end it with the valid bound.
 */
final class BranchAndPrice {
  private static final int BOUND_DEPTH = 64;
  /** Rounds of a node priced on the pool alone before the exact pricer runs. */
  private static final int CHEAP_ROUNDS = 5;
  /** Most pool variants outside the master that enter it per round. */
  private static final int POOL_PER_ROUND = 30;

  private final VariantSpace space;
  private final PortfolioTerms terms;
  private final Pool pool;
  private final PortfolioSettings settings;
  private final StageClock clock;
  private final StopCriterion stop;
  private final long deadlineNanos;
  private final PortfolioListener listener;
  private final int cap;
  private final NodeMasters masters;
  /** The segments whose counts per choice the tree splits on: those that choose (null: none). */
  private final boolean[] pairSegments;

  private final Object lock = new Object();
  private final PriorityQueue<TreeNode> open =
      new PriorityQueue<>(Comparator.comparingDouble(TreeNode::bound).reversed());
  private final double[] running;
  private final List<TreeNode> stuck = new ArrayList<>();
  private Plan incumbent;
  private double prunedMax = Double.NEGATIVE_INFINITY;
  private long nodes;
  private String stopReason = "";
  private String stuckReason = "";
  private double artificialCost = 1;
  /** What ended a worker: an exception, or an error such as running out of heap, rethrown by {@link #run}. */
  private final AtomicReference<Throwable> failure = new AtomicReference<>();
  /**
   * The retired nodes, kept so that those with decisions left can go back to the open list ({@link
   * #reopen}); the proof set, their largest bound and their floor are read from them.
   */
  private final List<Retired> retired = new ArrayList<>();
  /** Set once retired nodes went back to the open list: from then on only nodes with nothing to branch on retire. */
  private boolean retireClosed;
  private int reopened;
  /** Nodes split on a segment's count ({@link VariantBranching}), for the tree's record. */
  private final java.util.concurrent.atomic.AtomicLong segmentSplits = new java.util.concurrent.atomic.AtomicLong();
  /** Nodes split on the count of one choice among the variants a segment that chooses accepts. */
  private final java.util.concurrent.atomic.AtomicLong pairSplits = new java.util.concurrent.atomic.AtomicLong();
  /** The portfolios the nodes' rounding has valued (sorted pool indices), each once. */
  private final Set<List<Integer>> rounded = new HashSet<>();

  /**
   * Most variants outside the pool that may survive at a node for it to retire, and most members
   * (offered, passing pool variants and those listed) that a node with decisions left may bring.
   */
  private static final int RETIRE_LIMIT = 300;

  /**
   * A retired node as solved (its bound included), the incumbent plus tolerance when it retired (what
   * its portfolios outside {@code members} are worth at most), its proof-set members, and whether it
   * had decisions left to branch on ({@code gated}: only those can go back to the open list).
   */
  private record Retired(TreeNode node, double floor, List<Integer> members, boolean gated) {}

  /**
   * When a node with decisions left may retire: its bound at most {@code gate} introduction costs
   * above the incumbent, with at most {@code members} members. {@link #DEFAULT} is what runs; tests
   * loosen it to reach the paths of retirement on small catalogs.
   */
  record Retirement(double gate, int members) {
    static final Retirement DEFAULT = new Retirement(2, RETIRE_LIMIT);
  }

  private Retirement retirement = Retirement.DEFAULT;

  /**
   * A MIP over pool variants {@code over} with {@code on} offered (pool indices), within {@code timeMs},
   * over the portfolios worth at least {@code floor} only: its best portfolio (null for none) and an
   * upper bound on every such portfolio made of {@code over} that offers {@code on} ({@code floor} when
   * there is none); null when it found nothing and proved nothing.
   */
  interface MemberMip {
    Result solve(int[] over, int[] on, long timeMs, double floor);

    record Result(Plan plan, double bound, boolean optimal) {}
  }

  /** Most rounds a node's relaxation is cut by sales envelope tangents. */
  private static final int TANGENT_ROUNDS = 3;

  /** Most time one retired node's MIP gets. */
  private static final long MEMBER_MIP_MS = 2_000;

  private MemberMip memberMip;
  /** Retired nodes whose own MIP closed them. */
  private int closedByMip;

  /** The MIP that decides retired nodes as they retire (none: they wait for the proof set's MIP). */
  BranchAndPrice memberMip(MemberMip m) {
    this.memberMip = m;
    return this;
  }

  /** The retirement rule; for tests. */
  BranchAndPrice retirement(Retirement r) {
    this.retirement = r;
    return this;
  }

  /**
   * How the tree ended. {@code closed}: no node left above the incumbent but the retired ones. {@code
   * proofSet}: the pool variants of the retired nodes' survivors (empty when none retired): every
   * portfolio better than the incumbent in a retired node is made of them, so when the tree closed, a
   * MIP over them solved to optimality decides the whole space. {@code floor}: the most a portfolio
   * outside the proof set can be worth when the tree closed (the incumbent and the nodes pruned or
   * retired within the tolerance). {@code segmentSplits}: the nodes split on a segment's count, {@code
   * pairSplits} on the count of one choice among the variants a segment that chooses accepts. {@code
   * retired}: the nodes retired when the tree ended; {@code reopened}: those that went back to the open
   * list because they held the tree's bound ({@link #reopen}); {@code closedByMip}: the nodes that their
   * own MIP closed as they retired ({@link MemberMip}).
   */
  record Result(Plan incumbent, double bound, boolean closed, long nodes, int open, int workers, String reason,
      int[] proofSet, int retired, double floor, long segmentSplits, long pairSplits, int reopened,
      int closedByMip) {}

  /**
   * What a worker's master keeps between nodes. {@code keepNodes}: how many of the worker's nodes a
   * free variant may go unsold and stay; {@code deadSlack}: how many more dead blocks (barred at the
   * node, or idle) than live ones the master carries before it is rebuilt; {@code seedWithPool}: the
   * first master holds every free pool variant (otherwise only the offered ones). Any policy gives
   * the same bounds: whatever the master leaves out is priced from the pool.
   */
  record NodeMasters(int keepNodes, int deadSlack, boolean seedWithPool) {
    /**
     * Measured on the range demo (CPU time per node, docs/portfolio.md): keeping the blocks that sold
     * at the worker's last 10 nodes gave the fewest rounds per node for the size of the master.
     */
    static final NodeMasters DEFAULT = new NodeMasters(10, 100, true);
    /** Every node rebuilds its master from its offered variants: what the tests use to exercise pool pricing. */
    static final NodeMasters LEAN = new NodeMasters(0, 0, false);
  }

  /** Runs within {@code phase} (its time limit and the outer signal), with {@code workers} threads. */
  BranchAndPrice(VariantSpace space, PortfolioTerms terms, Pool pool, PortfolioSettings settings, StageClock clock,
      StageClock.Phase phase, PortfolioListener listener, int workers) {
    this(space, terms, pool, settings, clock, phase, listener, workers, NodeMasters.DEFAULT);
  }

  BranchAndPrice(VariantSpace space, PortfolioTerms terms, Pool pool, PortfolioSettings settings, StageClock clock,
      StageClock.Phase phase, PortfolioListener listener, int workers, NodeMasters masters) {
    this.masters = masters;
    this.space = space;
    this.terms = terms;
    this.pool = pool;
    this.settings = settings;
    this.clock = clock;
    this.stop = phase.stop();
    this.deadlineNanos = phase.deadlineNanos();
    this.listener = listener;
    this.cap = terms.variantCap();
    this.running = new double[Math.max(1, workers)];
    boolean[] choosing = new boolean[space.segmentCount()];
    boolean any = false;
    for (int s = 0; s < choosing.length; s++) {
      choosing[s] = space.chooses(s);
      any |= choosing[s];
    }
    this.pairSegments = any ? choosing : null;
  }

  /** The workers the machine supports: one per core, at most two. */
  static int defaultWorkers() {
    return Math.max(1, Math.min(2, Runtime.getRuntime().availableProcessors()));
  }

  Result run(Plan start, double rootBound) {
    incumbent = start;
    // far above any gain of one more variant, so the artificials of count rows leave the master once
    // pricing can meet the counts; the bounds do not depend on it
    artificialCost = 10 * (Math.abs(rootBound) + Math.abs(start.value()) + terms.introductionCost() + 1);
    Arrays.fill(running, Double.NaN);
    open.add(TreeNode.root(rootBound, pool.pinned()));
    List<Thread> threads = new ArrayList<>();
    for (int w = 1; w < running.length; w++) {
      int id = w;
      Thread t = new Thread(() -> work(id), "mixwright-tree-" + w);
      t.setDaemon(true);
      threads.add(t);
      t.start();
    }
    work(0);
    for (Thread t : threads) {
      try {
        t.join();
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }
    Throwable failed = failure.get();
    if (failed instanceof RuntimeException re) {
      throw re;
    }
    if (failed instanceof Error er) {
      throw er;
    }
    synchronized (lock) {
      double bound = Math.max(Math.max(incumbent.value(), prunedMax), retiredMax());
      for (TreeNode n : open) {
        bound = Math.max(bound, n.bound());
      }
      for (TreeNode n : stuck) {
        bound = Math.max(bound, n.bound());
      }
      boolean closed = open.isEmpty() && stuck.isEmpty() && stopReason.isEmpty();
      String reason = closed ? "" : !stopReason.isEmpty()
          ? stopReason + " with " + (open.size() + stuck.size()) + " nodes of the branch-and-price tree open"
          : stuckReason;
      int[] proof = proofSet().stream().mapToInt(Integer::intValue).sorted().toArray();
      // what a portfolio outside the proof set is worth at most: pruned, or below a retirement's floor
      double floor = Math.max(incumbent.value(), prunedMax);
      for (Retired r : retired) {
        floor = Math.max(floor, r.floor());
      }
      return new Result(incumbent, bound, closed, nodes, open.size() + stuck.size(), running.length, reason, proof,
          retired.size(), floor, segmentSplits.get(), pairSplits.get(), reopened, closedByMip);
    }
  }

  /** How far above the incumbent a bound may lie and be pruned: the stage's proof rule ({@link ValueBound#slack}). */
  private double tolerance(double value) {
    return ValueBound.slack(value, settings.gap(), terms.gapFloor());
  }

  /** True when a node of this bound cannot hold a portfolio better than the incumbent by more than the gap. */
  private boolean prunable(double bound) {
    return bound <= incumbent.value() + tolerance(incumbent.value());
  }

  private void work(int id) {
    try (Worker w = new Worker()) {
      while (true) {
        TreeNode node;
        synchronized (lock) {
          while (true) {
            Optional<String> why = stop.check(clock.now((int) Math.min(Integer.MAX_VALUE, nodes)));
            if (why.isPresent() && stopReason.isEmpty()) {
              stopReason = why.get();
            }
            if (!stopReason.isEmpty() || failure.get() != null) {
              lock.notifyAll();
              return;
            }
            if (!retireClosed && !open.isEmpty() && open.peek().bound() < retiredMax()) {
              reopen();
            }
            node = open.poll();
            if (node != null) {
              if (prunable(node.bound())) {
                prunedMax = Math.max(prunedMax, node.bound());
                continue;
              }
              break;
            }
            if (!anyRunning()) {
              lock.notifyAll();
              return;
            }
            try {
              lock.wait(50);
            } catch (InterruptedException e) {
              Thread.currentThread().interrupt();
              return;
            }
          }
          running[id] = node.bound();
          nodes++;
        }
        List<TreeNode> children = w.solve(node);
        synchronized (lock) {
          running[id] = Double.NaN;
          open.addAll(children);
          lock.notifyAll();
        }
      }
    } catch (RuntimeException | Error e) {
      failure.compareAndSet(null, e);
      synchronized (lock) {
        lock.notifyAll();
      }
    }
  }

  /**
   * The retired nodes hold the tree's bound while nodes below them are still open: the tree will not
   * close soon, so the MIP over the proof set that would decide them is not in sight, and their bound
   * would stay the tree's bound to the end (on the tight family at about 10^12 variants, 15,565 EUR above
   * the incumbent against 3,707 for the best open node after 60 s). Every retired node that has
   * decisions left goes back to the open list with its bound, to be branched like any other, and from
   * then on only nodes with nothing left to branch on retire. The proof set, its floor and the
   * retired bound are then those of the nodes that stay retired. Called under the lock.
   */
  private void reopen() {
    for (Retired r : retired) {
      if (r.gated()) {
        open.add(r.node());
        reopened++;
      }
    }
    retired.removeIf(Retired::gated);
    retireClosed = true;
  }

  /** The retired nodes' largest bound (−∞ for none). Called under the lock. */
  private double retiredMax() {
    double m = Double.NEGATIVE_INFINITY;
    for (Retired r : retired) {
      m = Math.max(m, r.node().bound());
    }
    return m;
  }

  /**
   * The proof set: the pool variants of every retired node that could be part of a better portfolio
   * there. Called under the lock.
   */
  private Set<Integer> proofSet() {
    Set<Integer> out = new HashSet<>();
    for (Retired r : retired) {
      out.addAll(r.members());
    }
    return out;
  }

  private boolean anyRunning() {
    for (double r : running) {
      if (!Double.isNaN(r)) {
        return true;
      }
    }
    return false;
  }

  /** The bound of every node in the tree now, for progress: open, running and pruned within the gap. */
  private double globalBound() {
    double b = Math.max(Math.max(incumbent.value(), prunedMax), retiredMax());
    for (TreeNode n : open) {
      b = Math.max(b, n.bound());
    }
    for (TreeNode n : stuck) {
      b = Math.max(b, n.bound());
    }
    for (double r : running) {
      if (!Double.isNaN(r)) {
        b = Math.max(b, r);
      }
    }
    return b;
  }

  /** Offers a feasible plan as the incumbent; true when it is better. */
  private boolean offer(Plan p, String how) {
    if (p == null) {
      return false;
    }
    synchronized (lock) {
      if (p.value() <= incumbent.value() + 1e-9 * (1 + Math.abs(incumbent.value()))) {
        return false;
      }
      incumbent = p;
      listener.event(new PortfolioEvent(PortfolioEvent.Kind.INCUMBENT, clock.elapsedMs(), p.value(), globalBound(),
          pool.size(), p.members().length, how));
      return true;
    }
  }

  /**
   * One worker's master and pricer; a node at a time.
   *
   * <p>The master is restricted: it holds the node's offered variants and the free pool variants that
   * sold (y &gt; 0) at one of the worker's last few nodes ({@link NodeMasters}), not the whole pool. The
   * node bound still covers the whole space, because every pool variant the master does not hold is
   * priced directly from its stored figures (its own caps, β = 0: {@link ChoicePrices}, the same
   * valuation the pricer gives a variant outside the master), and the pricer excludes exactly the pool
   * variants priced so ({@code pool.keysBelow(n)}), so every variant is listed once. A pool variant
   * outside the master whose ψ pays under the node's duals enters it, as a priced one does (column
   * generation with the pool as its first, cheap, pricing source). The master is kept from node to node
   * (GLOP warm-starts from the last basis) and rebuilt when the variants it holds for nothing (barred at
   * the node, or idle) outnumber the live ones: MPSolver copies the whole model into GLOP at every
   * solve, so dead blocks cost time at every solve even at y = 0.
   */
  private final class Worker implements AutoCloseable {
    private PortfolioLp lp = choosing(new PortfolioLp(terms.capacity(), terms.demand(), cap));
    private final VariantPricer pricer = new VariantPricer(space, terms, Long.MAX_VALUE).stopWhen(clock.signalFlag());
    /** Pool index of each block of the master, in the order added. */
    private int[] poolOf = new int[64];
    /** The last node (of this worker's count) at which each block sold or was offered. */
    private long[] usedAt = new long[64];
    private int blocks;
    /** Block of each pool variant, −1 outside the master; grown with the pool. */
    private int[] blockOf = new int[0];
    private long stamp;
    /** Blocks whose y bounds the last node set. */
    private final Set<Integer> fixed = new HashSet<>();
    /** Count row per flat choice and per segment (−1 until needed) and of the total; rows keep their variants for good. */
    private final int[] rowOf = new int[space.totalChoices()];
    private final int[] segmentRow = new int[space.segmentCount()];
    private int totalRow = -1;
    /** Count row per pair key ({@link TreeNode#pairKey}), made on first use. */
    private final java.util.Map<Integer, Integer> pairRow = new java.util.HashMap<>();
    private final Set<Integer> boundedRows = new HashSet<>();
    /** The node's count ranges, per row: lo, hi (hi = +∞ for none). */
    private final java.util.Map<Integer, double[]> ranges = new java.util.HashMap<>();

    Worker() {
      Arrays.fill(rowOf, -1);
      Arrays.fill(segmentRow, -1);
    }

    private PortfolioLp choosing(PortfolioLp fresh) {
      fresh.reserveRows(); // blocks enter node after node: keep GLOP's warm start
      fresh.presolve(); // bounds change from node to node, many blocks sit fixed: presolve removes them
      pool.choice().enter(fresh);
      pool.choice().envelope().sync(fresh); // the tangents found so far: every block entering joins those of its segments
      // a node's solve must not outlast the stage: GLOP gets the time left, and a node cut off is parked
      fresh.stopAt(deadlineNanos);
      return fresh;
    }

    private int blockOf(int i) {
      return i < blockOf.length ? blockOf[i] : -1;
    }

    /** A fresh master holding the given pool variants, with the node's decisions. */
    private void rebuild(TreeNode node, int[] keep) {
      lp.close();
      lp = choosing(new PortfolioLp(terms.capacity(), terms.demand(), cap));
      Arrays.fill(blockOf, -1);
      blocks = 0;
      Arrays.fill(rowOf, -1);
      Arrays.fill(segmentRow, -1);
      pairRow.clear();
      totalRow = -1;
      boundedRows.clear();
      fixed.clear();
      for (int i : keep) {
        enter(i);
      }
      fix(node);
    }

    /** The pool variants of the master's blocks, in block order. */
    private int[] held() {
      return Arrays.copyOf(poolOf, blocks);
    }

    /** Adds pool variant i as a new block (in every count row it belongs to); returns the block. */
    private int enter(int i) {
      int b = blockOf(i);
      if (b >= 0) {
        return b;
      }
      PoolVariant v = pool.get(i);
      // a variant of today's range carries its own fixed cost: none when pinned, −discontinue otherwise
      b = lp.addVariant(v.segments(), v.margin(), v.use(), v.upper(), v.fixedCost(), terms.minLot());
      pool.choice().attract(lp, b, v);
      if (totalRow >= 0) {
        lp.addToCount(totalRow, b);
      }
      for (int g = 0; g < v.choices().length; g++) {
        int r = rowOf[space.offset(g) + v.choices()[g]];
        if (r >= 0) {
          lp.addToCount(r, b);
        }
      }
      for (int s : v.segments()) {
        if (segmentRow[s] >= 0) {
          lp.addToCount(segmentRow[s], b);
        }
      }
      for (java.util.Map.Entry<Integer, Integer> e : pairRow.entrySet()) {
        if (inPair(v, e.getKey())) {
          lp.addToCount(e.getValue(), b);
        }
      }
      if (b == poolOf.length) {
        poolOf = Arrays.copyOf(poolOf, 2 * b);
        usedAt = Arrays.copyOf(usedAt, 2 * b);
      }
      poolOf[b] = i;
      usedAt[b] = stamp;
      if (i >= blockOf.length) {
        int old = blockOf.length;
        blockOf = Arrays.copyOf(blockOf, Math.max(i + 1, 2 * old + 64));
        Arrays.fill(blockOf, old, blockOf.length, -1);
      }
      blockOf[i] = b;
      blocks = b + 1;
      return b;
    }

    /**
     * Before a node: a first master holds every free pool variant; later ones keep the blocks that
     * sold lately, and are rebuilt when the dead ones (barred here, or idle) outnumber the live ones
     * by more than the policy's slack ({@link NodeMasters}).
     */
    private void prepare(TreeNode node) {
      stamp++;
      if (blocks == 0 && masters.seedWithPool()) {
        int n = pool.size();
        List<Integer> all = new ArrayList<>();
        for (int i = 0; i < n; i++) {
          if (!node.isBarred(i)) {
            all.add(i);
          }
        }
        rebuild(node, all.stream().mapToInt(Integer::intValue).toArray());
        return;
      }
      List<Integer> live = new ArrayList<>();
      for (int b = 0; b < blocks; b++) {
        int i = poolOf[b];
        if (node.isOffered(i) || !node.isBarred(i) && usedAt[b] >= stamp - masters.keepNodes()) {
          live.add(i);
        }
      }
      if (blocks - live.size() > live.size() + masters.deadSlack()) {
        for (int i : node.offered()) {
          if (blockOf(i) < 0) {
            live.add(i);
          }
        }
        rebuild(node, live.stream().mapToInt(Integer::intValue).toArray());
      } else {
        fix(node);
      }
    }

    /**
     * The count row of a key (a flat choice, {@link TreeNode#TOTAL} for all, a segment's key or a pair's),
     * made on first use over the master's variants.
     */
    private int row(int choice) {
      int ps = TreeNode.pairSegment(choice);
      if (ps >= 0) {
        Integer r = pairRow.get(choice);
        if (r == null) {
          r = lp.addCountRow(artificialCost);
          for (int b = 0; b < blocks; b++) {
            if (inPair(pool.get(poolOf[b]), choice)) {
              lp.addToCount(r, b);
            }
          }
          pairRow.put(choice, r);
        }
        return r;
      }
      int seg = TreeNode.segmentOf(choice);
      if (seg >= 0) {
        if (segmentRow[seg] < 0) {
          segmentRow[seg] = lp.addCountRow(artificialCost);
          for (int b = 0; b < blocks; b++) {
            if (Arrays.binarySearch(pool.get(poolOf[b]).segments(), seg) >= 0) {
              lp.addToCount(segmentRow[seg], b);
            }
          }
        }
        return segmentRow[seg];
      }
      if (choice == TreeNode.TOTAL) {
        if (totalRow < 0) {
          totalRow = lp.addCountRow(artificialCost);
          for (int b = 0; b < blocks; b++) {
            lp.addToCount(totalRow, b);
          }
        }
        return totalRow;
      }
      if (rowOf[choice] < 0) {
        rowOf[choice] = lp.addCountRow(artificialCost);
        for (int b = 0; b < blocks; b++) {
          if (TreeNode.uses(pool.get(poolOf[b]).choices(), choice, space.offsets())) {
            lp.addToCount(rowOf[choice], b);
          }
        }
      }
      return rowOf[choice];
    }

    /** True when pool variant v counts in the pair row of {@code key}: its segment accepts v, and v uses its choice. */
    private boolean inPair(PoolVariant v, int key) {
      return Arrays.binarySearch(v.segments(), TreeNode.pairSegment(key)) >= 0
          && TreeNode.uses(v.choices(), TreeNode.pairChoice(key), space.offsets());
    }

    private void fix(TreeNode node) {
      for (int b : fixed) {
        lp.fixIntroduction(b, 0, 1);
      }
      fixed.clear();
      for (int i : node.offered()) {
        int b = enter(i);
        lp.fixIntroduction(b, 1, 1);
        fixed.add(b);
      }
      for (int i : node.barred()) {
        int b = blockOf(i);
        if (b >= 0) {
          lp.fixIntroduction(b, 0, 0);
          fixed.add(b);
        }
      }
      for (int r : boundedRows) {
        lp.setCountBounds(r, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
      }
      boundedRows.clear();
      ranges.clear();
      for (TreeNode.Count c : node.counts()) {
        int[] range = node.range(c.choice());
        double hi = range[1] == Integer.MAX_VALUE ? Double.POSITIVE_INFINITY : range[1];
        int r = row(c.choice());
        lp.setCountBounds(r, range[0], hi);
        boundedRows.add(r);
        ranges.put(c.choice(), new double[] {range[0], hi});
      }
    }

    /** Solves a node; returns its children (none when it is pruned or closed). */
    List<TreeNode> solve(TreeNode node) {
      int[] total = node.range(TreeNode.TOTAL);
      int limit = Math.min(cap, total[1]);
      int freeCap = limit == PortfolioTerms.UNLIMITED ? limit : limit - node.offered().length;
      if (freeCap < 0 || total[0] > limit) {
        return List.of();
      }
      prepare(node);
      NodeLp relaxed = relax(node, freeCap);
      return relaxed.ended() != null ? relaxed.ended() : branch(node, relaxed);
    }

    /**
     * The node's relaxation, priced until no variant of the whole space pays under the node's
     * duals (or the node is pruned or parked, then {@code ended} holds its children: none or itself).
     */
    private NodeLp relax(TreeNode node, int freeCap) {
      double best = node.bound();
      int k = Math.max(settings.perRound(), cap == PortfolioTerms.UNLIMITED ? BOUND_DEPTH : Math.min(cap, BOUND_DEPTH));
      double offeredTooling = offeredTooling(node);
      NodeProbe last = null;
      int round = 0;
      int cheapRounds = 0;
      int tangentRounds = 0;
      while (true) {
        round++;
        pool.choice().envelope().sync(lp); // tangents other workers found meanwhile
        PortfolioLpSolution sol = lp.solve();
        if (sol.status() == LpStatus.FAILED) {
          // GLOP gave up from its warm start (seen once in a deep node): the same master built afresh
          rebuild(node, held());
          sol = lp.solve();
        }
        if (sol.status() == LpStatus.INFEASIBLE) {
          return NodeLp.ending(List.of()); // the offered variants' lots do not fit: no portfolio in this node
        }
        if (!sol.isOptimal()) {
          return NodeLp.ending(park(node, best, "the relaxation of a node ended " + sol.status() + " in GLOP"));
        }
        for (int b = 0; b < blocks; b++) {
          if (sol.y()[b] > 0) {
            usedAt[b] = stamp;
          }
        }
        double entry = sol.limitDual() + 1e-9 * (1 + Math.abs(sol.objective()));
        CountPrices cp = countPrices();
        PoolValues values = poolValues(node, sol.resourceDual(), sol.segmentDual(), cp, offeredTooling);
        if (cheapRounds < CHEAP_ROUNDS && enterPaying(node, values.psi(), entry) > 0) {
          // the pool outside the master still pays: re-solve before the exact pricer proves the rest
          cheapRounds++;
          Optional<String> why = stop.check(clock.now(round));
          if (why.isPresent()) {
            return NodeLp.ending(park(node, best, why.get()));
          }
          continue;
        }
        NodeProbe probe = probe(values, sol.resourceDual(), sol.segmentDual(), cp, k, freeCap);
        if (probe.bound.value() < best) {
          best = probe.bound.value();
          last = probe;
        } else if (last == null) {
          last = probe;
        }
        synchronized (lock) {
          if (prunable(best)) {
            prunedMax = Math.max(prunedMax, best);
            return NodeLp.ending(List.of());
          }
        }
        int added = enterPaying(node, probe.psi, entry);
        int found = 0;
        for (PricedVariant f : probe.found) {
          if (f.reducedCost() > entry && found < settings.perRound()) {
            int at = pool.indexOrAdd(f.choices());
            found++;
            if (at >= 0 && blockOf(at) < 0) {
              enter(at);
              added++;
            }
          }
        }
        if (added == 0 && probe.exact) {
          if (tangentRounds < TANGENT_ROUNDS && pool.choice().envelope().separate(lp, sol) > 0) {
            // priced to the end, and it sells more in a choosing segment than its offer's attraction
            // allows: cut that off and price again (as the stage's relaxation does), the bound so far kept
            tangentRounds++;
            continue;
          }
          return new NodeLp(poolY(sol), best, last, null);
        }
        Optional<String> why = stop.check(clock.now(round));
        if (why.isPresent()) {
          return NodeLp.ending(park(node, best, why.get()));
        }
        if (added == 0) {
          // the pricer was cut short and found nothing new: keep the node with its valid bound
          return NodeLp.ending(park(node, best, "pricing at a node did not finish"));
        }
      }
    }

    /**
     * Enters the free pool variants outside the master whose ψ pays under the node's duals (above
     * {@code entry}, the variant limit's dual), the best {@link #POOL_PER_ROUND} first; returns how many.
     */
    private int enterPaying(TreeNode node, double[] psi, double entry) {
      List<Integer> paying = new ArrayList<>();
      for (int i = 0; i < psi.length; i++) {
        if (psi[i] > entry && blockOf(i) < 0 && !node.isBarred(i)) {
          paying.add(i);
        }
      }
      paying.sort(Comparator.comparingDouble((Integer i) -> psi[i]).reversed());
      int n = Math.min(paying.size(), POOL_PER_ROUND);
      for (int j = 0; j < n; j++) {
        enter(paying.get(j));
      }
      return n;
    }

    /** The solution's y per pool index (0 outside the master). */
    private double[] poolY(PortfolioLpSolution sol) {
      int n = 0;
      for (int b = 0; b < blocks; b++) {
        n = Math.max(n, poolOf[b] + 1);
      }
      double[] y = new double[n];
      for (int b = 0; b < blocks; b++) {
        y[poolOf[b]] = sol.y()[b];
      }
      return y;
    }

    /** After a node's relaxation is proven: an incumbent from it, then its children or its closing. */
    private List<TreeNode> branch(TreeNode node, NodeLp relaxed) {
      double bound = relaxed.best();
      double[] y = relaxed.y();
      heuristic(node, y);
      VariantBranching.Decision d = VariantBranching.choose(node, y, i -> pool.get(i).choices(),
          i -> pool.get(i).segments(), space.segmentCount(), pairSegments, space.offsets(), space.totalChoices());
      if (d == null) {
        // y is integral and every variant at 1 is offered: the node's best portfolio is its offer
        Plan p = FixedPortfolio.solve(pool, terms, node.offered());
        offer(p, "an integral node of the branch-and-price tree");
        synchronized (lock) {
          if (prunable(bound)) {
            prunedMax = Math.max(prunedMax, bound);
            return List.of();
          }
        }
        // nothing left to branch on: its better portfolios, when few, go to the proof set, whose MIP
        // sells whole units when the catalog asks (so this is how a whole-units node gets decided)
        if (retire(node.withBound(bound), relaxed.last(), false)) {
          return List.of();
        }
        return park(node, bound, terms.wholeUnits()
            ? "whole units: a node's relaxation sells fractions, and its offer in whole units stays below its bound"
            : "a node's relaxation stays above the value of its own offer");
      }
      int[] bar = reducedCostFixing(node, relaxed.last());
      TreeNode solved = bar.length == 0 ? node.withBound(bound) : node.barring(bar, bound);
      if (retire(solved, relaxed.last(), true)) {
        return List.of();
      }
      if (!d.onCount() && solved.isBarred(d.variant())) {
        // the barred variant's y was fractional: re-solve the node with the bars (same portfolios of value)
        return List.of(solved);
      }
      if (d.onCount() && TreeNode.segmentOf(d.choice()) >= 0) {
        segmentSplits.incrementAndGet();
      }
      if (d.onCount() && TreeNode.pairSegment(d.choice()) >= 0) {
        pairSplits.incrementAndGet();
      }
      return VariantBranching.children(solved, d, bound);
    }

    /**
     * The duals of the node's count rows as prices: per flat choice (a penalty on variants using it),
     * per segment (a charge on variants it accepts), per (segment, choice) (a charge on the variants the
     * segment accepts that use the choice) and of the total (part of the charge), each clamped to the sign
     * its binding side allows.
     */
    private CountPrices countPrices() {
      double[] pen = new double[space.totalChoices()];
      double[] accept = new double[space.segmentCount()];
      boolean anyAccept = false;
      double[][] pair = null; // made with the first pair row: most nodes have none
      double charge = 0;
      double constant = 0;
      boolean any = false;
      for (java.util.Map.Entry<Integer, double[]> e : ranges.entrySet()) {
        double dual = lp.countDual(row(e.getKey()));
        double lo = e.getValue()[0];
        double hi = e.getValue()[1];
        // value(S) ≤ ... + δ·(side − count(S)): valid when δ ≥ 0 at a finite upper side, δ ≤ 0 at the lower
        if (dual > 0 && !Double.isFinite(hi) || !Double.isFinite(dual)) {
          dual = 0;
        }
        if (dual == 0) {
          continue;
        }
        any = true;
        constant += dual > 0 ? dual * hi : dual * lo;
        if (e.getKey() == TreeNode.TOTAL) {
          charge += dual;
        } else if (TreeNode.pairSegment(e.getKey()) >= 0) {
          if (pair == null) {
            pair = new double[space.segmentCount()][space.totalChoices()];
          }
          pair[TreeNode.pairSegment(e.getKey())][TreeNode.pairChoice(e.getKey())] += dual;
        } else if (TreeNode.segmentOf(e.getKey()) >= 0) {
          accept[TreeNode.segmentOf(e.getKey())] += dual;
          anyAccept = true;
        } else {
          pen[e.getKey()] += dual;
        }
      }
      return new CountPrices(any ? pen : null, anyAccept ? accept : null, charge, constant, pair);
    }

    /** A node that cannot be finished: it keeps its bound in the result, and the tree stays open. */
    private List<TreeNode> park(TreeNode node, double bound, String why) {
      synchronized (lock) {
        if (stop.check(clock.now(0)).isPresent()) {
          open.add(node.withBound(bound));
          if (stopReason.isEmpty()) {
            stopReason = stop.check(clock.now(0)).get();
          }
        } else {
          stuck.add(node.withBound(bound));
          stuckReason = why;
        }
      }
      return List.of();
    }

    /** The node's offered variants and those at y ≥ ½, as a fixed portfolio. */
    private void heuristic(TreeNode node, double[] y) {
      List<Integer> members = new ArrayList<>();
      for (int i : node.offered()) {
        members.add(i);
      }
      for (int i = 0; i < y.length; i++) {
        if (y[i] >= 0.5 && !node.isOffered(i) && !node.isBarred(i)) {
          members.add(i);
        }
      }
      if (members.size() > terms.maxVariants()) {
        return;
      }
      int[] set = members.stream().mapToInt(Integer::intValue).sorted().toArray();
      synchronized (lock) {
        // children of one parent often round to the same portfolio; its fixed-portfolio LP gives the same plan
        if (!rounded.add(Arrays.stream(set).boxed().toList())) {
          return;
        }
      }
      offer(FixedPortfolio.solve(pool, terms, set), "rounding at a node of the branch-and-price tree");
    }

    /**
     * Retires a node whose better portfolios are few to list, instead of branching on it: by the
     * inequality of {@link #reducedCostFixing}, a portfolio of the node worth more than the incumbent
     * holds its offered variants and only free variants w with B(λ̂) − (λ̂ − ψ(w))⁺ − tooling(w) above
     * the incumbent, i.e. ψ(w) &gt; θ = z − B(λ̂) + λ̂ outside the master (tooling left out there: a
     * superset). When the exact pricer lists all of those outside the master within {@link
     * #RETIRE_LIMIT}, they join the pool and, with the node's passing pool variants, the proof set:
     * every better portfolio of the node lies in it, so a MIP over the proof set bounds the node (the
     * quick proof of {@link IntegerStage} at the node's own prices, which are tighter than the root's).
     * The node's bound stays in the tree's bound until that MIP has run. Skipped while the node's
     * bound lies more than two introduction costs above the incumbent: every variant whose reduced
     * costs are all near 0 is worth about −F, so the survivors are then as many as such variants (on
     * the range demo 25,909 at a gap of 1.6·F at the root's prices, 59 at 1·F); the listing gets a
     * quarter of a second. A node with decisions left ({@code gated}) retires only with at most
     * {@link #RETIRE_LIMIT} members in all ({@link Retirement}), and not once retired nodes went back
     * to the open list ({@link #reopen}). A node with nothing left to branch on ({@code gated} false)
     * is tried whatever its gap: the listing is its only way to be decided, and it is tried once.
     */
    private boolean retire(TreeNode node, NodeProbe probe, boolean gated) {
      if (probe == null || !probe.bound.isFinite() || !probe.exact) {
        return false;
      }
      double z;
      synchronized (lock) {
        z = incumbent.value() + tolerance(incumbent.value());
        if (proofSet().size() >= settings.survivorLimit() || gated && retireClosed) {
          return false;
        }
      }
      LagrangianPortfolioBound b = probe.bound;
      double f = terms.introductionCost();
      if (gated && f > 0 && b.valueAtLambda() - z > retirement.gate() * f) {
        return false;
      }
      List<Integer> members = new ArrayList<>();
      for (int i : node.offered()) {
        members.add(i);
      }
      members.addAll(freeByTest(node, probe, z, true));
      if (gated && members.size() > retirement.members()) {
        // its pool variants that pass are many already: a MIP over them would not decide the node soon
        // (the dense family's root, 1,578 of them, where the quick proof's MIP over the same set had not
        // finished in 24 s), so it is branched without the listing
        return false;
      }
      double theta = z - b.valueAtLambda() + b.lambda();
      long soon = System.nanoTime() + 250_000_000L;
      VariantQuery q = b.query(probe.query.charge(), probe.query.penalty(), theta - 1e-7 * (1 + Math.abs(z)),
          RETIRE_LIMIT + 1, pool.keysBelow(probe.psi.length), deadlineNanos == 0 ? soon : Math.min(deadlineNanos, soon))
          .withAcceptCharge(probe.query.acceptCharge()).withPairCharge(probe.query.pairCharge());
      PricingOutcome out = pricer.price(q);
      if (!out.exact() || out.found().size() > RETIRE_LIMIT) {
        return false;
      }
      for (PricedVariant w : out.found()) {
        int at = pool.indexOrAdd(w.choices());
        if (at >= 0) {
          members.add(at);
        }
      }
      if (gated && members.size() > retirement.members()) {
        return false; // too many with the listed ones
      }
      if (memberMip != null) {
        // every portfolio of the node worth more than z is made of the members and offers the node's
        // offered variants (counts left out: a larger set), so the MIP over them, kept to portfolios worth
        // at least z, bounds the node's better portfolios; infeasible, the node holds none
        long ms = deadlineNanos == 0 ? MEMBER_MIP_MS
            : Math.min(MEMBER_MIP_MS, (deadlineNanos - System.nanoTime()) / 4_000_000L);
        MemberMip.Result r = ms > 1
            ? memberMip.solve(members.stream().mapToInt(Integer::intValue).distinct().toArray(), node.offered(), ms, z)
            : null;
        if (r != null) {
          if (r.plan() != null) {
            offer(r.plan(), "MIP over a retired node's members");
          }
          double now;
          synchronized (lock) {
            now = incumbent.value() + tolerance(incumbent.value());
          }
          // portfolios of the node worth at most z are worth at most the incumbent; the others at most
          // the MIP's bound, which its own portfolio may have just made the incumbent
          if (r.bound() <= Math.max(z, now)) {
            synchronized (lock) {
              prunedMax = Math.max(prunedMax, r.bound());
              closedByMip++;
            }
            return true;
          }
          node = node.withBound(Math.min(node.bound(), r.bound()));
        }
      }
      synchronized (lock) {
        Set<Integer> grown = proofSet();
        grown.addAll(members);
        if (grown.size() > settings.survivorLimit()) {
          return false;
        }
        if (gated && retireClosed) {
          return false; // retired nodes went back to the open list while this one was listed
        }
        retired.add(new Retired(node, z, List.copyOf(members), gated));
      }
      return true;
    }

    /** Free pool variants that cannot be part of a better portfolio in this node's subtree. */
    private int[] reducedCostFixing(TreeNode node, NodeProbe probe) {
      if (probe == null || !probe.bound.isFinite()) {
        return new int[0];
      }
      double z;
      synchronized (lock) {
        z = incumbent.value() + tolerance(incumbent.value());
      }
      return freeByTest(node, probe, z, false).stream().mapToInt(Integer::intValue).toArray();
    }

    /**
     * The free pool variants of the master that pass ({@code passing}) or fail the test
     * bound-with-w − tooling(w) &gt; z at the probe's prices, tooling counted beyond what the node's
     * offered variants pay already.
     */
    private List<Integer> freeByTest(TreeNode node, NodeProbe probe, double z, boolean passing) {
      List<Integer> out = new ArrayList<>();
      Set<Integer> paid = offeredTools(node);
      for (int i = 0; i < probe.psi.length; i++) {
        if (node.isOffered(i) || node.isBarred(i)) {
          continue;
        }
        double extra = 0;
        for (int t : pool.get(i).tools()) {
          if (!paid.contains(t)) {
            extra += terms.choiceCost()[t];
          }
        }
        if ((probe.bound.withVariant(probe.psi[i]) - extra > z) == passing) {
          out.add(i);
        }
      }
      return out;
    }

    /**
     * The first n pool variants valued at prices (π, μ) and the count rows' prices: ψ of each (with
     * its attraction rows' β when the master holds it, β = 0 otherwise; −∞ when barred), and the
     * constant of the node bound with the offered ones' ψ in it. With today's range, each current
     * variant carries its own fixed cost in its ψ and −Σ discontinue costs enters the constant once.
     */
    private PoolValues poolValues(TreeNode node, double[] pi, double[] mu, CountPrices cp, double offeredTooling) {
      int n = pool.size();
      ChoicePrices beta = ChoicePrices.of(lp, blocks);
      double constant = terms.rowValue(pi, mu) + beta.constant(terms, mu) + cp.constant() - offeredTooling
          + pool.current().constant();
      double[] psi = new double[n];
      for (int i = 0; i < n; i++) {
        if (node.isBarred(i)) {
          psi[i] = Double.NEGATIVE_INFINITY;
          continue;
        }
        PoolVariant v = pool.get(i);
        psi[i] = beta.psi(space.offsets(), v, blockOf(i), pi, mu, v.fixedCost() + cp.charge(), cp.penalty(),
            terms.minLot()) - acceptCharge(v, cp.accept())
            - VariantQuery.pairChargeOf(cp.pair(), v.choices(), space.offsets(),
                s -> Arrays.binarySearch(v.segments(), s) >= 0);
        if (node.isOffered(i)) {
          constant += psi[i];
        }
      }
      return new PoolValues(psi, constant, node, beta);
    }

    /**
     * The Lagrangian bound of the node: the pool's values, and one pricing call for the rest of the
     * space, which excludes exactly the pool variants valued.
     */
    private NodeProbe probe(PoolValues values, double[] pi, double[] mu, CountPrices cp, int k, int freeCap) {
      double[] psi = values.psi();
      int n = psi.length;
      double[] column = values.prices().columnPrice(mu);
      VariantQuery q = new VariantQuery(pi, column, terms.introductionCost() + cp.charge(), cp.penalty(), 0.0, k,
          pool.keysBelow(n), deadlineNanos).withAcceptCharge(cp.accept()).withPairCharge(cp.pair())
          .withAttractionBonus(values.prices().attractionBonus());
      PricingOutcome out = pricer.price(q);
      double[] listed = new double[n + out.found().size()];
      int m = 0;
      for (int i = 0; i < n; i++) {
        if (psi[i] > Double.NEGATIVE_INFINITY && !values.offered(i)) {
          listed[m++] = psi[i];
        }
      }
      for (PricedVariant f : out.found()) {
        listed[m++] = f.reducedCost();
      }
      LagrangianPortfolioBound b = LagrangianPortfolioBound.of(values.constant(), Arrays.copyOf(listed, m),
          out.restBound(), freeCap, pi.clone(), column.clone()).withAttractionBonus(q.attractionBonus());
      return new NodeProbe(b, psi, out.found(), out.exact(), q);
    }

    /** Σ of the segment charges over the segments that accept v (0 for none). */
    private double acceptCharge(PoolVariant v, double[] accept) {
      double c = 0;
      if (accept != null) {
        for (int s : v.segments()) {
          c += accept[s];
        }
      }
      return c;
    }

    private double offeredTooling(TreeNode node) {
      double t = 0;
      for (int f : offeredTools(node)) {
        t += terms.choiceCost()[f];
      }
      return t;
    }

    private Set<Integer> offeredTools(TreeNode node) {
      Set<Integer> tools = new HashSet<>();
      for (int i : node.offered()) {
        for (int f : pool.get(i).tools()) {
          tools.add(f);
        }
      }
      return tools;
    }

    @Override
    public void close() {
      lp.close();
    }
  }

  /**
   * Prices of a node's count rows: penalty per flat choice and charge per accepting segment (null for
   * none), added charge, and Σ δ·side.
   */
  private record CountPrices(double[] penalty, double[] accept, double charge, double constant, double[][] pair) {}

  /** ψ of the first n pool variants at a node's prices (−∞ when barred), and the bound's constant with the offered ones in it. */
  private record PoolValues(double[] psi, double constant, TreeNode node, ChoicePrices prices) {
    boolean offered(int i) {
      return node.isOffered(i);
    }
  }

  /** A node bound with the ψ of the master's variants at its prices, and what the pricer found outside. */
  private record NodeProbe(LagrangianPortfolioBound bound, double[] psi, List<PricedVariant> found, boolean exact,
      VariantQuery query) {}

  /**
   * A node's relaxation: its last solution's y per pool index, the best bound of its rounds and the
   * probe that gave it; or, when the node ended before its relaxation was proven, the children it ends with.
   */
  private record NodeLp(double[] y, double best, NodeProbe last, List<TreeNode> ended) {
    static NodeLp ending(List<TreeNode> children) {
      return new NodeLp(null, Double.NaN, null, children);
    }
  }
}
