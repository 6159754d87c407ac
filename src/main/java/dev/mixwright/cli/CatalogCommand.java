package dev.mixwright.cli;

import java.nio.file.Path;
import picocli.CommandLine.Parameters;

/** A subcommand whose first argument is a catalog file (check, solve, sweep). */
abstract class CatalogCommand extends SubCommand {
  @Parameters(index = "0", paramLabel = "CATALOG", description = "catalog file (.yaml, .yml or .json)")
  Path catalogFile;
}
