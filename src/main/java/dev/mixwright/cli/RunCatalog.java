package dev.mixwright.cli;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.runfolder.RunFolder;
import java.io.IOException;
import java.nio.file.Path;

/** The catalog a run solved (its catalog.json), for the labels and figures of the views that read a run. */
final class RunCatalog {
  private RunCatalog() {}

  /**
   * The run's catalog, checked against run.json (a changed copy would give other labels and figures
   * in silence: refused in words); null when the folder has none or it does not parse, and the
   * views then name groups and options by their ids.
   */
  static Catalog read(Path run) {
    try {
      return new RunFolder(run).solvedCatalog().orElse(null);
    } catch (IOException e) {
      throw new UserError(e.getMessage());
    } catch (CatalogException e) {
      return null;
    }
  }
}
