package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The branching rule itself: every portfolio of a node lies in exactly one of its children, checked
 * by listing every portfolio of a small space (brute force) at random nodes reached by random
 * decisions; and the choice of decision on hand-made relaxed solutions.
 */
class VariantBranchingTest {
  /** Two groups of 3 and 2 choices: flat choices 0..2 and 3..4, six variants. */
  private static final int[] OFFSETS = {0, 3, 5};

  /** Segment 0 accepts the first two choices of group 0 (a0, a1), segment 1 only b0 of group 1. */
  private static final TreeNode.Acceptance ACCEPTS = (v, s) -> s == 0 ? v[0] != 2 : v[1] == 0;

  /** The segments that accept pool variant i (of {@link #variants}). */
  private static int[] segmentsOf(int i) {
    int[] v = variants().get(i);
    List<Integer> out = new ArrayList<>();
    for (int s = 0; s < 2; s++) {
      if (ACCEPTS.accepts(v, s)) {
        out.add(s);
      }
    }
    return out.stream().mapToInt(Integer::intValue).toArray();
  }

  private static List<int[]> variants() {
    List<int[]> out = new ArrayList<>();
    for (int a = 0; a < 3; a++) {
      for (int b = 0; b < 2; b++) {
        out.add(new int[] {a, b});
      }
    }
    return out;
  }

  /** Every subset of the six variants, as lists of choices. */
  private static List<List<int[]>> portfolios(List<int[]> vs) {
    List<List<int[]>> out = new ArrayList<>();
    for (int mask = 0; mask < 1 << vs.size(); mask++) {
      List<int[]> p = new ArrayList<>();
      for (int i = 0; i < vs.size(); i++) {
        if ((mask & 1 << i) != 0) {
          p.add(vs.get(i));
        }
      }
      out.add(p);
    }
    return out;
  }

  @Test
  void everyPortfolioOfANodeLiesInExactlyOneChild() {
    List<int[]> vs = variants();
    List<List<int[]>> all = portfolios(vs);
    // the first four variants are in the pool, the last two outside it (index -1)
    java.util.function.ToIntFunction<int[]> poolIndex = v -> {
      for (int i = 0; i < 4; i++) {
        if (Arrays.equals(vs.get(i), v)) {
          return i;
        }
      }
      return -1;
    };
    for (int seed = 0; seed < 300; seed++) {
      Random rnd = new Random(seed);
      TreeNode node = TreeNode.root(0);
      int depth = rnd.nextInt(4);
      for (int step = 0; step <= depth; step++) {
        VariantBranching.Decision d = randomDecision(node, rnd);
        if (d == null) {
          break;
        }
        List<TreeNode> kids = VariantBranching.children(node, d, 0);
        assertEquals(2, kids.size());
        for (List<int[]> p : all) {
          boolean inNode = node.holds(p, poolIndex, OFFSETS, ACCEPTS);
          int in = 0;
          for (TreeNode k : kids) {
            in += k.holds(p, poolIndex, OFFSETS, ACCEPTS) ? 1 : 0;
          }
          assertEquals(inNode ? 1 : 0, in, "seed " + seed + ": a portfolio of the node in " + in + " children");
        }
        node = kids.get(rnd.nextInt(2));
      }
    }
  }

  private static VariantBranching.Decision randomDecision(TreeNode node, Random rnd) {
    if (rnd.nextInt(3) == 0) {
      // a segment's count of one choice: segment 0 or 1 and one of the five flat choices
      return VariantBranching.Decision.count(TreeNode.pairKey(rnd.nextInt(2), rnd.nextInt(5)), rnd.nextInt(3));
    }
    if (rnd.nextBoolean()) {
      int choice = rnd.nextInt(8) - 3; // −1 is the total, −2 and −3 the counts of segments 0 and 1
      return VariantBranching.Decision.count(choice, rnd.nextInt(4));
    }
    List<Integer> free = new ArrayList<>();
    for (int i = 0; i < 4; i++) {
      if (!node.isOffered(i) && !node.isBarred(i)) {
        free.add(i);
      }
    }
    return free.isEmpty() ? null : VariantBranching.Decision.variant(free.get(rnd.nextInt(free.size())));
  }

