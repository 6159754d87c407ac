package dev.mixwright.choice;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.space.SpaceCounter;
import dev.mixwright.space.VariantSpace;
import java.math.BigInteger;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The test catalog rowing-boats.yaml compiled: price points as choices, utilities per segment. */
class PricePointSpaceTest {
  static Catalog boats() throws Exception {
    return CatalogLoader.load(
        Path.of(PricePointSpaceTest.class.getResource("rowing-boats.yaml").toURI()));
  }

  @Test
  void eachPricePointIsAChoice() throws Exception {
    VariantSpace space = new VariantSpace(boats());
    assertEquals(4, space.choiceCount(0)); // skiff, shell@3900, shell@4300, shell@4700
    assertEquals(2, space.choiceCount(1));
    assertEquals(2, space.choiceCount(2)); // canvas, none
    assertEquals("skiff", space.choiceId(0, 0));
    assertEquals("shell@4300", space.choiceId(0, 2));
    assertEquals("shell", space.optionId(0, 2));
    assertEquals(1, space.optionOf(2));
    assertEquals(1, space.pricePointOf(2));
    assertEquals(4300, space.choicePrice(2));
    assertEquals(2600, space.choiceCost(2));
    assertEquals(4300 - 2600, space.choiceMargin(2));
    assertTrue(space.isNone(space.offset(2) + 1));
    assertEquals(2, space.groupOf(space.offset(2)));
    // 4 × 2 × 2 = 16 combinations, minus skiff with carbon oars (2): counted by hand
    assertEquals(BigInteger.valueOf(14), new SpaceCounter(space).count().value());
  }

  @Test
  void variantsAreWrittenAndReadWithTheirPricePoint() throws Exception {
    VariantSpace space = new VariantSpace(boats());
    int[] v = {3, 1, 1};
    assertEquals("hull=shell@4700,oars=carbon,cover=none", space.label(v));
    assertArrayEquals(v, space.parse(space.describe(v)));
    Map<String, String> m = new LinkedHashMap<>();
    m.put("hull", "shell@4700.0");
    m.put("oars", "carbon");
    assertArrayEquals(v, space.parse(m));
    m.put("hull", "shell");
    assertTrue(
        assertThrows(IllegalArgumentException.class, () -> space.parse(m))
            .getMessage()
            .contains("shell@3900, shell@4300, shell@4700"));
    m.put("hull", "shell@4500");
    assertThrows(IllegalArgumentException.class, () -> space.parse(m));
    // an option with one price may be written with it, as long as it is its price
    m.put("hull", "skiff@2400");
    assertEquals(0, space.parse(m)[0]);
    m.put("hull", "skiff@2500");
    assertTrue(
        assertThrows(IllegalArgumentException.class, () -> space.parse(m))
            .getMessage()
            .contains("write it as skiff"));
  }

  @Test
  void acceptsAndRulesApplyToEveryPricePoint() throws Exception {
    VariantSpace space = new VariantSpace(boats());
    int hire = 1;
    assertTrue(space.allowedIn(hire, 0));
    for (int f = 1; f <= 3; f++) {
      assertFalse(space.allowedIn(hire, f));
      assertTrue(space.allowedIn(0, f));
    }
    assertFalse(space.isBuildable(new int[] {0, 1, 0})); // skiff with carbon
    for (int k = 1; k <= 3; k++) {
      assertTrue(space.isBuildable(new int[] {k, 1, 0}));
    }
  }

  /**
   * u(v) by hand from the catalog: clubs has priceWeight -0.0009, part-worths hull.shell 2.6,
   * cover.none -0.2 inline and oars.carbon 0.9, cover.canvas 0.3 from its CSV table.
   */
  @Test
  void utilityIsPartWorthsPlusPriceWeightTimesPrice() throws Exception {
    VariantSpace space = new VariantSpace(boats());
    int clubs = 0;
    assertTrue(space.chooses(clubs));
    assertFalse(space.chooses(1));
    double u = 2.6 + 0.9 + 0.3 - 0.0009 * (4300 + 650 + 180);
    assertEquals(u, space.utility(new int[] {2, 1, 0}, clubs), 1e-12);
    double u2 = 0 + 0 - 0.2 - 0.0009 * (2400 + 300);
    assertEquals(u2, space.utility(new int[] {0, 0, 1}, clubs), 1e-12);
    assertEquals(2.6, space.partWorth(clubs, 3));
    assertEquals(4300 + 650 + 180, space.price(new int[] {2, 1, 0}, clubs));
    assertEquals(
        4300 + 650 + 180 - 2600 - 380 - 70, space.margin(new int[] {2, 1, 0}, clubs), 1e-9);
    assertThrows(IllegalStateException.class, () -> space.choiceUtilities(1));
  }
}
