package dev.mixwright.portfolio;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * A first feasible portfolio from the relaxation, greedily: pool variants in order of their relaxed
 * introduction y_v (then their relaxed sales), each kept when offering it as well raises the value of
 * the fixed portfolio's LP; then a pass that drops any variant whose removal raises it. Every trial
 * is one small LP over the chosen variants only, so this costs O(pool) LPs of at most K variants.
 * The empty portfolio (value 0) is the start, so the result is never worse than offering nothing;
 * with pinned current variants the start is those alone, and they are never dropped.
 */
final class Rounding {
  private Rounding() {}

  /** Stops early, with the best plan so far, once {@code phase} ends. */
  static Plan greedy(Pool pool, PortfolioTerms terms, double[] y, double[] score, StageClock clock,
      StageClock.Phase phase) {
    Integer[] order = new Integer[pool.size()];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    Arrays.sort(order, Comparator.comparingDouble((Integer i) -> -(i < y.length ? y[i] : 0))
        .thenComparingDouble(i -> -score[i]));
    List<Integer> chosen = new ArrayList<>();
    for (int i : pool.pinned()) {
      chosen.add(i);
    }
    Plan start = FixedPortfolio.solve(pool, terms, toArray(chosen));
    // pinned lots that do not fit leave no feasible start: the value −∞ lets any plan replace it
    Plan best = start != null ? start : new Plan(toArray(chosen), List.of(), Double.NEGATIVE_INFINITY, 0, 0);
    for (int i : order) {
      if (pool.get(i).pinned()) {
        continue;
      }
      if (chosen.size() >= terms.maxVariants() || phase.stop().fired(clock.now(chosen.size()))) {
        break;
      }
      if ((i < y.length ? y[i] : 0) <= 1e-9 && score[i] <= 0) {
        break; // the rest neither enter the relaxation nor pay at its prices
      }
      chosen.add(i);
      Plan p = FixedPortfolio.solve(pool, terms, toArray(chosen));
      if (p != null && p.value() > best.value() + 1e-9 * (1 + Math.abs(best.value()))) {
        best = p;
      } else {
        chosen.remove(chosen.size() - 1);
      }
    }
    boolean improved = true;
    while (improved && !phase.stop().fired(clock.now(chosen.size()))) {
      improved = false;
      for (int j = 0; j < chosen.size(); j++) {
        if (pool.get(chosen.get(j)).pinned()) {
          continue;
        }
        List<Integer> fewer = new ArrayList<>(chosen);
        fewer.remove(j);
        Plan p = FixedPortfolio.solve(pool, terms, toArray(fewer));
        if (p != null && p.value() > best.value() + 1e-9 * (1 + Math.abs(best.value()))) {
          best = p;
          chosen = fewer;
          improved = true;
          break;
        }
      }
    }
    return best;
  }

  private static int[] toArray(List<Integer> l) {
    return l.stream().mapToInt(Integer::intValue).toArray();
  }
}
