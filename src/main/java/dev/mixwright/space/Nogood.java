package dev.mixwright.space;

/**
 * A forbidden combination: a variant is not buildable when, for every group in {@link #groups()}, its
 * choice is marked in {@link #member()}. {@code member} is indexed by flat choice index (see
 * {@link VariantSpace#offset(int)}); only entries of the listed groups matter. {@code rule} is the index
 * of the catalog rule it came from.
 */
public record Nogood(int[] groups, boolean[] member, int rule) {

  /** True when this combination is present in the (complete) variant. */
  public boolean violatedBy(int[] choices, int[] offset) {
    for (int g : groups) {
      if (!member[offset[g] + choices[g]]) {
        return false;
      }
    }
    return true;
  }
}
