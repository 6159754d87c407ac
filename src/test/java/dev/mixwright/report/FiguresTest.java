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
}
