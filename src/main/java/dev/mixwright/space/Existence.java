package dev.mixwright.space;

import java.util.function.BooleanSupplier;

/** Whether some buildable variant exists within a domain: found, proven absent, or not settled. */
public enum Existence {
  FOUND,
  NONE,
  UNKNOWN;

  public boolean found() {
    return this == FOUND;
  }

  /** Proven: not one variant. */
  public boolean none() {
    return this == NONE;
  }

  /**
   * Whether some buildable variant within {@code domain} (by flat choice) exists, by a search with
   * constraint propagation ({@link Feasibility}) of at most {@code nodes} nodes.
   */
  public static Existence within(VariantSpace space, boolean[] domain, long nodes) {
    return within(space, domain, nodes, () -> false);
  }

  /** {@link #within(VariantSpace, boolean[], long)}, not settled once {@code stop} says so. */
  public static Existence within(VariantSpace space, boolean[] domain, long nodes, BooleanSupplier stop) {
    boolean[] d = domain.clone();
    for (int f = 0; f < d.length; f++) {
      d[f] &= space.allowed(f);
    }
    return switch (Feasibility.search(space, d, nodes, stop)) {
      case FOUND -> FOUND;
      case NONE -> NONE;
      case UNKNOWN -> UNKNOWN;
    };
  }
}
