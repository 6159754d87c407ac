package dev.mixwright.space;

import java.math.BigInteger;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.Deque;
import java.util.List;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * Counts the buildable variants of a {@link VariantSpace} (or of one segment, or of any restriction
 * of the choices) without listing them.
 *
 * <p>Method: nonserial dynamic programming in its bucket-elimination form (Bertelè &amp; Brioschi
 * 1972, <i>Nonserial Dynamic Programming</i>; Dechter 1999, "Bucket elimination: a unifying
 * framework for reasoning", Artificial Intelligence 113). Each group is a variable over its allowed
 * choices and each nogood a 0/1 factor over its groups; the count is the sum over all assignments of
 * the product of the factors. The groups are split into the connected components of the nogood
 * hypergraph, whose counts multiply; a group in no nogood contributes its number of allowed choices.
 * Inside a component groups are eliminated in the greedy min-fill order of {@link EliminationOrder}
 * (min-degree on large components, where min-fill itself gets slow): eliminating a group
 * multiplies the factors that mention it and sums it out, leaving one dense table over its
 * neighbours at that point. Time O(n · d^(w+1)) and table size O(d^w) for n groups, d choices per
 * group and induced width w of the order.
 *
 * <p>Before counting, the nogoods are simplified against the domains to a fixpoint: a nogood that no
 * allowed choice of one of its groups can match is dropped, a group whose every allowed choice
 * matches leaves the nogood's scope, and a nogood left with one group removes choices. This often
 * cuts components apart, in particular for segments whose accepts narrow a group.
 *
 * <p>Numbers: tables hold longs. A component whose count may pass 2^62 is first counted in doubles
 * for its size; then either in longs (small enough) or modulo as many primes below 2^31 as it
 * takes to pass twice that size, the count being rebuilt by the Chinese remainder theorem
 * (multi-modular counting, common practice in exact computer algebra). Tables stay primitive
 * {@code long[]} throughout; a nogood's 0/1 table becomes bit masks over the eliminated group's
 * choices, so it costs a word AND per entry rather than a read per choice.
 *
 * <p>When a table would exceed the limit, the widest nogood among those that fed it is dropped and
 * the component is planned again; the result is then an upper bound ({@link SpaceCount.Bounded}
 * with lower bound 0), since dropping a nogood only adds variants.
 *
 * <p>Every count can be given a stop signal, polled between components, between elimination steps,
 * every 256 rules of the first pass over them and every 1024 table entries; {@link #count(boolean[],
 * BooleanSupplier)} then answers empty instead of waiting.
 * {@link BudgetedCount} builds bounds from both sides and an estimate on top of this.
 */
public final class SpaceCounter {
  /** Default largest table, in entries (32 MiB of longs). */
  public static final long DEFAULT_TABLE_LIMIT = 1L << 22;

  /** Largest table limit accepted: Java arrays are int-indexed. */
  public static final long MAX_TABLE_LIMIT = 1L << 30;

  private final VariantSpace space;
  private final long tableLimit;

  public SpaceCounter(VariantSpace space) {
    this(space, DEFAULT_TABLE_LIMIT);
  }

  /** @param tableLimit largest table (entries) the count may build, 1..{@link #MAX_TABLE_LIMIT} */
  public SpaceCounter(VariantSpace space, long tableLimit) {
    if (tableLimit < 1 || tableLimit > MAX_TABLE_LIMIT) {
      throw new IllegalArgumentException(
          "tableLimit must be between 1 and " + MAX_TABLE_LIMIT + ", got " + tableLimit);
    }
    this.space = space;
    this.tableLimit = tableLimit;
  }

  public long tableLimit() {
    return tableLimit;
  }

  /** Number of buildable variants. */
  public SpaceCount count() {
    return countWithin(BudgetedCount.wholeSpace(space), NEVER);
  }

  /** Number of variants that are buildable and accepted by segment s. */
  public SpaceCount count(int segment) {
    return countWithin(BudgetedCount.segment(space, segment), NEVER);
  }

