package dev.mixwright.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** One command line run in this JVM, with what it printed. */
record CliRun(int code, String out, String err) {
  static CliRun of(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true));
    return new CliRun(code, out.toString(), err.toString());
  }

  @Override
  public String toString() {
    return "exit " + code + "\n--- stdout\n" + out + "--- stderr\n" + err;
  }
}
