package dev.mixwright.space;

import static dev.mixwright.space.Fixtures.catalog;
import static dev.mixwright.space.Fixtures.forbid;
import static dev.mixwright.space.Fixtures.group;
import static dev.mixwright.space.Fixtures.m;
import static dev.mixwright.space.Fixtures.numbered;
import static dev.mixwright.space.Fixtures.segment;
import static dev.mixwright.space.Fixtures.when;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

class VariantSpaceTest {
  static final Catalog BIKE =
      catalog(
          List.of(
              group("motor", true, "hub250", "mid750"),
              group("battery", true, "b400", "b625", "b750"),
              group("rack", false, "front", "rear")),
          List.of(
              when(m("motor", "mid750"), m("battery", "b625,b750")),
              forbid(m("rack", "front", "battery", "b750")),
              forbid(m("rack", "none", "motor", "hub250")),
              forbid(m("battery", "b400", "motor", "hub250", "rack", "rear"))),
          List.of(segment("commuters", m("rack", "rear,none"))));

  @Test
  void buildableFollowsTheRules() {
    VariantSpace s = new VariantSpace(BIKE);
    assertTrue(s.isBuildable(new int[] {1, 1, 0})); // mid750, b625, front
    assertFalse(s.isBuildable(new int[] {1, 0, 0})); // mid750 needs b625 or b750
    assertFalse(s.isBuildable(new int[] {1, 2, 0})); // front rack with b750
    assertFalse(s.isBuildable(new int[] {0, 1, 2})); // hub250 without rack
    assertFalse(s.isBuildable(new int[] {0, 0, 1})); // three-group forbid
    assertTrue(s.isBuildable(new int[] {0, 0, 0}));
    assertFalse(s.isBuildable(new int[] {0, 3, 0})); // out of range
    assertFalse(s.isBuildable(new int[] {-1, 0, 0}));
    assertTrue(s.isColumn(new int[] {1, 2, 2}, 0));
    assertFalse(s.isColumn(new int[] {1, 1, 0}, 0)); // commuters take no front rack
    assertEquals(4, s.nogoodCount(), "one nogood per rule: each names two or three groups");
  }

  @Test
  void describeLabelAndParseRoundTrip() {
    VariantSpace s = new VariantSpace(BIKE);
    int[] v = {1, 2, 2};
    Map<String, String> d = s.describe(v);
    assertEquals(List.of("motor", "battery", "rack"), new ArrayList<>(d.keySet()));
    assertEquals("mid750", d.get("motor"));
    assertEquals("none", d.get("rack"));
    assertEquals("motor=mid750,battery=b750,rack=none", s.label(v));
    assertArrayEquals(v, s.parse(d));
    assertArrayEquals(v, s.parse(Map.of("motor", "mid750", "battery", "b750")), "an optional group left out is none");
  }

  @Test
  void parseNamesWhatIsWrong() {
    VariantSpace s = new VariantSpace(BIKE);
    IllegalArgumentException unknownGroup =
        assertThrows(IllegalArgumentException.class, () -> s.parse(Map.of("motor", "hub250", "battery", "b400", "saddle", "x")));
    assertTrue(unknownGroup.getMessage().contains("'saddle'"), unknownGroup.getMessage());
    IllegalArgumentException unknownOption =
        assertThrows(IllegalArgumentException.class, () -> s.parse(Map.of("motor", "hub900", "battery", "b400")));
    assertTrue(unknownOption.getMessage().contains("hub900") && unknownOption.getMessage().contains("hub250"),
        unknownOption.getMessage());
    IllegalArgumentException missing =
        assertThrows(IllegalArgumentException.class, () -> s.parse(Map.of("motor", "hub250")));
    assertTrue(missing.getMessage().contains("'battery' is required"), missing.getMessage());
    assertThrows(IllegalArgumentException.class, () -> s.parse(Map.of("motor", "none", "battery", "b400")),
        "none is not a choice of a required group");
  }

  /**
   * 25 groups of 6 choices (3 bits) and 10 of 10 (4 bits): 115 bits, two longs, with a group
   * straddling the word boundary. Keys must be equal exactly when the variants are.
   */
  @Test
  void keysAreEqualExactlyWhenVariantsAreAcrossWords() {
    List<Group> groups = new ArrayList<>();
    for (int g = 0; g < 35; g++) {
      groups.add(numbered(g, g < 25 ? 6 : 10));
    }
    VariantSpace s = new VariantSpace(catalog(groups, List.of(), List.of()));
    Random rnd = new Random(11);
    Set<List<Integer>> seen = new HashSet<>();
    Set<VariantKey> keys = new HashSet<>();
    for (int t = 0; t < 5000; t++) {
      int[] v = random(s, rnd);
      // Few values per group so that equal variants actually recur.
      for (int g = 0; g < v.length; g++) {
        v[g] = g % 5 == 0 ? v[g] : v[g] % 2;
      }
      boolean newVariant = seen.add(Arrays.stream(v).boxed().toList());
      assertEquals(newVariant, keys.add(s.key(v)), "variant " + Arrays.toString(v));
    }
    assertEquals(seen.size(), keys.size());
    for (int t = 0; t < 200; t++) {
      int[] v = random(s, rnd);
      VariantKey k = s.key(v);
      assertEquals(k, s.key(v.clone()));
      assertEquals(k.hashCode(), s.key(v.clone()).hashCode());
      for (int g = 0; g < v.length; g++) {
        for (int x = 0; x < s.choiceCount(g); x++) {
          if (x != v[g]) {
            int[] w = v.clone();
            w[g] = x;
            assertNotEquals(k, s.key(w), "group " + g + " changed to " + x);
          }
        }
      }
    }
  }

  @Test
  void keysOfTheWholeSmallSpaceAreDistinct() {
    VariantSpace s = new VariantSpace(BIKE);
    Set<VariantKey> keys = new HashSet<>();
    for (int a = 0; a < 2; a++) {
      for (int b = 0; b < 3; b++) {
        for (int c = 0; c < 3; c++) {
          assertTrue(keys.add(s.key(new int[] {a, b, c})));
        }
      }
    }
    assertEquals(18, keys.size());
  }

  private static int[] random(VariantSpace s, Random rnd) {
    int[] v = new int[s.groupCount()];
    for (int g = 0; g < v.length; g++) {
      v[g] = rnd.nextInt(s.choiceCount(g));
    }
    return v;
  }
}
