package dev.mixwright.pricing;

import dev.mixwright.space.BestFirst;
import dev.mixwright.space.EliminationOrder;
import dev.mixwright.space.Nogood;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * Exact k-best pricing by branch-and-bound whose bound is exact: the cost-to-go tables of bucket
 * elimination.
 *
 * <p>Per query, groups are eliminated in the min-fill order of {@link EliminationOrder}:
 * eliminating group x turns its weight, the nogoods whose first eliminated group it is and the
 * messages sent to it into one table m_x over its neighbours at that time, the maximum over x's
 * choices (Bertelè &amp; Brioschi 1972, <i>Nonserial Dynamic Programming</i>; Dechter 1999, "Bucket
 * elimination", Artificial Intelligence 113). The search then assigns groups in the reverse order.
 * After the groups above depth d are set, the messages that cross from depth ≥ d to the set groups
 * add up to the best completion exactly, so the bound of a choice is the best score below it (the
 * use of bucket-elimination tables as search heuristics follows Kask &amp; Dechter 2001, "A general
 * scheme for automatic generation of search heuristics from specification dependencies", Artificial
 * Intelligence 129). The search walks children best bound first; the first leaf is the optimum, and
 * k best outside an excluded set cost about (k + excluded met) · G · d node expansions.
 *
 * <p>Time per query O(Σ_x d_x · |table_x| · (messages + nogoods of x)) for the tables, i.e.
 * O(G · d^(w+1)) for induced width w, plus the search; memory Σ_x |table_x|. Usable only when the
 * tables fit the limit given ({@link #fitting}); {@link BranchAndBoundPricer} uses
 * {@link ForwardCheckingPricer} where they do not.
 */
public final class BucketEliminationPricer extends NodeLimitedPricer {
  private final int groups;
  private final int[] offset;
  private final int[] order; // depth -> group
  private final int[] depthOf;
  private final int[][] scope; // per group: its message's scope (groups)
  private final int[][] stride; // per group: index strides of the scope
  private final double[][] table; // per group: its message, by scope index
  private final int[][] incoming; // per group: groups whose message it receives
  private final int[][] bucketNogoods; // per group: nogoods checked when it is set
  private final int[][] crossing; // per depth d (0..G): messages from depth >= d into depth < d
  private final Nogood[] nogoods;
  private final int[] elimination;
  private final long tableEntries;
  private final int[][] strideOfX; // per group x: the stride of x in each incoming message's scope
  private final int[][][] stepDelta; // per group x, scope position i: index change of each incoming message when i steps
  private final int[][] crossWith; // per depth d: messages of crossing[d + 1] whose scope holds order[d]
  private final int[][] crossWithStride; // ... and the stride of order[d] in each
  private final int[][] crossWithout; // per depth d: the other messages of crossing[d + 1]
  private final int[][] crossBase; // per depth d: scratch for the index bases of crossWith[d]
  private final int[][] memberChoices; // per nogood: member choices (indices) of its deepest group
  private final int[] usableOf;
  private final int[] incomingBase;
  private final boolean[] blockedChoice;

  // per query
  private final int[] v;
  private final int[][] candChoice;
  private final double[][] candBound;
  private double[] w;
  private QueryRun run;
  private long budget;

  private BucketEliminationPricer(
      VariantSpace space, long nodeLimit, int[] elimination, int[][] scope, long entries) {
    super(space, "bucket-elimination", nodeLimit);
    this.groups = space.groupCount();
    this.offset = space.offsets();
    this.nogoods = space.nogoods();
    this.elimination = elimination;
    this.scope = scope;
    this.tableEntries = entries;
    order = new int[groups];
    depthOf = new int[groups];
    for (int i = 0; i < groups; i++) {
      order[groups - 1 - i] = elimination[i];
    }
    for (int d = 0; d < groups; d++) {
      depthOf[order[d]] = d;
    }
    stride = new int[groups][];
    table = new double[groups][];
    int[] target = new int[groups];
    List<List<Integer>> in = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      in.add(new ArrayList<>());
    }
    for (int g = 0; g < groups; g++) {
      int[] s = scope[g];
      stride[g] = new int[s.length];
      int size = 1;
      for (int i = s.length - 1; i >= 0; i--) {
        stride[g][i] = size;
        size *= space.choiceCount(s[i]);
      }
      table[g] = new double[size];
      // the message goes to the deepest group of its scope, the first of them to be eliminated
      int t = -1;
      for (int h : s) {
        if (t < 0 || depthOf[h] > depthOf[t]) {
          t = h;
        }
      }
      target[g] = t;
      if (t >= 0) {
        in.get(t).add(g);
      }
    }
    incoming = new int[groups][];
    for (int g = 0; g < groups; g++) {
      incoming[g] = in.get(g).stream().mapToInt(Integer::intValue).toArray();
    }
    List<List<Integer>> atBucket = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      atBucket.add(new ArrayList<>());
    }
    for (int n = 0; n < nogoods.length; n++) {
      int deepest = -1;
      for (int h : nogoods[n].groups()) {
        if (deepest < 0 || depthOf[h] > depthOf[deepest]) {
          deepest = h;
        }
      }
      atBucket.get(deepest).add(n);
    }
    bucketNogoods = new int[groups][];
    for (int g = 0; g < groups; g++) {
      bucketNogoods[g] = atBucket.get(g).stream().mapToInt(Integer::intValue).toArray();
    }
    crossing = new int[groups + 1][];
    for (int d = 0; d <= groups; d++) {
      List<Integer> c = new ArrayList<>();
      for (int g = 0; g < groups; g++) {
        int td = target[g] < 0 ? -1 : depthOf[target[g]];
        if (depthOf[g] >= d && td < d) {
          c.add(g);
        }
      }
      crossing[d] = c.stream().mapToInt(Integer::intValue).toArray();
    }
    strideOfX = new int[groups][];
    int maxIn = 0;
    int maxChoices = 1;
    for (int g = 0; g < groups; g++) {
      strideOfX[g] = new int[incoming[g].length];
      for (int k = 0; k < incoming[g].length; k++) {
        int y = incoming[g][k];
        for (int i = 0; i < scope[y].length; i++) {
          if (scope[y][i] == g) {
            strideOfX[g][k] = stride[y][i];
          }
        }
      }
      maxIn = Math.max(maxIn, incoming[g].length);
      maxChoices = Math.max(maxChoices, space.choiceCount(g));
    }
    memberChoices = new int[nogoods.length][];
    for (int n = 0; n < nogoods.length; n++) {
      int deepest = -1;
      for (int h : nogoods[n].groups()) {
        if (deepest < 0 || depthOf[h] > depthOf[deepest]) {
          deepest = h;
        }
      }
      int[] list = new int[space.choiceCount(deepest)];
      int c = 0;
      for (int k = 0; k < list.length; k++) {
        if (nogoods[n].member()[offset[deepest] + k]) {
          list[c++] = k;
        }
      }
      memberChoices[n] = Arrays.copyOf(list, c);
    }
    crossWith = new int[groups][];
    crossWithStride = new int[groups][];
    crossWithout = new int[groups][];
    crossBase = new int[groups][];
    for (int d = 0; d < groups; d++) {
      int x = order[d];
      List<Integer> with = new ArrayList<>();
      List<Integer> withStride = new ArrayList<>();
      List<Integer> without = new ArrayList<>();
      for (int y : crossing[d + 1]) {
        int st = -1;
        for (int i = 0; i < scope[y].length; i++) {
          if (scope[y][i] == x) {
            st = stride[y][i];
          }
        }
        if (st >= 0) {
          with.add(y);
          withStride.add(st);
        } else {
          without.add(y);
        }
      }
      crossWith[d] = with.stream().mapToInt(Integer::intValue).toArray();
      crossWithStride[d] = withStride.stream().mapToInt(Integer::intValue).toArray();
      crossWithout[d] = without.stream().mapToInt(Integer::intValue).toArray();
      crossBase[d] = new int[with.size()];
    }
    stepDelta = new int[groups][][];
    for (int g = 0; g < groups; g++) {
      int[] sc = scope[g];
      int[] inc = incoming[g];
      int[][] strideIn = new int[inc.length][sc.length];
      for (int k = 0; k < inc.length; k++) {
        int y = inc[k];
        for (int i = 0; i < sc.length; i++) {
          for (int j = 0; j < scope[y].length; j++) {
            if (scope[y][j] == sc[i]) {
              strideIn[k][i] = stride[y][j];
            }
          }
        }
      }
      stepDelta[g] = new int[sc.length][inc.length];
      for (int i = 0; i < sc.length; i++) {
        for (int k = 0; k < inc.length; k++) {
          int delta = strideIn[k][i];
          for (int j = i + 1; j < sc.length; j++) {
            delta -= strideIn[k][j] * (space.choiceCount(sc[j]) - 1);
          }
          stepDelta[g][i][k] = delta;
        }
      }
    }
    usableOf = new int[maxChoices];
    incomingBase = new int[maxIn];
    blockedChoice = new boolean[maxChoices];
    v = new int[groups];
    candChoice = new int[groups][];
    candBound = new double[groups][];
    for (int g = 0; g < groups; g++) {
      candChoice[g] = new int[space.choiceCount(g)];
      candBound[g] = new double[space.choiceCount(g)];
    }
  }

  /**
   * The pricer for this space, or empty when the tables of a min-fill elimination order would hold
   * more than {@code maxEntries} doubles in all.
   *
   * @param nodeLimit most search nodes per query; when reached the outcome is not exact but keeps a
   *     valid upper bound. {@code Long.MAX_VALUE} for none.
   */
  public static Optional<BucketEliminationPricer> fitting(VariantSpace space, long nodeLimit, long maxEntries) {
    int groups = space.groupCount();
    if (groups == 0) {
      return Optional.empty();
    }
    EliminationOrder graph = new EliminationOrder(groups);
    for (Nogood n : space.nogoods()) {
      graph.connect(n.groups());
    }
    int[] elimination = new int[groups];
    int[][] scope = new int[groups][];
    long entries = 0;
    for (int i = 0; i < groups; i++) {
      int x = graph.next();
      elimination[i] = x;
      scope[x] = graph.neighbours(x);
      long size = 1;
      for (int a : scope[x]) {
        size = Math.multiplyHigh(size, space.choiceCount(a)) != 0 ? Long.MAX_VALUE : size * space.choiceCount(a);
        if (size > maxEntries) {
          return Optional.empty();
        }
      }
      entries += size;
      if (entries > maxEntries) {
        return Optional.empty();
      }
      graph.eliminate(x);
    }
    return Optional.of(new BucketEliminationPricer(space, nodeLimit, elimination, scope, entries));
  }

  /** Doubles the tables hold in all: their filling is the fixed cost of a query. */
  public long tableEntries() {
    return tableEntries;
  }

  @Override
  PricingOutcome price(PricingQuery q, long limit) {
    run = new QueryRun(space, q);
    w = run.w;
    budget = limit;
    for (int x : elimination) {
      if (!eliminate(x)) {
        // cancelled before the tables were filled: nothing is proven beyond what was found
        run.leaveOpen(Double.POSITIVE_INFINITY);
        return ended(false);
      }
    }
    boolean complete = true;
    double root = run.constant + crossingSum(0);
    if (root > run.threshold) {
      complete = search(0, run.constant);
    }
    return ended(complete);
  }

  private PricingOutcome ended(boolean complete) {
    PricingOutcome out = run.outcome(complete);
    w = null;
    run = null;
    return out;
  }

  /**
   * Fills m_x over every assignment of its scope (an odometer over the scope's groups). Per
   * assignment the part of each incoming message's index that does not depend on x, and the choices
   * of x that the bucket's nogoods block, are found once; the loop over x's choices then only adds.
   * False when the query was cancelled first (looked at every 4096 entries: a table of a few
   * thousand entries over a group of thousands of choices is seconds of work).
   */
  private boolean eliminate(int x) {
    int[] s = scope[x];
    double[] m = table[x];
    int base = offset[x];
    int[] in = incoming[x];
    int[] xs = strideOfX[x];
    int[] ng = bucketNogoods[x];
    int nu = 0;
    int[] uc = usableOf;
    for (int c = 0; c < space.choiceCount(x); c++) {
      if (QueryChecks.usable(space, w, base + c)) {
        uc[nu++] = c;
      }
    }
    int[] partial = incomingBase;
    boolean[] blockedC = blockedChoice;
    for (int h : s) {
      v[h] = 0;
    }
    // index bases of the incoming messages with x at 0, kept up to date as the odometer steps
    Arrays.fill(partial, 0, in.length, 0);
    int[][] delta = stepDelta[x];
    for (int idx = 0; idx < m.length; idx++) {
      if ((idx & 0xFFF) == 0xFFF && run.mayStop()) {
        return false;
      }
      boolean anyBlocked = false;
      for (int n : ng) {
        if (othersMatch(n, x)) {
          for (int c : memberChoices[n]) {
            blockedC[c] = true;
          }
          anyBlocked = true;
        }
      }
      double best = Double.NEGATIVE_INFINITY;
      for (int i = 0; i < nu; i++) {
        int c = uc[i];
        if (anyBlocked && blockedC[c]) {
          continue;
        }
        double val = w[base + c];
        for (int k = 0; k < in.length; k++) {
          val += table[in[k]][partial[k] + xs[k] * c];
        }
        if (val > best) {
          best = val;
        }
      }
      m[idx] = best;
      if (anyBlocked) {
        Arrays.fill(blockedC, false);
      }
      // next assignment of the scope, last group fastest (matches the strides)
      for (int i = s.length - 1; i >= 0; i--) {
        int h = s[i];
        if (++v[h] < space.choiceCount(h)) {
          int[] dk = delta[i];
          for (int k = 0; k < in.length; k++) {
            partial[k] += dk[k];
          }
          break;
        }
        v[h] = 0;
      }
    }
    return true;
  }

  /** Whether every group of nogood n other than x holds a member choice. */
  private boolean othersMatch(int n, int x) {
    Nogood ng = nogoods[n];
    boolean[] member = ng.member();
    for (int g : ng.groups()) {
      if (g != x && !member[offset[g] + v[g]]) {
        return false;
      }
    }
    return true;
  }

  private int index(int y) {
    int[] s = scope[y];
    int[] st = stride[y];
    int idx = 0;
    for (int i = 0; i < s.length; i++) {
      idx += st[i] * v[s[i]];
    }
    return idx;
  }

  private boolean violates(int[] ng) {
    for (int n : ng) {
      if (nogoods[n].violatedBy(v, offset)) {
        return true;
      }
    }
    return false;
  }

  private double crossingSum(int d) {
    double s = 0;
    for (int y : crossing[d]) {
      s += table[y][index(y)];
    }
    return s;
  }

  /** Depth-first, children best bound first; false when the node limit stopped it. */
  private boolean search(int d, double partial) {
    if (d == groups) {
      leaf();
      return true;
    }
    int x = order[d];
    int base = offset[x];
    int[] cc = candChoice[x];
    double[] cb = candBound[x];
    int n = 0;
    double cutoff = run.cutoff();
    // Messages that do not see x add the same to every child; the others differ by a stride of x.
    double fixed = partial;
    for (int y : crossWithout[d]) {
      fixed += table[y][index(y)];
    }
    int[] with = crossWith[d];
    int[] withStride = crossWithStride[d];
    int[] wb = crossBase[d];
    v[x] = 0;
    for (int k = 0; k < with.length; k++) {
      wb[k] = index(with[k]);
    }
    for (int c = 0; c < space.choiceCount(x); c++) {
      int f = base + c;
      if (!QueryChecks.usable(space, w, f)) {
        continue;
      }
      v[x] = c;
      if (violates(bucketNogoods[x])) {
        continue;
      }
      double b = fixed + w[f];
      for (int k = 0; k < with.length; k++) {
        b += table[with[k]][wb[k] + withStride[k] * c];
      }
      if (b + slack(b) > cutoff) {
        n = BestFirst.insert(cb, cc, n, b, c);
      }
    }
    for (int i = 0; i < n; i++) {
      double b = cb[i];
      if (!(b + slack(b) > run.cutoff())) {
        break;
      }
      if (run.spent(budget)) {
        run.leaveOpen(b);
        return false;
      }
      run.nodes++;
      int c = cc[i];
      v[x] = c;
      if (!search(d + 1, partial + w[base + c])) {
        if (i + 1 < n) {
          run.leaveOpen(cb[i + 1]);
        }
        return false;
      }
    }
    return true;
  }

  /** Summation order differs between the tables and the leaf score; never prune on round-off. */
  private static double slack(double b) {
    return 1e-9 * (1 + Math.abs(b));
  }

  private void leaf() {
    assert space.isBuildable(v) : "a rule violation reached a leaf";
    run.leaf(v);
  }
}
