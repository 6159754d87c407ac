package dev.mixwright.portfolio;

import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.pricing.ReducedCosts;
import dev.mixwright.space.BestFirst;
import dev.mixwright.space.ForwardChecker;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.SearchOrder;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.PriorityQueue;
import java.util.Set;
import java.util.function.BooleanSupplier;

/**
 * Exact k-best pricing of whole variants for the portfolio relaxation: maximise ψ(v) of
 * {@link VariantQuery} over every buildable variant, all segments at once.
 *
 * <p>Depth-first branch-and-bound over the groups in the order of {@link SearchOrder}, the groups that
 * decide the query's charges first ({@link #orderGroups}), with the rules
 * propagated by {@link ForwardChecker} as in {@link dev.mixwright.pricing.ForwardCheckingPricer}: once
 * all groups of a nogood but its last are assigned to member choices, the last group's member choices
 * leave its domain.
 * Bound of a partial variant: per segment s an optimistic reduced cost ub_s = (assigned part of d_s)
 * + Σ over unassigned groups of their best remaining weight in s (−∞ once an assigned choice is not
 * accepted by s, or some unassigned group has nothing left that s accepts); then g(ub) − charge −
 * (assigned penalties + Σ of the smallest remaining penalty per unassigned group). It is valid because
 * every completion has d_s ≤ ub_s per segment and g is nondecreasing in each argument ({@link
 * LotValue}). Children are tried best bound first, so the first child whose bound cannot beat the
 * cutoff (the threshold, or the k-th best value once k are held) ends the loop. Excluded variants are
 * skipped only at leaves, so bounds stay bounds on every non-excluded variant below a node.
 *
 * <p>Acceptance charges δ_s (a tree node's segment counts, {@link VariantQuery#acceptCharge}) stay
 * optimistic at inner nodes: a charge (δ_s &gt; 0) is taken in full only where every completion is
 * accepted by s (no assigned choice rejected, and every remaining choice of every unassigned group
 * accepted), a bonus (δ_s &lt; 0) wherever some completion may still be accepted (ub_s finite); leaves
 * take them exactly. Where s may accept or reject, the charge taken is min(δ_s, u_s·max(0, ub_s)): a
 * completion that s rejects is worth at most g(ub with ub_s = −∞) ≤ g(ub) − u_s·max(0, ub_s), because
 * adding x_s = u_s where ub_s &gt; 0 to the optimum of the former is feasible in the latter (the lot is
 * a covering row); so with R the charged segments that reject a completion, its value is at most g(ub)
 * − Σ_{s∈R} u_s·max(0, ub_s) − Σ_{s∉R} δ_s ≤ g(ub) − Σ_s min(δ_s, u_s·max(0, ub_s)). And since some
 * segment accepts every completion worth anything (g is −∞ for a variant no segment takes), one of the
 * segments that may still accept pays its charge in full: the bound also takes the least of δ_s −
 * min(δ_s, u_s·max(0, ub_s)) over them (0 once some segment certainly accepts, or carries a bonus or no
 * charge). Bonuses (δ_s &lt; 0) are taken for the best set of segments that can still accept together:
 * every unassigned group must have a choice left that all of them accept ({@link #jointAcceptance};
 * rules left out, so a superset). On the range demo a node's charges of about 5·10^5 on every segment
 * made one pricing call take 22 s (161 million search nodes) to find nothing, and bonuses of 3.5·10^9
 * on three segments, two of which accept disjoint capacities, one of 14.5 s; with both terms no call
 * without bonuses took more than 0.3 s in the runs measured, and those with bonuses 1–5 s
 * (docs/portfolio.md, "A search order per pricing query"). Choice penalties are followed the same
 * way ({@link #penaltyAhead}): the completion's choices must all be accepted by one segment.
 *
 * <p>Pair charges δ_sf (a tree node's count of the variants s accepts that use choice f, {@link
 * VariantQuery#pairCharge}) are simpler and looser: inside the search a charge (δ_sf &gt; 0) is taken
 * only where f is assigned and acceptance by s certain, a bonus (δ_sf &lt; 0) wherever s may still
 * accept and f is assigned or its group still open with f usable ({@link #pairCharges}); leaves take
 * them exactly. Every completion pays at least the charges taken and collects at most the bonuses
 * taken, so the bound stays a bound. Their groups count in the search order like the penalties.
 *
 * <p>Segments that choose (multinomial logit) cap a variant's sales by its own logit cap: x_sv ≤ U_sv =
 * buyers_s·w/(1+w), w = exp(u_s(v) − stayOut_s), in every portfolio (docs/portfolio.md, "Segments
 * that choose"). A leaf and {@link #value} use cap_s = min(column bound, U_sv) with the variant's own
 * utility ({@link ChoiceRows#capOf}, the computation the pool variants use). Inside the tree the cap
 * comes from an optimistic utility: (assigned part of u_s) + Σ over unassigned groups of the best
 * utility among their remaining choices that s may use (a completion using another choice has d_s =
 * −∞ and no sales in s). The cap is increasing in the utility ({@link ChoiceRows#capAt}) and g is
 * nondecreasing in every cap as well as in every reduced cost (a larger cap only widens the feasible
 * set), so g(ub_d, ub_cap) ≥ g(d(v), cap(v)) for every completion v: the node bound stays a bound.
 * The acceptance charge's loss term takes the same optimistic caps, the ones g was evaluated with.
 * Across scenarios each (scenario, segment) pair takes its own scenario's utilities and buyers, as
 * the scenario masters' pool variants do.
 *
 * <p>Cost per node O(S · Σ_g d_g) for the bounds; worst case exponential in the number of groups
 * (pricing under exclusion rules is NP-hard already for one segment: maximum-weight independent set
 * reduces to it, Garey &amp; Johnson GT20). With a node limit or deadline the search stops early; the
 * rest bound is then also at least the bound of every unexplored sibling along the current path.
 *
 * <p>Across n scenarios (a range chosen for a scenario set) the "segments" are the n·S pairs
 * (scenario, segment) and the value sums g per scenario; each g_k is nondecreasing in its own
 * arguments, so the per-pair optimistic bounds still give an optimistic sum. Cost per node then
 * O(n · S · Σ_g d_g).
 *
 * <p>Not thread-safe: per-query state lives in arrays allocated once per pricer.
 */
