package dev.mixwright.catalog;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.dataformat.csv.CsvMapper;
import com.fasterxml.jackson.dataformat.csv.CsvParser;
import dev.mixwright.catalog.Checks.Figure;
import dev.mixwright.catalog.Checks.IdKind;
import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * An option table in a CSV file next to the catalog: a header {@code id,price,cost[,label][,tooling]
 * [,uses.<resource>...]} (columns in any order) and one row per option. Problems are named {@code
 * groups[4].optionsFile heatpump-range-casings.csv line 5 column uses.brazing}; lines count from 1 at the header, blank
 * lines are skipped, cells are trimmed, an empty {@code uses.*} or {@code tooling} cell means zero.
 */
final class CsvOptionTable {
  private static final CsvMapper CSV = new CsvMapper();
  private static final java.util.regex.Pattern COLUMN_NAME =
      java.util.regex.Pattern.compile("[A-Za-z0-9_.\\-]{1,60}");
  private static final String HEADER_FORM = "id,price,cost[,label][,tooling][,uses.<resource>...]";
  private static final List<String> FIXED = List.of("id", "price", "cost", "label", "tooling");

  private CsvOptionTable() {}

  record Row(int line, List<String> cells) {}

  /**
   * Reads the table into {@code out}, registering each option id with {@code ref}. Returns the
   * number of option rows, or -1 when the file could not be read far enough to know its option ids.
   */
  static int read(
      CatalogReader reader,
      CatalogReader.GroupRef ref,
      String fieldPath,
      String fileName,
      Path baseDir,
      List<Option> out) {
    String text = readFile(reader, fieldPath, fileName, baseDir, "option tables", "list the options inline");
    if (text == null) {
      return -1;
    }
    String at = fieldPath + " " + fileName;
    List<Row> rows = rows(reader, at, text, Limits.MAX_OPTIONS_PER_GROUP + 1);
    if (rows == null) {
      return -1;
    }
    if (rows.size() > Limits.MAX_OPTIONS_PER_GROUP + 1) {
      reader.problem(at, "has more than " + Limits.MAX_OPTIONS_PER_GROUP + " option rows; a group has at most"
          + " that many — split it into groups, or leave out options no one would choose");
      return -1;
    }
    if (rows.isEmpty()) {
      reader.problem(
          at, "the file is empty — it needs the header " + HEADER_FORM + " and one row per option");
      return -1;
    }
    Row header = rows.get(0);
    String headerAt = at + " line " + header.line();
    Map<String, Integer> column = new LinkedHashMap<>();
    Map<String, Integer> usesColumn = new LinkedHashMap<>();
    boolean headerOk = true;
    java.util.Set<String> seen = new java.util.HashSet<>();
    for (int j = 0; j < header.cells().size(); j++) {
      String name = header.cells().get(j);
      String colAt = headerAt + " column " + CsvOptionTable.columnName(name, j);
      if (name.isEmpty()) {
        reader.problem(
            colAt,
            "the header has an empty column name — every column needs a name ("
                + HEADER_FORM
                + ")");
        headerOk = false;
      } else if (!seen.add(name)) {
        reader.problem(colAt, "the column appears twice in the header; keep one");
        headerOk = false;
      } else if (FIXED.contains(name)) {
        column.put(name, j);
      } else if (name.startsWith("uses.") && name.length() > 5) {
        String rid = name.substring(5);
        if (!reader.resourceIds().contains(rid)) {
          reader.unknownResource(rid, colAt);
        }
        usesColumn.put(rid, j);
      } else if (header.cells().size() == 1 && name.contains(";")) {
        reader.problem(
            headerAt,
            "the header is one column "
                + Where.quote(name)
                + " — separate the columns with commas, not semicolons");
        return -1;
      } else {
        List<String> allowed = new ArrayList<>(FIXED);
        reader.resourceIds().forEach(r -> allowed.add("uses." + r));
        reader.problem(
            colAt,
            "unknown column (columns: id, price, cost, label, tooling, uses.<resource> — here "
                + Where.list(allowed)
                + ")"
                + Where.didYouMean(name, allowed));
      }
    }
    for (String needed : List.of("id", "price", "cost")) {
      if (!column.containsKey(needed)) {
        reader.problem(
            headerAt, "missing column '" + needed + "' — the header must be " + HEADER_FORM);
        headerOk = false;
      }
    }
    if (!headerOk) {
      return -1;
    }
    int width = header.cells().size();
    for (Row row : rows.subList(1, rows.size())) {
      String lineAt = at + " line " + row.line();
      if (row.cells().size() != width) {
        reader.problem(lineAt, cellCountProblem(row, width));
        int idColumn = column.get("id");
        if (idColumn < row.cells().size() && !row.cells().get(idColumn).isEmpty()) {
          reader.registerOption(ref, row.cells().get(idColumn), lineAt + " column id");
        }
        continue;
      }
      Option o = readRow(reader, ref, lineAt, row.cells(), column, usesColumn);
      if (o != null) {
        out.add(o);
      }
    }
    return rows.size() - 1;
  }

