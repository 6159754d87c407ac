package dev.mixwright.cli;

import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.Supplier;
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

  /**
   * The subcommands by name, in the order the usage lists them. Picocli builds the model of every
   * subcommand it is given (reflection over each command's options and mixins, and the classes they
   * load): 0.5 s of CPU on a cold JVM for all eleven, measured, more than check's whole catalog read.
   * So a command line that starts with a command's name gets that command alone; any other (help,
   * version, a misspelt name) gets them all, for the usage and the suggestions.
   */
  private static final Map<String, Supplier<Object>> COMMANDS = new LinkedHashMap<>();

  static {
    COMMANDS.put("check", CheckCommand::new);
    COMMANDS.put("solve", SolveCommand::new);
    COMMANDS.put("explain", ExplainCommand::new);
    COMMANDS.put("log", LogCommand::new);
    COMMANDS.put("resume", ResumeCommand::new);
    COMMANDS.put("sweep", SweepCommand::new);
    COMMANDS.put("compare", CompareCommand::new);
    COMMANDS.put("generate", GenerateCommand::new);
    COMMANDS.put("bench", BenchCommand::new);
    COMMANDS.put("report", ReportCommand::new);
    COMMANDS.put("export", ExportCommand::new);
  }

  /** Runs one command line with the given streams; returns the exit code. */
  public static int run(String[] args, PrintWriter out, PrintWriter err) {
    CommandLine cl = new CommandLine(new Main());
    Supplier<Object> named = args.length > 0 ? COMMANDS.get(args[0]) : null;
    if (named != null) {
      cl.addSubcommand(named.get());
    } else {
      COMMANDS.values().forEach(c -> cl.addSubcommand(c.get()));
    }
    cl.setOut(out);
    cl.setErr(err);
    int code = execute(cl, args);
    out.flush();
    err.flush();
    return code;
  }

  /**
   * Runs a command line with the project's handlers. Picocli hands exceptions to {@link ExitCodes#handle}
   * but lets errors through; running out of heap is the one a user can act on, so it is said in words
   * (with the heap limit and how to raise it) instead of a stack trace.
   */
  static int execute(CommandLine cl, String[] args) {
    cl.setExecutionExceptionHandler(ExitCodes::handle);
    cl.setParameterExceptionHandler(ExitCodes::invalid);
    try {
      return cl.execute(args);
    } catch (OutOfMemoryError e) {
      return ExitCodes.outOfMemory(cl.getErr(), e);
    }
  }
}
