package dev.mixwright.space;

import java.util.BitSet;

/**
 * Greedy min-fill elimination order of an interaction graph (groups as vertices, the groups of each
 * nogood a clique), for the bucket-elimination tables of counting ({@link SpaceCounter}) and of
 * pricing. Each step picks the remaining vertex whose elimination adds the fewest edges among its
 * neighbours (fewest neighbours on a tie, then the lowest index, so the order is reproducible), then
 * connects those neighbours: they are the scope of the table the elimination leaves (Kjærulff 1990,
 * "Triangulation of graphs — algorithms giving small total state space", Aalborg University report
 * R-90-09; Dechter 2003, <i>Constraint Processing</i>, ch. 4 — both cited from memory). Above
 * {@value #MIN_FILL_MAX_VERTICES} vertices it picks by fewest neighbours alone (min-degree), since a
 * min-fill step costs O(n · deg²) and the whole order O(n² · deg²).
 *
 * <p>Use: {@link #connect} each clique, then repeat {@link #next}, {@link #neighbours},
 * {@link #eliminate} until {@link #isDone}.
 */
public final class EliminationOrder {
  /** Above this many vertices the order is min-degree. */
  public static final int MIN_FILL_MAX_VERTICES = 300;

  private final BitSet[] adj;
  private final BitSet remaining;
  private final boolean minDegree;
  private final BitSet scratch = new BitSet();

  /** A graph of {@code vertices} vertices and no edges yet. */
  public EliminationOrder(int vertices) {
    adj = new BitSet[vertices];
    for (int v = 0; v < vertices; v++) {
      adj[v] = new BitSet(vertices);
    }
    remaining = new BitSet(vertices);
    remaining.set(0, vertices);
    minDegree = vertices > MIN_FILL_MAX_VERTICES;
  }

  /** Makes the given vertices pairwise adjacent. */
  public void connect(int[] clique) {
    for (int a : clique) {
      for (int b : clique) {
        if (a != b) {
          adj[a].set(b);
        }
      }
    }
  }

  public boolean isDone() {
    return remaining.isEmpty();
  }

  /** The remaining vertex to eliminate next. */
  public int next() {
    int best = -1;
    long bestScore = Long.MAX_VALUE;
    int bestDegree = Integer.MAX_VALUE;
    for (int v = remaining.nextSetBit(0); v >= 0; v = remaining.nextSetBit(v + 1)) {
      int degree = adj[v].cardinality();
      long score = minDegree ? degree : fill(v);
      if (score < bestScore || score == bestScore && degree < bestDegree) {
        best = v;
        bestScore = score;
        bestDegree = degree;
      }
    }
    if (best < 0) {
      throw new IllegalStateException("every vertex is eliminated");
    }
    return best;
  }

  /** Edges missing among the neighbours of v. */
  private long fill(int v) {
    long fill = 0;
    for (int a = adj[v].nextSetBit(0); a >= 0; a = adj[v].nextSetBit(a + 1)) {
      scratch.clear();
      scratch.or(adj[v]);
      scratch.andNot(adj[a]);
      scratch.clear(0, a + 1); // each missing pair once
      fill += scratch.cardinality();
    }
    return fill;
  }

  /** The remaining neighbours of v, ascending: the scope of the table its elimination leaves. */
  public int[] neighbours(int v) {
    return adj[v].stream().toArray();
  }

  /** Removes v and connects its remaining neighbours. */
  public void eliminate(int v) {
    for (int a = adj[v].nextSetBit(0); a >= 0; a = adj[v].nextSetBit(a + 1)) {
      adj[a].or(adj[v]);
      adj[a].clear(a);
      adj[a].clear(v);
    }
    adj[v].clear();
    remaining.clear(v);
  }
}
