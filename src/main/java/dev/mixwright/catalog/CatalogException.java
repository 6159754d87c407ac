package dev.mixwright.catalog;

import java.util.List;
import java.util.stream.Collectors;

/**
 * A catalog that cannot be used, with every problem found in one pass (not only the first), each
 * naming its exact input path. The message lists them one per line as {@code path: message}.
 */
public final class CatalogException extends Exception {
  private final List<CatalogProblem> problems;

  public CatalogException(List<CatalogProblem> problems) {
    super(render(problems));
    if (problems.isEmpty()) {
      throw new IllegalArgumentException("a CatalogException needs at least one problem");
    }
    this.problems = List.copyOf(problems);
  }

  public CatalogException(CatalogProblem problem) {
    this(List.of(problem));
  }

  public List<CatalogProblem> problems() {
    return problems;
  }

  private static String render(List<CatalogProblem> problems) {
    return problems.stream().map(CatalogProblem::toString).collect(Collectors.joining("\n"));
  }
}
