package dev.mixwright.space;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Rule propagation for a depth-first search that assigns the groups in one fixed order: forward
 * checking over the compiled nogoods (Haralick &amp; Elliott 1980, "Increasing tree search efficiency
 * for constraint satisfaction problems", Artificial Intelligence 14). Each nogood becomes a trigger at
 * the depth of its second-to-last group (in the order); once every group of it but the last holds a
 * member choice, the last group's member choices leave its domain. An emptied domain cuts the branch.
 * Removals are counted per choice and undone through a trail, so a node allocates nothing; a
 * trigger costs O(its groups + member choices of its last group).
 *
 * <p>Per search: {@link #start} with the choices the query may use; then per node {@link #mark},
 * {@link #propagate} and {@link #undo}. A {@link DomainWatch} hears each usable choice leave or
 * return, for searches that keep per-group positions in their own rankings of the domains.
 */
public final class ForwardChecker {
  /** Told when a usable choice leaves its domain (first trigger) or returns (last one undone). */
  public interface DomainWatch {
    void removed(int flat, int group);

    void restored(int flat, int group);
  }

  /** For searches that read the domains only through {@link #blocked} and {@link #live}. */
  public static final DomainWatch NO_WATCH =
      new DomainWatch() {
        @Override
        public void removed(int flat, int group) {}

        @Override
        public void restored(int flat, int group) {}
      };

  private final int groups;
  private final int[] offset;
  private final int[] order;
  private final int[] depthOf;
  private final int[] groupOf;
  private final DomainWatch watch;

  private final int[] trigStart; // by depth, into the trigger arrays
  private final boolean[][] trigMember;
  private final int[][] trigCheck; // groups that must hold a member choice (all but the last)
  private final int[] trigTarget; // the last group in the order
  private final int[][] trigBlock; // member flat choices of the target group
  private final int[] trigFirst; // depth of the nogood's first group
  private final int[][] firstAt; // by depth: the triggers whose first group is there

  private boolean[] usable;
  private final int[] blocked; // how many fired triggers currently remove the flat choice
  private final int[] live;
  private final int[] trail;
  private int trailTop;

  /**
   * @param order the groups by depth (a permutation of the space's groups)
   * @param watch told of each removal and return of a usable choice; {@link #NO_WATCH} for none
   */
  public ForwardChecker(VariantSpace space, int[] order, DomainWatch watch) {
    this.groups = space.groupCount();
    if (order.length != groups) {
      throw new IllegalArgumentException("order has " + order.length + " groups, the space " + groups);
    }
    this.offset = space.offsets();
    this.order = order.clone();
    this.watch = watch;
    int total = space.totalChoices();
    groupOf = new int[total];
    for (int g = 0; g < groups; g++) {
      Arrays.fill(groupOf, offset[g], offset[g + 1], g);
    }
    depthOf = new int[groups];
    for (int d = 0; d < groups; d++) {
      depthOf[this.order[d]] = d;
    }
    Nogood[] nogoods = space.nogoods();
    List<List<Integer>> byDepth = new ArrayList<>();
    for (int d = 0; d < groups; d++) {
      byDepth.add(new ArrayList<>());
    }
    for (int n = 0; n < nogoods.length; n++) {
      int[] gs = SearchOrder.byDepth(nogoods[n].groups(), depthOf);
      byDepth.get(depthOf[gs[gs.length - 2]]).add(n);
    }
    int triggers = nogoods.length;
    trigStart = new int[groups + 1];
    trigMember = new boolean[triggers][];
    trigCheck = new int[triggers][];
    trigTarget = new int[triggers];
    trigBlock = new int[triggers][];
    trigFirst = new int[triggers];
    int t = 0;
    long trailNeed = 0;
    for (int d = 0; d < groups; d++) {
      trigStart[d] = t;
      for (int n : byDepth.get(d)) {
        Nogood ng = nogoods[n];
        int[] gs = SearchOrder.byDepth(ng.groups(), depthOf);
        int target = gs[gs.length - 1];
        trigMember[t] = ng.member();
        trigCheck[t] = Arrays.copyOf(gs, gs.length - 1);
        trigTarget[t] = target;
        trigFirst[t] = depthOf[gs[0]];
        int[] block = new int[space.choiceCount(target)];
        int nb = 0;
        for (int c = 0; c < block.length; c++) {
          if (ng.member()[offset[target] + c]) {
            block[nb++] = offset[target] + c;
          }
        }
        trigBlock[t] = Arrays.copyOf(block, nb);
        trailNeed += nb;
        t++;
      }
    }
    trigStart[groups] = t;
    firstAt = new int[groups][];
    int[] count = new int[groups];
    for (int x = 0; x < triggers; x++) {
      count[trigFirst[x]]++;
    }
    for (int d = 0; d < groups; d++) {
      firstAt[d] = new int[count[d]];
      count[d] = 0;
    }
    for (int x = 0; x < triggers; x++) {
      firstAt[trigFirst[x]][count[trigFirst[x]]++] = x;
    }
    blocked = new int[total];
    live = new int[groups];
    trail = new int[(int) Math.min(Integer.MAX_VALUE - 8, trailNeed)];
  }

  /** The groups by depth (a copy). */
  public int[] order() {
    return order.clone();
  }

  /**
   * Starts a search whose domains hold the choices marked in {@code usable} (read, not copied, until
   * the next start). Returns false when some group has no usable choice.
   */
  public boolean start(boolean[] usable) {
    this.usable = usable;
    trailTop = 0;
    Arrays.fill(blocked, 0);
    boolean any = true;
    for (int g = 0; g < groups; g++) {
      int n = 0;
      for (int f = offset[g]; f < offset[g + 1]; f++) {
        n += usable[f] ? 1 : 0;
      }
      live[g] = n;
      any &= n > 0;
    }
    return any;
  }

  /** Whether a fired trigger currently removes flat choice f. */
  public boolean blocked(int f) {
    return blocked[f] > 0;
  }

  /** Usable choices of group g still in its domain. */
  public int live(int g) {
    return live[g];
  }

  /** The trail position to {@link #undo} back to. */
  public int mark() {
    return trailTop;
  }

  /**
   * Fires the triggers of depth d given the choices {@code v} (by group) of the groups at depths
   * ≤ d, skipping those whose first group lies above depth {@code fromDepth} (a search of the tail
   * from that depth sees only the rules inside it). Returns -1 when a domain empties, else the number
   * of usable choices removed (0: the domains are unchanged).
   */
  public int propagate(int d, int[] v, int fromDepth) {
    int removed = 0;
    for (int t = trigStart[d]; t < trigStart[d + 1]; t++) {
      if (trigFirst[t] < fromDepth) {
        continue;
      }
      boolean[] member = trigMember[t];
      boolean match = true;
      for (int cg : trigCheck[t]) {
        if (!member[offset[cg] + v[cg]]) {
          match = false;
          break;
        }
      }
      if (!match) {
        continue;
      }
      int tg = trigTarget[t];
      for (int f : trigBlock[t]) {
        trail[trailTop++] = f;
        if (++blocked[f] == 1 && usable[f]) {
          removed++;
          live[tg]--;
          watch.removed(f, tg);
        }
      }
      if (live[tg] == 0) {
        return -1;
      }
    }
    return removed;
  }

  /** Takes back every removal made since {@code mark}. */
  public void undo(int mark) {
    while (trailTop > mark) {
      int f = trail[--trailTop];
      if (--blocked[f] == 0 && usable[f]) {
        int g = groupOf[f];
        live[g]++;
        watch.restored(f, g);
      }
    }
  }

  /**
   * Whether the choices {@code v} (by group) of the groups at depths ≥ d complete no nogood whose
   * first group is at depth d: the rules a tail from depth d adds to the tail below it.
   */
  public boolean fitsFrom(int d, int[] v) {
    for (int t : firstAt[d]) {
      boolean[] member = trigMember[t];
      boolean all = member[offset[trigTarget[t]] + v[trigTarget[t]]];
      for (int k = 0; all && k < trigCheck[t].length; k++) {
        int cg = trigCheck[t][k];
        all = member[offset[cg] + v[cg]];
      }
      if (all) {
        return false;
      }
    }
    return true;
  }
}
