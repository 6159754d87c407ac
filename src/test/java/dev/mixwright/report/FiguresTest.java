package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.util.Map;
import org.junit.jupiter.api.Test;

class FiguresTest {
  @Test
  void aSumOfCatalogFiguresIsWrittenAsTheFigure() {
    double m = 1303.2 + 78.9 + 157.9; // three catalog figures; 1540.0000000000002 in doubles
    assertEquals(1540.0000000000002, m, 0.0);
    assertEquals(1540.0, Figures.catalogSum(m), 0.0);
    assertEquals(2830.55, Figures.catalogSum(2830.55), 0.0);
    assertEquals(-12.25, Figures.catalogSum(-12.25), 0.0);
    assertEquals(0.0, Figures.catalogSum(-0.0), 0.0);
    RunResult.Offer o = new RunResult.Offer("s", Map.of("g", "o"), 10, m, 0, false, 10 * m);
    assertFalse(new RunResult(null, "", 0, null, null, 0, 0, 0, "1", null, null, null, 0, null, null, java.util.List.of(o),
        null, null, null, null, null, null).toJson().contains("1540.0000000000002"));
  }

  /** One format per kind of figure, each checked by hand against the format's rule. */
  @Test
  void eachKindHasItsFormat() {
    assertEquals("1,540.00", Figures.money(1540.0000000000002));
    assertEquals("0.00", Figures.money(-0.0001));
    assertEquals("12,346", Figures.units(12345.6));
    assertEquals("210.0000", Figures.price(210));
    assertEquals("0.012%", Figures.percent(0.00012));
    assertEquals("27.3%", Figures.share(0.2734));
    assertEquals("0.250", Figures.weight(0.25));
    assertEquals("14.30", Figures.attraction(14.2981));
    assertEquals("0.0001235", Figures.attraction(0.00012345));
    assertEquals("+1.250%", Figures.signedPercent(0.0125));
    assertEquals("-0.400%", Figures.signedPercent(-0.004));
    assertEquals("1,234,568", Figures.wholeMoney(1234567.5));
    assertEquals("—", Figures.share(Double.NaN));
  }
}
