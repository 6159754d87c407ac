package dev.mixwright.catalog;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A part-worth table of a segment that chooses, in a CSV file next to the catalog: the header
 * {@code group,option,utility} (columns in any order, no others) and one row per part-worth, as a
 * conjoint study reports them. Problems are named {@code segments[1].choice.utilityFile
 * homeowners.csv line 5 column utility}; lines count from 1 at the header, blank lines are skipped,
 * cells are trimmed.
 */
final class CsvUtilityTable {
  private static final String HEADER_FORM = "group,option,utility";
  private static final List<String> COLUMNS = List.of("group", "option", "utility");

  private CsvUtilityTable() {}

  /** One part-worth read from the table: key {@code group.option}, and where it was found. */
  record Entry(String key, double utility, String at) {}

  /** The table's part-worths, or null when the file or its header could not be read. */
  static List<Entry> read(CatalogReader reader, String fieldPath, String fileName, Path baseDir) {
    String text =
        CsvOptionTable.readFile(
            reader, fieldPath, fileName, baseDir, "utility tables", "give the part-worths inline under utility");
    if (text == null) {
      return null;
    }
    String at = fieldPath + " " + fileName;
    List<CsvOptionTable.Row> rows = CsvOptionTable.rows(reader, at, text, Limits.MAX_UTILITY_ROWS + 1);
    if (rows == null) {
      return null;
    }
    if (rows.size() > Limits.MAX_UTILITY_ROWS + 1) {
      reader.problem(at, "has more than " + Limits.MAX_UTILITY_ROWS + " rows; a utility table has at most that many");
      return null;
    }
    if (rows.isEmpty()) {
      reader.problem(
          at, "the file is empty — it needs the header " + HEADER_FORM + " and one row per part-worth");
      return null;
    }
    CsvOptionTable.Row header = rows.get(0);
    String headerAt = at + " line " + header.line();
    Map<String, Integer> column = new HashMap<>();
    boolean ok = true;
    for (int j = 0; j < header.cells().size(); j++) {
      String name = header.cells().get(j);
      String colAt = headerAt + " column " + CsvOptionTable.columnName(name, j);
      if (!COLUMNS.contains(name)) {
        reader.problem(
            colAt,
            "unknown column (the header must be "
                + HEADER_FORM
                + ")"
                + Where.didYouMean(name, COLUMNS));
        ok = false;
      } else if (column.putIfAbsent(name, j) != null) {
        reader.problem(colAt, "the column appears twice in the header; keep one");
        ok = false;
      }
    }
    for (String needed : COLUMNS) {
      if (!column.containsKey(needed)) {
        reader.problem(headerAt, "missing column '" + needed + "' — the header must be " + HEADER_FORM);
        ok = false;
      }
    }
    if (!ok) {
      return null;
    }
    int width = header.cells().size();
    List<Entry> out = new ArrayList<>();
    for (CsvOptionTable.Row row : rows.subList(1, rows.size())) {
      String lineAt = at + " line " + row.line();
      if (row.cells().size() != width) {
        reader.problem(lineAt, CsvOptionTable.cellCountProblem(row, width));
        continue;
      }
      String group = row.cells().get(column.get("group"));
      String option = row.cells().get(column.get("option"));
      String utilityText = row.cells().get(column.get("utility"));
      boolean rowOk = true;
      if (group.isEmpty()) {
        reader.problem(lineAt + " column group", "empty — give the group id, e.g. capacity");
        rowOk = false;
      }
      if (option.isEmpty()) {
        reader.problem(
            lineAt + " column option", "empty — give the option id, e.g. c12 (or none for an optional group)");
        rowOk = false;
      }
      if (rowOk) {
        rowOk = reader.checkChoiceOf(group, option, lineAt + " column group", lineAt + " column option");
      }
      String uAt = lineAt + " column utility";
      Double u = utilityText.isEmpty() ? null : Checks.decimal(utilityText);
      if (u == null) {
        reader.problem(
            uAt,
            (utilityText.isEmpty() ? "empty" : "not a number: " + Where.quote(utilityText))
                + " — write the part-worth as a plain number with a dot for decimals, e.g. 0.7 or -0.4");
        rowOk = false;
      } else {
        String p = Checks.figureProblem(u, Checks.Figure.UTILITY, "a part-worth, e.g. 0.7");
        if (p != null) {
          reader.problem(uAt, p);
          rowOk = false;
        }
      }
      if (rowOk) {
        out.add(new Entry(group + "." + option, u, lineAt));
      }
    }
    return out;
  }
}
