package dev.mixwright.space;

import java.util.Arrays;
import java.util.SplittableRandom;
import java.util.function.BooleanSupplier;

/**
 * Is there one buildable variant within a domain? Backtracking search that maintains generalised
 * arc consistency on the nogoods (Mackworth 1977, "Consistency in networks of relations",
 * Artificial Intelligence 8; Bessière 2006, "Constraint propagation", Handbook of Constraint
 * Programming, ch. 3) and picks the group with the fewest choices left first (Haralick &amp; Elliott
 * 1980, Artificial Intelligence 14). A nogood forbids the product of its member sets, so a choice of
 * group h loses its last support exactly when it is a member and every other group of the nogood has
 * only member choices left; counters of non-member choices per (nogood, group) make each removal
 * O(occurrences of the group). Exponential in the worst case (feasibility under pairwise rules is
 * graph colouring), hence the node budget.
 */
final class Feasibility {
  enum Answer {
    FOUND,
    NONE,
    UNKNOWN
  }

  private final VariantSpace space;
  private final int[] off;
  private final int[] groupOf;
  private final boolean[] alive;
  private final int[] size;
  private final boolean[] assigned;
  private final Nogood[] nogoods;
  /** nonMember[i][j]: alive non-member choices of the j-th group of nogood i. */
  private final int[][] nonMember;
  /** full[i]: groups of nogood i with member choices only. */
  private final int[] full;
  /** The nogoods group g is in ({@code occNogood[g][t]}) and its position there ({@code occPos}). */
  private final int[][] occNogood;
  private final int[][] occPos;
  private int[] trail = new int[64];
  private int top;
  private int[] queue = new int[64];
  private int qHead;
  private int qTail;
  private boolean[] queued;
  private long nodes;
  private final long budget;
  private BooleanSupplier stop = () -> false;

  private Feasibility(VariantSpace space, boolean[] domain, long budget) {
    this.space = space;
    this.off = space.offsets();
    this.alive = domain.clone();
    int n = space.groupCount();
    this.groupOf = new int[alive.length];
    this.size = new int[n];
    for (int g = 0; g < n; g++) {
      Arrays.fill(groupOf, off[g], off[g + 1], g);
      for (int f = off[g]; f < off[g + 1]; f++) {
        size[g] += alive[f] ? 1 : 0;
      }
    }
    this.assigned = new boolean[n];
    this.nogoods = space.nogoods();
    int m = nogoods.length;
    this.nonMember = new int[m][];
    this.full = new int[m];
    this.queued = new boolean[m];
    int[] occCount = new int[n];
    for (Nogood ng : nogoods) {
      for (int g : ng.groups()) {
        occCount[g]++;
      }
    }
    this.occNogood = new int[n][];
    this.occPos = new int[n][];
    for (int g = 0; g < n; g++) {
      occNogood[g] = new int[occCount[g]];
      occPos[g] = new int[occCount[g]];
      occCount[g] = 0;
    }
    for (int i = 0; i < m; i++) {
      int[] scope = nogoods[i].groups();
      boolean[] member = nogoods[i].member();
      nonMember[i] = new int[scope.length];
      for (int j = 0; j < scope.length; j++) {
        int g = scope[j];
        occNogood[g][occCount[g]] = i;
        occPos[g][occCount[g]] = j;
        occCount[g]++;
        for (int f = off[g]; f < off[g + 1]; f++) {
          if (alive[f] && !member[f]) {
            nonMember[i][j]++;
          }
        }
        if (nonMember[i][j] == 0) {
          full[i]++;
        }
      }
    }
    this.budget = budget;
  }

  /**
   * Searches for a variant whose every choice is marked in {@code domain} (which should already
   * exclude what {@link VariantSpace#allowed} rejects) and that violates no nogood.
   *
   * @param budget most search nodes to visit; {@code Long.MAX_VALUE} for a complete answer
   */
  static Answer search(VariantSpace space, boolean[] domain, long budget) {
    return search(space, domain, budget, () -> false);
  }

  /**
   * {@link #search(VariantSpace, boolean[], long)} that also ends, not settled, once {@code stop}
   * says so (asked at every node: a node propagates over whole groups, far dearer than the question).
   */
  static Answer search(VariantSpace space, boolean[] domain, long budget, BooleanSupplier stop) {
    Feasibility f = new Feasibility(space, domain, budget);
    f.stop = stop;
    for (int s : f.size) {
      if (s == 0) {
        return Answer.NONE;
      }
    }
    for (int i = 0; i < f.nogoods.length; i++) {
      f.enqueue(i);
    }
    if (!f.propagate()) {
      return Answer.NONE;
    }
    try {
      return f.dfs() ? Answer.FOUND : Answer.NONE;
    } catch (OutOfBudget e) {
      return Answer.UNKNOWN;
    }
  }

  /**
   * A search over {@code domain} made arc consistent at the root, for repeated {@link #probe}s;
   * null when that already proves there is no variant.
   */
  static Feasibility prepared(VariantSpace space, boolean[] domain) {
    Feasibility f = new Feasibility(space, domain, Long.MAX_VALUE);
    for (int s : f.size) {
      if (s == 0) {
        return null;
      }
    }
    for (int i = 0; i < f.nogoods.length; i++) {
      f.enqueue(i);
    }
    if (!f.propagate()) {
      return null;
    }
    f.top = 0; // the root's removals are never undone
    return f;
  }

