package dev.mixwright.choice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.Choice;
import dev.mixwright.catalog.Segment;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class ChoiceDescriptionTest {
  /** Without rules across groups the range is exact: checked against every accepted variant. */
  @Test
  void rangeIsExactWithoutRulesAcrossGroupsAndABoundWithThem() {
    for (long seed = 0; seed < 30; seed++) {
      long s0 = seed;
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, true));
      ChoiceDescription d = ChoiceDescription.of(space);
      int k = 0;
      for (int s = 0; s < space.segmentCount(); s++) {
        if (!space.chooses(s)) {
          continue;
        }
        ChoiceDescription.SegmentChoice sc = d.segments().get(k++);
        double best = Double.NEGATIVE_INFINITY;
        double worst = Double.POSITIVE_INFINITY;
        for (EnumeratedLp.Column c : EnumeratedLp.columns(space)) {
          if (c.segment() == s) {
            best = Math.max(best, space.utility(c.choices(), s));
            worst = Math.min(worst, space.utility(c.choices(), s));
          }
        }
        assertEquals(space.nogoodCount() == 0, sc.exact());
        if (sc.exact()) {
          assertEquals(best, sc.bestUtility(), 1e-9, () -> "seed " + s0);
          assertEquals(worst, sc.worstUtility(), 1e-9, () -> "seed " + s0);
        } else {
          assertTrue(sc.bestUtility() >= best - 1e-9, () -> "seed " + s0);
          assertTrue(sc.worstUtility() <= worst + 1e-9, () -> "seed " + s0);
        }
      }
    }
  }

  @Test
  void describesTheTestCatalogWithoutWarnings() throws Exception {
    ChoiceDescription d = ChoiceDescription.of(new VariantSpace(PricePointSpaceTest.boats()));
    assertEquals(1, d.segments().size());
    assertEquals(1, d.optionsWithPricePoints());
    assertEquals(List.of(), d.warnings());
    String text = String.join("\n", d.lines());
    assertTrue(text.contains("clubs"), text);
    assertTrue(text.contains("buyers 900, stayOut 0.4, priceWeight -0.0009"), text);
    assertTrue(text.contains("distinct variant"), text);
    assertEquals(900, d.json().get("segments").get(0).get("buyers").asDouble());
  }

  /** A part-worth of -30 (a scale error) makes every variant with that option vanish. */
  @Test
  void warnsWhereAUtilityMakesSharesVanish() throws Exception {
    Catalog base = PricePointSpaceTest.boats();
    Choice ch = base.segments().get(0).choice().orElseThrow();
    Map<String, Double> utility = new java.util.LinkedHashMap<>(ch.utility());
    utility.put("oars.carbon", -30.0);
    List<String> w = warnings(base, new Choice(ch.buyers(), ch.stayOut(), ch.priceWeight(), utility));
    assertEquals(1, w.size(), w::toString);
    assertTrue(w.get(0).contains("oars=carbon"), w.get(0));
    // a price weight a thousand times too large: nothing sells at all
    List<String> all = warnings(base, new Choice(ch.buyers(), ch.stayOut(), -0.9, ch.utility()));
    assertEquals(1, all.size(), all::toString);
    assertTrue(all.get(0).contains("with any variant"), all.get(0));
    assertFalse(all.get(0).contains("oars=carbon"));
  }

  private static List<String> warnings(Catalog base, Choice choice) throws CatalogException {
    List<Segment> segs = new ArrayList<>(base.segments());
    Segment old = segs.get(0);
    segs.set(0, Segment.choosing(old.id(), old.label(), old.accepts(), old.value(), choice));
    Catalog c =
        new Catalog(
            base.format(), base.name(), base.currency(), base.period(), base.resources(),
            base.groups(), base.rules(), segs, base.portfolio());
    return ChoiceDescription.of(new VariantSpace(c)).warnings();
  }
}
