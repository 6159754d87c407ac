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

  /** {@code solve CATALOG --out OUT} with the extra options after them. */
  static CliRun solve(java.nio.file.Path catalog, java.nio.file.Path out, String... extra) {
    String[] args = new String[4 + extra.length];
    args[0] = "solve";
    args[1] = catalog.toString();
    args[2] = "--out";
    args[3] = out.toString();
    System.arraycopy(extra, 0, args, 4, extra.length);
    return of(args);
  }

  /** Words of the solver a planner should not meet (issue 10), sought as words in every line of {@code text}. */
  static void assertPlain(String text) {
    for (String line : text.split("\n")) {
      for (String word : dev.mixwright.report.StageWords.JARGON) {
        org.junit.jupiter.api.Assertions.assertFalse(
            java.util.regex.Pattern.compile("(?i)\\b" + word).matcher(line).find(), "'" + word + "' in: " + line);
      }
    }
  }

  @Override
  public String toString() {
    return "exit " + code + "\n--- stdout\n" + out + "--- stderr\n" + err;
  }
}
