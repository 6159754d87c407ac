package dev.mixwright.space;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.function.BooleanSupplier;
import java.util.function.Consumer;

/**
 * Counts buildable variants within a time budget and says what it knows when the budget ends: the
 * exact count, or bounds from both sides with a sampled estimate.
 *
 * <p>Five steps, each published as soon as it is done:
 *
 * <ol>
 *   <li>Upper bound: {@link SpaceCounter} with a small table limit ({@value #QUICK_TABLE_LIMIT}
 *       entries), which drops the widest rules until the elimination fits; milliseconds, and exact
 *       when nothing had to be dropped.
 *   <li>When timed, a tenth of the budget (at most a second) of the probes of step 4, for a first
 *       estimate.
 *   <li>The full count: {@link SpaceCounter} with the configured table limit, stopped at half the
 *       budget; exact, or a tighter upper bound.
 *   <li>Sampling for 60 % of the rest of the budget: random probes down the search tree of
 *       {@link Feasibility} (generalised arc consistency, fewest choices first). Knuth's estimator
 *       (Knuth 1975, "Estimating the efficiency of backtrack programs", Mathematics of Computation
 *       29(129), 121–136): a probe that reaches a variant weighs the product of the numbers of live
 *       choices met on its way, a dead end weighs 0, and the mean weight is an unbiased estimate of
 *       the count; its standard error is the sample standard deviation over √n. Every variant a probe
 *       reaches is buildable, so the distinct ones found are a proven lower bound.
 *   <li>For the last 40 % of the budget, a stronger lower bound: the exact counts of the variants
 *       that agree with a found one on a cutset of groups (see {@link #conditioned}).
 * </ol>
 *
 * <p>A probe costs O(groups · propagation); the distinct variants are kept as keys, at most
 * {@value #MAX_KEPT} of them. A budget of 0 or less means no time limit: the full count runs to the
 * end and at most {@value #UNTIMED_PROBES} probes follow when it is not exact.
 */
public final class BudgetedCount {
  /** Table limit of the first, quick upper bound. */
  public static final long QUICK_TABLE_LIMIT = 1L << 12;

  static final int MAX_KEPT = 1 << 20;
  static final long UNTIMED_PROBES = 20_000;

  /**
   * Probes a timed count takes even past its budget (milliseconds on catalogs of hundreds of
   * choices), so that a loaded machine still gets an estimate and a lower bound.
   */
  static final long MIN_PROBES = 64;

  private final VariantSpace space;
  private final long tableLimit;
  private final long seed;
  private final long untimedProbes;

  public BudgetedCount(VariantSpace space) {
    this(space, SpaceCounter.DEFAULT_TABLE_LIMIT, 1);
  }

  /**
   * @param tableLimit largest table of the full count (see {@link SpaceCounter})
   * @param seed seed of the probes: the same seed and the same number of probes, the same estimate
   */
  public BudgetedCount(VariantSpace space, long tableLimit, long seed) {
    this(space, tableLimit, seed, UNTIMED_PROBES);
  }

  /** Tests fix the number of probes of an untimed count, so that its estimate is reproducible. */
  BudgetedCount(VariantSpace space, long tableLimit, long seed, long untimedProbes) {
    if (tableLimit < 1 || tableLimit > SpaceCounter.MAX_TABLE_LIMIT) {
      throw new IllegalArgumentException(
          "tableLimit must be between 1 and " + SpaceCounter.MAX_TABLE_LIMIT + ", got " + tableLimit);
    }
    this.space = space;
    this.tableLimit = tableLimit;
    this.seed = seed;
    this.untimedProbes = untimedProbes;
  }

  /** The choices of buildable variants: what {@link VariantSpace#allowed} lets through. */
  public static boolean[] wholeSpace(VariantSpace space) {
    boolean[] d = new boolean[space.totalChoices()];
    for (int f = 0; f < d.length; f++) {
      d[f] = space.allowed(f);
    }
    return d;
  }

