package dev.mixwright.cli;

import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogProblem;
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

  static int handle(Exception e, CommandLine cl, ParseResult parsed) {
    PrintWriter err = cl.getErr();
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
      err.println("mixwright: " + damaged.getMessage());
      err.flush();
      return BAD_INPUT;
    }
    if (e instanceof InputError) {
      err.println("mixwright: " + e.getMessage());
      err.flush();
      return BAD_INPUT;
    }
    err.println("mixwright: internal fault: " + e);
    if (System.getenv("MIXWRIGHT_DEBUG") != null) {
      e.printStackTrace(err);
    } else {
      err.println("  (run again with MIXWRIGHT_DEBUG=1 for the stack trace, and please report it)");
    }
    err.flush();
    return FAULT;
  }
}
