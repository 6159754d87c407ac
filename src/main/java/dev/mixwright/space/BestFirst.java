package dev.mixwright.space;

/**
 * The children of a search node in the order a best-first branch-and-bound tries them: a choice and
 * its bound per entry, in two parallel arrays kept by descending bound (insertion sort: a group has
 * few choices, and it keeps the work on primitives).
 */
public final class BestFirst {
  private BestFirst() {}

  /**
   * Inserts ({@code bound}, {@code choice}) among the first {@code n} entries, after those of equal
   * bound; returns the new count.
   */
  public static int insert(double[] bounds, int[] choices, int n, double bound, int choice) {
    int p = n;
    while (p > 0 && bounds[p - 1] < bound) {
      bounds[p] = bounds[p - 1];
      choices[p] = choices[p - 1];
      p--;
    }
    bounds[p] = bound;
    choices[p] = choice;
    return n + 1;
  }
}
