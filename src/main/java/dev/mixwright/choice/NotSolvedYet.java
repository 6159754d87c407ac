package dev.mixwright.choice;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogProblem;
import java.util.ArrayList;
import java.util.List;

/**
 * The one place that keeps catalogs with segments that choose away from the solvers of this
 * version: the master LP still has fixed demand rows, and solving such a catalog with them would
 * give a wrong plan rather than none. Remove the calls (in {@code solve} and {@code sweep}) and this
 * class once the sales-based master is in.
 */
public final class NotSolvedYet {
  private NotSolvedYet() {}

  /** Throws one problem per choosing segment, with its path; returns when there is none. */
  public static void refuseChoosingSegments(Catalog catalog) throws CatalogException {
    List<CatalogProblem> problems = new ArrayList<>();
    for (int s = 0; s < catalog.segments().size(); s++) {
      if (catalog.segments().get(s).chooses()) {
        problems.add(
            new CatalogProblem(
                "segments[" + s + "].choice",
                "segments that choose are not solved by this version yet — `check` describes"
                    + " them; to solve now, give segment '"
                    + catalog.segments().get(s).id()
                    + "' a fixed demand instead of choice"));
      }
    }
    if (!problems.isEmpty()) {
      throw new CatalogException(problems);
    }
  }
}
