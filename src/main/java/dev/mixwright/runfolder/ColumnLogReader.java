package dev.mixwright.runfolder;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Consumer;

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

  /** What a {@link #scan} found besides the lines: as in {@link Entries}, and how many whole lines. */
  public record Summary(long wholeLines, int droppedTornLines, long validBytes) {}

  /** Every whole line in memory at once; for callers that need them all (a pool rebuilt, an export). */
  public static Entries read(Path file) throws IOException {
    List<JsonNode> lines = new ArrayList<>();
    Summary s = scan(file, lines::add);
    return new Entries(lines, s.droppedTornLines(), s.validBytes());
  }

  /**
   * Hands each whole line to {@code each} in order, holding one line at a time: an overnight run's log
   * is read in memory of the size of its longest line. Damage is found where it is: a damaged line with
   * whole lines after it throws once the next whole line is read, after the lines before it were handed
   * on (validate first with a no-op consumer where that matters).
   */
  public static Summary scan(Path file, Consumer<JsonNode> each) throws IOException {
    long whole = 0;
    int dropped = 0;
    long validBytes = 0;
    int badLine = -1; // 1-based number of a damaged whole line, while no whole line followed it
    long badStart = -1;
    int lineNo = 0;
    long start = 0; // file offset of the line being read
    byte[] line = new byte[4096];
    int len = 0;
    byte[] chunk = new byte[1 << 16];
    try (InputStream in = Files.newInputStream(file)) {
      int n;
      while ((n = in.read(chunk)) > 0) {
        for (int i = 0; i < n; i++) {
          byte b = chunk[i];
          if (b != '\n') {
            if (len == line.length) {
              line = Arrays.copyOf(line, 2 * line.length);
            }
            line[len++] = b;
            continue;
          }
          lineNo++;
          long end = start + len; // offset of the newline
          JsonNode node = parse(line, 0, len);
          boolean blank = node == null && isBlank(line, 0, len);
          if (node != null || blank) {
            if (badLine >= 0) {
              throw new IOException(file.getFileName() + " line " + badLine
                  + " is damaged (not a whole JSON line with a matching checksum) and whole lines follow it,"
                  + " so it is not the mark of a crash; the file was changed by something else — move the"
                  + " line out of the file and try again");
            }
            if (node != null) {
              whole++;
              each.accept(node);
            }
            validBytes = end + 1;
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
          len = 0;
        }
      }
    }
    if (len > 0) {
      // No newline after it: the process died while writing it.
      if (badLine < 0) {
        validBytes = start;
      }
      dropped++;
    }
    if (badLine >= 0) {
      validBytes = badStart;
    }
    return new Summary(whole, dropped, validBytes);
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
