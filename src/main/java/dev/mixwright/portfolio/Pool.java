package dev.mixwright.portfolio;

import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.AbstractSet;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CopyOnWriteArrayList;

/**
 * The variants the integer stage works with, in the order they joined; no variant twice. Safe for the
 * two workers of {@link BranchAndPrice}: adds are serialised, reads need no lock, and a variant keeps
 * its index for good.
 */
final class Pool {
  private final VariantSpace space;
  private final PortfolioTerms terms;
  private final CurrentRange current;
  private final List<PoolVariant> variants = new CopyOnWriteArrayList<>();
  private final Map<VariantKey, Integer> index = new ConcurrentHashMap<>();
  private final ChoiceRows choice;

  Pool(VariantSpace space, PortfolioTerms terms) {
    this(space, terms, new CurrentRange(space));
  }

  Pool(VariantSpace space, PortfolioTerms terms, CurrentRange current) {
    this.space = space;
    this.terms = terms;
    this.choice = new ChoiceRows(space);
    this.current = current;
  }

  /** The rows of segments that choose, for every master built over this pool. */
  ChoiceRows choice() {
    return choice;
  }

  CurrentRange current() {
    return current;
  }

  /** The pool indices of the pinned variants. */
  int[] pinned() {
    return java.util.stream.IntStream.range(0, variants.size()).filter(i -> variants.get(i).pinned()).toArray();
  }

  /** Adds v unless it is there already or no segment takes it; true when added. */
  synchronized boolean add(int[] v) {
    int before = variants.size();
    return indexOrAdd(v) == before;
  }

  /**
   * The pool members of a range of variants: each one's index by {@code indexOrAdd} (which adds it
   * when new), leaving out those no segment takes (index −1).
   */
  static int[] members(List<int[]> range, java.util.function.ToIntFunction<int[]> indexOrAdd) {
    return range.stream().mapToInt(indexOrAdd).filter(at -> at >= 0).toArray();
  }

  /** The index of v, added when new; −1 when no segment takes it. */
  synchronized int indexOrAdd(int[] v) {
    VariantKey k = space.key(v);
    Integer at = index.get(k);
    if (at != null) {
      return at;
    }
    PoolVariant p = PoolVariant.of(space, terms, v, current.fixedCost(k, terms.introductionCost()),
        current.isPinned(k));
    if (!p.sellable()) {
      return -1;
    }
    variants.add(p);
    index.put(k, variants.size() - 1);
    return variants.size() - 1;
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
    return index.keySet();
  }

  /**
   * The keys of the first n variants, as a live view: what a master holding exactly those excludes
   * from pricing, while the other worker may be adding more.
   */
  Set<VariantKey> keysBelow(int n) {
    return new AbstractSet<>() {
      @Override
      public boolean contains(Object o) {
        Integer at = index.get(o);
        return at != null && at < n;
      }

      @Override
      public boolean isEmpty() {
        return n == 0;
      }

      @Override
      public Iterator<VariantKey> iterator() {
        return index.entrySet().stream().filter(e -> e.getValue() < n).map(Map.Entry::getKey).iterator();
      }

      @Override
      public int size() {
        return n;
      }
    };
  }
}
