package dev.mixwright.cli;

import dev.mixwright.catalog.CatalogException;
import dev.mixwright.export.CsvExport;
import dev.mixwright.export.ExportError;
import dev.mixwright.export.ModelExport;
import dev.mixwright.export.RunData;
import dev.mixwright.export.WorkbookExport;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

@Command(
    name = "export",
    description = {
      "Writes a finished run in a form to keep or hand on.",
      "csv: offers.csv, portfolio.csv (when the run has a portfolio), resources.csv, segments.csv,"
          + " matrix.csv and shared.csv. xlsx: plan.xlsx with a sheet for each. mps: master.mps (the"
          + " final restricted master, free MPS, rebuilt from the run's column log) and portfolio.mps"
          + " (the portfolio MIP over the run's variants). text: the matrix view on the screen.",
      "Variants are named by short codes (V01 sells most in the LP plan), the same in every export and"
          + " summary of the run. Text that a spreadsheet would read as a formula is written as text."
    })
final class ExportCommand extends RunDirCommand {
  @Option(names = "--format", required = true, paramLabel = "FORMAT", description = "csv, xlsx, mps or text")
  String format;

  @Option(names = "--out", paramLabel = "DIR", description = "folder for the files (not for text)")
  Path outDir;

  @Override
  public Integer call() throws IOException, CatalogException {
    String f = format.trim().toLowerCase(Locale.ROOT);
    if (!List.of("csv", "xlsx", "mps", "text").contains(f)) {
      throw new UserError("--format " + format + ": choose csv, xlsx, mps or text");
    }
    if (outDir == null && !f.equals("text")) {
      throw new UserError("--format " + f + " writes files: name their folder with --out DIR");
    }
    PrintWriter out = spec.commandLine().getOut();
    RunData run;
    try {
      run = RunData.read(runDir);
    } catch (IOException e) {
      throw new UserError(e.getMessage());
    }
    try {
      List<Path> files = switch (f) {
        case "csv" -> CsvExport.write(run, outDir);
        case "xlsx" -> List.of(WorkbookExport.write(run, outDir));
        case "mps" -> ModelExport.write(run, outDir);
        default -> {
          Summary.matrix(out, run.matrix(), Integer.MAX_VALUE, "");
          yield List.of();
        }
      };
      files.forEach(p -> out.println("wrote " + p));
    } catch (ExportError e) {
      throw new UserError(e.getMessage());
    }
    out.flush();
    return ExitCodes.OK;
  }
}
