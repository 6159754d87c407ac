package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** The indexed nearest coded variant is the one the plain scan over every code finds. */
class NearestVariantTest {

  /**
   * Brute force: every listed variant's count of differing groups (a group not named is none), the
   * first of the fewest; what {@code VariantNames.shortName} computed before the index.
   */
  private static int scan(List<Map<String, String>> coded, Map<String, String> q) {
    int best = -1;
    int bestApart = Integer.MAX_VALUE;
    for (int i = 0; i < coded.size(); i++) {
      int apart = apart(coded.get(i), q);
      if (apart < bestApart) {
        best = i;
        bestApart = apart;
      }
    }
    return best;
  }

  private static int apart(Map<String, String> a, Map<String, String> b) {
    Set<String> groups = new LinkedHashSet<>(a.keySet());
    groups.addAll(b.keySet());
    int apart = 0;
    for (String g : groups) {
      if (!a.getOrDefault(g, Group.NONE).equals(b.getOrDefault(g, Group.NONE))) {
        apart++;
      }
    }
    return apart;
  }

  /** A variant of random choices (rules ignored: names do not care), sometimes without its groups at none. */
  private static Map<String, String> draw(Random rnd, VariantSpace space) {
    int[] v = new int[space.groupCount()];
    for (int g = 0; g < v.length; g++) {
      v[g] = rnd.nextInt(space.choiceCount(g));
    }
    return dropNones(rnd, space.describe(v));
  }

  private static Map<String, String> dropNones(Random rnd, Map<String, String> v) {
    Map<String, String> out = new LinkedHashMap<>(v);
    if (rnd.nextBoolean()) {
      out.values().removeIf(Group.NONE::equals);
    }
    return out;
  }

  /** A coded variant with one to three groups changed: near, so that ties between codes are common. */
  private static Map<String, String> near(Random rnd, VariantSpace space, Map<String, String> of) {
    Map<String, String> out = new LinkedHashMap<>(of);
    Catalog c = space.catalog();
    for (int k = 1 + rnd.nextInt(3); k > 0; k--) {
      int g = rnd.nextInt(space.groupCount());
      out.put(c.groups().get(g).id(), space.choiceId(g, rnd.nextInt(space.choiceCount(g))));
    }
    return dropNones(rnd, out);
  }

  @Test
  void theIndexFindsWhatThePlainScanFinds() {
    int[] ties = {0};
    Cases.each(200, (seed, rnd) -> {
      Catalog c = RandomCatalogs.random(rnd, 1 + rnd.nextInt(12), 1 + rnd.nextInt(5), 1, 1, 0, false);
      VariantSpace space = new VariantSpace(c);
      List<Map<String, String>> coded = new ArrayList<>();
      for (int n = Cases.between(rnd, 0, rnd.nextBoolean() ? 60 : 250); n > 0; n--) {
        coded.add(draw(rnd, space));
      }
      NearestVariant index = new NearestVariant(coded);
      for (int q = 0; q < 40; q++) {
        Map<String, String> question = coded.isEmpty() || rnd.nextBoolean() ? draw(rnd, space)
            : near(rnd, space, coded.get(rnd.nextInt(coded.size())));
        if (rnd.nextInt(10) == 0) {
          // a choice no code holds and a group no code names: each differs from every code
          question.put(c.groups().get(0).id(), "unheard");
          question.put("extra", "o1");
        }
        int expected = scan(coded, question);
        assertEquals(expected, index.nearest(question), question + " among " + coded.size() + " codes");
        if (expected >= 0) {
          int fewest = apart(coded.get(expected), question);
          ties[0] += coded.stream().filter(v -> apart(v, question) == fewest).count() > 1 ? 1 : 0;
        }
      }
    });
    // the tie rule (the first code of the fewest) is exercised, not only the distance
    assertTrue(ties[0] >= 1000, ties[0] + " questions with a tie");
  }
}
