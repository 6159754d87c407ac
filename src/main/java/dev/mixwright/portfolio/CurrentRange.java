package dev.mixwright.portfolio;

import dev.mixwright.catalog.CurrentVariant;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The variants on sale today, as the integer stage sees them. Keeping a current variant costs no
 * introduction; dropping it costs its {@code discontinue}. With C the unpinned current variants,
 *
 * <pre>
 *   value(S) = Σ m x − F·|S \ current| − Σ_{c ∈ C \ S} disc_c − tooling
 *            = −Σ_{c ∈ C} disc_c  +  Σ m x  −  Σ_{v ∈ S} F_v  −  tooling,
 *   F_v = F for a new variant,  −disc_c for an unpinned current one,  0 for a pinned one,
 * </pre>
 *
 * so the stage's models stay those of a per-variant fixed cost F_v plus a constant, and a pinned
 * variant has y fixed at 1 (its discontinue cost is never paid, so it is left out of the constant).
 * Lookup is by {@link VariantKey}, O(1) per variant.
 */
final class CurrentRange {
  private final List<int[]> variants = new ArrayList<>();
  private final double[] discontinue;
  private final boolean[] pinned;
  private final Map<VariantKey, Integer> index = new HashMap<>();
  private final double constant;

  CurrentRange(VariantSpace space) {
    List<CurrentVariant> cs = space.catalog().current();
    discontinue = new double[cs.size()];
    pinned = new boolean[cs.size()];
    double c = 0;
    for (int i = 0; i < cs.size(); i++) {
      CurrentVariant cv = cs.get(i);
      int[] v = space.parse(cv.variant());
      variants.add(v);
      discontinue[i] = cv.discontinue();
      pinned[i] = cv.keep();
      index.put(space.key(v), i);
      if (!cv.keep()) {
        c -= cv.discontinue();
      }
    }
    constant = c;
  }

  boolean isEmpty() {
    return variants.isEmpty();
  }

  int size() {
    return variants.size();
  }

  int[] variant(int i) {
    return variants.get(i);
  }

  double discontinue(int i) {
    return discontinue[i];
  }

  boolean pinned(int i) {
    return pinned[i];
  }

  /** The index of v among the current variants, −1 when it is new. */
  int indexOf(VariantKey key) {
    Integer i = index.get(key);
    return i == null ? -1 : i;
  }

  /** F_v of the class comment. */
  double fixedCost(VariantKey key, double introductionCost) {
    int i = indexOf(key);
    return i < 0 ? introductionCost : pinned[i] ? 0.0 : -discontinue[i];
  }

  boolean isPinned(VariantKey key) {
    int i = indexOf(key);
    return i >= 0 && pinned[i];
  }

  /** Today's variants, in the catalog's order. */
  List<int[]> variants() {
    return java.util.Collections.unmodifiableList(variants);
  }

  /** −Σ disc over the unpinned current variants: the value's constant (0 without a current range). */
  double constant() {
    return constant;
  }
}
