package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.nio.file.Path;
import java.util.List;
import java.util.stream.Collectors;

/** Shared fixtures for the catalog tests: a valid base catalog and problem lookups. */
final class CatalogTesting {
  private CatalogTesting() {}

  /** A valid catalog (invented data) that tests break one line at a time. */
  static final String BASE =
      """
      format: 1
      resources:
        - {id: weld, capacity: 14000}
        - {id: paint, capacity: 9000}
        - {id: press, capacity: 500}
      groups:
        - id: frame
          options:
            - {id: step, price: 520, cost: 210, uses: {weld: 1.6}}
            - {id: low, price: 480, cost: 190, uses: {weld: 1.4, paint: 0.5}}
        - id: rack
          required: false
          options:
            - {id: front, price: 60, cost: 25}
        - id: bell
          required: false
          options:
            - {id: ring, price: 15, cost: 4}
      rules:
        - when: {frame: [low]}
          require: {rack: [front]}
        - forbid: {frame: [step], rack: [none]}
      segments:
        - id: commuters
          demand: 9000
          maxShare: 0.35
          accepts: {frame: [step, low]}
          value: {"rack.front": 20}
        - id: families
          demand: 2500
      """;

  /** BASE with one exact piece of text replaced; fails when the piece is not there. */
  static String base(String find, String replacement) {
    return edit(BASE, find, replacement);
  }

  static String edit(String text, String find, String replacement) {
    if (!text.contains(find)) {
      fail("fixture does not contain: " + find);
    }
    return text.replace(find, replacement);
  }

  static Catalog load(String yaml) {
    try {
      return CatalogLoader.parse(yaml, "range.yaml", null);
    } catch (CatalogException e) {
      return fail("expected a valid catalog, got:\n" + e.getMessage());
    }
  }

  static List<CatalogProblem> problems(String text, String fileName, Path dir) {
    CatalogException e =
        assertThrows(CatalogException.class, () -> CatalogLoader.parse(text, fileName, dir));
    return e.problems();
  }

  static List<CatalogProblem> problems(String yaml) {
    return problems(yaml, "range.yaml", null);
  }

  /** The only problem of {@code yaml}; it must be at {@code path}. */
  static CatalogProblem onlyProblem(String yaml, String path) {
    List<CatalogProblem> ps = problems(yaml);
    assertEquals(1, ps.size(), () -> "expected one problem, got:\n" + render(ps));
    assertEquals(path, ps.get(0).path(), () -> render(ps));
    return ps.get(0);
  }

  /** The problem at {@code path} among several. */
  static CatalogProblem at(List<CatalogProblem> ps, String path) {
    List<CatalogProblem> found = ps.stream().filter(p -> p.path().equals(path)).toList();
    assertEquals(
        1, found.size(), () -> "expected one problem at " + path + ", got:\n" + render(ps));
    return found.get(0);
  }

  /** Asserts that the message contains every fragment (the parts that tell the fix). */
  static void says(CatalogProblem p, String... fragments) {
    for (String f : fragments) {
      assertTrue(p.message().contains(f), () -> "message lacks \"" + f + "\":\n" + p);
    }
  }

  static String render(List<CatalogProblem> ps) {
    return ps.stream().map(CatalogProblem::toString).collect(Collectors.joining("\n"));
  }
}
