package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The optional {@code tooling} field of an option (a one-off cost of the integer stage). */
class ToolingFieldTest {

  @Test
  void readDefaultAndWrittenBack() throws Exception {
    Catalog c = CatalogTesting.load(CatalogTesting.base(
        "{id: front, price: 60, cost: 25}", "{id: front, price: 60, cost: 25, tooling: 40000}"));
    assertEquals(40000, c.groups().get(1).options().get(0).tooling());
    assertEquals(0, c.groups().get(0).options().get(0).tooling());
    // canonical JSON carries it and loads back to the same catalog
    assertEquals(c, CatalogLoader.parse(CatalogWriter.toJson(c), "x.json", null));
  }

  @Test
  void negativeOrTextIsNamedByPath() {
    CatalogProblem p = CatalogTesting.onlyProblem(CatalogTesting.base(
        "{id: front, price: 60, cost: 25}", "{id: front, price: 60, cost: 25, tooling: -5}"),
        "groups[1].options[0].tooling");
    CatalogTesting.says(p, ">= 0", "tooling: 40000");
    CatalogProblem q = CatalogTesting.onlyProblem(CatalogTesting.base(
        "{id: front, price: 60, cost: 25}", "{id: front, price: 60, cost: 25, tooling: lots}"),
        "groups[1].options[0].tooling");
    CatalogTesting.says(q, "must be a number");
  }
}
