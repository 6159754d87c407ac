package dev.mixwright.cli;

import picocli.CommandLine.Option;

/** {@code --progress/--no-progress}, as a mixin: unset means on when stderr is a terminal. */
final class ProgressOption {
  @Option(names = "--progress", negatable = true,
      description = "progress on stderr: a live line on a terminal, else one line per round"
          + " (default: on when stderr is a terminal)")
  Boolean asked;
}