public final class VariantPricer {
  private final VariantSpace space;
  private final List<VariantSpace> spaces;
  private final List<PortfolioTerms> termsOf;
  private final long nodeLimit;
  private final int groups;
  /** Segments per scenario, scenarios, and their product: the pairs the search bounds. */
  private final int perScenario;
  private final int scenarios;
  private final int segments;
  private final int[] offset;
  private final int[] staticOrder;
  /** The current query's group order ({@link #orderGroups}) and its forward checker. */
  private int[] order;
  private ForwardChecker rules;
  private final int[] nextOrder;
  private final double[] decides;
  /** Most segments with an acceptance bonus whose joint acceptance the bound follows ({@link #bonusSets}). */
  private static final int BONUS_SEGMENTS = 6;
  /** [mask]: the set of subsets of mask, as bits of a long (bit T for subset T), masks of up to 6 bits. */
  private static final long[] SUBSETS = subsets();
  private final int[] bonusSeg;
  private int bonusCount;
  private final int[] bonusMask; // [flat]: bit j when bonus segment j accepts the choice
  private final double[] bonusSum = new double[1 << BONUS_SEGMENTS]; // [T]: Σ |δ_s| over the subset
  /** The query has penalties: {@link #penaltyAhead} follows them per segment. */
  private boolean penalized;
  private final double[] penRestIn; // [segment]: Σ over the unassigned groups of the least penalty s accepts
  private final boolean[] usable;

  private final double[][] partial; // [depth][segment]: Σ of the assigned weights (finite ones)
  private final boolean[][] dead; // [depth][segment]: an assigned choice is not accepted there
  private final double[] penPartial; // [depth]
  private final int[][] cand; // [depth][i]: flat choices of the depth's group, best bound first
  private final double[][] candBound;
  private final double[] rest;
  private final double[] ub;
  private final double[] leafD;
  private final double[] leafU; // [pair]: utilities the caps are taken at (a leaf's, or a node's optimistic ones)
  private final int[] scratch;
  private final int[] v;
  /** [segment]: every remaining choice of the groups after the current depth is accepted there. */
  private final boolean[] sure;
  /** [pair][flat]: utility share of each choice for a choosing pair, null for a fixed one. */
  private final double[][] util;
  private final double[] baseCap; // [pair]: the terms' column bound
  private final double[][] utilPartial; // [depth][pair]: Σ of the assigned utility shares
  private final double[] restUtil; // [pair]: Σ over later groups of their best usable utility share
  private final double[][] caps; // [scenario][segment]: the caps g is evaluated with
  private final boolean anyChoice;

  private double[][] w;
  private double[] constant;
  private double[] pen;
  private double charge;
  private double[] accCharge;
  /** [pair]: the query's value per unit of attraction ({@link VariantQuery#attractionBonus}); null for none. */
  private double[] attBonus;
  private final double[] attW; // [pair]: the attraction the caps were last taken at ({@link #logitCaps})
  /** The query's nonzero pair charges ({@link VariantQuery#pairCharge}): segment, flat choice, its group, δ. */
  private int[] pairS = new int[0];
  private int[] pairF = new int[0];
  private int[] pairG = new int[0];
  private double[] pairD = new double[0];
  /** [group]: its depth in the current order. */
  private final int[] posOf;
  private double threshold;
  private int k;
  private Set<VariantKey> excluded;
  private PriorityQueue<PricedVariant> top;
  private long nodes;
  private long deadline;
  private BooleanSupplier stop = () -> false;
  private double openBound;