  /** The choices of buildable variants segment s accepts. */
  public static boolean[] segment(VariantSpace space, int s) {
    if (s < 0 || s >= space.segmentCount()) {
      throw new IllegalArgumentException(
          "segment index " + s + " out of range 0.." + (space.segmentCount() - 1));
    }
    boolean[] d = new boolean[space.totalChoices()];
    for (int f = 0; f < d.length; f++) {
      d[f] = space.allowedIn(s, f);
    }
    return d;
  }

  /**
   * The whole space first, then each segment in catalog order, within {@code budgetMs} in all (≤ 0:
   * no limit): half the budget for the whole space, the other half shared by the segments, each
   * count handing on the time it did not use.
   */
  public List<SpaceCount> wholeAndSegments(long budgetMs) {
    List<SpaceCount> out = new ArrayList<>();
    long start = System.nanoTime();
    int segments = space.segmentCount();
    out.add(count(wholeSpace(space), budgetMs <= 0 ? 0 : Math.max(1, budgetMs / 2)));
    for (int s = 0; s < segments; s++) {
      long share = 0;
      if (budgetMs > 0) {
        long left = budgetMs - (System.nanoTime() - start) / 1_000_000;
        share = Math.max(1, left / (segments - s));
      }
      SpaceCount c = count(segment(space, s), share);
      // A segment accepts only buildable variants, so the whole space's upper bound holds for it too.
      BigInteger cap = out.get(0).upper();
      out.add(c.upper().compareTo(cap) <= 0 ? c : SpaceCount.between(c.lower().min(cap), cap, c.estimate()));
    }
    return out;
  }

  /** {@link #count(boolean[], long, BooleanSupplier, Consumer)} without stop signal or progress. */
  public SpaceCount count(boolean[] domain, long budgetMs) {
    return count(domain, budgetMs, () -> false, c -> {});
  }

  /**
   * What can be said of the number of buildable variants within {@code domain} (by flat choice)
   * within {@code budgetMs} (≤ 0: no limit).
   *
   * @param stop polled inside every loop; once it says stop, the answer so far is returned
   * @param progress told each better answer as it is found, on the calling thread
   */
  public SpaceCount count(
      boolean[] domain, long budgetMs, BooleanSupplier stop, Consumer<SpaceCount> progress) {
    if (domain.length != space.totalChoices()) {
      throw new IllegalArgumentException(
          "domain has " + domain.length + " entries, the space has " + space.totalChoices() + " choices");
    }
    long start = System.nanoTime();
    boolean timed = budgetMs > 0;
    long end = timed ? start + budgetMs * 1_000_000L : Long.MAX_VALUE;
    long half = timed ? start + budgetMs * 500_000L : Long.MAX_VALUE;
    BooleanSupplier over = () -> stop.getAsBoolean() || System.nanoTime() - end > 0;

    BigInteger upper = product(domain);
    SpaceCount quick =
        new SpaceCounter(space, Math.min(QUICK_TABLE_LIMIT, tableLimit)).count(domain, over).orElse(null);
    if (quick != null) {
      if (quick.exact()) {
        progress.accept(quick);
        return quick;
      }
      upper = upper.min(quick.upper());
    }
    progress.accept(SpaceCount.atMost(upper));
    Probes probes = new Probes(domain);
    if (probes.search == null) {
      SpaceCount none = SpaceCount.exact(BigInteger.ZERO); // arc consistency empties a domain
      progress.accept(none);
      return none;
    }
    if (timed) {
      // A first estimate early, for whoever reads the count while the full count runs.
      long firstEnd = System.nanoTime() + Math.min(budgetMs * 100_000L, 1_000_000_000L);
      SpaceCount now = probes.run(upper, Long.MAX_VALUE, MIN_PROBES, stop,
          () -> over.getAsBoolean() || System.nanoTime() - firstEnd > 0, progress);
      if (now.exact()) {
        return now;
      }
    }
    if (tableLimit > QUICK_TABLE_LIMIT && !over.getAsBoolean()) {
      BooleanSupplier overHalf = () -> stop.getAsBoolean() || System.nanoTime() - half > 0;
      Optional<SpaceCount> full = new SpaceCounter(space, tableLimit).count(domain, overHalf);
      if (full.isPresent()) {
        if (full.get().exact()) {
          progress.accept(full.get());
          return full.get();
        }
        if (full.get().upper().compareTo(upper) < 0) {
          upper = full.get().upper();
          progress.accept(probes.answer(upper, probes.lower()));
        }
      }
    }
    long probeEnd = timed ? System.nanoTime() + (long) (0.6 * Math.max(0, end - System.nanoTime())) : Long.MAX_VALUE;
    SpaceCount now = probes.run(upper, timed ? Long.MAX_VALUE : untimedProbes, 0, stop,
        () -> over.getAsBoolean() || System.nanoTime() - probeEnd > 0, progress);
    if (now.exact() || probes.variants.isEmpty()) {
      return now;
    }
    BigInteger top = upper;
    BigInteger atLeast = conditioned(probes.domain, probes.variants, over,
        x -> progress.accept(probes.answer(top, x.max(probes.lower()))));
    now = probes.answer(upper, atLeast.max(probes.lower()));
    progress.accept(now);
    return now;
  }

