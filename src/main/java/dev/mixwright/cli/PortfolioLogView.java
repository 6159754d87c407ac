package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import dev.mixwright.report.StageWords;
import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.colgen.Durations;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.PortfolioLog;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/** The integer stage's log ({@code portfolio.jsonl}) as a table in a planner's words: best range and upper limit over time. */
final class PortfolioLogView {
  private PortfolioLogView() {}

  /** Prints the table when the run has the file; returns false when it has none. */
  static boolean print(PrintWriter out, Path runDir) throws IOException {
    Path file = runDir.resolve(PortfolioLog.FILE);
    if (!Files.isRegularFile(file)) {
      return false;
    }
    out.println();
    out.println("choosing the range of variants to offer, whole variants only (" + PortfolioLog.FILE + ")");
    out.println(String.format(Locale.ROOT, "%7s  %-12s  %14s  %14s  %s", "time", "step", "best range", "upper limit",
        "what happened"));
    int torn = 0;
    try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
      String line;
      while ((line = r.readLine()) != null) {
        if (line.isBlank()) {
          continue;
        }
        JsonNode n;
        try {
          n = Json.compact().readTree(line);
        } catch (IOException e) {
          torn++; // a line cut off by a crash while it was written
          continue;
        }
        String kind = n.path("kind").asText();
        JsonNode v = n.path("value");
        // the estimate's and the widening's value are no range's value (its own bound; a cut-off)
        boolean range = !kind.equals("relaxation") && !kind.equals("survivors") && v.isNumber();
        JsonNode b = n.path("bound");
        out.println(String.format(Locale.ROOT, "%7s  %-12s  %14s  %14s  %s",
            Durations.format(n.path("elapsedMs").asLong()), StageWords.step(kind),
            range ? Figures.money(v.asDouble()) : "", b.isNumber() ? Figures.money(b.asDouble()) : "—",
            StageWords.what(kind, n.path("pool").asInt(), n.path("count").asInt(), n.path("note").asText())));
      }
    }
    out.println("best range: value of the best range of whole variants found so far; upper limit: what no range");
    out.println("can exceed, proven; the range is the best when the two meet");
    if (torn > 0) {
      out.println(torn + " unreadable line(s) skipped (the run was cut off while writing)");
    }
    return true;
  }
}