  /**
   * @param nodeLimit most nodes per query, {@code Long.MAX_VALUE} for none; past it the outcome is not
   *     exact but keeps a valid bound
   */
  public VariantPricer(VariantSpace space, PortfolioTerms terms, long nodeLimit) {
    this(List.of(space), List.of(terms), nodeLimit);
  }

  /**
   * Over scenarios: {@code spaces} are one catalog's structure (groups, rules, segments, acceptance)
   * with each scenario's figures, {@code terms} their portfolio terms, aligned.
   */
  public VariantPricer(List<VariantSpace> spaces, List<PortfolioTerms> terms, long nodeLimit) {
    if (nodeLimit < 1) {
      throw new IllegalArgumentException("nodeLimit must be >= 1");
    }
    if (spaces.isEmpty() || spaces.size() != terms.size()) {
      throw new IllegalArgumentException("one set of terms per scenario space, and at least one");
    }
    this.space = spaces.get(0);
    this.spaces = List.copyOf(spaces);
    this.termsOf = List.copyOf(terms);
    this.nodeLimit = nodeLimit;
    groups = space.groupCount();
    perScenario = space.segmentCount();
    scenarios = spaces.size();
    segments = perScenario * scenarios;
    offset = space.offsets();
    int widest = 1;
    for (int g = 0; g < groups; g++) {
      widest = Math.max(widest, space.choiceCount(g));
    }
    staticOrder = SearchOrder.of(space);
    order = staticOrder.clone();
    nextOrder = new int[groups];
    decides = new double[groups];
    bonusSeg = new int[perScenario];
    penRestIn = new double[perScenario];
    bonusMask = new int[space.totalChoices()];
    rules = new ForwardChecker(space, order, ForwardChecker.NO_WATCH);
    usable = new boolean[space.totalChoices()];
    partial = new double[groups + 1][segments];
    dead = new boolean[groups + 1][segments];
    penPartial = new double[groups + 1];
    cand = new int[groups][widest];
    candBound = new double[groups][widest];
    rest = new double[segments];
    ub = new double[segments];
    posOf = new int[groups];
    leafD = new double[segments];
    leafU = new double[segments];
    scratch = new int[perScenario];
    v = new int[groups];
    sure = new boolean[perScenario];
    util = new double[segments][];
    baseCap = new double[segments];
    attW = new double[segments];
    boolean choosing = false;
    for (int k = 0; k < scenarios; k++) {
      for (int s = 0; s < perScenario; s++) {
        baseCap[k * perScenario + s] = termsOf.get(k).columnBound()[s];
        if (spaces.get(k).chooses(s)) {
          util[k * perScenario + s] = spaces.get(k).choiceUtilities(s);
          choosing = true;
        }
      }
    }
    anyChoice = choosing;
    utilPartial = new double[groups + 1][segments];
    restUtil = new double[segments];
    caps = new double[scenarios][perScenario];
    for (int k = 0; k < scenarios; k++) {
      System.arraycopy(baseCap, k * perScenario, caps[k], 0, perScenario);
    }
  }

  /**
   * Σ_k g_k over the scenarios' slices of the stacked reduced costs d with the caps in {@link #caps};
   * −∞ when some scenario cannot take the lot.
   */
  private double lotValue(double[] d) {
    double sum = 0;
    for (int k = 0; k < scenarios; k++) {
      sum += LotValue.best(d, k * perScenario, perScenario, caps[k], termsOf.get(k).minLot(), scratch);
    }
    return sum;
  }

  /**
   * Sets {@link #caps} of the choosing pairs alive in {@code d} from the utilities {@code u} (per pair),
   * and {@link #attW} to the attractions they were taken at ({@link ChoiceRows#capAt}'s two steps).
   */
  private void logitCaps(double[] d, double[] u) {
    for (int p = 0; p < segments; p++) {
      if (util[p] != null && d[p] != Double.NEGATIVE_INFINITY) {
        int k = p / perScenario;
        int s = p - k * perScenario;
        attW[p] = ChoiceRows.attractionAt(spaces.get(k), s, u[p]);
        caps[k][s] = Math.min(baseCap[p], ChoiceRows.cap(spaces.get(k).buyers(s), attW[p]));
      }
    }
  }

  /**
   * Per segment the bound g is taken with for whole variant v: the terms' column bound, and for a
   * choosing segment that accepts v at most its logit cap.
   */
  public static double[] caps(VariantSpace space, PortfolioTerms terms, int[] v) {
    double[] u = terms.columnBound().clone();
    for (int s = 0; s < u.length; s++) {
      if (space.chooses(s) && space.isColumn(v, s)) {
        u[s] = Math.min(u[s], ChoiceRows.capOf(space, v, s));
      }
    }
    return u;
  }

