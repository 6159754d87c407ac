package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.colgen.Durations;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.ColumnLogReader;
import dev.mixwright.runfolder.RunFolder;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
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

  @Option(names = "--full", description = "show every group of a variant, optional groups at none included")
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
    ColumnLogReader.Entries entries;
    try {
      entries = ColumnLogReader.read(file);
    } catch (IOException e) {
      throw new UserError(e.getMessage());
    }
    if (segment != null) {
      refuseUnknownSegment(entries);
    }
    out.println(String.format(Locale.ROOT, "%5s  %9s  %-14s  %14s  %16s  %16s  %s",
        "round", "time", "segment", "reduced cost", "objective after", "bound after", "variant"));
    int shown = 0;
    for (JsonNode n : entries.lines()) {
      String seg = n.path("segment").asText();
      if (segment != null && !segment.equals(seg)) {
        continue;
      }
      shown++;
      JsonNode b = n.path("boundAfter");
      out.println(String.format(Locale.ROOT, "%5d  %9s  %-14s  %14s  %16s  %16s  %s",
          n.path("iteration").asInt(), Durations.format(n.path("elapsedMs").asLong()), seg,
          n.path("iteration").asInt() == 0 ? "seed" : String.format(Locale.ROOT, "%,.4f", n.path("reducedCost").asDouble()),
          Figures.money(n.path("objectiveAfter").asDouble()),
          b.isNumber() ? Figures.money(b.asDouble()) : "—", variant(n.path("options"))));
    }
    out.println(shown + " columns" + (segment == null ? "" : " in segment " + segment)
        + (entries.droppedTornLines() > 0 ? "; " + entries.droppedTornLines()
            + " torn last line dropped (the run was cut off while writing it)" : ""));
    if (segment == null) {
      PortfolioLogView.print(out, runDir);
    }
    return ExitCodes.OK;
  }

  /**
   * A --segment the run does not have is a typo, not an empty answer: refused with the run's segment
   * ids (from result.json, or the segments the log names when the run has not finished).
   */
  private void refuseUnknownSegment(ColumnLogReader.Entries entries) {
    java.util.Set<String> ids = new java.util.LinkedHashSet<>();
    try {
      RunResult.read(runDir).segments().forEach(s -> ids.add(s.id()));
    } catch (IOException e) {
      entries.lines().forEach(n -> ids.add(n.path("segment").asText()));
    }
    if (!ids.contains(segment)) {
      throw new UserError("--segment " + segment + ": the run has no such segment; its segments are "
          + String.join(", ", ids));
    }
  }

  private String variant(JsonNode options) {
    StringBuilder sb = new StringBuilder();
    Iterator<Map.Entry<String, JsonNode>> it = options.fields();
    while (it.hasNext()) {
      Map.Entry<String, JsonNode> e = it.next();
      if (!full && e.getValue().asText().equals("none")) {
        continue;
      }
      sb.append(sb.length() == 0 ? "" : ",").append(e.getKey()).append('=').append(e.getValue().asText());
    }
    return sb.toString();
  }
}
