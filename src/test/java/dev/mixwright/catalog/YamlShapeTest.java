package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * Tags, anchors and aliases are refused during the tree reader's own parse ({@link YamlShape.Factory}),
 * each at the line and column where it stands, and a syntax error met first is still a syntax error.
 */
class YamlShapeTest {
  private static CatalogProblem refusal(String yaml) {
    CatalogException e = assertThrows(CatalogException.class, () -> CatalogLoader.parseTree(yaml, "c.yaml"));
    assertEquals(1, e.problems().size(), e.problems().toString());
    return e.problems().get(0);
  }

  @Test
  void anAnchorIsRefusedWhereItStands() {
    CatalogProblem p = refusal("format: 1\nname: &n \"x\"\n");
    assertEquals("c.yaml line 2 column 7", p.path());
    assertTrue(p.message().startsWith("sets the anchor &n"), p.message());
  }

  @Test
  void anAliasAndAMergeKeyAreRefused() {
    CatalogProblem p = refusal("format: 1\n<<: *base\n");
    assertEquals("c.yaml line 2 column 5", p.path());
    assertTrue(p.message().startsWith("uses the alias *base"), p.message());
  }

  @Test
  void standardAndCustomTagsAreRefusedInTheirShortForm() {
    assertTrue(refusal("format: 1\nname: !!str 5\n").message().startsWith("has the YAML tag !!str"));
    assertTrue(refusal("format: 1\nname: !custom 5\n").message().startsWith("has the YAML tag !custom"));
    CatalogProblem map = refusal("format: 1\nresources:\n  - !!map\n    id: r\n");
    assertEquals("c.yaml line 3 column 5", map.path());
    assertTrue(map.message().startsWith("has the YAML tag !!map"), map.message());
  }

  @Test
  void aSyntaxErrorBeforeAnyTagIsReportedAsSuch() {
    CatalogProblem p = refusal("format: 1\nname: \"x\n  bad: [\nother: !!str 1\n");
    assertTrue(p.message().startsWith("not valid YAML"), p.message());
  }

  @Test
  void plainYamlReadsAsBefore() throws CatalogException {
    assertEquals(5, CatalogLoader.parseTree("format: 1\nname: \"x\"\ncount: 5\n", "c.yaml").path("count").asInt());
  }
}
