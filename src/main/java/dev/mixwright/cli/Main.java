package dev.mixwright.cli;

import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.ScopeType;

/** The {@code mixwright} command: subcommands for each job; exit codes are mapped in {@link ExitCodes}. */
@Command(
    name = "mixwright",
    scope = ScopeType.INHERIT,
    mixinStandardHelpOptions = true,
    versionProvider = Version.class,
    description = "Designs a product range over the whole space of buildable variants by column generation.",
    subcommands = {CheckCommand.class, SolveCommand.class, ExplainCommand.class, LogCommand.class,
        ResumeCommand.class, SweepCommand.class, CompareCommand.class, GenerateCommand.class,
        BenchCommand.class, ReportCommand.class, ExportCommand.class},
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "0:success",
      "1:stopped early (limit or signal) or infeasible, said in words",
      "2:bad input (the message names the field and the fix)",
      "3:internal fault (a bug; MIXWRIGHT_DEBUG=1 shows the trace)"
    })
public final class Main implements Runnable {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new CommandLine.ParameterException(spec.commandLine(), "name a command: check, solve, explain or log");
  }

  public static void main(String[] args) {
    System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
  }

  /** Runs one command line with the given streams; returns the exit code. */
  public static int run(String[] args, PrintWriter out, PrintWriter err) {
    CommandLine cl = new CommandLine(new Main());
    cl.setOut(out);
    cl.setErr(err);
    cl.setExecutionExceptionHandler(ExitCodes::handle);
    cl.setParameterExceptionHandler(ExitCodes::invalid);
    int code = cl.execute(args);
    out.flush();
    err.flush();
    return code;
  }
}
