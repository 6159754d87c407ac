package dev.mixwright.report;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.colgen.ColGenListener;
import dev.mixwright.colgen.Column;
import dev.mixwright.space.VariantSpace;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;

/**
 * Appends one JSON object per column added to {@code columns.jsonl}, flushed after every round so
 * that a crash loses at most the round being written. Fields: iteration, segment, options,
 * reducedCost, margin, objectiveAfter, boundAfter, elapsedMs.
 */
public final class ColumnLog implements ColGenListener, AutoCloseable {
  public static final String FILE = "columns.jsonl";

  private final VariantSpace space;
  private final BufferedWriter out;

  public ColumnLog(VariantSpace space, Path runDir, boolean append) throws IOException {
    this.space = space;
    Files.createDirectories(runDir);
    out = Files.newBufferedWriter(runDir.resolve(FILE), StandardCharsets.UTF_8,
        StandardOpenOption.CREATE, StandardOpenOption.WRITE,
        append ? StandardOpenOption.APPEND : StandardOpenOption.TRUNCATE_EXISTING);
  }

  @Override
  public void columnsAdded(List<Column> columns, double objectiveAfter, double boundAfter, long elapsedMs) {
    Catalog catalog = space.catalog();
    try {
      for (Column c : columns) {
        ObjectNode n = Json.compact().createObjectNode();
        n.put("iteration", c.iteration());
        n.put("segment", catalog.segments().get(c.segment()).id());
        ObjectNode opts = n.putObject("options");
        space.describe(c.choices()).forEach(opts::put);
        n.put("reducedCost", c.reducedCostAtEntry());
        n.put("margin", c.margin());
        n.put("objectiveAfter", objectiveAfter);
        if (Double.isFinite(boundAfter)) {
          n.put("boundAfter", boundAfter);
        } else {
          n.putNull("boundAfter");
        }
        n.put("elapsedMs", elapsedMs);
        out.write(Json.compact().writeValueAsString(n));
        out.write('\n');
      }
      out.flush();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  @Override
  public void close() throws IOException {
    out.close();
  }
}
