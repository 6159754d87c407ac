package dev.mixwright.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import dev.mixwright.report.HtmlReport;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunLock;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

@Command(
    name = "report",
    description = {
      "Writes one self-contained HTML page for a finished run, to read and to hand on.",
      "Headline figures first (revenue, cost, margin, one-off costs, units by segment), then the range by variant code with attach rates, the range to build against the ideal LP plan, resource use, shadow prices, and the solver's convergence last. Nothing in it is fetched from a network."
    })
final class ReportCommand extends RunDirCommand {
  @Option(names = {"--out", "-o"}, paramLabel = "FILE", description = "where to write the page (default RUN_DIR/report.html)")
  Path out;

  @Override
  public Integer call() throws IOException {
    RunFolder folder = new RunFolder(runDir);
    if (RunLock.busy(folder)) {
      throw new UserError("the run in " + runDir + " is still running (another mixwright process holds its lock);"
          + " make the page when it has ended, or stop it with Ctrl-C and report the stopped run");
    }
    Path result = folder.result();
    if (!Files.isRegularFile(result)) {
      throw new UserError("no result.json in " + runDir + " — give a folder written by 'mixwright solve --out'"
          + " after the run has finished");
    }
    Path target = out != null ? out : runDir.resolve(HtmlReport.FILE);
    if (Files.isDirectory(target)) {
      throw new UserError("--out " + target + " is a folder — give a file name such as " + target.resolve(HtmlReport.FILE));
    }
    try {
      HtmlReport.write(runDir, target);
    } catch (IOException e) {
      if (e.getCause() instanceof JsonProcessingException j) {
        throw new UserError(result + " is not valid JSON (" + j.getOriginalMessage()
            + ") — solve again with 'mixwright solve --out " + runDir + " --replace'");
      }
      throw e;
    }
    spec.commandLine().getOut().println("report written to " + target);
    return ExitCodes.OK;
  }
}