  /** ψ(v) over scenarios at the query's stacked prices, computed directly (see {@link VariantQuery}). */
  public static double value(List<VariantSpace> spaces, List<PortfolioTerms> terms, int[] v, VariantQuery q) {
    VariantSpace first = spaces.get(0);
    int rc = first.resourceCount();
    int sc = first.segmentCount();
    double sum = 0;
    for (int k = 0; k < spaces.size(); k++) {
      VariantSpace sp = spaces.get(k);
      double[] pi = Arrays.copyOfRange(q.resourcePrice(), k * rc, (k + 1) * rc);
      double[] mu = Arrays.copyOfRange(q.segmentPrice(), k * sc, (k + 1) * sc);
      double[] d = reducedCosts(sp, v, pi, mu);
      for (int s = 0; s < sc; s++) {
        d[s] += (q.weight(k) - 1) * (d[s] == Double.NEGATIVE_INFINITY ? 0 : sp.margin(v, s));
      }
      sum += LotValue.best(d, caps(sp, terms.get(k), v), terms.get(k).minLot());
    }
    double p = 0;
    if (q.penalty() != null) {
      for (int g = 0; g < v.length; g++) {
        p += q.penalty()[first.offset(g) + v[g]];
      }
    }
    double[] acc = q.acceptCharge();
    if (acc != null) {
      for (int s = 0; s < acc.length; s++) {
        p += first.isColumn(v, s) ? acc[s] : 0.0;
      }
    }
    p += VariantQuery.pairChargeOf(q.pairCharge(), v, first.offsets(), s -> first.isColumn(v, s));
    double[] bonus = q.attractionBonus();
    for (int j = 0; bonus != null && j < bonus.length; j++) {
      int k = j / sc;
      int s = j - k * sc;
      VariantSpace sp = spaces.get(k);
      if (bonus[j] > 0 && sp.chooses(s) && sp.isColumn(v, s)) {
        sum += bonus[j] * ChoiceRows.attractionOf(sp, v, s);
      }
    }
    return sum - q.charge() - p;
  }

  /** Per-choice weights ω·margin − π·use of segment s (−∞ where s may not use the choice). */
  static double[] weights(VariantSpace space, int s, double[] pi, double omega) {
    double[] w = ReducedCosts.weights(space, s, pi);
    if (omega != 1.0) {
      double[] m = ReducedCosts.weights(space, s, new double[pi.length]);
      for (int f = 0; f < w.length; f++) {
        if (w[f] != Double.NEGATIVE_INFINITY) {
          w[f] += (omega - 1) * m[f];
        }
      }
    }
    return w;
  }

  /** ψ(v) at the query's prices, computed directly; −∞ when no segment can take v at its lot. */
  public static double value(VariantSpace space, PortfolioTerms terms, int[] v, VariantQuery q) {
    return value(List.of(space), List.of(terms), v, q);
  }

  /** d_s(v) per segment, −∞ where s does not accept v. */
  public static double[] reducedCosts(VariantSpace space, int[] v, double[] pi, double[] mu) {
    double[] d = new double[space.segmentCount()];
    for (int s = 0; s < d.length; s++) {
      d[s] = space.isColumn(v, s) ? ReducedCosts.of(space, v, s, pi, mu[s]) : Double.NEGATIVE_INFINITY;
    }
    return d;
  }

  /** A signal checked with the deadline: once true, searches stop early with valid bounds. */
  public VariantPricer stopWhen(BooleanSupplier signal) {
    this.stop = signal;
    return this;
  }