  /** {@link #count(int)} for every segment, in catalog order. */
  public List<SpaceCount> perSegment() {
    List<SpaceCount> out = new ArrayList<>(space.segmentCount());
    for (int s = 0; s < space.segmentCount(); s++) {
      out.add(count(s));
    }
    return out;
  }

  /**
   * Number of buildable variants whose every choice is marked in {@code domain} (indexed by flat
   * choice, length {@link VariantSpace#totalChoices()}). Choices that {@link VariantSpace#allowed}
   * rejects stay out whatever the mark.
   */
  public SpaceCount count(boolean[] domain) {
    return count(domain, NEVER).orElseThrow();
  }

  /**
   * {@link #count(boolean[])}, polling {@code stop}: empty when it said stop before the count was
   * done.
   */
  public Optional<SpaceCount> count(boolean[] domain, BooleanSupplier stop) {
    if (domain.length != space.totalChoices()) {
      throw new IllegalArgumentException(
          "domain has " + domain.length + " entries, the space has " + space.totalChoices() + " choices");
    }
    boolean[] d = new boolean[domain.length];
    for (int f = 0; f < d.length; f++) {
      d[f] = domain[f] && space.allowed(f);
    }
    try {
      return Optional.of(countWithin(d, stop));
    } catch (Stopped e) {
      return Optional.empty();
    }
  }

  private static final BooleanSupplier NEVER = () -> false;

  /** Thrown through the elimination when the stop signal is seen; carries no stack. */
  private static final class Stopped extends RuntimeException {
    Stopped() {
      super(null, null, false, false);
    }
  }

  private static void poll(BooleanSupplier stop) {
    if (stop.getAsBoolean()) {
      throw new Stopped();
    }
  }

  /**
   * A nogood restricted to the live choices: scope ascending, member[j][local choice]. A class, not
   * a record: lists of them are edited by identity.
   */
  private static final class Local {
    private final int[] scope;
    private final boolean[][] member;

    Local(int[] scope, boolean[][] member) {
      this.scope = scope;
      this.member = member;
    }

    int[] scope() {
      return scope;
    }

    boolean[][] member() {
      return member;
    }
  }

  /** An elimination order (local indices), or the nogood to drop when some table is too big. */
  private record Plan(int[] order, Local drop) {}

  private static final SpaceCount NONE = SpaceCount.exact(BigInteger.ZERO);

