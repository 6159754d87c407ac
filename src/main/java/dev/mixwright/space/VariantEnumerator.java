package dev.mixwright.space;

/**
 * Lists the buildable variants a segment accepts, one by one — the thing column generation exists
 * to avoid, kept for the benchmark's full LP and for checks on small catalogs.
 *
 * <p>Depth-first over the groups in catalog order, on each group's choices accepted by the segment,
 * with the rules propagated by {@link ForwardChecker}: once every group of a nogood but its last is
 * set to member choices, the last group's member choices leave its domain, so a forbidden prefix is
 * cut before its last group is tried and only buildable variants reach the visitor. O(N · (G + rule
 * work)) for N variants listed, plus the dead ends, which forward checking keeps few when rules are
 * local.
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
  private final ForwardChecker rules;

  public VariantEnumerator(VariantSpace space) {
    this.space = space;
    this.groups = space.groupCount();
    this.offset = space.offsets();
    int[] catalogOrder = new int[groups];
    for (int g = 0; g < groups; g++) {
      catalogOrder[g] = g;
    }
    this.rules = new ForwardChecker(space, catalogOrder, ForwardChecker.NO_WATCH);
  }

  /**
   * Visits every buildable variant accepted by {@code segment} (or every buildable variant when it
   * is -1), in odometer order. Returns how many were visited; stops early when the visitor says so.
   */
  public long forEach(int segment, Visitor visitor) {
    if (groups == 0) {
      return 0;
    }
    boolean[] usable = new boolean[space.totalChoices()];
    for (int f = 0; f < usable.length; f++) {
      usable[f] = segment < 0 ? space.allowed(f) : space.allowedIn(segment, f);
    }
    if (!rules.start(usable)) {
      return 0;
    }
    int[] v = new int[groups];
    int[] mark = new int[groups]; // trail position before the choice at each depth was propagated
    long visited = 0;
    int d = 0;
    v[0] = -1;
    while (d >= 0) {
      if (v[d] >= 0) {
        rules.undo(mark[d]);
      }
      int next = nextChoice(d, v[d] + 1, usable);
      if (next < 0) {
        d--;
        continue;
      }
      v[d] = next;
      mark[d] = rules.mark();
      if (rules.propagate(d, v, 0) < 0) {
        continue; // a later group has nothing left: try the next choice here
      }
      if (d == groups - 1) {
        visited++;
        assert space.isBuildable(v) : "forward checking let a rule violation through";
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

  /** The first choice ≥ from of group g still in its domain, or -1. */
  private int nextChoice(int g, int from, boolean[] usable) {
    for (int c = from; c < space.choiceCount(g); c++) {
      int f = offset[g] + c;
      if (usable[f] && !rules.blocked(f)) {
        return c;
      }
    }
    return -1;
  }
}
