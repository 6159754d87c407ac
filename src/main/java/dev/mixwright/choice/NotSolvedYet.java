package dev.mixwright.choice;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogProblem;
import java.util.ArrayList;
import java.util.List;

/**
 * The one place that keeps catalogs with segments that choose, or options with price points, away
 * from the solvers of this version. The master LP still has fixed demand rows, so a choosing segment
 * would be solved as if it bought up to its buyers whatever it is offered; and parts of the explain,
 * report and integer-stage code still take a choice index for an option index, which is only true
 * without price points. A wrong plan is worse than none. Remove the calls (in {@code solve} and
 * {@code sweep}) and this class once the sales-based master is in and those places use {@code
 * VariantSpace.optionOf}.
 */
public final class NotSolvedYet {
  private NotSolvedYet() {}

  /** Throws one problem per choosing segment and per option with price points; else returns. */
  public static void refuseChoiceFeatures(Catalog catalog) throws CatalogException {
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
    for (int g = 0; g < catalog.groups().size(); g++) {
      var options = catalog.groups().get(g).options();
      for (int k = 0; k < options.size(); k++) {
        if (options.get(k).hasPricePoints()) {
          problems.add(
              new CatalogProblem(
                  "groups[" + g + "].options[" + k + "].prices",
                  "options with price points are not solved by this version yet — `check`"
                      + " describes them; to solve now, give option '"
                      + options.get(k).id()
                      + "' one price"));
        }
      }
    }
    if (!problems.isEmpty()) {
      throw new CatalogException(problems);
    }
  }
}