  /**
   * One random path down the search tree of {@link #dfs} (same group order, same propagation): at
   * each node one of the d live choices of the chosen group, uniformly. Returns ln of the product of
   * the d's along the path when it ends in a variant (written to {@code out}), else -∞. Knuth's
   * estimator: over random paths, the mean of exp(result) (0 at a dead end) is the number of leaves
   * that are variants (Knuth 1975, "Estimating the efficiency of backtrack programs", Mathematics of
   * Computation 29(129)). Leaves the search as it found it. O(groups · propagation) per probe.
   */
  double probe(SplittableRandom rnd, int[] out) {
    double logWeight = 0;
    boolean dead = false;
    while (true) {
      int g = nextGroup();
      if (g < 0) {
        break;
      }
      assigned[g] = true;
      logWeight += Math.log(size[g]);
      int pick = rnd.nextInt(size[g]);
      int chosen = -1;
      for (int f = off[g]; f < off[g + 1]; f++) {
        if (alive[f] && pick-- == 0) {
          chosen = f;
          break;
        }
      }
      boolean ok = true;
      for (int f = off[g]; f < off[g + 1] && ok; f++) {
        if (f != chosen && alive[f]) {
          ok = remove(f);
        }
      }
      if (!ok || !propagate()) {
        dead = true;
        break;
      }
    }
    if (!dead) {
      for (int g = 0; g < size.length; g++) {
        for (int f = off[g]; f < off[g + 1]; f++) {
          if (alive[f]) {
            out[g] = f - off[g];
          }
        }
      }
    }
    clearQueue();
    undo(0);
    Arrays.fill(assigned, false);
    return dead ? Double.NEGATIVE_INFINITY : logWeight;
  }

  private void clearQueue() {
    for (int q = qHead; q < qTail; q++) {
      queued[queue[q]] = false;
    }
    qHead = 0;
    qTail = 0;
  }

  private static final class OutOfBudget extends RuntimeException {
    OutOfBudget() {
      super(null, null, false, false);
    }
  }

  private boolean dfs() {
    if (++nodes > budget || stop.getAsBoolean()) {
      throw new OutOfBudget();
    }
    int g = nextGroup();
    if (g < 0) {
      return true;
    }
    assigned[g] = true;
    for (int k = 0; k < space.choiceCount(g); k++) {
      if (!alive[off[g] + k]) {
        continue;
      }
      int mark = top;
      boolean ok = true;
      for (int f = off[g]; f < off[g + 1] && ok; f++) {
        if (f != off[g] + k && alive[f]) {
          ok = remove(f);
        }
      }
      if (ok && propagate() && dfs()) {
        return true;
      }
      undo(mark);
    }
    assigned[g] = false;
    return false;
  }

  /** The unassigned group with the fewest live choices, most rules first among equals; -1 when none. */
  private int nextGroup() {
    int g = -1;
    for (int h = 0; h < size.length; h++) {
      if (!assigned[h]
          && (g < 0
              || size[h] < size[g]
              || (size[h] == size[g] && occNogood[h].length > occNogood[g].length))) {
        g = h;
      }
    }
    return g;
  }

  /** Removes choice f and updates the counters; false on a wipe-out or a violated nogood. */
  private boolean remove(int f) {
    int g = groupOf[f];
    alive[f] = false;
    size[g]--;
    push(f);
    boolean ok = size[g] > 0;
    int[] ns = occNogood[g];
    int[] ps = occPos[g];
    for (int t = 0; t < ns.length; t++) {
      int i = ns[t];
      if (!nogoods[i].member()[f] && --nonMember[i][ps[t]] == 0) {
        full[i]++;
        int len = nonMember[i].length;
        if (full[i] == len) {
          ok = false;
        } else if (full[i] == len - 1) {
          enqueue(i);
        }
      }
    }
    return ok;
  }

  /** Prunes, for every queued nogood with all groups but one full, that group's member choices. */
  private boolean propagate() {
    boolean ok = true;
    while (qHead < qTail) {
      int i = queue[qHead++];
      queued[i] = false;
      if (!ok) {
        continue; // drain the queue so that it is empty for the next call
      }
      int len = nonMember[i].length;
      if (full[i] == len) {
        ok = false;
      } else if (full[i] == len - 1) {
        int[] scope = nogoods[i].groups();
        int h = -1;
        for (int j = 0; j < len; j++) {
          if (nonMember[i][j] > 0) {
            h = scope[j];
          }
        }
        boolean[] member = nogoods[i].member();
        for (int f = off[h]; f < off[h + 1] && ok; f++) {
          if (alive[f] && member[f]) {
            ok = remove(f);
          }
        }
      }
    }
    qHead = 0;
    qTail = 0;
    return ok;
  }

  private void undo(int mark) {
    while (top > mark) {
      int f = trail[--top];
      int g = groupOf[f];
      int[] ns = occNogood[g];
      int[] ps = occPos[g];
      for (int t = 0; t < ns.length; t++) {
        int i = ns[t];
        if (!nogoods[i].member()[f] && nonMember[i][ps[t]]++ == 0) {
          full[i]--;
        }
      }
      alive[f] = true;
      size[g]++;
    }
  }

  private void enqueue(int i) {
    if (queued[i]) {
      return;
    }
    if (qTail == queue.length) {
      queue = Arrays.copyOf(queue, queue.length * 2);
    }
    queued[i] = true;
    queue[qTail++] = i;
  }

  private void push(int f) {
    if (top == trail.length) {
      trail = Arrays.copyOf(trail, trail.length * 2);
    }
    trail[top++] = f;
  }
}
