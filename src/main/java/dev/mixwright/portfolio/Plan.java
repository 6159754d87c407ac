package dev.mixwright.portfolio;

import java.util.List;

/**
 * A feasible portfolio: the offered variants (pool indices) with their sales, exact for that set
 * (from the LP of the fixed portfolio). {@code value} = Σ margin · sales − introduction costs −
 * tooling paid; {@code sales.get(i)[k]} is sold of variant {@code members[i]} in its k-th segment.
 */
record Plan(int[] members, List<double[]> sales, double value, double introduction, double tooling) {
  static Plan empty() {
    return new Plan(new int[0], List.of(), 0.0, 0.0, 0.0);
  }

  /** Nothing offered from the pool: every unpinned current variant is dropped and pays its discontinue cost. */
  static Plan empty(Pool pool) {
    return new Plan(new int[0], List.of(), pool.current().constant(), 0.0, 0.0);
  }
}