  /**
   * The k best variants by ψ; each {@link PricedVariant#reducedCost()} is ψ(v), and
   * {@link PricingOutcome#restBound()} bounds ψ of every variant neither excluded nor found.
   */
  public PricingOutcome price(VariantQuery q) {
    if (q.resourcePrice().length != space.resourceCount() * scenarios || q.segmentPrice().length != segments) {
      throw new IllegalArgumentException("prices do not match the catalog's resources and segments");
    }
    if (q.penalty() != null && q.penalty().length != space.totalChoices()) {
      throw new IllegalArgumentException("penalty has " + q.penalty().length + " entries, the space "
          + space.totalChoices() + " choices");
    }
    if (q.acceptCharge() != null && q.acceptCharge().length != perScenario) {
      throw new IllegalArgumentException("acceptCharge has " + q.acceptCharge().length + " entries, the catalog "
          + perScenario + " segments");
    }
    pairCharges(q.pairCharge());
    w = new double[segments][];
    constant = new double[segments];
    int rc = space.resourceCount();
    for (int k = 0; k < scenarios; k++) {
      double[] pi = Arrays.copyOfRange(q.resourcePrice(), k * rc, (k + 1) * rc);
      for (int s = 0; s < perScenario; s++) {
        w[k * perScenario + s] = weights(spaces.get(k), s, pi, q.weight(k));
        constant[k * perScenario + s] = -q.segmentPrice()[k * perScenario + s];
      }
    }
    pen = q.penalty() == null ? new double[space.totalChoices()] : q.penalty();
    penalized = false;
    for (double x : pen) {
      penalized |= x != 0;
    }
    charge = q.charge();
    accCharge = q.acceptCharge();
    attBonus = null;
    if (q.attractionBonus() != null) {
      if (q.attractionBonus().length != segments) {
        throw new IllegalArgumentException("attractionBonus has " + q.attractionBonus().length
            + " entries, the prices " + segments + " segments");
      }
      for (int p = 0; p < segments; p++) {
        if (q.attractionBonus()[p] < 0 || q.attractionBonus()[p] > 0 && util[p] == null) {
          throw new IllegalArgumentException("attractionBonus must be >= 0, and 0 where a segment does not choose");
        }
        if (q.attractionBonus()[p] > 0) {
          attBonus = q.attractionBonus();
        }
      }
    }
    threshold = q.threshold();
    k = q.k();
    excluded = q.excluded();
    top = new PriorityQueue<>(VariantPricer::worseFirst);
    nodes = 0;
    deadline = q.deadlineNanos();
    openBound = Double.NEGATIVE_INFINITY;
    boolean complete = true;
    orderGroups();
    for (int e = 0; e < groups; e++) {
      posOf[order[e]] = e;
    }
    bonusSets();
    for (int f = 0; f < usable.length; f++) {
      boolean any = false;
      for (int s = 0; s < segments && !any; s++) {
        any = w[s][f] != Double.NEGATIVE_INFINITY;
      }
      usable[f] = any && space.allowed(f);
    }
    if (rules.start(usable)) {
      Arrays.fill(partial[0], 0.0);
      Arrays.fill(dead[0], false);
      penPartial[0] = 0;
      complete = search(0);
    }
    List<PricedVariant> found = new ArrayList<>(top);
    found.sort((a, b) -> -worseFirst(a, b));
    PricingOutcome out = PricingOutcome.of(found, k, threshold, complete, openBound, nodes);
    w = null;
    pen = null;
    accCharge = null;
    attBonus = null;
    excluded = null;
    top = null;
    return out;
  }

  /**
   * The query's group order: first the groups whose choice decides one of the query's charges, by
   * decreasing size of what it decides (the spread of the group's choice penalties, plus |δ_s| for
   * every charged segment s that some of its choices make reject the variant), then the others in the
   * static order of {@link SearchOrder#of}. Why: a tree node's count rows price choices and acceptance
   * through their duals, which reach the size of the master's artificial cost where a count row is
   * degenerate; the bound of a partial variant counts every undecided group's best penalty and every
   * undecided charge optimistically, so while those groups lie deep in the order the bound cannot prune
   * any assignment of the groups above them. Measured on the wide family at about 10^12 variants
   * (docs/portfolio.md): single pricing calls of 28 s (72 million search nodes) under such duals with
   * the static order; none above 0.3 s with this one. Without charges and penalties (every LP-stage
   * and relaxation query) the order is the static one. The forward checker is rebuilt when the order
   * changes: O(rules · groups).
   */
  private void orderGroups() {
    for (int g = 0; g < groups; g++) {
      double lo = Double.POSITIVE_INFINITY;
      double hi = Double.NEGATIVE_INFINITY;
      for (int f = offset[g]; f < offset[g + 1]; f++) {
        lo = Math.min(lo, pen[f]);
        hi = Math.max(hi, pen[f]);
      }
      double size = hi > lo ? hi - lo : 0;
      for (int s = 0; accCharge != null && s < perScenario; s++) {
        if (accCharge[s] != 0 && rejectsSome(s, g)) {
          size += Math.abs(accCharge[s]);
        }
      }
      for (int j = 0; j < pairS.length; j++) {
        if (pairG[j] == g) {
          size += Math.abs(pairD[j]);
        }
      }
      decides[g] = size;
    }
    SearchOrder.firstBy(staticOrder, g -> decides[g] > 0, decides, nextOrder);
    if (!Arrays.equals(nextOrder, order)) {
      order = nextOrder.clone();
      rules = new ForwardChecker(space, order, ForwardChecker.NO_WATCH);
    }
  }

  /** True when segment s (of scenario 0: acceptance is the same in all) rejects some choice of group g. */
  private boolean rejectsSome(int s, int g) {
    for (int f = offset[g]; f < offset[g + 1]; f++) {
      if (w[s][f] == Double.NEGATIVE_INFINITY) {
        return true;
      }
    }
    return false;
  }

  /** The group order of the last query's search (a copy; before any, the static order), for tests. */
  int[] groupOrder() {
    return order.clone();
  }

  /** Lower value first; equal values: the lexicographically larger choices first (so they leave first). */
  private static int worseFirst(PricedVariant a, PricedVariant b) {
    int c = Double.compare(a.reducedCost(), b.reducedCost());
    return c != 0 ? c : Arrays.compare(b.choices(), a.choices());
  }

  private double cutoff() {
    return top.size() < k ? threshold : Math.max(threshold, top.peek().reducedCost());
  }

  /** Prune slack: bounds and leaf values are summed in different orders. */
  private static double slack(double x) {
    return 1e-9 * (1 + Math.abs(x));
  }

