package dev.mixwright.cli;

import dev.mixwright.catalog.TableReach;
import picocli.CommandLine.Option;

/** {@code --allow-outside-tables}, as a mixin: only the person running the command can widen where tables may be. */
final class TableReachOption {
  @Option(names = "--allow-outside-tables",
      description = "let the catalog name option and utility tables outside its own folder (absolute paths, '..',"
          + " links leading out); by default they must lie in the catalog's folder or below it")
  boolean allowOutside;

  TableReach reach() {
    return allowOutside ? TableReach.ANYWHERE : TableReach.CATALOG_FOLDER;
  }
}
