package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The optional {@code wholeUnits} field of the portfolio section (integer sales in the integer stage). */
class WholeUnitsFieldTest {
  private static final String WITH_PORTFOLIO = CatalogTesting.BASE + "portfolio: {introductionCost: 100, minLot: 5}\n";

  @Test
  void readDefaultAndWrittenBack() throws Exception {
    Catalog plain = CatalogTesting.load(WITH_PORTFOLIO);
    assertFalse(plain.portfolio().orElseThrow().wholeUnits());
    Catalog c = CatalogTesting.load(CatalogTesting.edit(WITH_PORTFOLIO, "minLot: 5}", "minLot: 5, wholeUnits: true}"));
    assertTrue(c.portfolio().orElseThrow().wholeUnits());
    // canonical JSON carries it and loads back to the same catalog
    assertEquals(c, CatalogLoader.parse(CatalogWriter.toJson(c), "x.json", null));
    assertEquals(plain, CatalogLoader.parse(CatalogWriter.toJson(plain), "x.json", null));
  }

  @Test
  void anythingButABooleanIsNamedByPath() {
    CatalogProblem p = CatalogTesting.onlyProblem(
        CatalogTesting.edit(WITH_PORTFOLIO, "minLot: 5}", "minLot: 5, wholeUnits: yes please}"), "portfolio.wholeUnits");
    CatalogTesting.says(p, "must be true or false");
  }
}
