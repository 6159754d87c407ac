package dev.mixwright.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/**
 * What every subcommand of {@link Main} shares: the spec picocli injects (for its output streams and
 * parse errors). Help and version options come from the root command's inherited attributes.
 */
abstract class SubCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
}
