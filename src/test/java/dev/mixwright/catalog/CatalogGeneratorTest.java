package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.SpaceCount;
import dev.mixwright.space.SpaceCounter;
import dev.mixwright.space.VariantSpace;
import java.util.Random;
import org.junit.jupiter.api.Test;

class CatalogGeneratorTest {

  private static CatalogGenerator.Spec spec(Random rnd, long seed) {
    return new CatalogGenerator.Spec(2 + rnd.nextInt(14), 2 + rnd.nextInt(7), 1 + rnd.nextInt(8),
        1 + rnd.nextInt(6), rnd.nextInt(45), rnd.nextDouble() * 0.6, seed);
  }

  @Test
  void sameSeedSameBytes() {
    Random rnd = new Random(5);
    for (int i = 0; i < 20; i++) {
      CatalogGenerator.Spec s = spec(rnd, i);
      String a = CatalogWriter.toYaml(CatalogGenerator.generate(s));
      String b = CatalogWriter.toYaml(CatalogGenerator.generate(s));
      assertEquals(a, b, "spec " + s);
    }
    CatalogGenerator.Spec s = CatalogGenerator.Spec.of(10, 5, 4, 3, 20, 1);
    CatalogGenerator.Spec t = CatalogGenerator.Spec.of(10, 5, 4, 3, 20, 2);
    assertNotEquals(CatalogWriter.toYaml(CatalogGenerator.generate(s)), CatalogWriter.toYaml(CatalogGenerator.generate(t)));
  }

  @Test
  void everyGeneratedCatalogLoadsAndEverySegmentHasVariants() throws CatalogException {
    Random rnd = new Random(11);
    for (int i = 0; i < 60; i++) {
      CatalogGenerator.Spec s = spec(rnd, 100 + i);
      Catalog c = CatalogGenerator.generate(s);
      // the loader validates everything a user's file must satisfy; the writer's output must pass it
      Catalog back = CatalogLoader.parse(CatalogWriter.toYaml(c), "x.yaml", null);
      assertEquals(c, back, "round trip of " + s);
      assertEquals(s.groups(), c.groups().size());
      assertEquals(s.rules(), c.rules().size(), "every requested rule was placed: " + s);
      VariantSpace space = new VariantSpace(back);
      SpaceCounter counter = new SpaceCounter(space);
      assertTrue(!counter.count().isEmpty(), "buildable variants for " + s);
      for (SpaceCount sc : counter.perSegment()) {
        assertTrue(!sc.isEmpty(), "every segment accepts a buildable variant: " + s);
      }
    }
  }

  @Test
  void capacitiesAreBelowWhatTheBestVariantsWouldNeed() {
    Catalog c = CatalogGenerator.generate(CatalogGenerator.Spec.of(12, 6, 5, 4, 30, 3));
    VariantSpace space = new VariantSpace(c);
    double demand = c.segments().stream().mapToDouble(Segment::demand).sum();
    // Per resource, the use if every unit sold took each group's highest-use choice: capacity must
    // be well below it, or the resource can never bind.
    for (int r = 0; r < space.resourceCount(); r++) {
      double most = 0;
      for (int g = 0; g < space.groupCount(); g++) {
        double m = 0;
        for (int k = 0; k < space.choiceCount(g); k++) {
          m = Math.max(m, space.choiceUse(space.offset(g) + k, r));
        }
        most += m;
      }
      assertTrue(most > 0, "every resource is used by some option");
      assertTrue(c.resources().get(r).capacity() < 0.75 * most * demand, "resource " + r + " can bind");
    }
  }

  @Test
  void badSpecsAreRefusedInWords() {
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> CatalogGenerator.Spec.of(1, 5, 4, 3, 20, 1));
    assertTrue(e.getMessage().contains("groups"), e.getMessage());
    e = assertThrows(IllegalArgumentException.class, () -> new CatalogGenerator.Spec(5, 5, 4, 3, 20, 1.5, 1));
    assertTrue(e.getMessage().contains("optional share"), e.getMessage());
  }
}
