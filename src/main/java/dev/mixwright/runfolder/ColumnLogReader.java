package dev.mixwright.runfolder;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads {@code columns.jsonl}. A line is whole when it ends in a newline, is UTF-8, parses as a JSON
 * object and, when it carries a {@code crc} field (every line {@link ColumnLog} writes does),
 * matches it. The writer forces each line to disk before the next, so a crash can damage only the
 * line being written, the last: a last line that is not whole is dropped and counted, never
 * misread. A damaged line with whole lines after it is not a crash's mark but damage from outside,
 * and an error naming the line.
 */
public final class ColumnLogReader {
  private ColumnLogReader() {}

  /**
   * The whole lines in order; how many torn lines were dropped at the end (0 or 1, plus a cut-off
   * remainder); {@code validBytes}, the length of the file without them, where appending resumes.
   */
  public record Entries(List<JsonNode> lines, int droppedTornLines, long validBytes) {
    public Entries {
      lines = List.copyOf(lines);
    }
  }

  public static Entries read(Path file) throws IOException {
    byte[] bytes = Files.readAllBytes(file);
    List<JsonNode> lines = new ArrayList<>();
    int dropped = 0;
    long validBytes = 0;
    int badLine = -1; // 1-based number of a damaged whole line, while no whole line followed it
    long badStart = -1;
    int lineNo = 0;
    int start = 0;
    while (start < bytes.length) {
      int end = start;
      while (end < bytes.length && bytes[end] != '\n') {
        end++;
      }
      lineNo++;
      if (end == bytes.length) {
        // No newline after it: the process died while writing it.
        if (badLine < 0) {
          validBytes = start;
        }
        dropped++;
        break;
      }
      JsonNode node = parse(bytes, start, end);
      boolean blank = node == null && isBlank(bytes, start, end);
      if (node != null || blank) {
        if (badLine >= 0) {
          throw new IOException(file.getFileName() + " line " + badLine
              + " is damaged (not a whole JSON line with a matching checksum) and whole lines follow it,"
              + " so it is not the mark of a crash; the file was changed by something else — move the"
              + " line out of the file and try again");
        }
        if (node != null) {
          lines.add(node);
        }
        validBytes = end + 1L;
      } else if (badLine < 0) {
        badLine = lineNo;
        badStart = start;
        validBytes = start;
        dropped++;
      } else {
        throw new IOException(file.getFileName() + " lines " + badLine + " and " + lineNo
            + " are damaged; a crash damages at most the last line, so the file was changed by"
            + " something else — move the damaged lines out of the file and try again");
      }
      start = end + 1;
    }
    if (badLine >= 0) {
      validBytes = badStart;
    }
    return new Entries(lines, dropped, validBytes);
  }

  /** The line's JSON object when it is whole, else null. */
  private static JsonNode parse(byte[] bytes, int start, int end) {
    String text;
    try {
      text = StandardCharsets.UTF_8.newDecoder()
          .onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT)
          .decode(ByteBuffer.wrap(bytes, start, end - start)).toString();
    } catch (CharacterCodingException e) {
      return null;
    }
    if (text.isBlank()) {
      return null;
    }
    int mark = text.lastIndexOf(ColumnLog.CRC_MARK);
    if (mark >= 0) {
      int digits = mark + ColumnLog.CRC_MARK.length();
      if (text.length() != digits + 10 || !text.endsWith("\"}")
          || !text.substring(digits, digits + 8).equals(Checksums.crc(text.substring(0, mark)))) {
        return null;
      }
    }
    try {
      JsonNode n = Json.compact().readTree(text);
      return n != null && n.isObject() ? n : null;
    } catch (JsonProcessingException e) {
      return null;
    }
  }

  private static boolean isBlank(byte[] bytes, int start, int end) {
    for (int i = start; i < end; i++) {
      if (bytes[i] != ' ' && bytes[i] != '\t' && bytes[i] != '\r') {
        return false;
      }
    }
    return true;
  }
}
