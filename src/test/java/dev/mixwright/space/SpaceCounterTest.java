package dev.mixwright.space;

import static dev.mixwright.space.Fixtures.catalog;
import static dev.mixwright.space.Fixtures.forbid;
import static dev.mixwright.space.Fixtures.group;
import static dev.mixwright.space.Fixtures.m;
import static dev.mixwright.space.Fixtures.numbered;
import static dev.mixwright.space.Fixtures.segment;
import static dev.mixwright.space.Fixtures.when;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

class SpaceCounterTest {

  @Test
  void withoutRulesTheCountIsTheProductOfChoiceCounts() {
    List<Group> groups = new ArrayList<>();
    BigInteger product = BigInteger.ONE;
    for (int g = 0; g < 40; g++) {
      int options = 1 + g % 7;
      boolean required = g % 3 != 0;
      String[] ids = new String[options];
      for (int k = 0; k < options; k++) {
        ids[k] = "o" + k;
      }
      groups.add(group("g" + g, required, ids));
      product = product.multiply(BigInteger.valueOf(options + (required ? 0 : 1)));
    }
    Catalog c = catalog(groups, List.of(), List.of(segment("all", Map.of()), segment("g1", m("g1", "o0,o1"))));
    SpaceCounter counter = new SpaceCounter(new VariantSpace(c));
    assertEquals(SpaceCount.exact(product), counter.count());
    assertEquals(SpaceCount.exact(product), counter.count(0));
    // g1 has two options; the segment keeps both, so only a rule-free product again.
    assertEquals(SpaceCount.exact(product), counter.count(1));
    assertTrue(product.bitLength() > 63);
  }

  /**
   * 30 groups of 10 options, each group forbidden to repeat its neighbour's option index: the
   * proper colourings of a path of 30 vertices with 10 colours, 10 · 9^29 (hand-derived: 10 ways for
   * the first group, 9 for each next one).
   */
  @Test
  void chainOfPairwiseRulesCountsPathColourings() {
    List<Group> groups = new ArrayList<>();
    List<Rule> rules = new ArrayList<>();
    for (int g = 0; g < 30; g++) {
      groups.add(numbered(g, 10));
    }
    for (int g = 0; g + 1 < 30; g++) {
      for (int k = 0; k < 10; k++) {
        rules.add(forbid(m("g" + g, "o" + k, "g" + (g + 1), "o" + k)));
      }
    }
    Catalog c = catalog(groups, rules, List.of(segment("low", m("g0", "o0,o1"))));
    SpaceCounter counter = new SpaceCounter(new VariantSpace(c));
    BigInteger nine29 = BigInteger.valueOf(9).pow(29);
    SpaceCount all = counter.count();
    assertEquals(SpaceCount.exact(BigInteger.TEN.multiply(nine29)), all);
    assertTrue(all.value().compareTo(BigInteger.valueOf(Long.MAX_VALUE)) > 0);
    assertEquals(SpaceCount.exact(BigInteger.TWO.multiply(nine29)), counter.count(0));
  }

  /**
   * The same chain with random pairwise forbid and when/require rules between neighbours, and some
   * single-group rules, against a transfer-matrix count computed here from the rules as written:
   * N = 1ᵀ·D₀·A₁·D₁·…·A₂₉·D₂₉·1 with A_i the allowed pairs of groups i−1 and i, D_i the allowed
   * choices of group i (the standard transfer-matrix method for chains).
   */
  @Test
  void randomChainMatchesTransferMatrix() {
    Random rnd = new Random(20270417);
    int n = 30;
    int d = 10;
    List<Group> groups = new ArrayList<>();
    for (int g = 0; g < n; g++) {
      groups.add(numbered(g, d));
    }
    List<Rule> rules = new ArrayList<>();
    for (int g = 0; g + 1 < n; g++) {
      for (int r = 0; r < 6; r++) {
        String a = "o" + rnd.nextInt(d);
        if (rnd.nextBoolean()) {
          rules.add(forbid(m("g" + g, a, "g" + (g + 1), "o" + rnd.nextInt(d) + ",o" + rnd.nextInt(d))));
        } else {
          String req = "o" + rnd.nextInt(d) + ",o" + rnd.nextInt(d) + ",o" + rnd.nextInt(d);
          // Alternate direction so the chain is not only "left implies right".
          rules.add(
              rnd.nextBoolean()
                  ? when(m("g" + g, a), m("g" + (g + 1), req))
                  : when(m("g" + (g + 1), a), m("g" + g, req)));
        }
      }
      if (g % 7 == 3) {
        rules.add(forbid(m("g" + g, "o" + rnd.nextInt(d))));
      }
    }
    Segment seg = segment("mid", m("g15", "o2,o3,o4,o5"));
    Catalog c = catalog(groups, rules, List.of(seg));

    // Transfer matrix from the rule records; brute force inside each pair of neighbours.
    BigInteger[] vec = new BigInteger[d];
    BigInteger[] vecSeg = new BigInteger[d];
    for (int k = 0; k < d; k++) {
      boolean ok = singleOk(c, 0, k);
      vec[k] = ok ? BigInteger.ONE : BigInteger.ZERO;
      vecSeg[k] = vec[k];
    }
    for (int g = 1; g < n; g++) {
      BigInteger[] next = new BigInteger[d];
      BigInteger[] nextSeg = new BigInteger[d];
      for (int b = 0; b < d; b++) {
        next[b] = BigInteger.ZERO;
        nextSeg[b] = BigInteger.ZERO;
        boolean accepted = g != 15 || seg.accepts().get("g15").contains("o" + b);
        for (int a = 0; a < d; a++) {
          if (singleOk(c, g, b) && pairOk(c, g - 1, a, g, b)) {
            next[b] = next[b].add(vec[a]);
            if (accepted) {
              nextSeg[b] = nextSeg[b].add(vecSeg[a]);
            }
          }
        }
      }
      vec = next;
      vecSeg = nextSeg;
    }
    BigInteger total = BigInteger.ZERO;
    BigInteger totalSeg = BigInteger.ZERO;
    for (int k = 0; k < d; k++) {
      total = total.add(vec[k]);
      totalSeg = totalSeg.add(vecSeg[k]);
    }
    assertTrue(total.compareTo(BigInteger.valueOf(Long.MAX_VALUE)) > 0, "test should need > 63 bits: " + total);
    SpaceCounter counter = new SpaceCounter(new VariantSpace(c));
    assertEquals(SpaceCount.exact(total), counter.count());
    assertEquals(SpaceCount.exact(totalSeg), counter.count(0));
  }

