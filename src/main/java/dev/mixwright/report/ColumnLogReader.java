package dev.mixwright.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads {@code columns.jsonl}. A last line without its newline, or one that does not parse, is the
 * mark of a crash mid-write: it is dropped and counted, never misread. A bad line elsewhere is an error.
 */
public final class ColumnLogReader {
  private ColumnLogReader() {}

  public record Entries(List<JsonNode> lines, int droppedTornLines) {}

  public static Entries read(Path file) throws IOException {
    String text = Files.readString(file, StandardCharsets.UTF_8);
    List<JsonNode> lines = new ArrayList<>();
    int dropped = 0;
    String[] parts = text.split("\n", -1);
    for (int i = 0; i < parts.length; i++) {
      String line = parts[i];
      boolean last = i == parts.length - 1;
      if (line.isBlank()) {
        continue;
      }
      if (last) {
        dropped++; // no newline after it: written when the process died
        continue;
      }
      try {
        lines.add(Json.compact().readTree(line));
      } catch (JsonProcessingException e) {
        if (i == parts.length - 2 && parts[parts.length - 1].isEmpty()) {
          dropped++;
          continue;
        }
        throw new IOException(file + " line " + (i + 1) + " is not a JSON object: " + e.getOriginalMessage());
      }
    }
    return new Entries(lines, dropped);
  }
}