  /**
   * The text of a CSV file next to the catalog, or null (and a problem at {@code fieldPath}) when
   * it cannot be read. {@code kind} names such files in messages ("option tables"), {@code inline}
   * says how to do without one.
   */
  static String readFile(
      CatalogReader reader, String fieldPath, String fileName, Path baseDir, String kind, String inline) {
    String shown = Where.printable(fileName, 80);
    if (baseDir == null) {
      reader.problem(
          fieldPath,
          "cannot read '"
              + fileName
              + "': the catalog was not read from a file, so there is no folder to look in — "
              + inline
              + ", or load the catalog from its file");
      return null;
    }
    Path file = TablePlace.resolve(reader, fieldPath, shown, fileName, baseDir, kind);
    if (file == null) {
      return null;
    }
    if (!Files.exists(file)) {
      reader.problem(
          fieldPath,
          "cannot read '"
              + shown
              + "': no such file (looked for "
              + file
              + ") — "
              + kind
              + " are found relative to the catalog file's folder");
      return null;
    }
    byte[] bytes =
        InputFiles.read(
            file,
            Limits.MAX_TABLE_BYTES,
            "table",
            m -> reader.problem(fieldPath, "cannot read '" + shown + "': " + m));
    if (bytes == null) {
      return null;
    }
    try {
      return StandardCharsets.UTF_8
          .newDecoder()
          .decode(java.nio.ByteBuffer.wrap(bytes))
          .toString();
    } catch (CharacterCodingException e) {
      reader.problem(fieldPath, "'" + shown + "' is not UTF-8 text — save it as CSV in UTF-8");
      return null;
    }
  }

  private static Option readRow(
      CatalogReader reader,
      CatalogReader.GroupRef ref,
      String lineAt,
      List<String> cells,
      Map<String, Integer> column,
      Map<String, Integer> usesColumn) {
    boolean ok = true;
    String idAt = lineAt + " column id";
    String id = cells.get(column.get("id"));
    if (id.isEmpty()) {
      reader.problem(idAt, "empty — every option needs an id, e.g. " + IdKind.OPTION.example);
      ok = false;
    } else {
      String p = Checks.idProblem(id, IdKind.OPTION);
      if (p != null) {
        reader.problem(idAt, p);
        ok = false;
      }
      reader.registerOption(ref, id, idAt);
    }
    Double price =
        cell(
            reader,
            lineAt,
            "price",
            cells.get(column.get("price")),
            "the list price this option adds, e.g. 520",
            true,
            Figure.MONEY);
    Double cost =
        cell(
            reader,
            lineAt,
            "cost",
            cells.get(column.get("cost")),
            "the variable cost this option adds, e.g. 210",
            true,
            Figure.MONEY);
    Integer toolingColumn = column.get("tooling");
    Double tooling = toolingColumn == null
        ? Double.valueOf(0)
        : cell(reader, lineAt, "tooling", cells.get(toolingColumn),
            "the one-off cost of offering this option at all, e.g. 40000 (an empty cell means none)", false,
            Figure.MONEY);
    if (toolingColumn != null && tooling == null) {
      // an empty cell means no tooling; a bad one has been named
      ok &= cells.get(toolingColumn).isEmpty();
      tooling = 0.0;
    }
    Integer labelColumn = column.get("label");
    String label =
        labelColumn == null || cells.get(labelColumn).isEmpty() ? null : cells.get(labelColumn);
    String labelProblem = label == null ? null : Checks.textProblem(label);
    if (labelProblem != null) {
      reader.problem(lineAt + " column label", labelProblem);
      ok = false;
    }
    Map<String, Double> uses = new LinkedHashMap<>();
    for (Map.Entry<String, Integer> u : usesColumn.entrySet()) {
      String text = cells.get(u.getValue());
      if (text.isEmpty()) {
        continue;
      }
      Double x =
          cell(
              reader,
              lineAt,
              "uses." + u.getKey(),
              text,
              "the amount of '" + u.getKey() + "' one unit with this option uses, e.g. 1.6",
              false,
              Figure.USE);
      if (x == null) {
        ok = false;
      } else {
        uses.put(u.getKey(), x);
      }
    }
    return ok && price != null && cost != null ? new Option(id, label, price, cost, uses, tooling) : null;
  }

