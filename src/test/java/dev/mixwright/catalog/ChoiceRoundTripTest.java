package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.testing.RandomChoiceCatalogs;
import org.junit.jupiter.api.Test;

/** The canonical writer round-trips random catalogs with choosing segments and price points. */
class ChoiceRoundTripTest {
  @Test
  void jsonAndYamlReadBackEqual() throws Exception {
    for (long seed = 0; seed < 60; seed++) {
      Catalog c = RandomChoiceCatalogs.tiny(seed, true);
      long s = seed;
      assertEquals(c, CatalogLoader.parse(CatalogWriter.toJson(c), "x.json", null), () -> "seed " + s);
      assertEquals(c, CatalogLoader.parse(CatalogWriter.toYaml(c), "x.yaml", null), () -> "seed " + s);
    }
  }
}