  private SpaceCount countWithin(boolean[] dom, BooleanSupplier stop) {
    int n = space.groupCount();
    int[] off = space.offsets();
    for (int g = 0; g < n; g++) {
      if (aliveCount(dom, off, g) == 0) {
        return NONE;
      }
    }
    int m = space.nogoodCount();
    int[][] scope = new int[m][];
    boolean[] dead = new boolean[m];
    for (int i = 0; i < m; i++) {
      scope[i] = space.nogood(i).groups().clone();
      Arrays.sort(scope[i]);
    }
    boolean changed = true;
    while (changed) {
      changed = false;
      for (int i = 0; i < m; i++) {
        if (dead[i]) {
          continue;
        }
        if ((i & 255) == 255) {
          poll(stop); // a pass over thousands of rules on groups of thousands of choices is seconds
        }
        boolean[] mem = space.nogood(i).member();
        int[] sc = scope[i];
        int[] next = new int[sc.length];
        int keep = 0;
        boolean vacuous = false;
        for (int g : sc) {
          int alive = 0;
          int hit = 0;
          for (int f = off[g]; f < off[g + 1]; f++) {
            if (dom[f]) {
              alive++;
              if (mem[f]) {
                hit++;
              }
            }
          }
          if (hit == 0) {
            vacuous = true;
            break;
          }
          if (hit < alive) {
            next[keep++] = g;
          }
        }
        if (vacuous) {
          dead[i] = true;
        } else if (keep == 0) {
          return NONE; // every live variant holds this combination
        } else if (keep == 1) {
          int g = next[0];
          for (int f = off[g]; f < off[g + 1]; f++) {
            if (mem[f]) {
              dom[f] = false;
            }
          }
          dead[i] = true;
          changed = true;
          if (aliveCount(dom, off, g) == 0) {
            return NONE;
          }
        } else if (keep < sc.length) {
          scope[i] = Arrays.copyOf(next, keep);
        }
      }
    }

    int[] dsize = new int[n];
    int[][] localOf = new int[n][];
    for (int g = 0; g < n; g++) {
      localOf[g] = new int[off[g + 1] - off[g]];
      for (int k = 0; k < localOf[g].length; k++) {
        localOf[g][k] = dom[off[g] + k] ? dsize[g]++ : -1;
      }
    }
    List<Local> live = new ArrayList<>();
    for (int i = 0; i < m; i++) {
      if (dead[i]) {
        continue;
      }
      boolean[] mem = space.nogood(i).member();
      int[] sc = scope[i];
      boolean[][] lm = new boolean[sc.length][];
      for (int j = 0; j < sc.length; j++) {
        int g = sc[j];
        lm[j] = new boolean[dsize[g]];
        for (int k = 0; k < localOf[g].length; k++) {
          if (localOf[g][k] >= 0) {
            lm[j][localOf[g][k]] = mem[off[g] + k];
          }
        }
      }
      live.add(new Local(sc, lm));
    }

    BigInteger value = BigInteger.ONE;
    boolean exact = true;
    boolean[] covered = new boolean[n];
    for (Local l : live) {
      for (int g : l.scope()) {
        covered[g] = true;
      }
    }
    for (int g = 0; g < n; g++) {
      if (!covered[g]) {
        value = value.multiply(BigInteger.valueOf(dsize[g]));
      }
    }
    Deque<List<Local>> work = new ArrayDeque<>(split(live, n));
    while (!work.isEmpty()) {
      poll(stop);
      List<Local> comp = work.pop();
      int[] groups = groupsOf(comp, n);
      Plan plan = plan(groups, comp, dsize, stop);
      if (plan.drop() != null) {
        exact = false;
        List<Local> rest = new ArrayList<>(comp);
        rest.remove(plan.drop());
        boolean[] still = new boolean[n];
        for (Local l : rest) {
          for (int g : l.scope()) {
            still[g] = true;
          }
        }
        for (int g : groups) {
          if (!still[g]) {
            value = value.multiply(BigInteger.valueOf(dsize[g]));
          }
        }
        work.addAll(split(rest, n));
      } else {
        value = value.multiply(evaluate(groups, comp, plan.order(), dsize, stop));
      }
      if (value.signum() == 0) {
        return NONE; // a component with no assignment empties the space whatever was dropped
      }
    }
    return exact ? SpaceCount.exact(value) : SpaceCount.atMost(value);
  }

  private static int aliveCount(boolean[] dom, int[] off, int g) {
    int c = 0;
    for (int f = off[g]; f < off[g + 1]; f++) {
      if (dom[f]) {
        c++;
      }
    }
    return c;
  }

  private static int[] groupsOf(List<Local> comp, int n) {
    boolean[] in = new boolean[n];
    for (Local l : comp) {
      for (int g : l.scope()) {
        in[g] = true;
      }
    }
    int c = 0;
    for (boolean b : in) {
      c += b ? 1 : 0;
    }
    int[] out = new int[c];
    c = 0;
    for (int g = 0; g < n; g++) {
      if (in[g]) {
        out[c++] = g;
      }
    }
    return out;
  }

  /** Connected components of the hypergraph the nogoods span (union-find over groups). */
  private static List<List<Local>> split(List<Local> nogoods, int n) {
    int[] parent = new int[n];
    for (int g = 0; g < n; g++) {
      parent[g] = g;
    }
    for (Local l : nogoods) {
      int a = find(parent, l.scope()[0]);
      for (int g : l.scope()) {
        int b = find(parent, g);
        if (a != b) {
          parent[b] = a;
        }
      }
    }
    List<List<Local>> byRoot = new ArrayList<>();
    int[] slot = new int[n];
    Arrays.fill(slot, -1);
    for (Local l : nogoods) {
      int r = find(parent, l.scope()[0]);
      if (slot[r] < 0) {
        slot[r] = byRoot.size();
        byRoot.add(new ArrayList<>());
      }
      byRoot.get(slot[r]).add(l);
    }
    return byRoot;
  }