  /** Group g alone at choice k breaks no rule that names only g. */
  private static boolean singleOk(Catalog c, int g, int k) {
    for (Rule r : c.rules()) {
      Map<String, List<String>> scope = r.isForbid() ? r.forbid() : r.when();
      if (r.isForbid() && scope.size() == 1 && scope.containsKey("g" + g)
          && scope.get("g" + g).contains("o" + k)) {
        return false;
      }
    }
    return true;
  }

  /** Choices a of group g and b of group h break no rule that names exactly these two groups. */
  private static boolean pairOk(Catalog c, int g, int a, int h, int b) {
    for (Rule r : c.rules()) {
      if (r.isForbid()) {
        Map<String, List<String>> f = r.forbid();
        if (f.size() == 2 && f.containsKey("g" + g) && f.containsKey("g" + h)
            && f.get("g" + g).contains("o" + a) && f.get("g" + h).contains("o" + b)) {
          return false;
        }
        continue;
      }
      Map.Entry<String, List<String>> w = r.when().entrySet().iterator().next();
      Map.Entry<String, List<String>> q = r.require().entrySet().iterator().next();
      int wg = Integer.parseInt(w.getKey().substring(1));
      int qg = Integer.parseInt(q.getKey().substring(1));
      int wk = wg == g ? a : b;
      int qk = qg == g ? a : b;
      boolean mine = (wg == g && qg == h) || (wg == h && qg == g);
      if (mine && w.getValue().contains("o" + wk) && !q.getValue().contains("o" + qk)) {
        return false;
      }
    }
    return true;
  }

  /**
   * Ten groups of four options with a rule between every pair: induced width 9, a 4^9-entry table.
   * Under a 16-entry limit the count must drop rules and say so; the default limit counts exactly.
   */
  @Test
  void tooWideFallsBackToABoundAboveTheTruth() {
    Random rnd = new Random(7);
    List<Group> groups = new ArrayList<>();
    for (int g = 0; g < 10; g++) {
      groups.add(numbered(g, 4));
    }
    List<Rule> rules = new ArrayList<>();
    for (int g = 0; g < 10; g++) {
      for (int h = g + 1; h < 10; h++) {
        rules.add(forbid(m("g" + g, "o" + rnd.nextInt(4), "g" + h, "o" + rnd.nextInt(4) + ",o" + rnd.nextInt(4))));
      }
    }
    VariantSpace space = new VariantSpace(catalog(groups, rules, List.of()));
    BigInteger truth = BigInteger.valueOf(BruteForce.buildable(space)); // brute force
    assertTrue(truth.signum() > 0);

    SpaceCount bound = new SpaceCounter(space, 16).count();
    assertFalse(bound.exact());
    assertTrue(bound.value().compareTo(truth) >= 0, bound + " below " + truth);
    assertTrue(bound.text().startsWith("at most "));

    assertEquals(SpaceCount.exact(truth), new SpaceCounter(space).count());
  }

  @Test
  void emptyDomainsAndContradictionsCountZero() {
    Catalog c =
        catalog(
            List.of(group("a", true, "x", "y"), group("b", false, "p")),
            List.of(forbid(m("a", "x")), when(m("a", "y"), m("b", "p")), forbid(m("a", "y", "b", "p"))),
            List.of(segment("s", m("b", "none"))));
    SpaceCounter counter = new SpaceCounter(new VariantSpace(c));
    assertEquals(SpaceCount.exact(BigInteger.ZERO), counter.count());
    assertTrue(counter.count().isEmpty());
    assertEquals(List.of(SpaceCount.exact(BigInteger.ZERO)), counter.perSegment());
  }

  @Test
  void rejectsBadArguments() {
    VariantSpace space = new VariantSpace(catalog(List.of(numbered(0, 3)), List.of(), List.of()));
    assertThrows(IllegalArgumentException.class, () -> new SpaceCounter(space, 0));
    assertThrows(IllegalArgumentException.class, () -> new SpaceCounter(space).count(0));
    assertThrows(IllegalArgumentException.class, () -> new SpaceCounter(space).count(new boolean[2]));
    assertEquals(SpaceCount.exact(BigInteger.valueOf(3)), new SpaceCounter(space).count());
  }

  @Test
  void primesAreDistinctAndPrime() {
    long prev = Long.MAX_VALUE;
    for (int i = 0; i < 40; i++) {
      long p = SpaceCounter.Primes.below31(i);
      assertTrue(p < prev && p > (1L << 30));
      assertTrue(BigInteger.valueOf(p).isProbablePrime(60));
      prev = p;
    }
  }
}
