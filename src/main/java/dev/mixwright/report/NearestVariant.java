package dev.mixwright.report;

import dev.mixwright.catalog.Group;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The nearest of a fixed list of variants to any other variant: fewest groups in which the choices
 * differ (a group a variant does not name counts as {@link Group#NONE}), the first in the list on a
 * tie. A plain scan costs n·G per question, so naming every column of a large run by its nearest
 * code was quadratic (468,688 columns against 254,562 codes).
 *
 * <p>Method: the variants as rows of choice numbers, sorted lexicographically, form a trie (digital
 * search tree, Knuth, <i>The Art of Computer Programming</i>, vol. 3, section 6.3) whose node at
 * depth d is a range of rows agreeing in their first d groups. A question descends it depth first,
 * its own choice's child first, and prunes by branch and bound: a node already as far away as the
 * best row found is followed only along the question's own choices, since below it nothing nearer
 * can lie and only a lower row of the same distance could still win. Building costs O(n·G·log n)
 * time and n·G ints; a question O(G·log n) when a row is at distance 0 or 1, and at worst the trie's
 * nodes within the best distance of it (never more than n·G). One question at a time: the search
 * keeps its state in fields.
 */
final class NearestVariant {
  private final int groups;
  private final Map<String, Integer> groupIndex = new HashMap<>();
  /** Per group, choice id to its number; {@link Group#NONE} is 0. */
  private final List<Map<String, Integer>> choiceNumbers = new ArrayList<>();
  /** Row r of the sorted list: {@code rows[r * groups + g]}. */
  private final int[] rows;
  /** The position in the given list of sorted row r. */
  private final int[] origin;

  private int best;
  private int bestAt;
  private int[] question;

  NearestVariant(List<Map<String, String>> variants) {
    for (Map<String, String> v : variants) {
      for (String g : v.keySet()) {
        if (groupIndex.putIfAbsent(g, groupIndex.size()) == null) {
          Map<String, Integer> numbers = new HashMap<>();
          numbers.put(Group.NONE, 0);
          choiceNumbers.add(numbers);
        }
      }
    }
    groups = groupIndex.size();
    int n = variants.size();
    int[] plain = new int[n * groups];
    for (int i = 0; i < n; i++) {
      for (Map.Entry<String, String> e : variants.get(i).entrySet()) {
        int g = groupIndex.get(e.getKey());
        Map<String, Integer> numbers = choiceNumbers.get(g);
        plain[i * groups + g] = numbers.computeIfAbsent(e.getValue(), k -> numbers.size());
      }
    }
    Integer[] order = new Integer[n];
    Arrays.setAll(order, i -> i);
    Arrays.sort(order, (a, b) -> {
      for (int g = 0; g < groups; g++) {
        int c = Integer.compare(plain[a * groups + g], plain[b * groups + g]);
        if (c != 0) {
          return c;
        }
      }
      return Integer.compare(a, b);
    });
    rows = new int[n * groups];
    origin = new int[n];
    for (int r = 0; r < n; r++) {
      origin[r] = order[r];
      System.arraycopy(plain, order[r] * groups, rows, r * groups, groups);
    }
  }

  /** The position in the list of the variant nearest to {@code options}, or -1 for an empty list. */
  int nearest(Map<String, String> options) {
    if (origin.length == 0) {
      return -1;
    }
    // a group no listed variant names adds the same to every distance, so it is left out
    question = new int[groups];
    for (Map.Entry<String, String> e : options.entrySet()) {
      Integer g = groupIndex.get(e.getKey());
      if (g != null) {
        question[g] = choiceNumbers.get(g).getOrDefault(e.getValue(), -1);
      }
    }
    best = Integer.MAX_VALUE;
    bestAt = -1;
    descend(0, 0, origin.length, 0);
    return bestAt;
  }

  /** Rows [lo, hi) agree in their first {@code depth} groups and differ from the question in {@code apart} of them. */
  private void descend(int depth, int lo, int hi, int apart) {
    if (apart > best) {
      return;
    }
    if (depth == groups) {
      int first = Integer.MAX_VALUE;
      for (int r = lo; r < hi; r++) {
        first = Math.min(first, origin[r]);
      }
      if (apart < best || first < bestAt) { // apart <= best here
        best = apart;
        bestAt = first;
      }
      return;
    }
    int own = question[depth];
    int start = lowerBound(lo, hi, depth, own);
    int end = lowerBound(start, hi, depth, own + 1);
    if (start < end) {
      descend(depth + 1, start, end, apart);
    }
    for (int s = lo; s < hi && apart + 1 <= best; ) {
      int value = rows[s * groups + depth];
      int e = lowerBound(s, hi, depth, value + 1);
      if (value != own) {
        descend(depth + 1, s, e, apart + 1);
      }
      s = e;
    }
  }

  /** The first row of [lo, hi) whose choice in group {@code depth} is at least {@code value}; the range is sorted by it. */
  private int lowerBound(int lo, int hi, int depth, int value) {
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (rows[mid * groups + depth] < value) {
        lo = mid + 1;
      } else {
        hi = mid;
      }
    }
    return lo;
  }
}
