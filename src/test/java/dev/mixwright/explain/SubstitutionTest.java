package dev.mixwright.explain;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.space.VariantSpace;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Explain in a segment that chooses, on the test catalog rowing-boats.yaml (segment clubs: buyers 900,
 * stayOut 0.4, priceWeight −0.0009, part-worths hull.shell 2.6, oars.carbon 0.9, cover.canvas 0.3,
 * cover.none −0.2). Utilities are written out by hand from those figures; the shares and the buyers
 * taken follow the multinomial logit's formulas (Train, <i>Discrete Choice Methods with
 * Simulation</i>, 2nd ed. 2009, ch. 3: share w/(1 + Σw); adding an alternative takes from each other
 * one in proportion to its share).
 */
class SubstitutionTest {
  private static final double BUYERS = 900;

  private static VariantSpace boats() throws Exception {
    return new VariantSpace(CatalogLoader.load(
        Path.of(SubstitutionTest.class.getResource("/dev/mixwright/choice/rowing-boats.yaml").toURI())));
  }

  // u = part-worths − 0.0009 · price; w = exp(u − 0.4)
  private static final double W1 = Math.exp(2.6 + 0.9 + 0.3 - 0.0009 * (4300 + 650 + 180) - 0.4); // shell@4300,carbon,canvas
  private static final double W2 = Math.exp(-0.2 - 0.0009 * (2400 + 300) - 0.4); // skiff,wood,none
  private static final double W3 = Math.exp(2.6 + 0.3 - 0.0009 * (3900 + 300 + 180) - 0.4); // shell@3900,wood,canvas

  private static int[] v(VariantSpace space, String hull, String oars, String cover) {
    return space.parse(Map.of("hull", hull, "oars", oars, "cover", cover));
  }

  /** The three variants whose attractions are W1, W2 and W3. */
  private static int[][] three(VariantSpace space) {
    return new int[][] {v(space, "shell@4300", "carbon", "canvas"), v(space, "skiff", "wood", "none"),
        v(space, "shell@3900", "wood", "canvas")};
  }

  @Test
  void aVariantAddedTakesFromEachOfferInProportionToItsShare() throws Exception {
    VariantSpace space = boats();
    int[][] three = three(space);
    int[] v1 = three[0];
    int[] v2 = three[1];
    int[] v3 = three[2];
    Substitution sub = new Explainer(space).substitution(v1, 0, List.of(v2, v3));
    double w = W2 + W3;
    assertFalse(sub.offered());
    assertEquals(W1, sub.attraction(), 1e-12);
    assertEquals(w, sub.othersAttraction(), 1e-12);
    assertEquals(BUYERS * W1 / (1 + w + W1), sub.sales(), 1e-9);
    assertEquals(W1 / (1 + w + W1), sub.share(), 1e-12);
    double lost = 1 / (1 + w) - 1 / (1 + w + W1); // the fraction of its buyers every alternative loses
    assertEquals(2, sub.others().size());
    assertArrayEquals(v2, sub.others().get(0).choices());
    assertEquals(BUYERS * W2 / (1 + w), sub.others().get(0).salesWithout(), 1e-9);
    assertEquals(BUYERS * W2 * lost, sub.others().get(0).taken(), 1e-9);
    assertEquals(BUYERS * W3 * lost, sub.others().get(1).taken(), 1e-9);
    assertEquals(BUYERS * lost, sub.fromStayingOut(), 1e-9);
    assertEquals(BUYERS / (1 + w), sub.stayingOutWithout(), 1e-9);
    // nobody comes from nowhere: what it sells is what the others and staying out lose
    assertEquals(sub.sales(), sub.others().get(0).taken() + sub.others().get(1).taken() + sub.fromStayingOut(), 1e-9);
  }

  @Test
  void anOfferedVariantIsMeasuredAgainstThePlanWithoutIt() throws Exception {
    VariantSpace space = boats();
    int[][] three = three(space);
    int[] v1 = three[0];
    int[] v2 = three[1];
    int[] v3 = three[2];
    Substitution sub = new Explainer(space).substitution(v1, 0, List.of(v3, v1, v2));
    assertTrue(sub.offered());
    assertEquals(2, sub.others().size());
    assertEquals(W1 / (1 + W1 + W2 + W3), sub.share(), 1e-12);
    double lost = 1 / (1 + W2 + W3) - 1 / (1 + W1 + W2 + W3);
    assertEquals(BUYERS * W3 * lost, sub.others().get(0).taken(), 1e-9);
    assertEquals(BUYERS * W2 * lost, sub.others().get(1).taken(), 1e-9);
  }

  @Test
  void theMarginUsesTheChosenPricePoint() throws Exception {
    VariantSpace space = boats();
    int[] v1 = v(space, "shell@4300", "carbon", "canvas");
    Explanation e = new Explainer(space).explain(v1, 0, new double[] {10}, new double[] {100, 0});
    Explanation.MarginPart hull = e.marginParts().get(0);
    assertEquals("shell@4300", hull.option());
    assertEquals(4300, hull.price());
    assertEquals(2600, hull.cost());
    // (4300 − 2600) + (650 − 380) + (180 − 70) = 2080; layup 14 h at 10; buyers row 100
    assertEquals(2080, e.margin(), 1e-9);
    assertEquals(2080 - 140 - 100, e.reducedCost(), 1e-9);
    int[] forbidden = v(space, "skiff", "carbon", "none");
    assertFalse(new Explainer(space).explain(forbidden, 0, new double[] {10}, new double[] {100, 0}).sellable());
  }
}