  private static int find(int[] parent, int g) {
    while (parent[g] != g) {
      parent[g] = parent[parent[g]];
      g = parent[g];
    }
    return g;
  }

  /** Product of domain sizes, saturating just above the limit. */
  private long tableSize(int[] localVars, int[] dim) {
    long size = 1;
    for (int v : localVars) {
      size *= dim[v];
      if (size > tableLimit) {
        return tableLimit + 1;
      }
    }
    return size;
  }

  private long tableSize(BitSet localVars, int[] dim) {
    return tableSize(localVars.stream().toArray(), dim);
  }

  private static int[] localScope(Local l, int[] where) {
    int[] s = new int[l.scope().length];
    for (int j = 0; j < s.length; j++) {
      s[j] = where[l.scope()[j]];
    }
    return s;
  }

  /**
   * Simulates the elimination on scopes only: the order when every table fits, else the widest
   * nogood among those that fed the first table too big.
   */
  private Plan plan(int[] groups, List<Local> comp, int[] dsize, BooleanSupplier stop) {
    int c = groups.length;
    int[] where = localIndex(groups, dsize.length);
    int[] dim = new int[c];
    for (int v = 0; v < c; v++) {
      dim[v] = dsize[groups[v]];
    }
    int q = comp.size();
    int[][] scopes = new int[q][];
    long[] ownSize = new long[q];
    int tooWide = -1;
    for (int i = 0; i < q; i++) {
      scopes[i] = localScope(comp.get(i), where);
      ownSize[i] = tableSize(scopes[i], dim);
      if (ownSize[i] > tableLimit && (tooWide < 0 || scopes[i].length > scopes[tooWide].length)) {
        tooWide = i;
      }
    }
    if (tooWide >= 0) {
      return new Plan(null, comp.get(tooWide));
    }
    EliminationOrder graph = new EliminationOrder(c);
    List<BitSet> fScope = new ArrayList<>();
    List<BitSet> fProv = new ArrayList<>();
    for (int i = 0; i < q; i++) {
      graph.connect(scopes[i]);
      BitSet s = new BitSet(c);
      for (int a : scopes[i]) {
        s.set(a);
      }
      BitSet p = new BitSet(q);
      p.set(i);
      fScope.add(s);
      fProv.add(p);
    }
    int[] order = new int[c];
    for (int step = 0; step < c; step++) {
      poll(stop);
      int v = graph.next();
      BitSet newScope = new BitSet(c);
      BitSet prov = new BitSet(q);
      for (int i = fScope.size() - 1; i >= 0; i--) {
        if (fScope.get(i).get(v)) {
          newScope.or(fScope.get(i));
          prov.or(fProv.get(i));
          fScope.remove(i);
          fProv.remove(i);
        }
      }
      newScope.clear(v);
      if (tableSize(newScope, dim) > tableLimit) {
        int drop = -1;
        for (int i = prov.nextSetBit(0); i >= 0; i = prov.nextSetBit(i + 1)) {
          if (drop < 0
              || scopes[i].length > scopes[drop].length
              || (scopes[i].length == scopes[drop].length && ownSize[i] >= ownSize[drop])) {
            drop = i;
          }
        }
        return new Plan(null, comp.get(drop));
      }
      if (!newScope.isEmpty()) {
        fScope.add(newScope);
        fProv.add(prov);
      }
      graph.eliminate(v);
      order[step] = v;
    }
    return new Plan(order, null);
  }

  private static int[] localIndex(int[] groups, int n) {
    int[] where = new int[n];
    Arrays.fill(where, -1);
    for (int v = 0; v < groups.length; v++) {
      where[groups[v]] = v;
    }
    return where;
  }

