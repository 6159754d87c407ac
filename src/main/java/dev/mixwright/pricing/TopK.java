package dev.mixwright.pricing;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The k best variants seen so far: a binary min-heap on score, so the k-th best is at the root and
 * serves as the pruning level. Storage grows on demand up to k; an insertion copies the variant into
 * a slot it reuses, so offering costs no allocation once the heap is full.
 */
final class TopK {
  private final int k;
  private final int groups;
  private double[] score;
  private int[][] choice;
  private int size;

  TopK(int k, int groups) {
    this.k = k;
    this.groups = groups;
    int cap = Math.min(k, 16);
    score = new double[cap];
    choice = new int[cap][];
  }

  int k() {
    return k;
  }

  int size() {
    return size;
  }

  /** Scores at or below this cannot enter: the threshold, or the k-th best once k are held. */
  double cutoff(double threshold) {
    return size < k ? threshold : Math.max(threshold, score[0]);
  }

  /** Keeps v (copied) if it beats the cutoff; the caller has checked the threshold and exclusions. */
  boolean offer(int[] v, double s) {
    if (size < k) {
      if (size == score.length) {
        int cap = (int) Math.min(k, 2L * score.length);
        score = Arrays.copyOf(score, cap);
        choice = Arrays.copyOf(choice, cap);
      }
      if (choice[size] == null) {
        choice[size] = new int[groups];
      }
      System.arraycopy(v, 0, choice[size], 0, groups);
      score[size] = s;
      siftUp(size++);
      return true;
    }
    if (!(s > score[0])) {
      return false;
    }
    System.arraycopy(v, 0, choice[0], 0, groups);
    score[0] = s;
    siftDown(0);
    return true;
  }

  private void siftUp(int i) {
    while (i > 0) {
      int p = (i - 1) >>> 1;
      if (!(score[i] < score[p])) {
        return;
      }
      swap(i, p);
      i = p;
    }
  }

  private void siftDown(int i) {
    while (true) {
      int l = 2 * i + 1;
      if (l >= size) {
        return;
      }
      int m = l + 1 < size && score[l + 1] < score[l] ? l + 1 : l;
      if (!(score[m] < score[i])) {
        return;
      }
      swap(i, m);
      i = m;
    }
  }

  private void swap(int a, int b) {
    double s = score[a];
    score[a] = score[b];
    score[b] = s;
    int[] c = choice[a];
    choice[a] = choice[b];
    choice[b] = c;
  }

  /** Best first; equal scores in lexicographic order of the choices, so results are reproducible. */
  List<PricedVariant> sorted() {
    List<PricedVariant> out = new ArrayList<>(size);
    for (int i = 0; i < size; i++) {
      out.add(new PricedVariant(choice[i].clone(), score[i]));
    }
    out.sort(
        (a, b) -> {
          int c = Double.compare(b.reducedCost(), a.reducedCost());
          return c != 0 ? c : Arrays.compare(a.choices(), b.choices());
        });
    return out;
  }
}