  /**
   * Knuth probes over one domain, and what they found: the distinct variants (a lower bound) and
   * the mean of their weights (the estimate).
   */
  private final class Probes {
    final boolean[] domain;
    final Feasibility search;
    final SplittableRandom rnd = new SplittableRandom(seed);
    final Set<VariantKey> found = new HashSet<>();
    final List<int[]> variants = new ArrayList<>();
    final Mean mean = new Mean();
    final int[] v = new int[space.groupCount()];

    Probes(boolean[] domain) {
      this.domain = domain.clone();
      for (int f = 0; f < this.domain.length; f++) {
        this.domain[f] &= space.allowed(f);
      }
      search = Feasibility.prepared(space, this.domain);
    }

    BigInteger lower() {
      return BigInteger.valueOf(found.size());
    }

    SpaceCount answer(BigInteger upper, BigInteger lower) {
      return SpaceCount.between(lower, upper, mean.estimate());
    }

    /**
     * Probes until {@code over} (but at least {@code minProbes} unless {@code stop}) or
     * {@code maxProbes} more; exact when they found all {@code upper}.
     */
    SpaceCount run(BigInteger upper, long maxProbes, long minProbes, BooleanSupplier stop, BooleanSupplier over,
        Consumer<SpaceCount> progress) {
      for (long probes = 0;
          probes < maxProbes && (probes < minProbes ? !stop.getAsBoolean() : !over.getAsBoolean());
          probes++) {
        double w = search.probe(rnd, v);
        mean.add(w);
        if (w > Double.NEGATIVE_INFINITY && found.size() < MAX_KEPT && found.add(space.key(v))) {
          variants.add(v.clone());
          if (lower().equals(upper)) {
            SpaceCount all = SpaceCount.exact(upper);
            progress.accept(all);
            return all; // every variant the relaxation allows has been found
          }
        }
        if ((probes & 255) == 255) {
          progress.accept(answer(upper, lower()));
        }
      }
      SpaceCount now = answer(upper, lower());
      progress.accept(now);
      return now;
    }
  }

  /** Table limit of the counts with a cutset fixed: many of them run, so each must be quick. */
  static final long CUTSET_TABLE_LIMIT = 1L << 14;

