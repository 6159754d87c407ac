package dev.mixwright.portfolio;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The branching rule of the branch-and-price tree, in the order tried:
 *
 * <ol>
 *   <li>On a segment's count: when the relaxation offers a fractional number n of variants that segment
 *       s accepts (Σ y_v over the variants whose every choice s accepts), the children hold at most ⌊n⌋
 *       and at least ⌊n⌋ + 1 of them; the most fractional segment first. The relaxation pays the
 *       introduction cost F·y_v of a variant sold at a fraction y_v = x/u of its cap, so it offers
 *       fewer variants per segment than any portfolio selling the same (the fixed-charge gap of
 *       x ≤ u·y); this decision closes that gap segment by segment, which single variants cannot, as
 *       near-identical variants take each other's place. The row's dual δ_s enters pricing as a
 *       charge on every variant s accepts ({@link VariantQuery#acceptCharge}).
 *   <li>On a choosing segment's count of one option: once every segment's count is whole, for a segment
 *       that chooses (multinomial logit), the count of the variants s accepts that use flat choice f,
 *       split as above; the most fractional pair first, skipping those equal to s's own count. At a
 *       whole count the relaxation of such a segment still mixes single offers (1.0 split as 0.30, 0.38
 *       and 0.32 over three near-identical variants that differ in a refrigerant or a heater), which the
 *       count of one option splits apart where a single variant would let its neighbour take its place.
 *       The row's dual δ_sf enters pricing as a charge on every variant s accepts that uses f ({@link
 *       VariantQuery#pairCharge}). Only choosing segments: on the generator's families (fixed segments)
 *       it cost more nodes than it saved (docs/portfolio.md, "A choosing segment's count of one option").
 *   <li>On a choosing segment's variant: with those counts whole too, the most fractional free variant
 *       that a choosing segment accepts, as in 5 below. The segment can still mix two offers crossed
 *       (0.59 of variants with both a heater and a tank and with neither, 0.41 of those with one of
 *       them each), which no count of one option separates; it accepts few variants, so deciding one
 *       settles its offer soon (docs/portfolio.md, "A choosing segment's variant before the option
 *       counts").
 *   <li>On a count (Vanderbeck 2000, "On Dantzig-Wolfe decomposition in integer programming and ways
 *       to perform branching in a branch-and-price algorithm", Operations Research 48(1)): when the
 *       relaxation offers a fractional number n of variants in all, or of variants using some option
 *       (a flat choice), the children hold at most ⌊n⌋ and at least ⌊n⌋ + 1. Many near-identical
 *       variants share their options, so this splits them as a whole instead of one at a time. The
 *       row's dual enters pricing as a charge (all variants) or a penalty on the choice, so the pricer
 *       keeps its structure.
 *   <li>On one variant's introduction (Barnhart, Johnson, Nemhauser, Savelsbergh &amp; Vance 1998,
 *       "Branch-and-price", Operations Research 46(3)): the most fractional y_v of a pool variant, into
 *       "offered" (y_v = 1) and "barred" (y_v = 0). The decision is on the variant, never on a column
 *       (v, s). A barred pool variant is held at 0 in the node's master; the pricer skips the pool
 *       anyway.
 *   <li>When y is integral but a variant at 1 is not yet offered by the node (tooling its members pay,
 *       whole units), that variant.
 * </ol>
 *
 * Every portfolio of a node lies in exactly one child: a count is either ≤ ⌊n⌋ or ≥ ⌊n⌋ + 1 (each count
 * is a function of the offered set alone), and a variant is either offered or not.
 */
final class VariantBranching {
  private VariantBranching() {}

  /** Values within this of a whole number count as integral. */
  static final double INTEGRAL = 1e-6;

  /**
   * A branching decision: a count (choice, {@link TreeNode#TOTAL} or {@link TreeNode#segmentKey}) split at
   * {@code floor}, or a variant.
   */
  record Decision(boolean onCount, int choice, int floor, int variant) {
    static Decision count(int choice, int floor) {
      return new Decision(true, choice, floor, -1);
    }

    static Decision variant(int v) {
      return new Decision(false, 0, 0, v);
    }
  }

  /**
   * What to branch on, or null when y is integral and every variant at 1 is already offered.
   *
   * @param y the node relaxation's y per pool index
   * @param choices the choices of pool variant i
   * @param offsets flat choice offsets of the groups; totalChoices the number of flat choices
   */
  static Decision choose(TreeNode node, double[] y, java.util.function.IntFunction<int[]> choices, int[] offsets,
      int totalChoices) {
    return choose(node, y, choices, i -> new int[0], 0, offsets, totalChoices);
  }

  /**
   * What to branch on, with segment counts: {@code segmentsOf} gives the segments that accept pool
   * variant i, among {@code segmentCount}.
   */
  static Decision choose(TreeNode node, double[] y, java.util.function.IntFunction<int[]> choices,
      java.util.function.IntFunction<int[]> segmentsOf, int segmentCount, int[] offsets, int totalChoices) {
    return choose(node, y, choices, segmentsOf, segmentCount, null, offsets, totalChoices);
  }

  /**
   * What to branch on, with segment counts and, for the segments marked in {@code pairSegments} (null:
   * none), counts of the variants a segment accepts that use one choice.
   */
  static Decision choose(TreeNode node, double[] y, java.util.function.IntFunction<int[]> choices,
      java.util.function.IntFunction<int[]> segmentsOf, int segmentCount, boolean[] pairSegments, int[] offsets,
      int totalChoices) {
    double[] bySegment = new double[segmentCount];
    for (int i = 0; i < y.length && segmentCount > 0; i++) {
      if (y[i] > INTEGRAL) {
        for (int s : segmentsOf.apply(i)) {
          bySegment[s] += y[i];
        }
      }
    }
    int bestS = -1;
    double bestSFrac = INTEGRAL;
    for (int s = 0; s < segmentCount; s++) {
      double fr = fraction(bySegment[s]);
      if (fr > bestSFrac && splits(node, TreeNode.segmentKey(s), bySegment[s])) {
        bestSFrac = fr;
        bestS = s;
      }
    }
    if (bestS >= 0) {
      return Decision.count(TreeNode.segmentKey(bestS), (int) Math.floor(bySegment[bestS]));
    }
    Decision pair = pairCount(node, y, choices, segmentsOf, bySegment, pairSegments, offsets, totalChoices);
    if (pair != null) {
      return pair;
    }
    int crossed = choosingVariant(node, y, segmentsOf, pairSegments);
    if (crossed >= 0) {
      return Decision.variant(crossed);
    }
    double total = 0;
    double[] byChoice = new double[totalChoices];
    for (int i = 0; i < y.length; i++) {
      if (y[i] <= INTEGRAL) {
        continue;
      }
      total += y[i];
      int[] v = choices.apply(i);
      for (int g = 0; g < v.length; g++) {
        byChoice[offsets[g] + v[g]] += y[i];
      }
    }
    if (fraction(total) > INTEGRAL && splits(node, TreeNode.TOTAL, total)) {
      return Decision.count(TreeNode.TOTAL, (int) Math.floor(total));
    }
    int bestF = -1;
    double bestFrac = INTEGRAL;
    for (int f = 0; f < totalChoices; f++) {
      double fr = fraction(byChoice[f]);
      if (fr > bestFrac && splits(node, f, byChoice[f])) {
        bestFrac = fr;
        bestF = f;
      }
    }
    if (bestF >= 0) {
      return Decision.count(bestF, (int) Math.floor(byChoice[bestF]));
    }
    int v = chooseVariant(node, y);
    return v < 0 ? null : Decision.variant(v);
  }

  /**
   * The most fractional count of variants that a marked segment s accepts and that use a choice f, among
   * those that differ from s's own count (a choice every fractional variant of s uses adds nothing), or
   * null.
   */
  private static Decision pairCount(TreeNode node, double[] y, java.util.function.IntFunction<int[]> choices,
      java.util.function.IntFunction<int[]> segmentsOf, double[] bySegment, boolean[] pairSegments, int[] offsets,
      int totalChoices) {
    if (pairSegments == null) {
      return null;
    }
    double[][] n = new double[bySegment.length][];
    for (int i = 0; i < y.length; i++) {
      if (y[i] <= INTEGRAL) {
        continue;
      }
      int[] v = null;
      for (int s : segmentsOf.apply(i)) {
        if (!pairSegments[s]) {
          continue;
        }
        if (n[s] == null) {
          n[s] = new double[totalChoices];
        }
        v = v == null ? choices.apply(i) : v;
        for (int g = 0; g < v.length; g++) {
          n[s][offsets[g] + v[g]] += y[i];
        }
      }
    }
    int bestKey = 0;
    double bestN = 0;
    double bestFrac = INTEGRAL;
    for (int s = 0; s < n.length; s++) {
      for (int f = 0; n[s] != null && f < totalChoices; f++) {
        double fr = fraction(n[s][f]);
        if (fr > bestFrac && Math.abs(n[s][f] - bySegment[s]) > INTEGRAL && TreeNode.pairable(s, f)
            && splits(node, TreeNode.pairKey(s, f), n[s][f])) {
          bestFrac = fr;
          bestKey = TreeNode.pairKey(s, f);
          bestN = n[s][f];
        }
      }
    }
    return bestFrac > INTEGRAL ? Decision.count(bestKey, (int) Math.floor(bestN)) : null;
  }

  /**
   * With a marked (choosing) segment's counts whole, per choice too, the most fractional free variant
   * it accepts (ties to the larger y), or −1. Its relaxation can still mix two offers crossed: on the
   * range demo quieturban at 0.59 of (3 kW heater, 150 l tank) and of (neither), 0.41 of (heater only)
   * and of (tank only), where every count of one choice is 1; no count on one choice separates the two
   * offers, and the global choice counts that come next move the segment only by chance. A choosing
   * segment accepts few variants (40 and 1,152 there), so deciding one of them settles its offer soon.
   */
  private static int choosingVariant(TreeNode node, double[] y, java.util.function.IntFunction<int[]> segmentsOf,
      boolean[] pairSegments) {
    if (pairSegments == null) {
      return -1;
    }
    int best = -1;
    double bestScore = -1;
    for (int i = 0; i < y.length; i++) {
      double f = Math.min(y[i], 1 - y[i]);
      if (f <= INTEGRAL || node.isOffered(i) || node.isBarred(i)) {
        continue;
      }
      boolean marked = false;
      for (int s : segmentsOf.apply(i)) {
        marked |= pairSegments[s];
      }
      double score = f + 1e-3 * y[i];
      if (marked && score > bestScore) {
        bestScore = score;
        best = i;
      }
    }
    return best;
  }

  /**
   * True when splitting the count at ⌊n⌋ gives two nonempty children inside the node's range; false
   * when n lies outside it (the master's artificial fills the count), where the split would repeat
   * the node.
   */
  private static boolean splits(TreeNode node, int choice, double n) {
    int[] range = node.range(choice);
    int floor = (int) Math.floor(n);
    return floor >= range[0] && floor + 1 <= range[1];
  }

  /** Distance to the nearest whole number. */
  private static double fraction(double x) {
    return Math.abs(x - Math.rint(x));
  }

  /**
   * The pool variant to branch on, or −1 when y is integral and every variant at 1 is already
   * offered by the node.
   */
  static int chooseVariant(TreeNode node, double[] y) {
    int best = -1;
    double bestScore = -1;
    for (int i = 0; i < y.length; i++) {
      if (node.isOffered(i) || node.isBarred(i)) {
        continue;
      }
      double f = Math.min(y[i], 1 - y[i]);
      if (f > INTEGRAL) {
        double score = f + 1e-3 * y[i];
        if (score > bestScore) {
          bestScore = score;
          best = i;
        }
      }
    }
    if (best >= 0) {
      return best;
    }
    for (int i = 0; i < y.length; i++) {
      if (!node.isOffered(i) && !node.isBarred(i) && y[i] >= 1 - INTEGRAL) {
        return i;
      }
    }
    return -1;
  }

  /** The two children of {@code node} on the decision, both with {@code bound} until solved. */
  static List<TreeNode> children(TreeNode node, Decision d, double bound) {
    if (d.onCount()) {
      List<TreeNode.Count> low = new ArrayList<>(node.counts());
      low.add(new TreeNode.Count(d.choice(), 0, d.floor()));
      List<TreeNode.Count> high = new ArrayList<>(node.counts());
      high.add(new TreeNode.Count(d.choice(), d.floor() + 1, Integer.MAX_VALUE));
      return List.of(new TreeNode(node.offered(), node.barred(), low, bound, node.depth() + 1),
          new TreeNode(node.offered(), node.barred(), high, bound, node.depth() + 1));
    }
    int v = d.variant();
    if (node.isOffered(v) || node.isBarred(v)) {
      throw new IllegalArgumentException("variant " + v + " is already decided at this node");
    }
    int[] in = Arrays.copyOf(node.offered(), node.offered().length + 1);
    in[in.length - 1] = v;
    int[] out = Arrays.copyOf(node.barred(), node.barred().length + 1);
    out[out.length - 1] = v;
    return List.of(new TreeNode(in, node.barred(), node.counts(), bound, node.depth() + 1),
        new TreeNode(node.offered(), out, node.counts(), bound, node.depth() + 1));
  }
}
