package dev.mixwright.export;

import dev.mixwright.runfolder.AtomicFiles;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * The run as CSV files, one per {@link Tables table}: offers.csv, portfolio.csv (when the run has a
 * portfolio), resources.csv, segments.csv, matrix.csv and shared.csv (the choices all variants of the
 * matrix share). UTF-8, comma-separated, a header row, CRLF line ends as RFC 4180 gives them; numbers
 * as plain decimals ({@link CellText#plain}), text guarded against formula injection ({@link CellText}).
 */
public final class CsvExport {
  private CsvExport() {}

  /** Writes the files into {@code outDir}; returns them in the order written. */
  public static List<Path> write(RunData run, Path outDir) throws IOException {
    List<Path> files = new ArrayList<>();
    for (Table t : Tables.of(run)) {
      Path f = outDir.resolve(t.name() + ".csv");
      AtomicFiles.write(f, text(t).getBytes(StandardCharsets.UTF_8), true);
      files.add(f);
    }
    return files;
  }

  static String text(Table t) {
    StringBuilder b = new StringBuilder();
    line(b, new ArrayList<>(t.header()));
    t.rows().forEach(r -> line(b, r));
    return b.toString();
  }

  private static void line(StringBuilder b, List<?> cells) {
    for (int i = 0; i < cells.size(); i++) {
      Object c = cells.get(i);
      b.append(i == 0 ? "" : ",");
      if (c instanceof Double d) {
        b.append(CellText.plain(d));
      } else if (c != null) {
        b.append(CellText.csvText(c.toString()));
      }
    }
    b.append("\r\n");
  }
}