  @Test
  void reducedCostBarsKeepThePortfoliosThatHoldNoBarredVariant() {
    TreeNode node = TreeNode.root(5).barring(new int[] {2, 0}, 4);
    assertTrue(node.isBarred(0) && node.isBarred(2) && !node.isBarred(1));
    assertEquals(4, node.bound());
  }

  private static int[] choicesOf(int i) {
    return variants().get(i);
  }

  @Test
  void aFractionalSegmentCountComesBeforeTheTotal() {
    // y = (0.5, 0.5, 0.7) on variants (a0,b0), (a0,b1), (a1,b0): segment 0 accepts all three (1.7),
    // segment 1 the first and the third (1.2) → segment 0 is the most fractional: at most 1 / at least 2
    VariantBranching.Decision d = VariantBranching.choose(TreeNode.root(0), new double[] {0.5, 0.5, 0.7},
        VariantBranchingTest::choicesOf, VariantBranchingTest::segmentsOf, 2, OFFSETS, 5);
    assertNotNull(d);
    assertTrue(d.onCount());
    assertEquals(TreeNode.segmentKey(0), d.choice());
    assertEquals(1, d.floor());
    // once segment 0's count is decided (its range excludes the split), segment 1 at 1.2 is next
    TreeNode atMostOne = VariantBranching.children(TreeNode.root(0), d, 0).get(0);
    TreeNode both = VariantBranching.children(atMostOne, VariantBranching.Decision.count(TreeNode.segmentKey(0), 0),
        0).get(1);
    d = VariantBranching.choose(both, new double[] {0.5, 0.5, 0.7}, VariantBranchingTest::choicesOf,
        VariantBranchingTest::segmentsOf, 2, OFFSETS, 5);
    assertEquals(TreeNode.segmentKey(1), d.choice());
    assertEquals(1, d.floor());
  }

  @Test
  void pairKeysRoundTripAndStayApartFromTheOtherKeys() {
    for (int s : new int[] {0, 1, 7, 65_535}) {
      for (int f : new int[] {0, 3, 999, 16_383}) {
        int key = TreeNode.pairKey(s, f);
        assertEquals(s, TreeNode.pairSegment(key));
        assertEquals(f, TreeNode.pairChoice(key));
        assertEquals(-1, TreeNode.segmentOf(key));
        assertTrue(key < TreeNode.segmentKey(1_000_000));
      }
    }
    assertEquals(-1, TreeNode.pairSegment(TreeNode.segmentKey(3)));
    assertEquals(-1, TreeNode.pairSegment(TreeNode.TOTAL));
    assertEquals(-1, TreeNode.pairSegment(4));
  }

  @Test
  void withSegmentCountsWholeAChoosingSegmentsCountOfOneChoiceIsNext() {
    // y = (0.5, 0.5, 1) on (a0,b0), (a0,b1), (a1,b0): segment 0 accepts all three (2), segment 1 the first
    // and the third (1.5, a segment count, first); once it is decided, segment 0's counts per choice:
    // a0 1, a1 1, b0 1.5, b1 0.5 → b0 (flat 3) among the variants segment 0 accepts
    double[] y = {0.5, 0.5, 1};
    boolean[] pairs = {true, false};
    VariantBranching.Decision d = VariantBranching.choose(TreeNode.root(0), y, VariantBranchingTest::choicesOf,
        VariantBranchingTest::segmentsOf, 2, pairs, OFFSETS, 5);
    assertEquals(TreeNode.segmentKey(1), d.choice());
    TreeNode decided = VariantBranching.children(TreeNode.root(0), d, 0).get(0);
    d = VariantBranching.choose(decided, y, VariantBranchingTest::choicesOf, VariantBranchingTest::segmentsOf, 2,
        pairs, OFFSETS, 5);
    assertTrue(d.onCount());
    assertEquals(TreeNode.pairKey(0, 3), d.choice());
    assertEquals(1, d.floor());
    // without pair counts for segment 0 the rule goes on to the choice counts of the whole portfolio
    d = VariantBranching.choose(decided, y, VariantBranchingTest::choicesOf, VariantBranchingTest::segmentsOf, 2,
        new boolean[] {false, false}, OFFSETS, 5);
    assertEquals(3, d.choice());
  }

