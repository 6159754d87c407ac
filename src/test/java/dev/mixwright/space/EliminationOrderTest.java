package dev.mixwright.space;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class EliminationOrderTest {

  private static int[] order(EliminationOrder graph, int n) {
    int[] out = new int[n];
    for (int i = 0; i < n; i++) {
      out[i] = graph.next();
      graph.eliminate(out[i]);
    }
    assertTrue(graph.isDone());
    return out;
  }

  @Test
  void aStarLosesItsLeavesBeforeItsCentre() {
    // centre 0, leaves 1..4: eliminating the centre first would add 6 edges, a leaf none (worked by hand)
    EliminationOrder graph = new EliminationOrder(5);
    for (int leaf = 1; leaf <= 4; leaf++) {
      graph.connect(new int[] {0, leaf});
    }
    int[] order = order(graph, 5);
    assertArrayEquals(new int[] {1, 2, 3, 0, 4}, order, "leaves first; once only 0 and 4 are left they tie, and the lower index goes first");
  }

  @Test
  void eliminatingAVertexConnectsItsNeighbours() {
    // a cycle 0-1-2-3-0: every vertex has one missing edge among its neighbours; the first (0) goes
    // first, and its neighbours 1 and 3 become adjacent (worked by hand)
    EliminationOrder graph = new EliminationOrder(4);
    graph.connect(new int[] {0, 1});
    graph.connect(new int[] {1, 2});
    graph.connect(new int[] {2, 3});
    graph.connect(new int[] {3, 0});
    assertEquals(0, graph.next());
    assertArrayEquals(new int[] {1, 3}, graph.neighbours(0));
    graph.eliminate(0);
    assertArrayEquals(new int[] {2, 3}, graph.neighbours(1));
    assertArrayEquals(new int[] {1, 2}, graph.neighbours(3));
  }

  @Test
  void aCliqueOfARuleCountsAsEdgesAmongAllItsGroups() {
    EliminationOrder graph = new EliminationOrder(4);
    graph.connect(new int[] {0, 1, 2});
    assertArrayEquals(new int[] {1, 2}, graph.neighbours(0));
    assertEquals(3, graph.next(), "the isolated vertex: no fill, no neighbours");
  }
}
