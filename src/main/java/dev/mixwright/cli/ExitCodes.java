package dev.mixwright.cli;

import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogProblem;
import dev.mixwright.catalog.Where;
import dev.mixwright.run.InputError;
import dev.mixwright.run.RunOutcome;
import dev.mixwright.runfolder.RunFileDamaged;
import dev.mixwright.runfolder.RunFileWriteFailed;
import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.ParseResult;

/** Every exit code in one place, and the mapping of exceptions to them. */
public final class ExitCodes {
  public static final int OK = 0;
  public static final int STOPPED = 1;
  public static final int BAD_INPUT = 2;
  public static final int FAULT = 3;

  private ExitCodes() {}

  /** A run that ended at its proven optimum is success; stopped early or infeasible is 1. */
  static int of(RunOutcome o) {
    if (o instanceof RunOutcome.Solved s) {
      return s.lp().status().isOptimal() ? OK : STOPPED;
    }
    return o instanceof RunOutcome.AlreadyOptimal ? OK : STOPPED;
  }

  /** Longest line of a message shown: far beyond any message of ours, short beside a file's contents. */
  private static final int MAX_LINE = 2_000;

  /**
   * A message as it may reach a terminal: line by line, every control character (a terminal escape
   * code in a path or argument the user typed, or in a file name) shown as {@code \u001B}.
   */
  static String shown(String message) {
    return java.util.Arrays.stream(String.valueOf(message).split("\n", -1))
        .map(line -> Where.printable(line, MAX_LINE)).collect(java.util.stream.Collectors.joining("\n"));
  }

  /**
   * The JVM ran out of heap: said with the limit it had and how to give it more. Run folders hold
   * only whole files (each written to a temporary file and moved into place; the column log line by
   * line, a torn last line dropped on reading), so what was written before stays readable.
   */
  static int outOfMemory(PrintWriter err, OutOfMemoryError e) {
    long mib = Runtime.getRuntime().maxMemory() / (1024 * 1024);
    err.println("mixwright: ran out of memory (" + shown(e.getMessage()) + ") with a heap limit of " + mib
        + " MiB; give Java more, e.g. java -Xmx4g -jar mixwright.jar ... (up to what the machine has"
        + " to spare), or solve a smaller catalog");
    err.flush();
    return FAULT;
  }

  /** The out-of-memory error among an exception's causes, or null. */
  private static OutOfMemoryError outOfMemoryIn(Throwable e) {
    java.util.Set<Throwable> seen = java.util.Collections.newSetFromMap(new java.util.IdentityHashMap<>());
    for (Throwable t = e; t != null && seen.add(t); t = t.getCause()) {
      if (t instanceof OutOfMemoryError oom) {
        return oom;
      }
    }
    return null;
  }

  /** picocli's refusal of a command line, its message shown as {@link #shown} allows, then the usage. */
  static int invalid(CommandLine.ParameterException e, String[] args) {
    CommandLine cl = e.getCommandLine();
    PrintWriter err = cl.getErr();
    err.println(shown(e.getMessage()));
    if (!CommandLine.UnmatchedArgumentException.printSuggestions(e, err)) {
      cl.usage(err, cl.getColorScheme());
    }
    err.flush();
    return cl.getCommandSpec().exitCodeOnInvalidInput();
  }

  static int handle(Exception e, CommandLine cl, ParseResult parsed) {
    PrintWriter err = cl.getErr();
    OutOfMemoryError oom = outOfMemoryIn(e);
    if (oom != null) {
      // a worker thread ran out of heap and its pool handed the error on, wrapped (scenario sets, counts)
      return outOfMemory(err, oom);
    }
    if (e instanceof CatalogException ce) {
      err.println("mixwright: the catalog has " + ce.problems().size()
          + (ce.problems().size() == 1 ? " problem:" : " problems:"));
      for (CatalogProblem p : ce.problems()) {
        err.println("  " + p.path() + ": " + p.message());
      }
      err.flush();
      return BAD_INPUT;
    }
    Throwable damaged = e instanceof java.io.UncheckedIOException u ? u.getCause() : e;
    if (damaged instanceof RunFileDamaged || damaged instanceof RunFileWriteFailed) {
      err.println("mixwright: " + shown(damaged.getMessage()));
      err.flush();
      return BAD_INPUT;
    }
    if (e instanceof InputError) {
      err.println("mixwright: " + shown(e.getMessage()));
      err.flush();
      return BAD_INPUT;
    }
    err.println("mixwright: internal fault: " + shown(String.valueOf(e)));
    if (System.getenv("MIXWRIGHT_DEBUG") != null) {
      e.printStackTrace(err);
    } else {
      err.println("  (run again with MIXWRIGHT_DEBUG=1 for the stack trace, and please report it)");
    }
    err.flush();
    return FAULT;
  }
}