  /** Arithmetic of one elimination pass. */
  private enum Mode {
    /** Longs, throwing on overflow. */
    EXACT,
    /** Residues modulo a prime below 2^31: every product of two fits in a long. */
    MODULAR,
    /** Doubles (stored as raw bits in the long tables), for the magnitude only. */
    ESTIMATE
  }

  private static final double TWO_POW_62 = 0x1p62;

  /**
   * Exact count of one component. Tables never overflow when the product of the domain sizes fits
   * in a long (an entry counts assignments of the groups summed out so far). Otherwise a
   * floating-point pass estimates the count: if it is below 2^62 the long pass is tried, else the
   * count is taken modulo primes until their product exceeds twice the estimate. The estimate's
   * relative error is below (eliminations × (choices + bucket size)) × 2^-53, far less than the
   * factor 2 of margin, since every operation adds or multiplies nonnegative numbers.
   */
  private BigInteger evaluate(int[] groups, List<Local> comp, int[] order, int[] dsize, BooleanSupplier stop) {
    BigInteger bound = BigInteger.ONE;
    for (int g : groups) {
      bound = bound.multiply(BigInteger.valueOf(dsize[g]));
    }
    if (bound.bitLength() <= 62) {
      return BigInteger.valueOf(eliminate(groups, comp, order, dsize, Mode.EXACT, 0, stop));
    }
    double estimate =
        Double.longBitsToDouble(eliminate(groups, comp, order, dsize, Mode.ESTIMATE, 0, stop));
    BigInteger need = bound;
    if (estimate < TWO_POW_62) {
      try {
        return BigInteger.valueOf(eliminate(groups, comp, order, dsize, Mode.EXACT, 0, stop));
      } catch (ArithmeticException overflow) {
        // The estimate was close to 2^62; the bound below still holds.
      }
    } else if (Double.isFinite(estimate)) {
      need = new java.math.BigDecimal(estimate).toBigInteger().shiftLeft(1).add(BigInteger.TWO).min(bound);
    }
    BigInteger x = BigInteger.ZERO;
    BigInteger modulus = BigInteger.ONE;
    for (int i = 0; modulus.compareTo(need) <= 0; i++) {
      long p = Primes.below31(i);
      long r = eliminate(groups, comp, order, dsize, Mode.MODULAR, p, stop);
      // Chinese remainder step: x' = x + M·((r − x)·M⁻¹ mod p), so x' ≡ x (mod M), x' ≡ r (mod p).
      BigInteger bp = BigInteger.valueOf(p);
      BigInteger t = BigInteger.valueOf(r).subtract(x).multiply(modulus.modInverse(bp)).mod(bp);
      x = x.add(modulus.multiply(t));
      modulus = modulus.multiply(bp);
    }
    return x;
  }

  /**
   * A dense table over ascending local variables, row-major (last variable fastest). A binary table
   * (a nogood) holds 0/1 in every mode and only masks; other tables hold numbers of the pass's mode.
   */
  private static final class Table {
    final int[] vars;
    final int[] stride;
    final long[] data;
    final boolean binary;

    Table(int[] vars, int[] dim, long[] data, boolean binary) {
      this.vars = vars;
      this.stride = new int[vars.length];
      int s = 1;
      for (int i = vars.length - 1; i >= 0; i--) {
        stride[i] = s;
        s *= dim[vars[i]];
      }
      this.data = data;
      this.binary = binary;
    }

    int strideOf(int v) {
      for (int i = 0; i < vars.length; i++) {
        if (vars[i] == v) {
          return stride[i];
        }
      }
      return 0;
    }

    boolean mentions(int v) {
      return Arrays.binarySearch(vars, v) >= 0;
    }
  }

