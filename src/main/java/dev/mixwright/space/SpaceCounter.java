package dev.mixwright.space;

import java.math.BigInteger;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.Deque;
import java.util.List;

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
 * Inside a component groups are eliminated in greedy min-fill order (min-degree above
 * {@value #MIN_FILL_MAX_GROUPS} groups, where min-fill itself gets slow): eliminating a group
 * multiplies the factors that mention it and sums it out, leaving one dense table over its
 * neighbours at that point. Time O(n · d^(w+1)) and table size O(d^w) for n groups, d choices per
 * group and induced width w of the order.
 *
 * <p>Before counting, the nogoods are simplified against the domains to a fixpoint: a nogood that no
 * allowed choice of one of its groups can match is dropped, a group whose every allowed choice
 * matches leaves the nogood's scope, and a nogood left with one group removes choices. This often
 * cuts components apart, in particular for segments whose accepts narrow a group.
 *
 * <p>Numbers: tables hold longs. When a component overflows, it is recounted modulo enough primes
 * below 2^31 that their product exceeds the product of the component's domain sizes, and the count
 * is rebuilt by the Chinese remainder theorem (multi-modular counting, common practice in exact
 * computer algebra). Tables stay primitive {@code long[]} either way.
 *
 * <p>When a table would exceed the limit, the widest nogood among those that fed it is dropped and
 * the component is planned again; the result is then an upper bound ({@link SpaceCount#exact()}
 * false), since dropping a nogood only adds variants.
 */
public final class SpaceCounter {
  /** Default largest table, in entries (32 MiB of longs). */
  public static final long DEFAULT_TABLE_LIMIT = 1L << 22;

  /** Largest table limit accepted: Java arrays are int-indexed. */
  public static final long MAX_TABLE_LIMIT = 1L << 30;

  static final int MIN_FILL_MAX_GROUPS = 300;

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
    boolean[] domain = new boolean[space.totalChoices()];
    for (int f = 0; f < domain.length; f++) {
      domain[f] = space.allowed(f);
    }
    return countWithin(domain);
  }

  /** Number of variants that are buildable and accepted by segment s. */
  public SpaceCount count(int segment) {
    if (segment < 0 || segment >= space.segmentCount()) {
      throw new IllegalArgumentException(
          "segment index " + segment + " out of range 0.." + (space.segmentCount() - 1));
    }
    boolean[] domain = new boolean[space.totalChoices()];
    for (int f = 0; f < domain.length; f++) {
      domain[f] = space.allowedIn(segment, f);
    }
    return countWithin(domain);
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
    if (domain.length != space.totalChoices()) {
      throw new IllegalArgumentException(
          "domain has " + domain.length + " entries, the space has " + space.totalChoices() + " choices");
    }
    boolean[] d = new boolean[domain.length];
    for (int f = 0; f < d.length; f++) {
      d[f] = domain[f] && space.allowed(f);
    }
    return countWithin(d);
  }

  /** A nogood restricted to the live choices: scope ascending, member[j][local choice]. */
  private record Local(int[] scope, boolean[][] member) {}

  private static final SpaceCount NONE = new SpaceCount(BigInteger.ZERO, true);

  private SpaceCount countWithin(boolean[] dom) {
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
      List<Local> comp = work.pop();
      int[] groups = groupsOf(comp, n);
      Object plan = plan(groups, comp, dsize);
      if (plan instanceof Local drop) {
        exact = false;
        List<Local> rest = new ArrayList<>(comp);
        rest.remove(drop);
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
        value = value.multiply(evaluate(groups, comp, (int[]) plan, dsize));
      }
      if (value.signum() == 0) {
        return NONE; // a component with no assignment empties the space whatever was dropped
      }
    }
    return new SpaceCount(value, exact);
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
   * Simulates the elimination on scopes only. Returns the order ({@code int[]} of local indices)
   * when every table fits, or the {@link Local} nogood to drop.
   */
  private Object plan(int[] groups, List<Local> comp, int[] dsize) {
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
      return comp.get(tooWide);
    }
    BitSet[] adj = new BitSet[c];
    for (int v = 0; v < c; v++) {
      adj[v] = new BitSet(c);
    }
    List<BitSet> fScope = new ArrayList<>();
    List<BitSet> fProv = new ArrayList<>();
    for (int i = 0; i < q; i++) {
      BitSet s = new BitSet(c);
      for (int a : scopes[i]) {
        s.set(a);
        for (int b : scopes[i]) {
          if (a != b) {
            adj[a].set(b);
          }
        }
      }
      BitSet p = new BitSet(q);
      p.set(i);
      fScope.add(s);
      fProv.add(p);
    }
    BitSet remaining = new BitSet(c);
    remaining.set(0, c);
    boolean minDegree = c > MIN_FILL_MAX_GROUPS;
    int[] order = new int[c];
    for (int step = 0; step < c; step++) {
      int v = pick(remaining, adj, dim, minDegree);
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
        return comp.get(drop);
      }
      if (!newScope.isEmpty()) {
        fScope.add(newScope);
        fProv.add(prov);
      }
      for (int a = adj[v].nextSetBit(0); a >= 0; a = adj[v].nextSetBit(a + 1)) {
        adj[a].or(adj[v]);
        adj[a].clear(a);
        adj[a].clear(v);
      }
      adj[v].clear();
      remaining.clear(v);
      order[step] = v;
    }
    return order;
  }

  private static int[] localIndex(int[] groups, int n) {
    int[] where = new int[n];
    Arrays.fill(where, -1);
    for (int v = 0; v < groups.length; v++) {
      where[groups[v]] = v;
    }
    return where;
  }

  /** Greedy min-fill (or min-degree); ties go to the smaller table, then the lower index. */
  private int pick(BitSet remaining, BitSet[] adj, int[] dim, boolean minDegree) {
    int best = -1;
    long bestScore = Long.MAX_VALUE;
    long bestSize = Long.MAX_VALUE;
    BitSet tmp = new BitSet();
    for (int v = remaining.nextSetBit(0); v >= 0; v = remaining.nextSetBit(v + 1)) {
      long score;
      if (minDegree) {
        score = adj[v].cardinality();
      } else {
        long fill = 0;
        for (int a = adj[v].nextSetBit(0); a >= 0; a = adj[v].nextSetBit(a + 1)) {
          tmp.clear();
          tmp.or(adj[v]);
          tmp.andNot(adj[a]);
          tmp.clear(a);
          fill += tmp.cardinality();
        }
        score = fill / 2;
      }
      if (score > bestScore) {
        continue;
      }
      long size = tableSize(adj[v], dim);
      if (score < bestScore || size < bestSize) {
        best = v;
        bestScore = score;
        bestSize = size;
      }
    }
    return best;
  }

  private BigInteger evaluate(int[] groups, List<Local> comp, int[] order, int[] dsize) {
    try {
      return BigInteger.valueOf(eliminate(groups, comp, order, dsize, 0));
    } catch (ArithmeticException overflow) {
      BigInteger bound = BigInteger.ONE;
      for (int g : groups) {
        bound = bound.multiply(BigInteger.valueOf(dsize[g]));
      }
      BigInteger x = BigInteger.ZERO;
      BigInteger modulus = BigInteger.ONE;
      for (int i = 0; modulus.compareTo(bound) <= 0; i++) {
        long p = Primes.below31(i);
        long r = eliminate(groups, comp, order, dsize, p);
        // Chinese remainder step: x' = x + M·((r − x)·M⁻¹ mod p), so x' ≡ x (mod M), x' ≡ r (mod p).
        BigInteger bp = BigInteger.valueOf(p);
        BigInteger t =
            BigInteger.valueOf(r)
                .subtract(x)
                .multiply(modulus.modInverse(bp))
                .mod(bp);
        x = x.add(modulus.multiply(t));
        modulus = modulus.multiply(bp);
      }
      return x;
    }
  }

  /** A dense table over ascending local variables, row-major (last variable fastest). */
  private static final class Table {
    final int[] vars;
    final int[] stride;
    final long[] data;

    Table(int[] vars, int[] dim, long[] data) {
      this.vars = vars;
      this.stride = new int[vars.length];
      int s = 1;
      for (int i = vars.length - 1; i >= 0; i--) {
        stride[i] = s;
        s *= dim[vars[i]];
      }
      this.data = data;
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

  /** Runs the elimination exactly in longs ({@code mod == 0}, throws on overflow) or modulo mod. */
  private static long eliminate(int[] groups, List<Local> comp, int[] order, int[] dsize, long mod) {
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
    long scalar = 1;
    for (int v : order) {
      List<Table> bucket = new ArrayList<>();
      for (int i = tables.size() - 1; i >= 0; i--) {
        if (tables.get(i).mentions(v)) {
          bucket.add(tables.remove(i));
        }
      }
      if (bucket.isEmpty()) {
        scalar = mul(scalar, dim[v], mod);
        continue;
      }
      Table t = sumOut(bucket, v, dim, mod);
      if (t.vars.length == 0) {
        scalar = mul(scalar, t.data[0], mod);
      } else {
        tables.add(t);
      }
    }
    return scalar;
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
    Table t = new Table(vars, dim, data);
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

  private static Table sumOut(List<Table> bucket, int v, int[] dim, long mod) {
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
    int b = bucket.size();
    long[][] data = new long[b][];
    int[][] st = new int[b][nv];
    int[] vst = new int[b];
    int[] idx = new int[b];
    for (int f = 0; f < b; f++) {
      Table t = bucket.get(f);
      data[f] = t.data;
      vst[f] = t.strideOf(v);
      for (int i = 0; i < nv; i++) {
        st[f][i] = t.strideOf(vars[i]);
      }
    }
    int dv = dim[v];
    int[] digit = new int[nv];
    long[] out = new long[size];
    for (int p = 0; p < size; p++) {
      long sum = 0;
      for (int x = 0; x < dv; x++) {
        long prod = 1;
        for (int f = 0; f < b; f++) {
          long e = data[f][idx[f] + x * vst[f]];
          if (e == 0) {
            prod = 0;
            break;
          }
          prod = mul(prod, e, mod);
        }
        sum = add(sum, prod, mod);
      }
      out[p] = sum;
      for (int i = nv - 1; i >= 0; i--) {
        digit[i]++;
        for (int f = 0; f < b; f++) {
          idx[f] += st[f][i];
        }
        if (digit[i] < dim[vars[i]]) {
          break;
        }
        for (int f = 0; f < b; f++) {
          idx[f] -= st[f][i] * dim[vars[i]];
        }
        digit[i] = 0;
      }
    }
    return new Table(vars, dim, out);
  }

  private static long mul(long a, long b, long mod) {
    return mod == 0 ? Math.multiplyExact(a, b) : (a % mod) * (b % mod) % mod;
  }

  private static long add(long a, long b, long mod) {
    if (mod == 0) {
      return Math.addExact(a, b);
    }
    long s = a + b;
    return s >= mod ? s - mod : s;
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
