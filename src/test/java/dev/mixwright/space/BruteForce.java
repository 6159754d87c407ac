package dev.mixwright.space;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import java.util.List;
import java.util.Map;
import java.util.function.Predicate;

/**
 * Brute force for tests: lists every combination of choices with an odometer. The {@code rulesHold}
 * family reads the catalog records directly, not the compiled space, so it checks compilation too.
 */
final class BruteForce {
  private BruteForce() {}

  /** Number of combinations of choices, or Long.MAX_VALUE when above it. */
  static long combinations(Catalog c) {
    long p = 1;
    for (Group g : c.groups()) {
      p = Math.multiplyExact(p, g.choiceCount());
    }
    return p;
  }

  /** Counts the combinations that satisfy the predicate. */
  static long count(Catalog c, Predicate<int[]> ok) {
    int n = c.groups().size();
    int[] v = new int[n];
    long count = 0;
    for (Group g : c.groups()) {
      if (g.choiceCount() == 0) {
        return 0;
      }
    }
    while (true) {
      if (ok.test(v)) {
        count++;
      }
      int g = n - 1;
      while (g >= 0 && ++v[g] == c.groups().get(g).choiceCount()) {
        v[g] = 0;
        g--;
      }
      if (g < 0) {
        return count;
      }
    }
  }

  static long buildable(VariantSpace s) {
    return count(s.catalog(), s::isBuildable);
  }

  static long columns(VariantSpace s, int seg) {
    return count(s.catalog(), v -> s.isColumn(v, seg));
  }

  /** The catalog's rules, read from the records, hold for v. */
  static boolean rulesHold(Catalog c, List<Rule> rules, int[] v) {
    for (Rule r : rules) {
      if (r.isForbid()) {
        if (matches(c, r.forbid(), v)) {
          return false;
        }
      } else if (matches(c, r.when(), v) && !matches(c, r.require(), v)) {
        return false;
      }
    }
    return true;
  }

  static boolean accepts(Catalog c, Segment s, int[] v) {
    return matches(c, s.accepts(), v);
  }

  /** Every named group holds one of its listed choices (an empty map always matches). */
  static boolean matches(Catalog c, Map<String, List<String>> m, int[] v) {
    for (Map.Entry<String, List<String>> e : m.entrySet()) {
      int g = c.groupIndex(e.getKey());
      if (!e.getValue().contains(c.groups().get(g).choiceId(v[g]))) {
        return false;
      }
    }
    return true;
  }

  /** Some variant satisfies only the listed rules (and, when seg >= 0, segment seg's accepts). */
  static boolean feasible(Catalog c, List<Integer> ruleIndices, int seg) {
    List<Rule> rules = ruleIndices.stream().map(c.rules()::get).toList();
    return count(
            c,
            v -> rulesHold(c, rules, v) && (seg < 0 || accepts(c, c.segments().get(seg), v)))
        > 0;
  }
}