  private static Double cell(
      CatalogReader reader,
      String lineAt,
      String columnName,
      String text,
      String hint,
      boolean required,
      Figure kind) {
    String at = lineAt + " column " + columnName;
    if (text.isEmpty()) {
      if (required) {
        reader.problem(at, "empty — give " + hint);
      }
      return null;
    }
    Double x = Checks.decimal(text);
    if (x == null) {
      reader.problem(
          at,
          "not a number: "
              + Where.quote(text)
              + " — write a plain number with a dot for decimals; "
              + hint);
      return null;
    }
    String p = Checks.figureProblem(x, kind, hint);
    if (p != null) {
      reader.problem(at, p);
      return null;
    }
    return x;
  }

  /**
   * A header cell as a column is named in problems: the name when it reads as one, else its
   * position, so that a file that is no table at all (a password file) is never quoted.
   */
  static String columnName(String name, int j) {
    return COLUMN_NAME.matcher(name).matches() ? name : "#" + (j + 1);
  }

  /** The message for a row whose number of cells differs from the header's. */
  static String cellCountProblem(Row row, int width) {
    return "has "
        + row.cells().size()
        + " cells, the header has "
        + width
        + " — check for a missing or extra comma (quote cells that contain commas)";
  }

  /** The rows of CSV text (a leading byte-order mark dropped), or null and a problem at {@code at}. */
  static List<Row> rows(CatalogReader reader, String at, String text, int maxRows) {
    try {
      return rows(text.startsWith("\uFEFF") ? text.substring(1) : text, maxRows);
    } catch (JsonProcessingException e) {
      int line = e.getLocation() == null ? -1 : e.getLocation().getLineNr();
      reader.problem(
          line > 0 ? at + " line " + line : at, "not valid CSV: " + e.getOriginalMessage());
      return null;
    }
  }

  /** Rows with the line each starts on; rows whose cells are all blank are left out. */
  /** At most {@code maxRows + 1} rows are kept: one more than allowed says the table is too long. */
  private static List<Row> rows(String text, int maxRows) throws JsonProcessingException {
    List<Row> rows = new ArrayList<>();
    try (CsvParser p = CSV.getFactory().createParser(text)) {
      p.enable(CsvParser.Feature.WRAP_AS_ARRAY);
      List<String> cells = null;
      int line = -1;
      JsonToken t;
      while ((t = p.nextToken()) != null) {
        if (t == JsonToken.START_ARRAY) {
          cells = new ArrayList<>();
          line = -1;
        } else if (t == JsonToken.VALUE_STRING && cells != null) {
          if (line < 0) {
            line = p.currentTokenLocation().getLineNr();
          }
          cells.add(p.getText().strip());
        } else if (t == JsonToken.END_ARRAY && cells != null) {
          if (cells.stream().anyMatch(c -> !c.isEmpty())) {
            rows.add(new Row(line, cells));
            if (rows.size() > maxRows) {
              break;
            }
          }
          cells = null;
        }
      }
    } catch (JsonProcessingException e) {
      throw e;
    } catch (IOException e) {
      throw new IllegalStateException("reading CSV from a string cannot fail", e);
    }
    return rows;
  }
}