  /** Depth-first search below depth d; false when a limit stopped it. */
  private boolean search(int d) {
    if (d == groups) {
      leaf();
      return true;
    }
    int g = order[d];
    double penRest = 0;
    if (penalized) {
      Arrays.fill(penRestIn, 0.0);
    }
    Arrays.fill(rest, 0.0);
    Arrays.fill(restUtil, 0.0);
    for (int e = d + 1; e < groups; e++) {
      int h = order[e];
      double minPen = Double.POSITIVE_INFINITY;
      for (int s = 0; s < segments; s++) {
        double best = Double.NEGATIVE_INFINITY;
        double bestUtil = Double.NEGATIVE_INFINITY;
        double least = Double.POSITIVE_INFINITY; // the least penalty among the choices s accepts
        double[] us = util[s];
        for (int f = offset[h]; f < offset[h + 1]; f++) {
          if (usable[f] && !rules.blocked(f) && w[s][f] != Double.NEGATIVE_INFINITY) {
            best = Math.max(best, w[s][f]);
            least = Math.min(least, pen[f]);
            if (us != null) {
              bestUtil = Math.max(bestUtil, us[f]);
            }
          }
        }
        rest[s] += best;
        restUtil[s] += bestUtil;
        if (penalized && s < perScenario) {
          penRestIn[s] += least;
        }
      }
      for (int f = offset[h]; f < offset[h + 1]; f++) {
        if (usable[f] && !rules.blocked(f) && pen[f] < minPen) {
          minPen = pen[f];
        }
      }
      penRest += minPen;
    }
    if (accCharge != null || pairS.length > 0) {
      certainAcceptance(d);
    }
    // bit T: the unassigned groups can all be accepted by the bonus segments T (all bits without bonuses)
    long together = bonusCount > 0 ? jointAcceptance(d) : -1L;
    int n = 0;
    int[] cs = cand[d];
    double[] cb = candBound[d];
    for (int f = offset[g]; f < offset[g + 1]; f++) {
      if (!usable[f] || rules.blocked(f)) {
        continue;
      }
      for (int s = 0; s < segments; s++) {
        double x = w[s][f];
        ub[s] = dead[d][s] || x == Double.NEGATIVE_INFINITY || rest[s] == Double.NEGATIVE_INFINITY
            ? Double.NEGATIVE_INFINITY
            : partial[d][s] + x + rest[s] + constant[s];
        if (util[s] != null) {
          leafU[s] = utilPartial[d][s] + util[s][f] + restUtil[s];
        }
      }
      if (anyChoice) {
        logitCaps(ub, leafU);
      }
      double b = lotValue(ub) + (attBonus == null ? 0.0 : attraction(ub))
          - charge - (penPartial[d] + pen[f] + penaltyAhead(ub, penRest))
          - (accCharge == null ? 0.0 : acceptance(ub, false, together))
          - (pairS.length == 0 ? 0.0 : pairCharges(d, g, f, ub));
      n = BestFirst.insert(cb, cs, n, b, f);
    }
    for (int i = 0; i < n; i++) {
      double cut = cutoff();
      if (cb[i] + slack(cut) <= cut) {
        break;
      }
      if (nodes >= nodeLimit || ((nodes & 1023) == 0
          && ((deadline != 0 && System.nanoTime() > deadline) || stop.getAsBoolean()))) {
        openBound = Math.max(openBound, cb[i]);
        return false;
      }
      nodes++;
      int f = cs[i];
      v[g] = f - offset[g];
      for (int s = 0; s < segments; s++) {
        double x = w[s][f];
        dead[d + 1][s] = dead[d][s] || x == Double.NEGATIVE_INFINITY;
        partial[d + 1][s] = dead[d + 1][s] ? 0.0 : partial[d][s] + x;
        if (util[s] != null) {
          utilPartial[d + 1][s] = utilPartial[d][s] + util[s][f];
        }
      }
      penPartial[d + 1] = penPartial[d] + pen[f];
      int mark = rules.mark();
      if (rules.propagate(d, v, 0) >= 0 && !search(d + 1)) {
        rules.undo(mark);
        if (i + 1 < n) {
          openBound = Math.max(openBound, cb[i + 1]);
        }
        return false;
      }
      rules.undo(mark);
    }
    return true;
  }

  /**
   * The least penalty the unassigned groups can add: a completion sells only to segments that accept
   * every choice of it, and to at least one (g is −∞ otherwise), so its penalty there is at least the
   * least, over the segments that may still accept it, of the sum per group of the smallest penalty
   * among the choices that segment accepts ({@link #penRestIn}); never less than the smallest
   * penalties over all choices ({@code any}). Under a tree node's count duals, bonuses of the size of
   * the master's artificial cost on choices that no one segment accepts together otherwise all count.
   */
  private double penaltyAhead(double[] ub, double any) {
    if (!penalized) {
      return any;
    }
    double least = Double.POSITIVE_INFINITY;
    for (int s = 0; s < perScenario; s++) {
      if (ub[s] != Double.NEGATIVE_INFINITY) {
        least = Math.min(least, penRestIn[s]);
      }
    }
    return least == Double.POSITIVE_INFINITY ? any : Math.max(any, least);
  }

