package dev.mixwright.pricing;

import dev.mixwright.space.Nogood;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.HashSet;
import java.util.Random;
import java.util.Set;

/**
 * Fast pricing for early column-generation rounds; proves nothing, so its outcome is never exact and
 * its upper bound is +∞ (the last round must use an exact pricer).
 *
 * <p>Each restart builds a variant greedily, group by group in order of rule involvement, taking the
 * best choice that completes no nogood with the groups already set, backing up chronologically when
 * a group has no such choice (within a small node budget); restarts after the first perturb the
 * choice preference at random. Each variant is then improved by 1-opt: change the one group whose
 * change raises the score most while staying buildable, until no change helps. Every buildable
 * variant met on the way competes for the k best. Greedy with local search is the usual start for
 * product-line pricing (Bront, Méndez-Díaz &amp; Vulcano 2009, Operations Research 57(3)). Per restart
 * O(budget + rounds · Σ_g d_g · (G + rule work)).
 */
public final class HeuristicPricer extends SpacePricer {
  public static final int DEFAULT_RESTARTS = 8;
  public static final long DEFAULT_SEED = 1L;

  private final int restarts;
  private final long seed;
  private final int groups;
  private final int[] offset;
  private final Nogood[] nogoods;
  private final int[][] nogoodsOf;
  private final int[] order;

  public HeuristicPricer(VariantSpace space) {
    this(space, DEFAULT_RESTARTS, DEFAULT_SEED);
  }

  /**
   * @param restarts greedy constructions per query (≥ 1)
   * @param seed seed of the perturbations; the same seed gives the same answers
   */
  public HeuristicPricer(VariantSpace space, int restarts, long seed) {
    super(space, "heuristic");
    if (restarts < 1) {
      throw new IllegalArgumentException("restarts must be >= 1");
    }
    this.restarts = restarts;
    this.seed = seed;
    this.groups = space.groupCount();
    this.offset = space.offsets();
    this.nogoods = space.nogoods();
    this.nogoodsOf = new int[groups][];
    Integer[] byDegree = new Integer[groups];
    for (int g = 0; g < groups; g++) {
      nogoodsOf[g] = space.nogoodsOf(g);
      byDegree[g] = g;
    }
    java.util.Arrays.sort(byDegree, (a, b) -> Integer.compare(nogoodsOf[b].length, nogoodsOf[a].length));
    order = new int[groups];
    for (int d = 0; d < groups; d++) {
      order[d] = byDegree[d];
    }
  }

  @Override
  PricingOutcome search(PricingQuery q) {
    return new Run(q).solve();
  }

  /** The state of one query. */
  private final class Run {
    final PricingQuery q;
    final double[] w;
    final int[][] choices; // usable choice indices per group
    final int[] v = new int[groups];
    final boolean[] set = new boolean[groups];
    final double[] pref;
    final TopK top;
    final Set<VariantKey> seen = new HashSet<>();
    final Random rnd = new Random(seed);
    long work;

    Run(PricingQuery q) {
      this.q = q;
      this.w = q.weight();
      this.top = new TopK(q.k(), groups);
      this.pref = w.clone();
      this.choices = new int[groups][];
      for (int g = 0; g < groups; g++) {
        choices[g] = QueryChecks.usableChoices(space, w, g);
      }
    }

    PricingOutcome solve() {
      boolean possible = true;
      double spread = 0;
      for (int g = 0; g < groups; g++) {
        possible &= choices[g].length > 0;
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int c : choices[g]) {
          lo = Math.min(lo, w[offset[g] + c]);
          hi = Math.max(hi, w[offset[g] + c]);
        }
        spread += hi > lo ? (hi - lo) / groups : 0;
      }
      for (int r = 0; possible && r < restarts; r++) {
        for (int f = 0; f < w.length; f++) {
          // the first restart is plain greedy; later ones blur the preference by about half a group's spread
          pref[f] = r == 0 || w[f] == Double.NEGATIVE_INFINITY ? w[f] : w[f] + (rnd.nextDouble() - 0.5) * spread;
        }
        if (construct(50L * (groups + 1))) {
          improve();
        }
      }
      return QueryChecks.outcome(top, q.threshold(), false, Double.POSITIVE_INFINITY, work);
    }

    /** Greedy by preference with chronological backtracking; false when the budget runs out. */
    boolean construct(long budget) {
      java.util.Arrays.fill(set, false);
      int[] next = new int[groups]; // candidates already tried at each depth
      int[][] ranked = new int[groups][];
      for (int g = 0; g < groups; g++) {
        ranked[g] = rankByPreference(g);
      }
      int d = 0;
      while (d >= 0 && d < groups) {
        int g = order[d];
        set[g] = false;
        boolean placed = false;
        while (next[d] < ranked[g].length) {
          int c = ranked[g][next[d]++];
          work++;
          if (--budget < 0) {
            return false;
          }
          v[g] = c;
          if (!conflicts(g, c)) {
            set[g] = true;
            placed = true;
            break;
          }
        }
        if (placed) {
          d++;
        } else {
          next[d] = 0;
          d--;
        }
      }
      return d == groups;
    }

    private int[] rankByPreference(int g) {
      int[] r = choices[g].clone();
      for (int i = 1; i < r.length; i++) {
        int x = r[i];
        int j = i - 1;
        while (j >= 0 && pref[offset[g] + r[j]] < pref[offset[g] + x]) {
          r[j + 1] = r[j];
          j--;
        }
        r[j + 1] = x;
      }
      return r;
    }

    /** Whether g = c completes a nogood with the groups already set. */
    boolean conflicts(int g, int c) {
      for (int n : nogoodsOf[g]) {
        Nogood ng = nogoods[n];
        if (!ng.member()[offset[g] + c]) {
          continue;
        }
        boolean all = true;
        for (int h : ng.groups()) {
          if (h != g && (!set[h] || !ng.member()[offset[h] + v[h]])) {
            all = false;
            break;
          }
        }
        if (all) {
          return true;
        }
      }
      return false;
    }

    /** Best-improvement 1-opt from the complete buildable variant in v. */
    void improve() {
      offer();
      for (int round = 0; round < 10 * groups + 10; round++) {
        double bestDelta = 0;
        int bestG = -1;
        int bestC = -1;
        for (int g = 0; g < groups; g++) {
          int cur = v[g];
          double wc = w[offset[g] + cur];
          for (int c : choices[g]) {
            if (c == cur) {
              continue;
            }
            work++;
            set[g] = false;
            boolean bad = conflicts(g, c);
            set[g] = true;
            if (bad) {
              continue;
            }
            v[g] = c;
            offer();
            v[g] = cur;
            double delta = w[offset[g] + c] - wc;
            if (delta > bestDelta) {
              bestDelta = delta;
              bestG = g;
              bestC = c;
            }
          }
        }
        if (bestG < 0) {
          return;
        }
        v[bestG] = bestC;
      }
    }

    private void offer() {
      double s = QueryChecks.score(offset, w, q.constant(), v);
      if (s > top.cutoff(q.threshold())) {
        VariantKey key = space.key(v);
        if (!q.excluded().contains(key) && seen.add(key)) {
          top.offer(v, s);
        }
      }
    }
  }
}
