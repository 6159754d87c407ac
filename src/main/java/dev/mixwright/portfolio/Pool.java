package dev.mixwright.portfolio;

import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/** The variants the integer stage works with, in the order they joined; no variant twice. */
final class Pool {
  private final VariantSpace space;
  private final PortfolioTerms terms;
  private final List<PoolVariant> variants = new ArrayList<>();
  private final Set<VariantKey> keys = new HashSet<>();

  Pool(VariantSpace space, PortfolioTerms terms) {
    this.space = space;
    this.terms = terms;
  }

  /** Adds v unless it is there already or no segment takes it; true when added. */
  boolean add(int[] v) {
    VariantKey k = space.key(v);
    if (keys.contains(k)) {
      return false;
    }
    PoolVariant p = PoolVariant.of(space, terms, v);
    if (!p.sellable()) {
      return false;
    }
    keys.add(k);
    variants.add(p);
    return true;
  }

  int size() {
    return variants.size();
  }

  PoolVariant get(int i) {
    return variants.get(i);
  }

  List<PoolVariant> all() {
    return variants;
  }

  /** A live view for exclusion in pricing queries. */
  Set<VariantKey> keys() {
    return keys;
  }
}
