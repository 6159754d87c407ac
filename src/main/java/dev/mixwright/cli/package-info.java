/**
 * The command line (picocli): one subcommand per job, exit codes mapped in one place.
 */
package dev.mixwright.cli;
