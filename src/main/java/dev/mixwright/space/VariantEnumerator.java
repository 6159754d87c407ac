package dev.mixwright.space;

/**
 * Lists the buildable variants a segment accepts, one by one — the thing column generation exists
 * to avoid, kept for the benchmark's full LP and for checks on small catalogs.
 *
 * <p>Depth-first over the groups in catalog order, on each group's choices accepted by the segment;
 * a nogood is tested as soon as its last group (in catalog order) is set, so a forbidden prefix is
 * cut at once and only buildable variants reach the visitor. O(N · (G + rule work)) for N variants
 * listed, plus the dead ends, which the early tests keep few when rules are local.
 */
public final class VariantEnumerator {
  /** Receives each variant; the array is reused, copy it to keep it. Return false to stop. */
  @FunctionalInterface
  public interface Visitor {
    boolean visit(int[] choices);
  }

  private final VariantSpace space;
  private final int groups;
  private final int[] offset;
  private final int[][] closing; // per group: nogoods whose last group it is

  public VariantEnumerator(VariantSpace space) {
    this.space = space;
    this.groups = space.groupCount();
    this.offset = space.offsets();
    int[] count = new int[groups];
    int[] last = new int[space.nogoodCount()];
    for (int n = 0; n < last.length; n++) {
      int m = -1;
      for (int g : space.nogood(n).groups()) {
        m = Math.max(m, g);
      }
      last[n] = m;
      count[m]++;
    }
    closing = new int[groups][];
    for (int g = 0; g < groups; g++) {
      closing[g] = new int[count[g]];
      count[g] = 0;
    }
    for (int n = 0; n < last.length; n++) {
      closing[last[n]][count[last[n]]++] = n;
    }
  }

  /**
   * Visits every buildable variant accepted by {@code segment} (or every buildable variant when it
   * is -1), in odometer order. Returns how many were visited; stops early when the visitor says so.
   */
  public long forEach(int segment, Visitor visitor) {
    if (groups == 0) {
      return 0;
    }
    int[] v = new int[groups];
    long visited = 0;
    int d = 0;
    v[0] = -1;
    while (d >= 0) {
      int next = nextChoice(segment, d, v[d] + 1, v);
      if (next < 0) {
        d--;
        continue;
      }
      v[d] = next;
      if (d == groups - 1) {
        visited++;
        if (!visitor.visit(v)) {
          return visited;
        }
      } else {
        d++;
        v[d] = -1;
      }
    }
    return visited;
  }

  /** The first choice ≥ from of group g that is usable and closes no nogood, or -1. */
  private int nextChoice(int segment, int g, int from, int[] v) {
    for (int c = from; c < space.choiceCount(g); c++) {
      int f = offset[g] + c;
      if (!(segment < 0 ? space.allowed(f) : space.allowedIn(segment, f))) {
        continue;
      }
      v[g] = c;
      boolean ok = true;
      for (int n : closing[g]) {
        if (space.nogood(n).violatedBy(v, offset)) {
          ok = false;
          break;
        }
      }
      if (ok) {
        return c;
      }
    }
    return -1;
  }
}
