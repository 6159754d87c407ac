package dev.mixwright.portfolio;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.ToIntFunction;

/**
 * A node of the branch-and-price tree: the portfolios that offer every pool variant of
 * {@code offered}, none of {@code barred} (pool indices, sorted), and satisfy every count range of
 * {@code counts} (how many offered variants use a choice, how many a segment accepts, how many a
 * segment accepts among those using a choice, or how many are offered at all). Variants outside the pool are free in every node but for the counts, which the
 * pricer sees as penalties per choice, charges per accepting segment and charges per (accepting segment,
 * choice). {@code bound}: an upper bound on the value of every portfolio of the node (the parent's until
 * the node is solved); {@code depth}: the number of decisions.
 */
record TreeNode(int[] offered, int[] barred, List<Count> counts, double bound, int depth) {

  /** Total count: the number of variants offered. */
  static final int TOTAL = -1;

  /** The key of segment s's count (offered variants that s accepts): {@code -2 - s}, below {@link #TOTAL}. */
  static int segmentKey(int s) {
    return -2 - s;
  }

  /** The segment of a count key, or −1 when the key is a flat choice, {@link #TOTAL} or a pair's. */
  static int segmentOf(int key) {
    return key <= -2 && key > PAIR_BASE ? -2 - key : -1;
  }

  /** Pair keys lie at and below this: {@code PAIR_BASE − (f · 2^16 + s)}. */
  private static final int PAIR_BASE = -(1 << 30);

  /** True when (segment s, flat choice f) can have a pair key: s below 2^16, f below 2^14. */
  static boolean pairable(int s, int flat) {
    return s >= 0 && s < (1 << 16) && flat >= 0 && flat < (1 << 14);
  }

  /**
   * The key of the count of offered variants that segment s accepts and that use flat choice f (see
   * {@link #pairable}).
   */
  static int pairKey(int s, int flat) {
    if (!pairable(s, flat)) {
      throw new IllegalArgumentException("no pair key for segment " + s + " and choice " + flat);
    }
    return PAIR_BASE - ((flat << 16) | s);
  }

  /** The segment of a pair key, −1 for any other key. */
  static int pairSegment(int key) {
    return key <= PAIR_BASE ? (PAIR_BASE - key) & 0xFFFF : -1;
  }

  /** The flat choice of a pair key. */
  static int pairChoice(int key) {
    return (PAIR_BASE - key) >>> 16;
  }

  /**
   * lo ≤ (offered variants using flat choice {@code choice} when ≥ 0, all offered when {@link #TOTAL},
   * those that segment s accepts at {@link #segmentKey}(s), those that s accepts and that use flat
   * choice f at {@link #pairKey}(s, f)) ≤ hi.
   */
  record Count(int choice, int lo, int hi) {}

  /** Whether segment s accepts a variant (every choice of it in s's accepts lists). */
  interface Acceptance {
    boolean accepts(int[] v, int s);
  }

  TreeNode {
    offered = offered.clone();
    barred = barred.clone();
    Arrays.sort(offered);
    Arrays.sort(barred);
    counts = List.copyOf(counts);
  }

  static TreeNode root(double bound) {
    return root(bound, new int[0]);
  }

  /** The root with {@code pinned} offered: variants of today's range the planner keeps in every range. */
  static TreeNode root(double bound, int[] pinned) {
    return new TreeNode(pinned, new int[0], List.of(), bound, 0);
  }

  /**
   * True when the portfolio belongs to this node.
   *
   * @param portfolio the choices of each offered variant
   * @param poolIndex the pool index of a variant, −1 outside the pool
   * @param offsets flat choice offsets of the groups
   * @param acceptance which segments accept which variants (for segment counts)
   */
  boolean holds(List<int[]> portfolio, ToIntFunction<int[]> poolIndex, int[] offsets, Acceptance acceptance) {
    List<Integer> members = new ArrayList<>();
    for (int[] v : portfolio) {
      members.add(poolIndex.applyAsInt(v));
    }
    for (int i : offered) {
      if (!members.contains(i)) {
        return false;
      }
    }
    for (int i : barred) {
      if (members.contains(i)) {
        return false;
      }
    }
    for (Count c : counts) {
      int n = 0;
      for (int[] v : portfolio) {
        int s = segmentOf(c.choice());
        int ps = pairSegment(c.choice());
        boolean counted = ps >= 0 ? acceptance.accepts(v, ps) && uses(v, pairChoice(c.choice()), offsets)
            : c.choice() == TOTAL || (s >= 0 ? acceptance.accepts(v, s) : uses(v, c.choice(), offsets));
        n += counted ? 1 : 0;
      }
      if (n < c.lo() || n > c.hi()) {
        return false;
      }
    }
    return true;
  }

  static boolean uses(int[] v, int flat, int[] offsets) {
    for (int g = 0; g < v.length; g++) {
      if (offsets[g] + v[g] == flat) {
        return true;
      }
    }
    return false;
  }

  boolean isOffered(int i) {
    return Arrays.binarySearch(offered, i) >= 0;
  }

  boolean isBarred(int i) {
    return Arrays.binarySearch(barred, i) >= 0;
  }

  /** The tightest range on the count of key {@code choice}: {lo, hi}, hi = Integer.MAX_VALUE for none. */
  int[] range(int choice) {
    int lo = 0;
    int hi = Integer.MAX_VALUE;
    for (Count c : counts) {
      if (c.choice() == choice) {
        lo = Math.max(lo, c.lo());
        hi = Math.min(hi, c.hi());
      }
    }
    return new int[] {lo, hi};
  }

  /** This node with more variants barred (ruled out by their reduced cost): the same portfolios of value. */
  TreeNode barring(int[] more, double newBound) {
    int[] b = Arrays.copyOf(barred, barred.length + more.length);
    System.arraycopy(more, 0, b, barred.length, more.length);
    return new TreeNode(offered, Arrays.stream(b).distinct().toArray(), counts, newBound, depth);
  }

  TreeNode withBound(double newBound) {
    return new TreeNode(offered, barred, counts, newBound, depth);
  }
}
