package dev.mixwright.choice;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogProblem;
import java.util.ArrayList;
import java.util.List;

/**
 * The one place that keeps catalogs with segments that choose, or options with price points, away
 * from {@code sweep}. {@code solve} and {@code resume} run them (the master is the sales-based LP;
 * the integer stage is skipped for choosing segments in {@code run.PortfolioStep}); a sweep's
 * scenario changes and table have not been checked against the choice model and price points yet,
 * and a wrong table is worse than none. Remove the call in {@code run.SweepRun} and this class once
 * they are.
 */
public final class NotSolvedYet {
  private NotSolvedYet() {}

  /** Throws one problem per choosing segment and per option with price points; else returns. */
  public static void refuseInSweep(Catalog catalog) throws CatalogException {
    List<CatalogProblem> problems = new ArrayList<>();
    for (int s = 0; s < catalog.segments().size(); s++) {
      if (catalog.segments().get(s).chooses()) {
        problems.add(
            new CatalogProblem(
                "segments[" + s + "].choice",
                "sweeps over segments that choose are not run by this version yet — `solve`"
                    + " solves the catalog; to sweep now, give segment '"
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
                  "sweeps over options with price points are not run by this version yet —"
                      + " `solve` solves the catalog; to sweep now, give option '"
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