  /** One elimination pass; returns the count (raw double bits in ESTIMATE mode, a residue in MODULAR). */
  private static long eliminate(
      int[] groups, List<Local> comp, int[] order, int[] dsize, Mode mode, long mod, BooleanSupplier stop) {
    int c = groups.length;
    int[] where = localIndex(groups, dsize.length);
    int[] dim = new int[c];
    for (int v = 0; v < c; v++) {
      dim[v] = dsize[groups[v]];
    }
    List<Table> tables = new ArrayList<>();
    for (Local l : comp) {
      tables.add(nogoodTable(l, where, dim));
    }
    long exact = 1;
    double estimate = 1;
    for (int v : order) {
      List<Table> bucket = new ArrayList<>();
      for (int i = tables.size() - 1; i >= 0; i--) {
        if (tables.get(i).mentions(v)) {
          bucket.add(tables.remove(i));
        }
      }
      long factor = dim[v];
      if (!bucket.isEmpty()) {
        Table t = sumOut(bucket, v, dim, mode, mod, stop);
        if (t.vars.length > 0) {
          tables.add(t);
          continue;
        }
        factor = t.data[0];
      } else if (mode == Mode.ESTIMATE) {
        factor = Double.doubleToRawLongBits(dim[v]);
      }
      switch (mode) {
        case EXACT -> exact = Math.multiplyExact(exact, factor);
        case MODULAR -> exact = exact * factor % mod;
        case ESTIMATE -> estimate *= Double.longBitsToDouble(factor);
      }
    }
    return mode == Mode.ESTIMATE ? Double.doubleToRawLongBits(estimate) : exact;
  }

  private static Table nogoodTable(Local l, int[] where, int[] dim) {
    int k = l.scope().length;
    int[] vars = new int[k];
    for (int j = 0; j < k; j++) {
      vars[j] = where[l.scope()[j]];
    }
    int size = 1;
    for (int v : vars) {
      size *= dim[v];
    }
    long[] data = new long[size];
    Arrays.fill(data, 1);
    Table t = new Table(vars, dim, data, true);
    // Zero the member combinations only: odometer over each group's member choices.
    int[][] hits = new int[k][];
    for (int j = 0; j < k; j++) {
      boolean[] mj = l.member()[j];
      hits[j] = java.util.stream.IntStream.range(0, mj.length).filter(x -> mj[x]).toArray();
    }
    int[] digit = new int[k];
    while (true) {
      int idx = 0;
      for (int j = 0; j < k; j++) {
        idx += t.stride[j] * hits[j][digit[j]];
      }
      data[idx] = 0;
      int j = k - 1;
      while (j >= 0 && ++digit[j] == hits[j].length) {
        digit[j] = 0;
        j--;
      }
      if (j < 0) {
        return t;
      }
    }
  }

