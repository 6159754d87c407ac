package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The text matrix of a catalog with many groups fits the line it is given and loses no cell. */
class MatrixViewWidthTest {

  /** Invented: {@code groups} groups in which 6 variants differ, each option text 22 characters long. */
  private static MatrixView wide(int groups) {
    List<MatrixView.GroupColumn> cols = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      cols.add(new MatrixView.GroupColumn("g" + g, "Assembly group " + g));
    }
    List<MatrixView.Row> rows = new ArrayList<>();
    for (int v = 0; v < 6; v++) {
      List<String> cells = new ArrayList<>();
      Map<String, String> options = new LinkedHashMap<>();
      for (int g = 0; g < groups; g++) {
        cells.add(String.format("Option %02d of group %02d", (v + g) % 8, g));
        options.put("g" + g, "o" + ((v + g) % 8));
      }
      rows.add(new MatrixView.Row(VariantCodes.code(v, 6), options, cells, new double[] {100 * v, 50, 0}, 100 * v + 50,
          Double.NaN));
    }
    List<MatrixView.Shared> shared = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      shared.add(new MatrixView.Shared("s" + g, "Shared group " + g, "x", "Shared option " + g));
    }
    return new MatrixView(shared, cols, List.of("retrofit", "newbuild", "quiet"), false, rows);
  }

  @Test
  void aWideTableIsCutIntoBlocksThatFit() {
    MatrixView m = wide(30);
    List<String> lines = m.lines(Figures::units, 100, 120);
    for (String line : lines) {
      assertTrue(line.length() <= 120, line.length() + ": " + line);
    }
    String all = String.join("\n", lines);
    for (MatrixView.Row r : m.rows()) {
      for (String cell : r.cells()) {
        assertTrue(all.contains(cell), "lost: " + cell);
      }
      // every block names the variant
      long blocks = lines.stream().filter(l -> l.startsWith("variant ")).count();
      assertTrue(blocks > 1);
      assertEquals(blocks, lines.stream().filter(l -> l.startsWith(r.code() + " ")).count(), r.code());
    }
    for (int g = 0; g < 30; g++) {
      assertTrue(all.contains("Shared group " + g + ": Shared option " + g), "shared " + g);
    }
    // the units stay in the first block, beside the first groups
    assertTrue(lines.stream().filter(l -> l.startsWith("variant ")).findFirst().orElseThrow().endsWith("LP total"));
  }

  @Test
  void aNarrowTableIsOneBlockAsBefore() {
    MatrixView m = wide(2);
    assertEquals(m.lines(Figures::units, 100), m.lines(Figures::units, 100, 120));
    assertEquals(1, m.lines(Figures::units, 100, 120).stream().filter(l -> l.startsWith("variant ")).count());
  }
}
