package dev.mixwright.catalog;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.fasterxml.jackson.dataformat.yaml.YAMLMapper;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;

/**
 * Reads a catalog from YAML ({@code .yaml}, {@code .yml}) or JSON ({@code .json}) and validates it.
 * The text is parsed to a tree first, then walked by hand, so every problem is reported with its
 * exact path and all problems come in one {@link CatalogException}. Malformed YAML or JSON is one
 * problem naming the line and column. Never throws anything else for bad input.
 */
public final class CatalogLoader {
  /** Large generated catalogs exceed SnakeYAML's default 3 MB; the file limit bounds it anyway. */
  private static final int YAML_CODE_POINT_LIMIT = (int) Limits.MAX_FILE_BYTES + 1;

  private static final ObjectMapper JSON =
      JsonMapper.builder()
          .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
          .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
          .build();
  private static final ObjectMapper YAML = yamlMapper();

  private static final Pattern JACKSON_LOCATION =
      Pattern.compile("\\[Source: [^\\]]*?; line: (\\d+), column: (\\d+)\\]");

  private CatalogLoader() {}

  private static final LoaderOptions YAML_OPTIONS = yamlOptions();

  private static LoaderOptions yamlOptions() {
    LoaderOptions options = new LoaderOptions();
    options.setCodePointLimit(YAML_CODE_POINT_LIMIT);
    return options;
  }

  private static ObjectMapper yamlMapper() {
    YAMLFactory factory = new YamlShape.Factory(yamlOptions());
    return YAMLMapper.builder(factory)
        .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
        .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
        .build();
  }

  /** Loads a catalog file; option tables it names are read from the same folder. */
  public static Catalog load(Path file) throws CatalogException {
    return loadHashed(file).catalog();
  }

  /** Loads a catalog file whose option tables may lie where {@code reach} allows. */
  public static Catalog load(Path file, TableReach reach) throws CatalogException {
    return loadHashed(file, reach).catalog();
  }

  /** A catalog and the SHA-256 (lower-case hex) of the very bytes it was parsed from. */
  public record Hashed(Catalog catalog, String sha256) {}

  /**
   * Reads the file once, hashes those bytes and parses them, so the hash a run records is of the
   * text that was solved even if the file is rewritten meanwhile.
   */
  public static Hashed loadHashed(Path file) throws CatalogException {
    return loadHashed(file, TableReach.CATALOG_FOLDER);
  }

  /** As {@link #loadHashed(Path)}, with the tables allowed where {@code reach} says. */
  public static Hashed loadHashed(Path file, TableReach reach) throws CatalogException {
    String name = nameOf(file.toString(), file);
    formatOf(name); // reject an unknown file type before reading it
    if (Files.isDirectory(file)) {
      throw new CatalogException(
          new CatalogProblem(
              name, "is a folder, not a catalog file — give the .yaml or .json file"));
    }
    byte[] bytes = readBytes(file, name);
    String text = decode(bytes, name);
    Catalog c =
        new CatalogReader(name, file.toAbsolutePath().getParent(), reach)
            .read(parseTree(text, file.toString()));
    return new Hashed(c, sha256(bytes));
  }

  private static String sha256(byte[] bytes) {
    try {
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java runtime has SHA-256", e);
    }
  }


  /**
   * Parses catalog text. {@code fileNameForFormat} picks YAML or JSON by its ending and names the
   * document in problems; {@code baseDirForCsv} is where {@code optionsFile} tables are looked up
   * (null: there is no folder, and a group that names a table is a problem).
   */
  public static Catalog parse(String text, String fileNameForFormat, Path baseDirForCsv)
      throws CatalogException {
    String name = nameOf(fileNameForFormat, null);
    return new CatalogReader(name, baseDirForCsv).read(parseTree(text, fileNameForFormat));
  }

  /**
   * YAML or JSON text (picked by the file name's ending) as a tree, for the files that sit beside a
   * catalog (scenarios, sweeps); text that is neither is one problem naming the line and column.
   */
  public static JsonNode parseTree(String text, String fileNameForFormat) throws CatalogException {
    String name = nameOf(fileNameForFormat, null);
    boolean yaml = formatOf(name);
    String body = text.startsWith("\uFEFF") ? text.substring(1) : text;
    if (body.length() > Limits.MAX_FILE_BYTES) {
      throw new CatalogException(
          new CatalogProblem(
              name,
              "is longer than "
                  + Limits.bytes(Limits.MAX_FILE_BYTES)
                  + "; catalog files are read up to that size, far more than a real one needs"));
    }
    if (yaml) {
      longestLine(body, name);
    }
    try {
      return (yaml ? YAML : JSON).readTree(body);
    } catch (YamlShape.Refused e) {
      throw new CatalogException(e.in(name));
    } catch (JsonProcessingException e) {
      throw new CatalogException(syntaxProblem(e, name, yaml));
    }
  }

  /** Refuses a YAML line longer than {@link Limits#MAX_YAML_LINE} before the YAML reader sees it. */
  private static void longestLine(String body, String name) throws CatalogException {
    int line = 1;
    int start = 0;
    for (int i = 0; i <= body.length(); i++) {
      if (i == body.length() || body.charAt(i) == '\n') {
        if (i - start > Limits.MAX_YAML_LINE) {
          throw new CatalogException(
              new CatalogProblem(
                  name + " line " + line,
                  "is "
                      + (i - start)
                      + " characters long; a line of a YAML file has at most "
                      + Limits.MAX_YAML_LINE
                      + " — break it up (ids have at most "
                      + Limits.MAX_ID_LENGTH
                      + " characters, texts "
                      + Limits.MAX_TEXT_LENGTH
                      + "), or save the catalog as .json"));
        }
        line++;
        start = i + 1;
      }
    }
  }