  /**
   * Σ over v of the product of the bucket's tables, as a table over their other variables. Binary
   * tables are first turned into bit masks over v's choices, so that for each entry of the result
   * the live choices of v come from a few word ANDs; only the numeric tables are read per choice.
   */
  private static Table sumOut(List<Table> bucket, int v, int[] dim, Mode mode, long mod, BooleanSupplier stop) {
    BitSet u = new BitSet();
    for (Table t : bucket) {
      for (int x : t.vars) {
        u.set(x);
      }
    }
    u.clear(v);
    int[] vars = u.stream().toArray();
    int nv = vars.length;
    int size = 1;
    for (int x : vars) {
      size *= dim[x];
    }
    int dv = dim[v];
    int words = (dv + 63) >>> 6;
    long lastWord = (dv & 63) == 0 ? -1L : (1L << (dv & 63)) - 1;
    List<Table> bins = new ArrayList<>();
    List<Table> nums = new ArrayList<>();
    for (Table t : bucket) {
      (t.binary ? bins : nums).add(t);
    }
    int nb = bins.size();
    long[][] mask = new long[nb][];
    int[][] mst = new int[nb][nv];
    int[] midx = new int[nb];
    for (int f = 0; f < nb; f++) {
      Table t = bins.get(f);
      int sv = t.strideOf(v);
      long[] md = new long[t.data.length / dv * words];
      for (int e = 0; e < t.data.length; e++) {
        if (t.data[e] != 0) {
          int x = (e / sv) % dv;
          int r = (e / (sv * dv)) * sv + e % sv;
          md[r * words + (x >>> 6)] |= 1L << (x & 63);
        }
      }
      mask[f] = md;
      for (int i = 0; i < nv; i++) {
        int s = t.strideOf(vars[i]);
        mst[f][i] = (s > sv ? s / dv : s) * words;
      }
    }
    int nn = nums.size();
    long[][] data = new long[nn][];
    int[][] st = new int[nn][nv];
    int[] vst = new int[nn];
    int[] idx = new int[nn];
    for (int f = 0; f < nn; f++) {
      Table t = nums.get(f);
      data[f] = t.data;
      vst[f] = t.strideOf(v);
      for (int i = 0; i < nv; i++) {
        st[f][i] = t.strideOf(vars[i]);
      }
    }
    int[] digit = new int[nv];
    long[] out = new long[size];
    for (int p = 0; p < size; p++) {
      if ((p & 1023) == 1023) {
        poll(stop);
      }
      long sum = 0;
      double sumD = 0;
      for (int w = 0; w < words; w++) {
        long m = w == words - 1 ? lastWord : -1L;
        for (int f = 0; f < nb && m != 0; f++) {
          m &= mask[f][midx[f] + w];
        }
        if (nn == 0) {
          // Only nogoods here: each live choice counts one.
          sum += Long.bitCount(m);
          sumD += Long.bitCount(m);
          continue;
        }
        for (; m != 0; m &= m - 1) {
          int x = (w << 6) + Long.numberOfTrailingZeros(m);
          switch (mode) {
            case EXACT -> {
              long prod = data[0][idx[0] + x * vst[0]];
              for (int f = 1; f < nn && prod != 0; f++) {
                prod = Math.multiplyExact(prod, data[f][idx[f] + x * vst[f]]);
              }
              sum = Math.addExact(sum, prod);
            }
            case MODULAR -> {
              long prod = data[0][idx[0] + x * vst[0]];
              for (int f = 1; f < nn && prod != 0; f++) {
                prod = prod * data[f][idx[f] + x * vst[f]] % mod;
              }
              sum += prod;
              if (sum >= mod) {
                sum -= mod;
              }
            }
            case ESTIMATE -> {
              double prod = Double.longBitsToDouble(data[0][idx[0] + x * vst[0]]);
              for (int f = 1; f < nn; f++) {
                prod *= Double.longBitsToDouble(data[f][idx[f] + x * vst[f]]);
              }
              sumD += prod;
            }
          }
        }
      }
      if (nn == 0 && mode == Mode.MODULAR) {
        sum %= mod;
      }
      out[p] = mode == Mode.ESTIMATE ? Double.doubleToRawLongBits(sumD) : sum;
      for (int i = nv - 1; i >= 0; i--) {
        digit[i]++;
        for (int f = 0; f < nn; f++) {
          idx[f] += st[f][i];
        }
        for (int f = 0; f < nb; f++) {
          midx[f] += mst[f][i];
        }
        if (digit[i] < dim[vars[i]]) {
          break;
        }
        for (int f = 0; f < nn; f++) {
          idx[f] -= st[f][i] * dim[vars[i]];
        }
        for (int f = 0; f < nb; f++) {
          midx[f] -= mst[f][i] * dim[vars[i]];
        }
        digit[i] = 0;
      }
    }
    return new Table(vars, dim, out, false);
  }

  /** Primes just below 2^31, found by trial division and kept once found. */
  static final class Primes {
    private static final List<Long> FOUND = new ArrayList<>();

    private Primes() {}

    static synchronized long below31(int i) {
      long next = FOUND.isEmpty() ? (1L << 31) - 1 : FOUND.get(FOUND.size() - 1) - 2;
      while (FOUND.size() <= i) {
        if (isPrime(next)) {
          FOUND.add(next);
        }
        next -= 2;
      }
      return FOUND.get(i);
    }

    static boolean isPrime(long x) {
      if (x < 2) {
        return false;
      }
      if (x % 2 == 0) {
        return x == 2;
      }
      for (long d = 3; d * d <= x; d += 2) {
        if (x % d == 0) {
          return false;
        }
      }
      return true;
    }
  }
}
