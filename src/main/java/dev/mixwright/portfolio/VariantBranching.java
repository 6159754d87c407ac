package dev.mixwright.portfolio;

import java.util.Arrays;
import java.util.List;

/**
 * Branching on one variant's introduction (Barnhart, Johnson, Nemhauser, Savelsbergh &amp; Vance 1998,
 * "Branch-and-price: column generation for solving huge integer programs", Operations Research
 * 46(3)): a node splits on a pool variant v it leaves free into "v offered" (y_v = 1) and "v not
 * offered" (y_v = 0). Every portfolio of the node either holds v or not, so it lies in exactly one
 * child. The decision is on the variant, never on a column (v, s), so a variant sold in two segments
 * still pays its introduction once. Neither child changes the pricing problem: the pricer searches
 * outside the pool, and a barred pool variant is simply held at y_v = 0 in the node's master.
 *
 * <p>Which variant: the most fractional y_v of the node's relaxation (closest to ½); ties to the
 * larger y. When y is integral but the portfolio is not yet decided (tooling its members pay, or
 * whole units), the member with the largest y that is not yet offered by the node.
 */
final class VariantBranching {
  private VariantBranching() {}

  /** Values of y within this of 0 or 1 count as integral. */
  static final double INTEGRAL = 1e-6;

  /**
   * The pool variant to branch on, or −1 when y is integral and every variant at 1 is already
   * offered by the node.
   *
   * @param y the node relaxation's y per pool index (index ≥ y.length: 0)
   */
  static int choose(TreeNode node, double[] y) {
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

  /** The two children of {@code node} on variant v, both with the node's bound until solved. */
  static List<TreeNode> children(TreeNode node, int v, double bound) {
    if (node.isOffered(v) || node.isBarred(v)) {
      throw new IllegalArgumentException("variant " + v + " is already decided at this node");
    }
    int[] in = Arrays.copyOf(node.offered(), node.offered().length + 1);
    in[in.length - 1] = v;
    int[] out = Arrays.copyOf(node.barred(), node.barred().length + 1);
    out[out.length - 1] = v;
    return List.of(new TreeNode(in, node.barred(), bound, node.depth() + 1),
        new TreeNode(node.offered(), out, bound, node.depth() + 1));
  }
}
