package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.CatalogGenerator;
import dev.mixwright.space.SpaceCounter;
import dev.mixwright.space.VariantSpace;
import org.junit.jupiter.api.Test;

/** The bench's section on the generator's families: its options and the "before" count it times. */
class BenchFamiliesTest {

  @Test
  void anUnknownFamilyIsRefusedInWordsBeforeAnythingRuns() {
    CliRun r = CliRun.of("bench", "--quick", "--only-families", "--families", "classic,sparse");
    assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
    assertTrue(r.err().contains("--families") && r.err().contains("sparse") && r.err().contains("multi"), r.err());
    assertFalse(r.err().contains("Exception"), r.err());
    assertEquals("", r.out());
  }

  @Test
  void onlyFamiliesWithNoFamilyIsRefused() {
    CliRun r = CliRun.of("bench", "--only-families", "--families", "none");
    assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
    assertTrue(r.err().contains("name a family"), r.err());
  }

  @Test
  void theCountBeforePricingIsTheExactCountOfTheCodeBeforeIssue11() {
    for (CatalogGenerator.Family f : CatalogGenerator.Family.values()) {
      VariantSpace space = new VariantSpace(CatalogGenerator.generate(FamilyBench.spec(f, 6, 20, 3)));
      FamilyBench.OldCount c = FamilyBench.oldCount(space, 60_000);
      assertTrue(c.done(), f.word());
      assertEquals(new SpaceCounter(space).count().text(), c.text(), f.word());
    }
  }

  @Test
  void aCountCutOffAtItsCapSaysSo() {
    VariantSpace space = new VariantSpace(CatalogGenerator.generate(
        FamilyBench.spec(CatalogGenerator.Family.DISTANT, 30, 100, 7)));
    // a cap of 0 ms fires at the first poll, whatever the machine's speed
    FamilyBench.OldCount c = FamilyBench.oldCount(space, 0);
    assertFalse(c.done());
    assertEquals("", c.text());
  }
}