  /**
   * A lower bound from the variants found: fix a set of groups (a w-cutset: the groups in most
   * rules, as few as let the rest count exactly within small tables; Bidyuk &amp;
   * Dechter 2004, "On finding minimal w-cutset", UAI), and add up the exact counts of the variants
   * that agree with each found variant on those groups, once per distinct agreement. The sets
   * counted are disjoint and hold only buildable variants, so the sum never passes the count. The
   * cutset size is found by bisection: O(log groups) counts, then one count per distinct
   * agreement, until {@code over}.
   */
  private BigInteger conditioned(boolean[] d, List<int[]> variants, BooleanSupplier over, Consumer<BigInteger> better) {
    int n = space.groupCount();
    Integer[] byRules = new Integer[n];
    for (int g = 0; g < n; g++) {
      byRules[g] = g;
    }
    java.util.Arrays.sort(byRules, (a, b) -> Integer.compare(space.nogoodsOf(b).length, space.nogoodsOf(a).length));
    SpaceCounter small = new SpaceCounter(space, Math.min(CUTSET_TABLE_LIMIT, tableLimit));
    int[] first = variants.get(0);
    BigInteger sum = BigInteger.ZERO;
    // Bisection on the cutset size: all groups fixed counts exactly; none fixed did not (or we
    // would not be sampling). Large cutsets count fastest, so the probes go from the top.
    int lo = 0;
    int hi = n;
    while (hi - lo > 1) {
      int mid = (lo + hi) >>> 1;
      Optional<SpaceCount> c = small.count(fixed(d, top(byRules, mid), first), over);
      if (c.isEmpty()) {
        return sum;
      }
      if (c.get().exact()) {
        hi = mid;
      } else {
        lo = mid;
      }
    }
    int[] cut = top(byRules, hi);
    Set<List<Integer>> seen = new HashSet<>();
    for (int[] v : variants) {
      if (over.getAsBoolean()) {
        break;
      }
      List<Integer> agreement = new ArrayList<>(cut.length);
      for (int g : cut) {
        agreement.add(v[g]);
      }
      if (!seen.add(agreement)) {
        continue;
      }
      Optional<SpaceCount> c = small.count(fixed(d, cut, v), over);
      if (c.isPresent() && c.get().exact()) {
        sum = sum.add(c.get().upper());
        better.accept(sum);
      }
    }
    return sum;
  }

  private static int[] top(Integer[] groups, int k) {
    int[] out = new int[k];
    for (int i = 0; i < k; i++) {
      out[i] = groups[i];
    }
    return out;
  }

  /** {@code d} with each group of {@code groups} narrowed to its choice in {@code v}. */
  private boolean[] fixed(boolean[] d, int[] groups, int[] v) {
    boolean[] out = d.clone();
    int[] off = space.offsets();
    for (int g : groups) {
      for (int f = off[g]; f < off[g + 1]; f++) {
        out[f] = f - off[g] == v[g];
      }
    }
    return out;
  }

  /** Product of the groups' numbers of choices within the domain: the count with no rules. */
  BigInteger product(boolean[] domain) {
    BigInteger p = BigInteger.ONE;
    int[] off = space.offsets();
    for (int g = 0; g < space.groupCount(); g++) {
      int n = 0;
      for (int f = off[g]; f < off[g + 1]; f++) {
        n += domain[f] && space.allowed(f) ? 1 : 0;
      }
      p = p.multiply(BigInteger.valueOf(n));
    }
    return p;
  }

  /**
   * Mean and standard error of weights e^x given as logarithms x (x = -∞ for 0), kept relative to
   * the largest x so far, since weights can pass the range of a double.
   */
  static final class Mean {
    private long n;
    private double top = Double.NEGATIVE_INFINITY;
    private double s1;
    private double s2;

    void add(double x) {
      n++;
      if (x == Double.NEGATIVE_INFINITY) {
        return;
      }
      if (x > top) {
        double r = top == Double.NEGATIVE_INFINITY ? 0 : Math.exp(top - x);
        s1 *= r;
        s2 *= r * r;
        top = x;
      }
      double e = Math.exp(x - top);
      s1 += e;
      s2 += e * e;
    }

    /** Empty until two weights are in. */
    Optional<SpaceCount.Estimate> estimate() {
      if (n < 2) {
        return Optional.empty();
      }
      if (top == Double.NEGATIVE_INFINITY) {
        return Optional.of(new SpaceCount.Estimate(BigDecimal.ZERO, BigDecimal.ZERO, n));
      }
      double m = s1 / n;
      double var = Math.max(0, (s2 - s1 * s1 / n) / (n - 1));
      double se = Math.sqrt(var / n);
      return Optional.of(new SpaceCount.Estimate(scaled(m, top), scaled(se, top), n));
    }

    /** a · e^top as a decimal of six significant digits. */
    static BigDecimal scaled(double a, double top) {
      if (a <= 0) {
        return BigDecimal.ZERO;
      }
      double log10 = Math.log10(a) + top / Math.log(10);
      int exponent = (int) Math.floor(log10);
      double mantissa = Math.pow(10, log10 - exponent);
      return new BigDecimal(mantissa, new MathContext(6)).scaleByPowerOfTen(exponent).stripTrailingZeros();
    }
  }
}
