package dev.mixwright.master;

import com.google.ortools.linearsolver.MPSolver;
import dev.mixwright.choice.Logit;
import com.google.ortools.linearsolver.MPVariable;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The restricted master LP on GLOP:
 *
 * <pre>
 *   max  Σ_j m_j x_j
 *   s.t. Σ_j a_rj x_j ≤ capacity_r      for every resource r   (dual π_r ≥ 0)
 *        Σ_{j in s} x_j ≤ demand_s       for every segment s    (dual μ_s ≥ 0)
 *        0 ≤ x_j ≤ u_j
 * and per segment that chooses, instead of its demand row, the sales-based LP (SBLP; Gallego,
 * Ratliff &amp; Shebalov 2015, Operations Research 63(1):212–232) over its columns J_s:
 *        Σ_{j in s} x_j + x_s0 = buyers_s                    (dual μ_s)
 *        x_j − w_j·x_s0 ≤ 0   for each column j of s        (dual β_j ≥ 0)
 *        x_j ≥ 0, x_s0 ≥ 0 (margin 0), no other bound on x_j
 * </pre>
 *
 * <p>The choosing part is not handed to GLOP row by row: one row per column made every re-solve
 * cost as much as the simplex over thousands of rows (measured: 5 of 5.3 s of a 28,547-variant run
 * went to 8 re-solves of a master of 5,800 columns and rows). Instead the master is solved by
 * Dantzig–Wolfe over each segment's polytope P_s = {(x, x_s0) ≥ 0 : the rows above}. A vertex of
 * P_s is an offer set S ⊆ J_s: x_s0 = buyers/(1 + w(S)), x_j = w_j·x_s0 on S, 0 elsewhere (the
 * offer-set LP of Liu &amp; van Ryzin 2008, MSOM 10(2), equals the SBLP: Gallego et al. 2015). GLOP
 * holds the resource rows, the fixed segments' rows and columns, and per choosing segment a
 * convexity row Σ_S λ_S ≤ 1 (dual σ_s ≥ 0; the empty set, everyone stays out, is the slack) with
 * one column per offer set found: margin buyers·Σ_S w m/(1 + w(S)), use buyers·Σ_S w a/(1 + w(S)).
 *
 * <p>Pricing an offer set at duals (π, σ): max_S buyers·f(S) − σ_s, f(S) = Σ_S w_j r_j/(1 + w(S)),
 * r_j = m_j − π·a_j. Its maximiser is revenue-ordered (Talluri &amp; van Ryzin 2004, Management
 * Science 50(1), for the multinomial logit): with R* = max f, f(S) ≤ R* ⟺ Σ_S w (r − R*) ≤ R*, and
 * the left side is largest at S = {r &gt; R*}, so that set attains R*. Walking the columns by
 * descending r, adding a column of r above the current f raises f, and once the next r is ≤ f no
 * later prefix does better; {@link Logit#bestOfferValue} finds R* by Newton's method without a
 * sort, O(|J_s|·resources) per segment and inner round plus a few O(|J_s|) steps. The inner rounds stop when no segment's best set pays more than a round-off tolerance,
 * and then σ_s/buyers_s ≥ R*_s, i.e. μ_s := σ_s/buyers_s with β_j := (r_j − μ_s)^+ satisfy every
 * dual row of the SBLP over J_s (μ_s + β_j ≥ r_j, and x_s0's row μ_s ≥ Σ_j w_j β_j is the
 * fixed point μ ≥ Σ w (r − μ)^+, which holds iff μ ≥ R*), with dual objective π·b + Σ σ_s + (fixed
 * part) = the objective. These are the duals returned, so column generation over the whole space
 * keeps its argument and its bound unchanged (see {@code colgen.ColumnGeneration}). The primal is
 * recovered as x_j = Σ_{S ∋ j} λ_S·buyers·w_j/(1 + w(S)), x_s0 = buyers − Σ_j x_j, a convex
 * combination of vertices, so it satisfies every row of the SBLP.
 *
 * <p>Fixed segments' columns are added one at a time into the live solver, so each re-solve
 * warm-starts from the last basis (measured: about 10x fewer simplex iterations than a cold solve
 * at 50 rows × 2,000 columns). x = 0 (with x_s0 = buyers_s) is always feasible, so the master is
 * never infeasible. Not thread-safe; close it to free the native solver.
 */
public final class RestrictedMaster implements AutoCloseable {
  private static final double FEASIBILITY_TOLERANCE = Rows.FEASIBILITY_TOLERANCE;
  /** Inner Dantzig–Wolfe rounds of one solve, a guard against cycling on round-off. */
  private static final int INNER_LIMIT = 10_000;

  private final Rows rows;
  private final double[] capacity;
  private final double[] demand;
  /** Per column its GLOP variable, null for a column of a choosing segment. */
  private final List<MPVariable> vars = new ArrayList<>();
  /**
   * Where column j's resource use lies: at {@code slotOf[j] * rows} in {@code memberUse[s]} for a
   * column of choosing segment s, else in {@code fixedUse}. One flat copy per column, no array of its
   * own: a choosing run holds hundreds of thousands of columns, and a second copy plus an array header
   * per column took about 140 MB of a 512 MB heap at 400,000 columns.
   */
  private int[] slotOf = new int[64];
  private double[] fixedUse = new double[0];
  private int fixedCount;
  private int[] segmentOf = new int[64];
  private double[] marginOf = new double[64];
  private final boolean[] chooses;
  /** Per column its attraction w_j, NaN for a column of a fixed segment. */
  private double[] attractionOf = new double[64];
  /** Per choosing segment, the indices of its columns (the first {@code memberCount[s]}). */
  private final List<int[]> members = new ArrayList<>();
  private final int[] memberCount;
  /**
   * Per choosing segment, aligned with {@code members}: margins, attractions and uses (flat,
   * resources per column), so that the r of every column, wanted in each inner round, is read from
   * contiguous arrays; and a buffer for those r.
   */
  private final double[][] memberMargin;
  private final double[][] memberW;
  private final double[][] memberUse;
  private final double[][] revenueBuffer;
  /** Per choosing segment, its offer-set columns in GLOP and their members. */
  private final List<List<MPVariable>> offerVars = new ArrayList<>();
  private final List<List<OfferSet>> offerSets = new ArrayList<>();
  /** Per choosing segment, the members of the offer set added last (null before the first). */
  private final int[][] lastAdded;

  /**
   * @param capacity right-hand side of each resource row
   * @param demand right-hand side of each segment row (may be empty for a plain product-mix LP)
   */
  public RestrictedMaster(double[] capacity, double[] demand) {
    this(capacity, demand, new boolean[demand.length]);
  }

  /**
   * @param demand per segment its demand, or its buyers where {@code chooses[s]}
   * @param chooses per segment, whether its buyers choose (the SBLP above)
   */
  public RestrictedMaster(double[] capacity, double[] demand, boolean[] chooses) {
    if (chooses.length != demand.length) {
      throw new IllegalArgumentException("chooses has " + chooses.length + " entries, segments " + demand.length);
    }
    this.capacity = capacity.clone();
    this.demand = demand.clone();
    this.chooses = chooses.clone();
    double[] rhs = demand.clone();
    memberCount = new int[demand.length];
    memberMargin = new double[demand.length][];
    memberW = new double[demand.length][];
    memberUse = new double[demand.length][];
    revenueBuffer = new double[demand.length][];
    lastAdded = new int[demand.length][];
    for (int s = 0; s < demand.length; s++) {
      if (chooses[s]) {
        rhs[s] = 1.0;
      }
      int cap = chooses[s] ? 64 : 0;
      members.add(new int[cap]);
      memberMargin[s] = new double[cap];
      memberW[s] = new double[cap];
      memberUse[s] = new double[cap * capacity.length];
      revenueBuffer[s] = new double[cap];
      offerVars.add(new ArrayList<>());
      offerSets.add(new ArrayList<>());
    }
    rows = new Rows("GLOP", capacity, rhs);
    // Without presolve GLOP re-solves incrementally from the previous basis.
    rows.solver.setSolverSpecificParametersAsString("use_preprocessing:false");
  }

  /**
   * Adds a column and returns its index.
   *
   * @param segment its segment row, or -1 for none
   * @param margin objective coefficient m_j
   * @param use resource use a_j, aligned with the capacity rows
   * @param upper upper bound u_j ({@code Double.POSITIVE_INFINITY} for none)
   */
  public int addColumn(int segment, double margin, double[] use, double upper) {
    if (segment >= 0 && chooses[segment]) {
      throw new IllegalArgumentException("segment " + segment + " chooses: add its columns with addChoiceColumn");
    }
    int j = vars.size();
    vars.add(rows.addSales("x" + j, upper, segment, margin, use));
    record(segment, margin, fixedCount, Double.NaN);
    if ((fixedCount + 1) * capacity.length > fixedUse.length) {
      fixedUse = Arrays.copyOf(fixedUse, grown(fixedCount) * capacity.length);
    }
    System.arraycopy(use, 0, fixedUse, fixedCount * capacity.length, capacity.length);
    fixedCount++;
    return j;
  }

  /**
   * Adds a column of a choosing segment (with, in the SBLP, its row x_j − w_j·x_s0 ≤ 0) and returns
   * its index.
   *
   * @param attraction w_j = exp(u_s(v) − stayOut_s) &gt; 0
   */
  public int addChoiceColumn(int segment, double margin, double[] use, double attraction) {
    if (segment < 0 || !chooses[segment]) {
      throw new IllegalArgumentException("segment " + segment + " does not choose: add its columns with addColumn");
    }
    if (!(attraction > 0) || Double.isInfinite(attraction)) {
      throw new IllegalArgumentException("attraction must be positive and finite, got " + attraction);
    }
    if (use.length != capacity.length) {
      throw new IllegalArgumentException("use has " + use.length + " entries, rows " + capacity.length);
    }
    int j = vars.size();
    vars.add(null);
    int[] m = members.get(segment);
    int i = memberCount[segment];
    record(segment, margin, i, attraction);
    if (i == m.length) {
      m = Arrays.copyOf(m, grown(m.length));
      members.set(segment, m);
      memberMargin[segment] = Arrays.copyOf(memberMargin[segment], m.length);
      memberW[segment] = Arrays.copyOf(memberW[segment], m.length);
      memberUse[segment] = Arrays.copyOf(memberUse[segment], m.length * capacity.length);
      revenueBuffer[segment] = new double[m.length];
    }
    m[i] = j;
    memberMargin[segment][i] = margin;
    memberW[segment][i] = attraction;
    System.arraycopy(use, 0, memberUse[segment], i * capacity.length, capacity.length);
    memberCount[segment] = i + 1;
    return j;
  }

  /** A length that grows by half, not double: at the largest sizes the old and new arrays are alive together. */
  private static int grown(int length) {
    return Math.max(64, length + (length >> 1));
  }

  private void record(int segment, double margin, int slot, double w) {
    int j = vars.size() - 1;
    if (j == marginOf.length) {
      int cap = grown(j);
      slotOf = Arrays.copyOf(slotOf, cap);
      segmentOf = Arrays.copyOf(segmentOf, cap);
      marginOf = Arrays.copyOf(marginOf, cap);
      attractionOf = Arrays.copyOf(attractionOf, cap);
    }
    slotOf[j] = slot;
    segmentOf[j] = segment;
    marginOf[j] = margin;
    attractionOf[j] = w;
  }

  /** The array holding column j's use, from {@link #useStart(int)} on for as many entries as rows. */
  private double[] useStore(int j) {
    int s = segmentOf[j];
    return s >= 0 && chooses[s] ? memberUse[s] : fixedUse;
  }

  private int useStart(int j) {
    return slotOf[j] * capacity.length;
  }

  /** Changes the bounds of a fixed segment's column ({@code 0, 0} retires it without removing it). */
  public void setColumnBounds(int j, double lower, double upper) {
    if (vars.get(j) == null) {
      throw new IllegalArgumentException("column " + j + " belongs to a choosing segment, whose columns keep their bounds");
    }
    vars.get(j).setBounds(lower, upper);
  }

  /** Changes a resource row's capacity. */
  public void setCapacity(int r, double value) {
    capacity[r] = value;
    rows.setCapacity(r, value);
  }

  public int columnCount() {
    return vars.size();
  }

  /** Offer-set columns held for the choosing segments (Dantzig–Wolfe columns of the SBLP). */
  public int offerSetCount() {
    int n = 0;
    for (List<MPVariable> l : offerVars) {
      n += l.size();
    }
    return n;
  }

  /** Solves exactly (with the inner Dantzig–Wolfe rounds for choosing segments), verifies, and reads values and duals. */
  public MasterSolution solve() {
    return solve(0.0);
  }

  /**
   * As {@link #solve()}, but the inner rounds stop once the offer sets not yet added would pay at
   * most {@code slack} in all, Σ_s (buyers_s·R*_s − σ_s)^+ ≤ slack, after at least one round that
   * adds every paying set. The duals returned stay feasible for the SBLP over the master's columns:
   * μ_s := max(σ_s/buyers_s, R*_s) (see the class comment: μ_s ≥ R*_s is what x_s0's dual row
   * needs); their objective is the solution's {@code dualObjective}, the objective plus that
   * shortfall, which a bound must then start from (inexact Dantzig–Wolfe master, as in column
   * generation with early termination of the master; the bound argument is unchanged).
   */
  public MasterSolution solve(double slack) {
    long iters = 0;
    for (int round = 0; ; round++) {
      MPSolver.ResultStatus rs = solveGlop();
      iters += rows.solver.iterations();
      LpStatus status = Rows.lpStatus(rs);
      if (!status.isOptimal()) {
        return MasterSolution.failed(status, iters);
      }
      if (round >= INNER_LIMIT || !addPayingOfferSets(round == 0 ? 0.0 : slack)) {
        MasterSolution sol = read(iters);
        if (sol.status() == LpStatus.FAILED && round < INNER_LIMIT) {
          rows.solver.reset();
          continue;
        }
        return sol;
      }
    }
  }

  private MPSolver.ResultStatus solveGlop() {
    MPSolver.ResultStatus rs = rows.solver.solve();
    if (Rows.lpStatus(rs) == LpStatus.FAILED) {
      // Measured: GLOP's incremental re-solve without presolve can end ABNORMAL after some sequences
      // of added columns (seen with smoothed duals on a generated catalog); a cold start from
      // scratch then solves the same LP. reset() drops the basis, not the model.
      rows.solver.reset();
      rs = rows.solver.solve();
    }
    return rs;
  }

  /** The best offer set of segment s at resource prices π: its members and f(S) (see the class comment). */
  private record BestSet(int[] members, double value) {}

  /**
   * An offer set as the prices that chose it: the first {@code upTo} columns of its segment with r
   * above {@code value} at {@code pi}. Kept this way rather than as a member list, so that a
   * thousand offer sets of 10^5 columns each cost a thousand price vectors, not 10^8 indices; the
   * members are recomputed, with the same arithmetic, only for the sets in the solution.
   */
  private record OfferSet(double[] pi, double value, int upTo) {}

  /**
   * r_j = m_j − π·a_j of the first n columns of choosing segment s, into {@code out}. Only the
   * resources with a price enter the sum: few bind (5 of 20 on the 10^9 benchmark), and this sum
   * over every column is the inner rounds' main work.
   */
  private double[] revenues(int s, double[] pi, int n, double[] out) {
    int rc = capacity.length;
    int[] priced = new int[rc];
    int k = 0;
    for (int q = 0; q < rc; q++) {
      if (pi[q] != 0) {
        priced[k++] = q;
      }
    }
    double[] m = memberMargin[s];
    double[] a = memberUse[s];
    for (int i = 0; i < n; i++) {
      double v = m[i];
      int base = i * rc;
      for (int t = 0; t < k; t++) {
        v -= pi[priced[t]] * a[base + priced[t]];
      }
      out[i] = v;
    }
    return out;
  }

  /** The columns among the first n of segment s with r above {@code value}. */
  private int[] above(int s, double[] r, int n, double value) {
    int[] js = members.get(s);
    int[] set = new int[n];
    int k = 0;
    for (int i = 0; i < n; i++) {
      if (r[i] > value) {
        set[k++] = js[i];
      }
    }
    return Arrays.copyOf(set, k);
  }

  private int[] membersOf(int s, OfferSet o) {
    return above(s, revenues(s, o.pi(), o.upTo(), new double[o.upTo()]), o.upTo(), o.value());
  }

  /** The revenue-ordered best offer set of segment s at resource prices π ({@link Logit#bestOfferValue}). */
  private BestSet bestSet(int s, double[] pi) {
    int n = memberCount[s];
    double[] r = revenues(s, pi, n, revenueBuffer[s]);
    double mu = Logit.bestOfferValue(r, memberW[s], n);
    return new BestSet(above(s, r, n, mu), mu);
  }

  /**
   * Adds, per choosing segment, its best offer set at the current duals when it pays more than the
   * round-off tolerance and is not the set just added (GLOP priced that one already); true when
   * one was added.
   */
  private boolean addPayingOfferSets(double slack) {
    double[] pi = rows.resourceDuals();
    double[] sigma = rows.segmentDuals();
    double tol = 1e-9 * (1 + Math.abs(rows.objective.value()));
    BestSet[] bests = new BestSet[chooses.length];
    double shortfall = 0;
    for (int s = 0; s < chooses.length; s++) {
      if (chooses[s] && memberCount[s] > 0) {
        bests[s] = bestSet(s, pi);
        shortfall += Math.max(0.0, demand[s] * bests[s].value() - sigma[s]);
      }
    }
    if (shortfall <= slack) {
      return false;
    }
    boolean added = false;
    for (int s = 0; s < chooses.length; s++) {
      if (bests[s] == null) {
        continue;
      }
      BestSet best = bests[s];
      if (best.members().length == 0 || demand[s] * best.value() - sigma[s] <= tol
          || Arrays.equals(lastAdded[s], best.members())) {
        continue;
      }
      addOfferSet(s, best.members());
      offerSets.get(s).add(new OfferSet(pi, best.value(), memberCount[s]));
      lastAdded[s] = best.members();
      added = true;
    }
    return added;
  }

  private double sumOfAttractions(int[] set) {
    double sw = 0;
    for (int j : set) {
      sw += attractionOf[j];
    }
    return sw;
  }

  private void addOfferSet(int s, int[] set) {
    double sw = sumOfAttractions(set);
    double[] use = new double[capacity.length];
    double margin = 0;
    for (int j : set) {
      double share = demand[s] * attractionOf[j] / (1 + sw);
      margin += share * marginOf[j];
      double[] a = useStore(j);
      int at = useStart(j);
      for (int r = 0; r < use.length; r++) {
        use[r] += share * a[at + r];
      }
    }
    List<MPVariable> l = offerVars.get(s);
    l.add(rows.addSales("o" + s + "_" + l.size(), Double.POSITIVE_INFINITY, s, margin, use));
  }

  private MasterSolution read(long iters) {
    int n = vars.size();
    double[] x = new double[n];
    double[] rc = new double[n];
    boolean[] atUpper = new boolean[n];
    for (int j = 0; j < n; j++) {
      MPVariable v = vars.get(j);
      if (v != null) {
        x[j] = v.solutionValue();
        rc[j] = v.reducedCost();
        atUpper[j] = v.basisStatus() == MPSolver.BasisStatus.AT_UPPER_BOUND;
      }
    }
    double[] pi = rows.resourceDuals();
    double[] mu = rows.segmentDuals();
    double[] beta = new double[n];
    double[] stayingOut = new double[demand.length];
    double shortfall = 0;
    for (int s = 0; s < demand.length; s++) {
      stayingOut[s] = Double.NaN;
      if (!chooses[s]) {
        continue;
      }
      // μ_s ≥ R*_s at the final π, exactly, whether or not the inner rounds ran to the end
      double[] rev = revenues(s, pi, memberCount[s], revenueBuffer[s]);
      double bestValue = Logit.bestOfferValue(rev, memberW[s], memberCount[s]);
      // what is missing within round-off of the segment's own figures (1e-9 of buyers × its largest
      // |revenue|, the scale of the floor of ValueBound) is GLOP's round-off, not an offer set left out:
      // at capacity 0 one such 1e-9 kept the bound above an objective of 0, which no relative gap accepts
      double largest = 0;
      for (int j = 0; j < memberCount[s]; j++) {
        largest = Math.max(largest, Math.abs(rev[j]));
      }
      double missing = demand[s] * bestValue - mu[s];
      if (missing > 1e-9 * Math.max(1.0, demand[s] * largest)) {
        shortfall += missing;
      }
      mu[s] = Math.max(mu[s] / demand[s], bestValue);
      List<MPVariable> l = offerVars.get(s);
      for (int t = 0; t < l.size(); t++) {
        double lambda = Math.max(0.0, l.get(t).solutionValue());
        if (lambda == 0) {
          continue;
        }
        int[] set = membersOf(s, offerSets.get(s).get(t));
        double sw = sumOfAttractions(set);
        for (int j : set) {
          x[j] += lambda * demand[s] * attractionOf[j] / (1 + sw);
        }
      }
      double sold = 0;
      for (int i = 0; i < memberCount[s]; i++) {
        int j = members.get(s)[i];
        double r = marginOf[j];
        double[] a = memberUse[s];
        int at = i * capacity.length;
        for (int k = 0; k < capacity.length; k++) {
          r -= pi[k] * a[at + k];
        }
        beta[j] = Math.max(0.0, r - mu[s]);
        rc[j] = Math.min(0.0, r - mu[s]);
        sold += x[j];
      }
      stayingOut[s] = Math.max(0.0, demand[s] - sold);
    }
    if (!verify(x, stayingOut)) {
      return MasterSolution.failed(LpStatus.FAILED, iters);
    }
    double z = 0;
    for (int j = 0; j < n; j++) {
      z += marginOf[j] * x[j];
    }
    return new MasterSolution(LpStatus.OPTIMAL, z, x, rc, atUpper, pi, mu, beta, stayingOut, iters, z + shortfall);
  }

  /** Checks the returned point against rows and bounds, scaled by the row's size. */
  private boolean verify(double[] x, double[] stayingOut) {
    double[] rowUse = new double[capacity.length];
    double[] segUse = new double[demand.length];
    for (int j = 0; j < x.length; j++) {
      MPVariable v = vars.get(j);
      double lb = v == null ? 0.0 : v.lb();
      double ub = v == null ? Double.POSITIVE_INFINITY : v.ub();
      double tol = FEASIBILITY_TOLERANCE * Math.max(1.0, Math.abs(ub == Double.POSITIVE_INFINITY ? x[j] : ub));
      if (x[j] < lb - tol || x[j] > ub + tol) {
        return false;
      }
      double[] a = useStore(j);
      int at = useStart(j);
      for (int r = 0; r < rowUse.length; r++) {
        rowUse[r] += a[at + r] * x[j];
      }
      int s = segmentOf[j];
      if (s >= 0) {
        segUse[s] += x[j];
      }
      if (s >= 0 && chooses[s]
          && x[j] - attractionOf[j] * stayingOut[s] > FEASIBILITY_TOLERANCE * Math.max(1.0, demand[s])) {
        return false;
      }
    }
    for (int s = 0; s < demand.length; s++) {
      if (chooses[s]) {
        double tol = FEASIBILITY_TOLERANCE * Math.max(1.0, demand[s]);
        if (stayingOut[s] < -tol || Math.abs(segUse[s] + stayingOut[s] - demand[s]) > tol) {
          return false;
        }
        segUse[s] = 0;
      }
    }
    return Rows.within(rowUse, capacity) && Rows.within(segUse, demand);
  }

  @Override
  public void close() {
    rows.close();
  }
}