  /** A file's text, or one problem saying in words why it cannot be read. */
  public static String readText(Path file, String name) throws CatalogException {
    formatOf(name);
    if (Files.isDirectory(file)) {
      throw new CatalogException(
          new CatalogProblem(name, "is a folder, not a file — give the .yaml or .json file"));
    }
    return decode(readBytes(file, name), name);
  }

  private static byte[] readBytes(Path file, String name) throws CatalogException {
    String[] why = new String[1];
    byte[] bytes = InputFiles.read(file, Limits.MAX_FILE_BYTES, "catalog", m -> why[0] = m);
    if (bytes == null) {
      throw new CatalogException(new CatalogProblem(name, why[0]));
    }
    return bytes;
  }

  private static String decode(byte[] bytes, String name) throws CatalogException {
    try {
      return StandardCharsets.UTF_8.newDecoder().decode(ByteBuffer.wrap(bytes)).toString();
    } catch (CharacterCodingException e) {
      throw new CatalogException(
          new CatalogProblem(name, "is not UTF-8 text — save the file in UTF-8"));
    }
  }


  /** The file name problems are reported under. */
  public static String displayName(Path file) {
    return nameOf(file.toString(), file);
  }

  /** True for YAML, false for JSON; a problem for any other file type. */
  private static boolean formatOf(String name) throws CatalogException {
    String lower = name.toLowerCase(Locale.ROOT);
    if (lower.endsWith(".yaml") || lower.endsWith(".yml")) {
      return true;
    }
    if (lower.endsWith(".json")) {
      return false;
    }
    throw new CatalogException(
        new CatalogProblem(
            name, "unknown file type — a catalog file name ends in .yaml, .yml or .json"));
  }

  private static String nameOf(String given, Path file) {
    Path p = file != null ? file : pathOrNull(given);
    return p != null && p.getFileName() != null ? p.getFileName().toString() : given;
  }

  private static Path pathOrNull(String s) {
    try {
      return Path.of(s);
    } catch (RuntimeException e) {
      return null;
    }
  }

  /** One problem for text that is not YAML or JSON at all, at the line and column of the error. */
  private static CatalogProblem syntaxProblem(
      JsonProcessingException e, String name, boolean yaml) {
    MarkedYAMLException marked = null;
    for (Throwable t = e; t != null && marked == null; t = t.getCause()) {
      if (t instanceof MarkedYAMLException m) {
        marked = m;
      }
    }
    if (marked != null) {
      Mark at = marked.getProblemMark() != null ? marked.getProblemMark() : marked.getContextMark();
      String problem = oneLine(marked.getProblem());
      StringBuilder msg = new StringBuilder("not valid YAML: ").append(problem);
      Mark ctx = marked.getContextMark();
      if (marked.getContext() != null && ctx != null) {
        msg.append(" (")
            .append(oneLine(marked.getContext()))
            .append(" that starts at line ")
            .append(ctx.getLine() + 1)
            .append(", column ")
            .append(ctx.getColumn() + 1)
            .append(")");
      }
      msg.append(yamlHint(problem));
      String where =
          at == null
              ? name
              : name + " line " + (at.getLine() + 1) + " column " + (at.getColumn() + 1);
      return new CatalogProblem(where, msg.toString());
    }
    JsonLocation loc = e.getLocation();
    String where =
        loc != null && loc.getLineNr() > 0
            ? name + " line " + loc.getLineNr() + " column " + loc.getColumnNr()
            : name;
    return new CatalogProblem(
        where, "not valid " + (yaml ? "YAML" : "JSON") + ": " + plainJacksonMessage(e));
  }

  private static String plainJacksonMessage(JsonProcessingException e) {
    String m = e.getOriginalMessage() == null ? "" : e.getOriginalMessage();
    Matcher dup = Pattern.compile("Duplicate field '(.*)'").matcher(m);
    if (dup.find()) {
      return "the key '" + dup.group(1) + "' appears twice in one mapping; keep one";
    }
    if (m.startsWith("Trailing token")) {
      return "more content after the end of the catalog — a file holds one catalog (one JSON"
          + " object, or one YAML document)";
    }
    Matcher bad =
        Pattern.compile("(?:Non-standard token|Malformed numeric value) '(.*?)'").matcher(m);
    if (bad.find()) {
      return "'"
          + bad.group(1)
          + "' is not a number this format reads — numbers must be finite and"
          + " written as digits, e.g. 1.6";
    }
    m = JACKSON_LOCATION.matcher(m).replaceAll("line $1, column $2");
    m = m.replaceAll(":? ?(?:enable|Enable) `[^`]*` to allow", "");
    return oneLine(m);
  }

  private static String yamlHint(String problem) {
    if (problem.contains("\\t") || problem.contains("\t") || problem.contains("(TAB)")) {
      return " — YAML indents with spaces, not tabs";
    }
    if (problem.startsWith("mapping values are not allowed")) {
      return " — often a missing space after ':' or a value containing ': '; put such a value in"
          + " quotes";
    }
    if (problem.startsWith("expected <block end>")
        || problem.contains("could not find expected ':'")) {
      return " — often a line indented differently from the entries beside it; check the"
                 + " indentation";
    }
    return "";
  }

  private static String oneLine(String s) {
    return s == null ? "" : s.strip().replaceAll("\\s*\\n\\s*", " ");
  }
}