  /** Keeps the nonzero entries of a query's pair charges ({@code null}: none). */
  private void pairCharges(double[][] pc) {
    int n = 0;
    if (pc != null) {
      if (pc.length != perScenario) {
        throw new IllegalArgumentException("pairCharge has " + pc.length + " rows, the catalog " + perScenario
            + " segments");
      }
      for (double[] row : pc) {
        if (row.length != space.totalChoices()) {
          throw new IllegalArgumentException("a pairCharge row has " + row.length + " entries, the space "
              + space.totalChoices() + " choices");
        }
        for (double x : row) {
          n += x != 0 ? 1 : 0;
        }
      }
    }
    pairS = new int[n];
    pairF = new int[n];
    pairG = new int[n];
    pairD = new double[n];
    n = 0;
    for (int s = 0; pc != null && s < pc.length; s++) {
      for (int f = 0; f < pc[s].length; f++) {
        if (pc[s][f] != 0) {
          pairS[n] = s;
          pairF[n] = f;
          pairG[n] = space.groupOf(f);
          pairD[n++] = pc[s][f];
        }
      }
    }
  }

  /**
   * The pair charges a bound takes for candidate f of group g at depth d, with optimistic reduced costs
   * {@code ub} (scenario 0's slice; acceptance is the same in every scenario). A completion pays pair
   * (s, f') exactly when s accepts it and it uses f'. A charge (δ &gt; 0) is taken only where both are
   * certain: f' is assigned (here or above) and s accepts every remaining choice ({@link #sure}, with
   * ub_s finite for what is assigned); a bonus (δ &lt; 0) wherever both are still possible: ub_s finite
   * and f' assigned, or its group later in the order with f' usable. So the bound is at least the value
   * of every completion.
   */
  private double pairCharges(int d, int g, int f, double[] ub) {
    double c = 0;
    for (int j = 0; j < pairS.length; j++) {
      if (ub[pairS[j]] == Double.NEGATIVE_INFINITY) {
        continue;
      }
      int h = pairG[j];
      boolean assigned;
      boolean possible;
      if (h == g) {
        assigned = pairF[j] == f;
        possible = assigned;
      } else if (posOf[h] < d) {
        assigned = offset[h] + v[h] == pairF[j];
        possible = assigned;
      } else {
        assigned = false;
        possible = usable[pairF[j]];
      }
      if (pairD[j] < 0 ? possible : assigned && sure[pairS[j]]) {
        c += pairD[j];
      }
    }
    return c;
  }

  /** {@link #sure} for the groups after depth d: their remaining choices all accepted by segment s. */
  private void certainAcceptance(int d) {
    for (int s = 0; s < perScenario; s++) {
      boolean all = true;
      for (int e = d + 1; e < groups && all; e++) {
        int h = order[e];
        for (int f = offset[h]; f < offset[h + 1] && all; f++) {
          all = !usable[f] || rules.blocked(f) || w[s][f] != Double.NEGATIVE_INFINITY;
        }
      }
      sure[s] = all;
    }
  }

  /**
   * The acceptance charges to take from a bound with optimistic reduced costs {@code ub} (scenario 0's
   * slice; acceptance is the same in every scenario): ub_s = −∞ exactly when s rejects every completion.
   * At a leaf ({@code exact}) a finite d_s means s accepts; inside the tree a charge in full only where
   * {@link #sure} (else at most what rejecting s would cost, see the class comment), a bonus wherever s
   * may still accept. The loss term uses {@link #caps}, the caps g(ub) was just evaluated with.
   * {@code together}: {@link #jointAcceptance} of the node (unused at a leaf).
   */
  private double acceptance(double[] ub, boolean exact, long together) {
    double sum = 0;
    double least = Double.POSITIVE_INFINITY;
    boolean joint = !exact && bonusCount > 0;
    for (int s = 0; s < perScenario; s++) {
      double delta = accCharge[s];
      if (ub[s] == Double.NEGATIVE_INFINITY) {
        continue;
      }
      if (delta == 0 || delta < 0 && joint) {
        least = 0; // bonuses: below, for the sets of segments that can accept together
        continue;
      }
      if (exact || delta < 0 || sure[s]) {
        sum += delta;
        least = 0;
      } else {
        double loss = 0;
        for (int k = 0; k < scenarios; k++) {
          loss += caps[k][s] * Math.max(0.0, ub[k * perScenario + s]);
        }
        double taken = Math.min(delta, loss);
        sum += taken;
        least = Math.min(least, delta - taken);
      }
    }
    if (joint) {
      int alive = 0;
      for (int j = 0; j < bonusCount; j++) {
        if (ub[bonusSeg[j]] != Double.NEGATIVE_INFINITY) {
          alive |= 1 << j;
        }
      }
      // the best bonus a completion can collect: a set of segments that can all accept it
      double best = 0;
      for (int t = alive; t > 0; t = (t - 1) & alive) {
        if ((together >>> t & 1L) != 0 && bonusSum[t] > best) {
          best = bonusSum[t];
        }
      }
      sum -= best;
    }
    // some segment accepts every completion of value (LotValue is −∞ for a variant no segment takes)
    return least == Double.POSITIVE_INFINITY ? sum : sum + least;
  }

