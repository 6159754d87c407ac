package dev.mixwright.testing;

import dev.mixwright.space.VariantSpace;

/** The tests' enumeration of every combination of choices, one group per digit, last group fastest. */
public final class Odometer {
  private Odometer() {}

  /** Moves v to the next combination; false when it wrapped around past the last one. */
  public static boolean next(VariantSpace space, int[] v) {
    int g = v.length - 1;
    while (g >= 0 && ++v[g] == space.choiceCount(g)) {
      v[g] = 0;
      g--;
    }
    return g >= 0;
  }
}
