package dev.mixwright.space;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class VariantEnumeratorTest {

  /** Brute force: every combination in odometer order, kept when the space says it is buildable. */
  private static List<int[]> bruteForce(VariantSpace space, int segment) {
    List<int[]> out = new ArrayList<>();
    BruteForce.count(space.catalog(), v -> {
      if (segment < 0 ? space.isBuildable(v) : space.isColumn(v, segment)) {
        out.add(v.clone());
      }
      return false;
    });
    return out;
  }

  @Test
  void listsExactlyTheBuildableVariantsInOdometerOrder() {
    for (long seed = 0; seed < 150; seed++) {
      Random rnd = new Random(seed);
      Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(5), 4, 2, 2, rnd.nextInt(10), false);
      VariantSpace space = new VariantSpace(c);
      VariantEnumerator e = new VariantEnumerator(space);
      for (int segment = -1; segment < space.segmentCount(); segment++) {
        List<int[]> got = new ArrayList<>();
        long n = e.forEach(segment, v -> got.add(v.clone()));
        List<int[]> want = bruteForce(space, segment);
        String where = "seed " + seed + ", segment " + segment;
        assertEquals(want.size(), n, where);
        assertEquals(want.size(), got.size(), where);
        for (int i = 0; i < want.size(); i++) {
          assertEquals(Arrays.toString(want.get(i)), Arrays.toString(got.get(i)), where + ", variant " + i);
        }
      }
    }
  }

  @Test
  void stopsWhenTheVisitorSaysSo() {
    for (long seed = 0; seed < 50; seed++) {
      Random rnd = new Random(seed);
      VariantSpace space = new VariantSpace(RandomCatalogs.random(rnd, 3 + rnd.nextInt(3), 4, 2, 1, rnd.nextInt(6), false));
      long all = bruteForce(space, -1).size();
      long[] seen = {0};
      long n = new VariantEnumerator(space).forEach(-1, v -> ++seen[0] < 2);
      assertEquals(Math.min(all, 2), n, "seed " + seed);
    }
  }
}
