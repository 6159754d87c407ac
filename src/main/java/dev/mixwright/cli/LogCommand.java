package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.colgen.Durations;
import dev.mixwright.report.RunResult;
import dev.mixwright.report.VariantCodes;
import dev.mixwright.report.VariantNames;
import dev.mixwright.runfolder.ColumnLogReader;
import dev.mixwright.runfolder.RunFolder;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

@Command(
    name = "log",
    description = "Shows a run's column log as a table: when each column entered, which variant in which"
        + " segment, its reduced cost, and the objective and bound after its round.")
final class LogCommand extends RunDirCommand {
  @Option(names = "--segment", paramLabel = "S", description = "only columns of this segment")
  String segment;

  @Option(names = "--full", description = "name each variant by all its options (group=option) instead of its code; optional groups at none included")
  boolean full;

  @Option(names = "--portfolio", description = "show only the integer stage's log (incumbents and bound over time)")
  boolean portfolioOnly;

  @Override
  public Integer call() throws IOException {
    PrintWriter out = spec.commandLine().getOut();
    if (portfolioOnly) {
      if (!PortfolioLogView.print(out, runDir)) {
        throw new UserError("no integer stage log in " + runDir + " — the catalog solved there has no portfolio section");
      }
      return ExitCodes.OK;
    }
    Path file = new RunFolder(runDir).columnLog();
    if (!Files.isRegularFile(file)) {
      throw new UserError("no column log at " + file + " — give a folder written by 'mixwright solve --out'");
    }
    // two passes, one line in memory at a time (an overnight run's log can be far larger than the heap):
    // the first checks the whole file, so damage is refused before anything is printed, and notes the
    // segments the log names; the second prints
    java.util.Set<String> logged = new java.util.LinkedHashSet<>();
    ColumnLogReader.Summary summary;
    try {
      summary = ColumnLogReader.scan(file, n -> logged.add(n.path("segment").asText()));
    } catch (IOException e) {
      throw new UserError(e.getMessage());
    }
    if (segment != null) {
      refuseUnknownSegment(logged);
    }
    VariantNames names = names();
    out.println(String.format(Locale.ROOT, "  %-14s  %14s  %s", "segment", "reduced cost", "variant"));
    long[] shownAndRound = {0, -1};
    try {
      ColumnLogReader.scan(file, n -> {
        String seg = n.path("segment").asText();
        if (segment != null && !segment.equals(seg)) {
          return;
        }
        shownAndRound[0]++;
        int it = n.path("iteration").asInt();
        if (it != shownAndRound[1] || shownAndRound[0] == 1) {
          // objective and bound belong to the round, not to each column: said once per round
          shownAndRound[1] = it;
          JsonNode b = n.path("boundAfter");
          out.println(String.format(Locale.ROOT, "round %d at %s%s: objective after %s, bound after %s", it,
              Durations.format(n.path("elapsedMs").asLong()), it == 0 ? ", the starting columns" : "",
              Figures.money(n.path("objectiveAfter").asDouble()), b.isNumber() ? Figures.money(b.asDouble()) : "—"));
        }
        Map<String, String> options = VariantNames.options(n.path("options"));
        out.println(String.format(Locale.ROOT, "  %-14s  %14s  %s", seg,
            it == 0 ? "start" : Figures.price(n.path("reducedCost").asDouble()),
            full || names == null ? VariantCodes.key(options) : names.shortName(options)));
      });
    } catch (IOException e) {
      throw new UserError(e.getMessage()); // the file changed between the passes
    }
    long shown = shownAndRound[0];
    out.println(shown + " columns" + (segment == null ? "" : " in segment " + segment)
        + (summary.droppedTornLines() > 0 ? "; " + summary.droppedTornLines()
            + " torn last line dropped (the run was cut off while writing it)" : ""));
    if (names != null && !full && shown > 0) {
      out.println("variants by their codes in the run's summary and report; \"V04 but X\": a variant outside the");
      out.println("plan, named by the nearest coded variant and the options that differ (--full: every option);");
      out.println("reduced cost: what a unit of the variant earns above the worth of what it uses, when it entered");
    }
    if (segment == null) {
      PortfolioLogView.print(out, runDir);
    }
    return ExitCodes.OK;
  }

  /**
   * A --segment the run does not have is a typo, not an empty answer: refused with the run's segment
   * ids (from result.json, or the segments the log names when the run has not finished).
   */
  private void refuseUnknownSegment(java.util.Set<String> logged) {
    java.util.Set<String> ids = new java.util.LinkedHashSet<>();
    try {
      RunResult.read(runDir).segments().forEach(s -> ids.add(s.id()));
    } catch (IOException e) {
      ids.addAll(logged);
    }
    if (!ids.contains(segment)) {
      throw new UserError("--segment " + segment + ": the run has no such segment; its segments are "
          + String.join(", ", ids));
    }
  }

  /** The run's variant names, or null before result.json exists (a run still going or cut off). */
  private VariantNames names() {
    RunResult result;
    try {
      result = RunResult.read(runDir);
    } catch (IOException e) {
      return null;
    }
    return VariantNames.of(result, RunCatalog.read(runDir));
  }
}
