package dev.mixwright.cli;

import dev.mixwright.report.Figures;
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

/** The integer stage's log ({@code portfolio.jsonl}) as a table: incumbents and bound over time. */
final class PortfolioLogView {
  private PortfolioLogView() {}

  /** Prints the table when the run has the file; returns false when it has none. */
  static boolean print(PrintWriter out, Path runDir) throws IOException {
    Path file = runDir.resolve(PortfolioLog.FILE);
    if (!Files.isRegularFile(file)) {
      return false;
    }
    out.println();
    out.println("integer stage (" + PortfolioLog.FILE + ")");
    out.println(String.format(Locale.ROOT, "%9s  %-10s  %18s  %18s  %6s  %s", "time", "step", "value", "bound",
        "pool", "note"));
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
        String value = !v.isNumber() ? "—"
            : kind.equals("survivors") ? "threshold " + Figures.money(v.asDouble()) : Figures.money(v.asDouble());
        JsonNode b = n.path("bound");
        out.println(String.format(Locale.ROOT, "%9s  %-10s  %18s  %18s  %6d  %s",
            Durations.format(n.path("elapsedMs").asLong()), kind, value,
            b.isNumber() ? Figures.money(b.asDouble()) : "—", n.path("pool").asInt(), n.path("note").asText()));
      }
    }
    if (torn > 0) {
      out.println(torn + " unreadable line(s) skipped (the run was cut off while writing)");
    }
    return true;
  }
}
