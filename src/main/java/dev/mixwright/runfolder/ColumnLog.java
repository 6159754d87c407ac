package dev.mixwright.runfolder;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.colgen.ColGenListener;
import dev.mixwright.colgen.Column;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;

/**
 * Appends one JSON object per column added to {@code columns.jsonl}. The log is also the run's column
 * pool: a line holds what rebuilds its column (segment and options; margin and use are recomputed
 * from the catalog), so {@code mixwright resume} can refill the master from it.
 *
 * <p>The lines of one round's columns are written together and forced to disk once ({@link
 * FileChannel#force}) before the listener returns, so everything the loop announced is on disk
 * before the round's state is, and a crash loses at most the round being written (its columns are
 * found again by pricing). Forcing each line on its own cost one disk flush per column: measured, 61
 * of 78 s of a solve that added 22,866 columns of segments that choose. Each line ends with a CRC-32C
 * of the text before it, so a line cut short or garbled by the crash is recognised and dropped by
 * {@link ColumnLogReader}, never misread. Fields: session, iteration, segment, options, reducedCost,
 * margin, objectiveAfter, boundAfter, elapsedMs, crc.
 */
public final class ColumnLog implements ColGenListener, AutoCloseable {
  public static final String FILE = "columns.jsonl";
  /** What separates a line's body from its checksum: {@code {...,"crc":"89abcdef"}}. */
  static final String CRC_MARK = ",\"crc\":\"";

  private final VariantSpace space;
  private final FileChannel channel;
  private final Path file;
  private final int session;

  /** A new log ({@code append} false: an earlier one is emptied) or more lines on an existing one. */
  public ColumnLog(VariantSpace space, Path runDir, boolean append) throws IOException {
    this(space, runDir, 1, append ? -1 : 0);
  }

  /**
   * Opens the log for session {@code session} (1 for the first solve, +1 per resume), first cut to
   * its first {@code keepBytes} bytes ({@code -1} keeps all; 0 empties it). Cutting drops a torn
   * last line before new lines follow it, so it never ends up in the middle of the file.
   */
  public static ColumnLog open(VariantSpace space, Path runDir, int session, long keepBytes)
      throws IOException {
    return new ColumnLog(space, runDir, session, keepBytes);
  }

  private ColumnLog(VariantSpace space, Path runDir, int session, long keepBytes) throws IOException {
    this.space = space;
    this.session = session;
    Files.createDirectories(runDir);
    file = runDir.resolve(FILE);
    boolean existed = Files.exists(file);
    if (Files.isSymbolicLink(file)) {
      throw new RunFileDamaged(file + " is a symbolic link; mixwright never writes through a link — remove it");
    }
    channel = FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE, LinkOption.NOFOLLOW_LINKS);
    if (keepBytes >= 0 && keepBytes < channel.size()) {
      channel.truncate(keepBytes);
    }
    channel.position(channel.size());
    channel.force(true);
    if (!existed) {
      AtomicFiles.syncDirectory(runDir);
    }
  }

  @Override
  public void columnsAdded(List<Column> columns, double objectiveAfter, double boundAfter, long elapsedMs) {
    if (columns.isEmpty()) {
      return;
    }
    try {
      StringBuilder text = new StringBuilder(columns.size() * 256);
      for (Column c : columns) {
        text.append(line(c, objectiveAfter, boundAfter, elapsedMs));
      }
      ByteBuffer buf = ByteBuffer.wrap(text.toString().getBytes(StandardCharsets.UTF_8));
      WriteFaults.check(file);
      while (buf.hasRemaining()) {
        channel.write(buf);
      }
      channel.force(false);
    } catch (JsonProcessingException e) {
      throw new UncheckedIOException(e);
    } catch (IOException e) {
      // the lines before are on disk and whole; a torn last line is dropped by the reader
      throw new UncheckedIOException(new RunFileWriteFailed(file, e, "the columns logged before are kept"));
    }
  }

  /** One line with its newline: the JSON object, its last field the checksum of what precedes it. */
  String line(Column c, double objectiveAfter, double boundAfter, long elapsedMs) throws JsonProcessingException {
    Catalog catalog = space.catalog();
    ObjectNode n = Json.compact().createObjectNode();
    n.put("session", session);
    n.put("iteration", c.iteration());
    n.put("segment", catalog.segments().get(c.segment()).id());
    ObjectNode opts = n.putObject("options");
    space.describe(c.choices()).forEach(opts::put);
    n.put("reducedCost", c.reducedCostAtEntry());
    n.put("margin", c.margin());
    Json.putNum(n, "objectiveAfter", objectiveAfter);
    Json.putNum(n, "boundAfter", boundAfter);
    n.put("elapsedMs", elapsedMs);
    return sealed(Json.compact().writeValueAsString(n));
  }

  /** {@code {"a":1}} becomes {@code {"a":1,"crc":"…"}} plus newline, the CRC taken over {@code {"a":1}. */
  static String sealed(String json) {
    String body = json.substring(0, json.length() - 1);
    return body + CRC_MARK + Checksums.crc(body) + "\"}\n";
  }

  @Override
  public void close() throws IOException {
    channel.close();
  }
}
