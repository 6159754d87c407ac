package dev.mixwright.portfolio;

import java.util.Arrays;
import java.util.function.IntPredicate;

/**
 * A node of the branch-and-price tree: the portfolios that offer every pool variant of
 * {@code offered} and none of {@code barred} (pool indices, sorted). Variants outside the pool are
 * free in every node, so the pricer only ever has to skip the pool, which it does anyway.
 * {@code bound}: an upper bound on the value of every portfolio of the node (the parent's until the
 * node is solved); {@code depth}: the number of decisions.
 */
record TreeNode(int[] offered, int[] barred, double bound, int depth) {

  TreeNode {
    offered = offered.clone();
    barred = barred.clone();
    Arrays.sort(offered);
    Arrays.sort(barred);
  }

  static TreeNode root(double bound) {
    return new TreeNode(new int[0], new int[0], bound, 0);
  }

  /** True when the portfolio (membership of pool indices) belongs to this node. */
  boolean holds(IntPredicate inPortfolio) {
    for (int i : offered) {
      if (!inPortfolio.test(i)) {
        return false;
      }
    }
    for (int i : barred) {
      if (inPortfolio.test(i)) {
        return false;
      }
    }
    return true;
  }

  boolean isOffered(int i) {
    return Arrays.binarySearch(offered, i) >= 0;
  }

  boolean isBarred(int i) {
    return Arrays.binarySearch(barred, i) >= 0;
  }

  /** This node with more variants barred (ruled out by their reduced cost), same portfolios of value. */
  TreeNode barring(int[] more, double newBound) {
    int[] b = Arrays.copyOf(barred, barred.length + more.length);
    System.arraycopy(more, 0, b, barred.length, more.length);
    return new TreeNode(offered, Arrays.stream(b).distinct().toArray(), newBound, depth);
  }
}