  /**
   * The query's bonus segments (δ_s &lt; 0), when there are two to {@link #BONUS_SEGMENTS}: per choice
   * the bonus segments accepting it, per subset T the bonus Σ_{s∈T} |δ_s|. With fewer or more, the
   * bound takes every bonus of a segment that may still accept, as before.
   */
  private void bonusSets() {
    bonusCount = 0;
    if (accCharge == null) {
      return;
    }
    for (int s = 0; s < perScenario; s++) {
      if (accCharge[s] < 0) {
        bonusSeg[bonusCount++] = s;
      }
    }
    if (bonusCount < 2 || bonusCount > BONUS_SEGMENTS) {
      bonusCount = 0;
      return;
    }
    for (int f = 0; f < bonusMask.length; f++) {
      int m = 0;
      for (int j = 0; j < bonusCount; j++) {
        if (w[bonusSeg[j]][f] != Double.NEGATIVE_INFINITY) {
          m |= 1 << j;
        }
      }
      bonusMask[f] = m;
    }
    for (int t = 0; t < 1 << bonusCount; t++) {
      double sum = 0;
      for (int j = 0; j < bonusCount; j++) {
        if ((t >>> j & 1) != 0) {
          sum -= accCharge[bonusSeg[j]];
        }
      }
      bonusSum[t] = sum;
    }
  }

  /**
   * The sets T of bonus segments that can all accept some completion of the groups after depth d
   * (bit T): every such group has a choice left that all of T accept. Rules are left out, so this is
   * a superset, and the bound stays a bound: a completion's accepting bonus segments form such a set.
   */
  private long jointAcceptance(int d) {
    long can = -1L;
    for (int e = d + 1; e < groups; e++) {
      int h = order[e];
      long any = 0;
      for (int f = offset[h]; f < offset[h + 1]; f++) {
        if (usable[f] && !rules.blocked(f)) {
          any |= SUBSETS[bonusMask[f]];
        }
      }
      can &= any;
    }
    return can;
  }

  private static long[] subsets() {
    long[] out = new long[1 << BONUS_SEGMENTS];
    for (int m = 0; m < out.length; m++) {
      long bits = 0;
      for (int t = m; ; t = (t - 1) & m) {
        bits |= 1L << t;
        if (t == 0) {
          break;
        }
      }
      out[m] = bits;
    }
    return out;
  }

  /**
   * Σ over the choosing pairs p still alive in {@code d} (that may accept, or at a leaf accept) of
   * {@link #attBonus}[p]·w, w the attraction {@link #logitCaps} just took the caps at (called with the
   * same {@code d} before this): at a leaf the variant's own, inside the search the one at its optimistic
   * utility, which bounds every completion's (w is increasing in u, and the bonus is ≥ 0).
   */
  private double attraction(double[] d) {
    double sum = 0;
    for (int p = 0; p < segments; p++) {
      if (attBonus[p] > 0 && d[p] != Double.NEGATIVE_INFINITY) {
        sum += attBonus[p] * attW[p];
      }
    }
    return sum;
  }

  private void leaf() {
    assert space.isBuildable(v) : "forward checking let a rule violation through";
    double[] d = leafD;
    for (int s = 0; s < segments; s++) {
      double x = constant[s];
      for (int g = 0; g < groups; g++) {
        double y = w[s][offset[g] + v[g]];
        if (y == Double.NEGATIVE_INFINITY) {
          x = Double.NEGATIVE_INFINITY;
          break;
        }
        x += y;
      }
      d[s] = x;
      if (util[s] != null && x != Double.NEGATIVE_INFINITY) {
        int k = s / perScenario;
        leafU[s] = spaces.get(k).utility(v, s - k * perScenario);
      }
    }
    if (anyChoice) {
      logitCaps(d, leafU);
    }
    double p = 0;
    for (int g = 0; g < groups; g++) {
      p += pen[offset[g] + v[g]];
    }
    double val = lotValue(d) + (attBonus == null ? 0.0 : attraction(d)) - charge - p
        - (accCharge == null ? 0.0 : acceptance(d, true, -1L));
    for (int j = 0; j < pairS.length; j++) {
      if (d[pairS[j]] != Double.NEGATIVE_INFINITY && offset[pairG[j]] + v[pairG[j]] == pairF[j]) {
        val -= pairD[j];
      }
    }
    if (val > cutoff() && (excluded.isEmpty() || !excluded.contains(space.key(v)))) {
      top.add(new PricedVariant(v.clone(), val));
      if (top.size() > k) {
        top.poll();
      }
    }
  }
}
