package dev.mixwright.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** Runs the command line in-process with captured output. */
record CliRun(int code, String out, String err) {
  static CliRun of(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
    return new CliRun(code, out.toString(), err.toString());
  }
}