  @Test
  void withAChoosingSegmentsCountsWholeItsMostFractionalVariantComesBeforeTheChoiceCounts() {
    // segment 0 (accepting a0 and a1) offered crossed: (a0,b0) and (a1,b1) at 0.6, (a0,b1) and (a1,b0) at
    // 0.4; its count is 2 and each of its counts per choice is 1. Segment 1 (b0) counts 1. Variant 5 =
    // (a2,b1), accepted by neither, at 0.5 makes the total 2.5 and a2 0.5.
    double[] y = {0.6, 0.4, 0.4, 0.6, 0, 0.5};
    VariantBranching.Decision d = VariantBranching.choose(TreeNode.root(0), y, VariantBranchingTest::choicesOf,
        VariantBranchingTest::segmentsOf, 2, new boolean[] {true, false}, OFFSETS, 5);
    // segment 0 chooses: its most fractional variant (the larger y of the ties) before the total
    assertTrue(!d.onCount());
    assertEquals(0, d.variant());
    // when it does not choose, the total comes first, as before
    d = VariantBranching.choose(TreeNode.root(0), y, VariantBranchingTest::choicesOf,
        VariantBranchingTest::segmentsOf, 2, new boolean[] {false, false}, OFFSETS, 5);
    assertTrue(d.onCount());
    assertEquals(TreeNode.TOTAL, d.choice());
    // a decided variant is skipped: the next one of the segment
    TreeNode barred = VariantBranching.children(TreeNode.root(0), VariantBranching.Decision.variant(0), 0).get(1);
    d = VariantBranching.choose(barred, y, VariantBranchingTest::choicesOf, VariantBranchingTest::segmentsOf, 2,
        new boolean[] {true, false}, OFFSETS, 5);
    assertEquals(3, d.variant());
  }

  @Test
  void aFractionalTotalIsSplitFirst() {
    // y = (0.5, 0.5, 0.7): 1.7 variants in all → at most 1 / at least 2
    VariantBranching.Decision d = VariantBranching.choose(TreeNode.root(0), new double[] {0.5, 0.5, 0.7},
        VariantBranchingTest::choicesOf, OFFSETS, 5);
    assertNotNull(d);
    assertTrue(d.onCount());
    assertEquals(TreeNode.TOTAL, d.choice());
    assertEquals(1, d.floor());
  }

  @Test
  void thenTheMostFractionalChoiceCount() {
    // variants 0 = (a0,b0), 1 = (a0,b1), 2 = (a1,b0) at y = (0.5, 0.5, 1): total 2; choice a0 counts 1,
    // b0 counts 1.5, b1 0.5, a1 1 → split on b0 (flat 3) or b1 (flat 4); both are 0.5 away, the first wins
    VariantBranching.Decision d = VariantBranching.choose(TreeNode.root(0), new double[] {0.5, 0.5, 1},
        VariantBranchingTest::choicesOf, OFFSETS, 5);
    assertNotNull(d);
    assertTrue(d.onCount());
    assertEquals(3, d.choice());
    assertEquals(1, d.floor());
  }

  @Test
  void integralCountsLeaveTheVariantsAndAnIntegralOfferEndsIt() {
    // variants 0 = (a0,b0), 3 = (a1,b1) half each, 1 = (a0,b1), 2 = (a1,b0) half each: every count
    // is whole (a0: 1, a1: 1, b0: 1, b1: 1, total 2), so the rule falls back to a variant
    double[] y = {0.5, 0.5, 0.5, 0.5};
    VariantBranching.Decision d = VariantBranching.choose(TreeNode.root(0), y, VariantBranchingTest::choicesOf,
        OFFSETS, 5);
    assertNotNull(d);
    assertTrue(!d.onCount());
    // integral y with the variant at 1 not yet offered: branch on it; once offered, nothing is left
    double[] whole = {0, 1, 0, 0};
    d = VariantBranching.choose(TreeNode.root(0), whole, VariantBranchingTest::choicesOf, OFFSETS, 5);
    assertNotNull(d);
    assertEquals(1, d.variant());
    TreeNode offered = VariantBranching.children(TreeNode.root(0), d, 0).get(0);
    assertNull(VariantBranching.choose(offered, whole, VariantBranchingTest::choicesOf, OFFSETS, 5));
  }
}
