package dev.mixwright.space;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.testing.RandomCatalogs;
import java.util.Random;
import org.junit.jupiter.api.Test;

class ForwardCheckerTest {

  /**
   * Forward checking by its definition: choice f of a group at a depth below d is removed when some
   * nogood has f among its members, that group as its last in the order, and every other group set
   * (at depth ≤ d) to a member choice.
   */
  private static boolean removedByDefinition(VariantSpace space, int[] depthOf, int d, int[] v, int f, int g) {
    int[] off = space.offsets();
    for (Nogood n : space.nogoods()) {
      if (!n.member()[f]) {
        continue;
      }
      boolean last = true;
      boolean othersSet = true;
      for (int h : n.groups()) {
        if (h == g) {
          continue;
        }
        last &= depthOf[h] < depthOf[g];
        othersSet &= depthOf[h] <= d && n.member()[off[h] + v[h]];
      }
      boolean inNogood = false;
      for (int h : n.groups()) {
        inNogood |= h == g;
      }
      if (inNogood && last && othersSet) {
        return true;
      }
    }
    return false;
  }

  @Test
  void removesWhatTheRulesForbidAndUndoesIt() {
    int checked = 0;
    int removed = 0;
    for (long seed = 0; seed < 200; seed++) {
      Random rnd = new Random(seed);
      VariantSpace space = new VariantSpace(RandomCatalogs.random(rnd, 3 + rnd.nextInt(4), 4, 1, 1, 2 + rnd.nextInt(10), false));
      int groups = space.groupCount();
      int[] order = new int[groups];
      for (int i = 0; i < groups; i++) {
        order[i] = i;
      }
      for (int i = groups - 1; i > 0; i--) { // a random order: the checker must not assume one
        int j = rnd.nextInt(i + 1);
        int t = order[i];
        order[i] = order[j];
        order[j] = t;
      }
      int[] depthOf = new int[groups];
      for (int i = 0; i < groups; i++) {
        depthOf[order[i]] = i;
      }
      boolean[] usable = new boolean[space.totalChoices()];
      for (int f = 0; f < usable.length; f++) {
        usable[f] = space.allowed(f);
      }
      ForwardChecker fc = new ForwardChecker(space, order, ForwardChecker.NO_WATCH);
      if (!fc.start(usable)) {
        continue;
      }
      int[] live0 = new int[groups];
      for (int g = 0; g < groups; g++) {
        live0[g] = fc.live(g);
      }
      int[] v = new int[groups];
      int prefix = 1 + rnd.nextInt(groups - 1);
      int d = 0;
      boolean wiped = false;
      for (; d < prefix && !wiped; d++) {
        int g = order[d];
        int c;
        do {
          c = rnd.nextInt(space.choiceCount(g));
        } while (!usable[space.offset(g) + c]);
        v[g] = c;
        wiped = fc.propagate(d, v, 0) < 0;
      }
      if (wiped) {
        fc.undo(0);
        continue;
      }
      int setTo = d - 1;
      for (int e = setTo + 1; e < groups; e++) {
        int g = order[e];
        int live = 0;
        for (int f = space.offset(g); f < space.offset(g + 1); f++) {
          boolean want = removedByDefinition(space, depthOf, setTo, v, f, g);
          assertEquals(want, fc.blocked(f), "seed " + seed + ", choice " + f);
          live += usable[f] && !want ? 1 : 0;
          checked++;
          removed += want ? 1 : 0;
        }
        assertEquals(live, fc.live(g), "seed " + seed + ", group " + g);
      }
      fc.undo(0);
      for (int g = 0; g < groups; g++) {
        assertEquals(live0[g], fc.live(g), "undo restores the domains, seed " + seed);
        for (int f = space.offset(g); f < space.offset(g + 1); f++) {
          assertEquals(false, fc.blocked(f), "undo restores the domains, seed " + seed);
        }
      }
    }
    assertEquals(true, checked > 1000 && removed > 50, "too few choices checked: " + checked + ", removed " + removed);
  }
}
