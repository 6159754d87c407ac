package dev.mixwright.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.MappingIterator;
import com.fasterxml.jackson.dataformat.csv.CsvMapper;
import com.fasterxml.jackson.dataformat.csv.CsvSchema;
import dev.mixwright.report.MatrixView;
import dev.mixwright.report.RunResult;
import dev.mixwright.report.VariantCodes;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.dhatim.fastexcel.reader.Cell;
import org.dhatim.fastexcel.reader.CellType;
import org.dhatim.fastexcel.reader.ReadableWorkbook;
import org.dhatim.fastexcel.reader.Row;
import org.dhatim.fastexcel.reader.Sheet;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** CSV and workbook exports of a solved run read back and compared with its result.json. */
class ExportTest {
  @TempDir static Path dir;
  static Path run;
  static RunData data;

  @BeforeAll
  static void solve() throws Exception {
    run = ExportRuns.solve(dir, ExportRuns.FORMULA_NAMES);
    data = RunData.read(run);
    assertNotNull(data.result().portfolio(), "the test catalog has a portfolio section");
    assertFalse(data.result().offers().isEmpty());
  }

  static List<Map<String, String>> readCsv(Path f) throws Exception {
    CsvMapper m = new CsvMapper();
    try (MappingIterator<Map<String, String>> it = m.readerForMapOf(String.class)
        .with(CsvSchema.emptySchema().withHeader()).readValues(f.toFile())) {
      return it.readAll();
    }
  }

  /** The text a CSV cell holds for a catalog name: the name, behind a quote when it starts like a formula. */
  static String asCsvText(String name) {
    return "=+-@".indexOf(name.charAt(0)) >= 0 ? "'" + name : name;
  }

  @Test
  void offersCsvHasOneRowPerOfferOfResultJsonWithPlainNumbers() throws Exception {
    Path out = dir.resolve("csv");
    List<Path> files = CsvExport.write(data, out);
    Set<String> names = new HashSet<>();
    files.forEach(p -> names.add(p.getFileName().toString()));
    assertTrue(names.containsAll(Set.of("offers.csv", "portfolio.csv", "resources.csv", "segments.csv", "matrix.csv")),
        names.toString());
    List<Map<String, String>> rows = readCsv(out.resolve("offers.csv"));
    List<RunResult.Offer> offers = data.result().offers();
    assertEquals(offers.size(), rows.size());
    for (int i = 0; i < offers.size(); i++) {
      RunResult.Offer o = offers.get(i);
      Map<String, String> r = rows.get(i);
      assertEquals(asCsvText(o.segment()), r.get("segment"));
      o.options().forEach((g, c) -> assertEquals(asCsvText(c), r.get(g), g));
      assertEquals(o.quantity(), Double.parseDouble(r.get("quantity")), 1e-6 * Math.max(1, o.quantity()));
      assertEquals(o.unitMargin(), Double.parseDouble(r.get("unitMargin")), 1e-6);
      assertEquals(o.contribution(), Double.parseDouble(r.get("contribution")), 1e-6 * Math.max(1, o.contribution()));
      assertEquals(o.atLimit(), Boolean.parseBoolean(r.get("atLimit")));
      assertEquals(data.codes().code(o.options()), r.get("variant"));
      for (String k : List.of("quantity", "unitMargin", "reducedCost", "contribution")) {
        assertFalse(r.get(k).contains("E") || r.get(k).contains(","), k + " " + r.get(k));
      }
    }
    List<Map<String, String>> portfolio = readCsv(out.resolve("portfolio.csv"));
    assertEquals(data.result().portfolio().variants().size(), portfolio.size());
    double units = 0;
    for (Map<String, String> r : portfolio) {
      units += Double.parseDouble(r.get("units"));
    }
    double expected = data.result().portfolio().variants().stream().mapToDouble(RunResult.PortfolioVariant::units).sum();
    assertEquals(expected, units, 1e-5);
  }

  @Test
  void nothingACatalogNamesIsWrittenAsAFormula() throws Exception {
    Path out = dir.resolve("csv-injection");
    CsvExport.write(data, out);
    int guarded = 0;
    for (String file : List.of("offers.csv", "resources.csv", "segments.csv", "matrix.csv", "shared.csv", "portfolio.csv")) {
      for (Map<String, String> r : readCsv(out.resolve(file))) {
        for (Map.Entry<String, String> e : r.entrySet()) {
          String v = e.getValue();
          if (v.isEmpty() || isNumber(v)) {
            continue;
          }
          assertTrue("=+-@".indexOf(v.charAt(0)) < 0, file + " " + e.getKey() + " starts like a formula: " + v);
          guarded += v.startsWith("'") ? 1 : 0;
        }
      }
    }
    assertTrue(guarded > 0, "the test catalog's names start with = + - @, so some cells are guarded");
    // the guard is the OWASP "CSV Injection" advice: a leading single quote
    assertEquals("'=1+2", CellText.guarded("=1+2"));
    assertEquals("'+1", CellText.guarded("+1"));
    assertEquals("'-x", CellText.guarded("-x"));
    assertEquals("'@SUM(A1)", CellText.guarded("@SUM(A1)"));
    assertEquals("'\t=1", CellText.guarded("\t=1"));
    assertEquals("plain", CellText.guarded("plain"));
    assertEquals("\"'=SUM(1,2)\"\"x\"", CellText.csvText("=SUM(1,2)\"x"));
    assertEquals("\"'+alu\"\"x\"", CellText.csvText("+alu\"x"));
    assertEquals("-12.5", CellText.plain(-12.5));
    assertEquals("29923273.809524", CellText.plain(2.9923273809523813E7));
    assertEquals("3000", CellText.plain(2999.9999999999995));
  }

