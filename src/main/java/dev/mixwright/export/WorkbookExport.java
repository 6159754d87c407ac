package dev.mixwright.export;

import dev.mixwright.runfolder.AtomicFiles;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.file.Path;
import org.dhatim.fastexcel.Workbook;
import org.dhatim.fastexcel.Worksheet;

/**
 * The run as one workbook, {@code plan.xlsx}: a sheet per {@link Tables table} (offers, portfolio
 * when the run has one, resources with their shadow prices, segments, the matrix view with its shared
 * choices above the table, and the shared choices alone). Numbers are numeric cells, text is text
 * cells: the writer (fastexcel) has no way to turn a value into a formula, so a name starting with
 * {@code =} stays the text it is.
 */
public final class WorkbookExport {
  public static final String FILE = "plan.xlsx";

  private WorkbookExport() {}

  public static Path write(RunData run, Path outDir) throws IOException {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (Workbook wb = new Workbook(bytes, "mixwright", "1.0")) {
      for (Table t : Tables.of(run)) {
        sheet(wb.newWorksheet(t.name()), t);
      }
      wb.finish();
    }
    Path f = outDir.resolve(FILE);
    AtomicFiles.write(f, bytes.toByteArray(), true);
    return f;
  }

  private static void sheet(Worksheet ws, Table t) {
    int row = 0;
    for (String line : t.above()) {
      ws.value(row++, 0, line);
    }
    if (!t.above().isEmpty()) {
      row++;
    }
    for (int c = 0; c < t.header().size(); c++) {
      ws.value(row, c, t.header().get(c));
      ws.style(row, c).bold().set();
    }
    ws.freezePane(0, row + 1);
    row++;
    for (var r : t.rows()) {
      for (int c = 0; c < r.size(); c++) {
        Object v = r.get(c);
        if (v instanceof Double d) {
          if (Double.isFinite(d)) {
            ws.value(row, c, d);
          }
        } else if (v instanceof Boolean b) {
          ws.value(row, c, b);
        } else if (v != null) {
          ws.value(row, c, (String) v);
        }
      }
      row++;
    }
  }
}
