package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The catalog's {@code current} and {@code exclude} sections: read, defaults, and problems named by path. */
class CurrentRangeSchemaTest {
  private static String with(String tail) {
    return CatalogTesting.BASE + tail;
  }

  @Test
  void readWithDefaults() {
    Catalog c = CatalogTesting.load(with("""
        current:
          - variant: {frame: step, rack: front}
            discontinue: 4000
            keep: true
          - variant: {frame: low, rack: front, bell: ring}
        exclude:
          - {frame: low, bell: ring}
        """));
    assertEquals(2, c.current().size());
    assertEquals(new CurrentVariant(Map.of("frame", "step", "rack", "front"), 4000, true), c.current().get(0));
    assertEquals(0, c.current().get(1).discontinue());
    assertTrue(!c.current().get(1).keep());
    assertEquals(List.of(Map.of("frame", "low", "bell", "ring")), c.exclude());
    // canonical JSON (the run folder's copy) carries both sections and reads back to the same catalog
    assertEquals(c, assertDoesNotThrow(() -> CatalogLoader.parse(CatalogWriter.toJson(c), "x.json", null)));
  }

  @Test
  void unknownGroupAndOptionAreNamedByPath() {
    CatalogTesting.says(CatalogTesting.onlyProblem(with("current:\n  - variant: {frame: step, rack: front, horn: loud}\n"),
        "current[0].variant.horn"), "unknown group 'horn'");
    CatalogTesting.says(CatalogTesting.onlyProblem(with("current:\n  - variant: {frame: stepp, rack: front}\n"),
        "current[0].variant.frame"), "unknown option 'stepp'", "step");
    CatalogTesting.says(CatalogTesting.onlyProblem(with("exclude:\n  - {frame: low, bell: gong}\n"),
        "exclude[0].bell"), "unknown option 'gong'");
  }

  @Test
  void aRequiredGroupLeftOutIsNamed() {
    CatalogTesting.says(CatalogTesting.onlyProblem(with("current:\n  - variant: {rack: front}\n"),
        "current[0].variant.frame"), "required");
  }

  @Test
  void aVariantTheRulesForbidNamesTheRule() {
    // rules[1] forbids a step frame without a rack; rules[0] requires a rack with a low frame
    CatalogTesting.says(CatalogTesting.onlyProblem(with("current:\n  - variant: {frame: step}\n"),
        "current[0].variant"), "not buildable", "rules[1]");
    CatalogTesting.says(CatalogTesting.onlyProblem(with("current:\n  - variant: {frame: low, bell: ring}\n"),
        "current[0].variant"), "not buildable", "rules[0]", "requires");
  }

  @Test
  void pinnedButExcludedAndNegativeDiscontinueAreProblems() {
    CatalogTesting.says(CatalogTesting.onlyProblem(with("""
        current:
          - {variant: {frame: low, rack: front, bell: ring}, keep: true}
        exclude:
          - {frame: low, bell: ring}
        """), "current[0]"), "pinned", "exclude[0]");
    CatalogTesting.says(CatalogTesting.onlyProblem(with(
        "current:\n  - {variant: {frame: step, rack: front}, discontinue: -5}\n"), "current[0].discontinue"),
        "must be >= 0");
  }

  @Test
  void anExcludedVariantThatIsNotPinnedIsAllowed() {
    // it can be on sale today and still be barred from the new range: the portfolio drops it
    Catalog c = CatalogTesting.load(with("""
        current:
          - {variant: {frame: low, rack: front, bell: ring}, discontinue: 10}
        exclude:
          - {frame: low, bell: ring}
        """));
    assertEquals(1, c.current().size());
  }
}