  private static boolean isNumber(String v) {
    try {
      Double.parseDouble(v);
      return true;
    } catch (NumberFormatException e) {
      return false;
    }
  }

  @Test
  void theWorkbookOpensWithASheetPerTableNumericCellsAndNoFormulas() throws Exception {
    Path f = WorkbookExport.write(data, dir.resolve("xlsx"));
    try (ReadableWorkbook wb = new ReadableWorkbook(f.toFile())) {
      List<Sheet> sheets = wb.getSheets().toList();
      List<String> names = new ArrayList<>();
      sheets.forEach(s -> names.add(s.getName()));
      assertTrue(names.containsAll(List.of("offers", "portfolio", "resources", "segments", "matrix")), names.toString());
      List<Row> offers = sheets.get(names.indexOf("offers")).read();
      assertEquals(data.result().offers().size() + 1, offers.size());
      int quantityColumn = -1;
      for (Cell c : offers.get(0)) {
        if ("quantity".equals(c.getText())) {
          quantityColumn = c.getColumnIndex();
        }
      }
      for (int i = 1; i < offers.size(); i++) {
        Cell q = offers.get(i).getCell(quantityColumn);
        assertEquals(CellType.NUMBER, q.getType());
        assertEquals(data.result().offers().get(i - 1).quantity(), q.asNumber().doubleValue(), 1e-9);
        assertEquals(CellType.STRING, offers.get(i).getCell(1).getType());
      }
      List<Row> resources = sheets.get(names.indexOf("resources")).read();
      assertEquals(CellType.NUMBER, resources.get(1).getCell(5).getType(), "shadow prices are numbers");
      boolean sawFormulaLikeText = false;
      for (Sheet s : sheets) {
        for (Row r : s.read()) {
          for (Cell c : r) {
            if (c == null) {
              continue;
            }
            assertTrue(c.getType() != CellType.FORMULA, s.getName() + " " + c.getAddress());
            sawFormulaLikeText |= c.getType() == CellType.STRING && c.getText().startsWith("=");
          }
        }
      }
      assertTrue(sawFormulaLikeText, "a name starting with = is kept as text");
    }
  }

  @Test
  void exportFilesAreWrittenWithTheProcessDefaultPermissionsNotOwnerOnly() throws Exception {
    Path out = dir.resolve("perm");
    Files.createDirectories(out);
    if (!FileSystems.getDefault().supportedFileAttributeViews().contains("posix")) {
      return;
    }
    Path probe = Files.writeString(out.resolve("probe"), "x");
    Path f = WorkbookExport.write(data, out);
    assertEquals(Files.getPosixFilePermissions(probe), Files.getPosixFilePermissions(f));
    try (var left = Files.list(out)) {
      assertEquals(2, left.count(), "no temp file left behind");
    }
  }

  @Test
  void codesFollowUnitsSoldAndAreTheSameForTheSameResult() throws Exception {
    VariantCodes a = VariantCodes.of(data.result());
    VariantCodes b = VariantCodes.of(RunResult.read(run));
    assertEquals(a.variants(), b.variants());
    double last = Double.POSITIVE_INFINITY;
    for (int i = 0; i < a.size(); i++) {
      assertEquals(String.format("V%02d", i + 1), a.codeAt(i));
      double units = 0;
      for (RunResult.Offer o : data.result().offers()) {
        if (o.options().equals(a.variants().get(i))) {
          units += o.quantity();
        }
      }
      if (units > 0) {
        assertTrue(units <= last + 1e-6);
        last = units;
      }
    }
    MatrixView m = data.matrix();
    assertEquals(a.size(), m.rows().size());
    for (MatrixView.Row r : m.rows()) {
      assertEquals(m.groups().size(), r.cells().size());
    }
    // a group every variant holds alike is above the table, not in it
    for (MatrixView.Shared s : m.shared()) {
      assertTrue(m.groups().stream().noneMatch(g -> g.id().equals(s.group())));
    }
  }
}
