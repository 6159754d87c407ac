package dev.mixwright.choice;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogProblem;
import dev.mixwright.testing.RandomCatalogs;
import java.util.List;
import org.junit.jupiter.api.Test;

class NotSolvedYetTest {
  @Test
  void choosingSegmentsAndPricePointsAreRefusedByPath() throws Exception {
    CatalogException e =
        assertThrows(
            CatalogException.class,
            () -> NotSolvedYet.refuseInSweep(PricePointSpaceTest.boats()));
    assertEquals(
        List.of("segments[0].choice", "groups[0].options[1].prices"),
        e.problems().stream().map(CatalogProblem::path).toList());
  }

  @Test
  void todaysCatalogsPass() {
    for (long seed = 0; seed < 10; seed++) {
      long s = seed;
      assertDoesNotThrow(() -> NotSolvedYet.refuseInSweep(RandomCatalogs.small(s)));
    }
  }
}
