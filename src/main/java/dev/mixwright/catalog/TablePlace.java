package dev.mixwright.catalog;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;

/**
 * Where a table named by a catalog is, and whether the catalog may reach it (see {@link
 * TableReach}): inside the catalog's folder the name must be relative, must not climb out with
 * {@code ..}, and once links are followed must still lead into the folder.
 */
final class TablePlace {
  private TablePlace() {}

  private static final String WIDEN =
      " (if you trust this catalog, allow it with --allow-outside-tables)";

  /** The table's path, or null after recording why the catalog may not use it. */
  static Path resolve(
      CatalogReader reader, String fieldPath, String shown, String fileName, Path baseDir, String kind) {
    Path given;
    try {
      given = Path.of(fileName);
    } catch (InvalidPathException e) {
      reader.problem(fieldPath, "'" + shown + "' is not a file name this system accepts — rename the file");
      return null;
    }
    Path file = baseDir.resolve(given).normalize();
    if (reader.reach().anywhere()) {
      return file;
    }
    if (given.isAbsolute()) {
      reader.problem(
          fieldPath,
          "'"
              + shown
              + "' is an absolute path — "
              + kind
              + " must lie in the catalog's folder or below it; give the name relative to the"
              + " catalog file, e.g. heatpump-range-casings.csv"
              + WIDEN);
      return null;
    }
    Path base = baseDir.normalize();
    if (!file.startsWith(base)) {
      reader.problem(
          fieldPath,
          "'"
              + shown
              + "' leads out of the catalog's folder — "
              + kind
              + " must lie in the catalog's folder or below it; move the table next to the catalog"
              + WIDEN);
      return null;
    }
    if (Files.exists(file)) {
      try {
        Path real = file.toRealPath();
        if (!real.startsWith(base.toRealPath())) {
          reader.problem(
              fieldPath,
              "'"
                  + shown
                  + "' is a link leading out of the catalog's folder — "
                  + kind
                  + " must lie in the catalog's folder or below it; copy the table next to the"
                  + " catalog"
                  + WIDEN);
          return null;
        }
      } catch (IOException | SecurityException e) {
        reader.problem(fieldPath, "cannot read '" + shown + "': cannot follow the path");
        return null;
      }
    }
    return file;
  }
}
