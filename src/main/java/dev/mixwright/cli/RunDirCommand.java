package dev.mixwright.cli;

import java.nio.file.Path;
import picocli.CommandLine.Parameters;

/** A subcommand whose first argument is a run folder that {@code solve} wrote (explain, log, report, resume). */
abstract class RunDirCommand extends SubCommand {
  @Parameters(index = "0", paramLabel = "RUN_DIR", description = "a folder written by 'mixwright solve --out'")
  Path runDir;
}
