package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.dataformat.yaml.YAMLMapper;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogGenerator;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.catalog.Limits;
import dev.mixwright.report.RunResult;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.RandomCatalogs;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.io.IOException;
import java.math.BigInteger;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Seeded mutations of the shipped catalogs (catalogs/*.yaml with their tables) and of generated
 * ones ({@link CatalogGenerator}, {@link RandomCatalogs}, {@link RandomChoiceCatalogs}), each run
 * in this JVM through {@code check} and then {@code solve} (a short time limit). Every case must
 * end in one of two ways: it is refused with exit 2 and each problem named by a path (and solve,
 * given a seeded quarter of these, refuses it too), or {@code check} finds it valid and {@code solve}
 * writes a result (exit 0, or 1 when the time limit stopped it). Never an internal fault (exit 3), a stack trace, a raw control character,
 * and never a case that does not end: a watchdog stops the test when one case runs past
 * {@link #HANG_GUARD_SECONDS} (a guard against hangs, not a speed assertion). Mutations that must
 * be refused (figures beyond the limits, non-finite figures, YAML tags and anchors, duplicate
 * keys and ids, special files, over-long ids and lines, oversized lists) assert exit 2.
 *
 * <p>A failure names the case's seed and number; {@code -Dmixwright.mutation.case=N} runs case N
 * alone.
 */
class MutationTest {
  private static final int CASES = 1_000;
  private static final long HANG_GUARD_SECONDS = 120;
  /** Each stage of a solve stops here: the test is about what happens to the input, not the optimum. */
  private static final String SOLVE_LIMIT = "300ms";
  /**
   * One refused case in this many is also given to solve, which must refuse it as check did; the
   * rest skip it, since reading a catalog is the same code in both commands.
   */
  private static final int REFUSED_SOLVE_EVERY = 4;
  private static final ObjectMapper YAML = new YAMLMapper();
  private static final ObjectMapper JSON = JsonMapper.builder().build();
  private static final Pattern PROBLEM_LINE = Pattern.compile("(?m)^  (\\S[^\\n]*?): \\S");

  /** What a mutation does; {@code refused}: the result must be exit 2 whatever the seed. */
  enum Kind {
    DELETE_FIELD(false),
    ODD_VALUE(false),
    MISSPELT_KEY(true),
    EXTREME_NUMBER(true),
    NON_FINITE(true),
    TINY_NUMBER(false),
    DUPLICATE_ID(true),
    UNKNOWN_REFERENCE(true),
    WRONG_NESTING(false),
    LONG_ID(true),
    CONTROL_CHARACTERS(true),
    TRUNCATED(false),
    GARBAGE(false),
    YAML_TAG(true),
    YAML_ANCHOR(true),
    DUPLICATE_KEY(true),
    LONG_LINE(true),
    BROKEN_TABLE(false),
    EXTREME_TABLE_FIGURE(true),
    SPECIAL_TABLE_FILE(true),
    SPECIAL_CATALOG_FILE(true),
    TOO_MANY_OPTIONS(true),
    NONE(false);

    final boolean refused;

    Kind(boolean refused) {
      this.refused = refused;
    }

    /** Mutations of the YAML text rather than of the tree. */
    boolean onText() {
      return this == TRUNCATED || this == GARBAGE || this == YAML_TAG || this == YAML_ANCHOR
          || this == DUPLICATE_KEY || this == LONG_LINE;
    }
  }

  /** A catalog to mutate: its tree, and the tables it names (file name to text). */
  record Source(String name, JsonNode tree, Map<String, String> tables) {}

  @TempDir static Path tmp;
  private static final List<Source> SOURCES = new ArrayList<>();
  private static boolean fifos;
  private static ExecutorService watchdog;

  @BeforeAll
  static void sources() throws Exception {
    try (var files = Files.list(Path.of("catalogs"))) {
      for (Path f : files.sorted().toList()) {
        if (f.toString().endsWith(".yaml")) {
          JsonNode tree = CatalogLoader.parseTree(Files.readString(f), f.toString());
          Map<String, String> tables = new LinkedHashMap<>();
          for (String field : List.of("optionsFile", "utilityFile")) {
            for (JsonNode file : tree.findValues(field)) {
              tables.put(file.asText(), Files.readString(f.resolveSibling(file.asText())));
            }
          }
          SOURCES.add(new Source(f.getFileName().toString(), tree, tables));
        }
      }
    }
    assertFalse(SOURCES.isEmpty(), "no catalogs/*.yaml found");
    for (int k = 0; k < 3; k++) {
      var spec = CatalogGenerator.Spec.of(3 + 2 * k, 3 + k, 2 + k, 1 + k, 3 * k, 1000 + k);
      Catalog c = CatalogGenerator.generate(spec);
      add("generated-" + k, k == 2 ? CatalogGenerator.choosing(c, 7, 2.0) : c);
    }
    add("random-portfolio", RandomCatalogs.random(new Random(41), 4, 4, 2, 2, 4, true));
    add("random-choice", RandomChoiceCatalogs.tiny(43, true));
    Path probe = tmp.resolve("probe-fifo");
    try {
      fifos = new ProcessBuilder("mkfifo", probe.toString()).start().waitFor() == 0;
    } catch (IOException e) {
      fifos = false;
    }
    watchdog = Executors.newSingleThreadExecutor(r -> {
      Thread t = new Thread(r, "mutation-case");
      t.setDaemon(true); // a hung case must not keep the test JVM alive
      return t;
    });
  }

  @AfterAll
  static void stopWatchdog() {
    watchdog.shutdownNow();
  }

  private static void add(String name, Catalog c) throws Exception {
    String yaml = CatalogWriter.toYaml(c);
    SOURCES.add(new Source(name + ".yaml", CatalogLoader.parseTree(yaml, "g.yaml"), Map.of()));
  }

  @Test
  void unmutatedCatalogsAreValid() throws Exception {
    for (Source s : SOURCES) {
      Path dir = Files.createDirectories(tmp.resolve("plain-" + s.name()));
      Path file = write(dir, s.name(), YAML.writeValueAsString(s.tree()), s.tables());
      CliRun r = CliRun.of("check", file.toString());
      assertEquals(0, r.code(), s.name() + "\n" + r);
    }
  }

  @Test
  void mutatedCatalogsAreRefusedInWordsOrSolved() throws Exception {
    Map<Kind, int[]> tally = new EnumMap<>(Kind.class); // refused, solved
    for (Kind k : Kind.values()) {
      tally.put(k, new int[2]);
    }
    String only = System.getProperty("mixwright.mutation.case");
    List<String> failures = new ArrayList<>();
    for (int i = 0; i < CASES; i++) {
      if (only != null && Integer.parseInt(only) != i) {
        continue;
      }
      int n = i;
      Future<?> f = watchdog.submit(() -> {
        Cases.one(Cases.seed(n), (seed, rnd) -> oneCase(n, seed, rnd, tally));
        return null;
      });
      try {
        f.get(HANG_GUARD_SECONDS, TimeUnit.SECONDS);
      } catch (ExecutionException e) {
        failures.add("case " + n + ": " + e.getCause().getMessage());
      } catch (TimeoutException e) {
        f.cancel(true);
        // the case's thread may still run: stop here rather than let it slow every later case
        fail("case " + n + " (seed " + Cases.seed(n) + ") did not end within " + HANG_GUARD_SECONDS
            + " s — a hang; run it alone with -Dmixwright.mutation.case=" + n + "\n" + String.join("\n\n", failures));
      }
    }
    // every failing case is counted, the first few shown in full (each names its seed)
    assertTrue(failures.isEmpty(), failures.size() + " cases failed (run one alone with"
        + " -Dmixwright.mutation.case=N):\n" + String.join("\n\n", failures.subList(0, Math.min(8, failures.size()))));
    StringBuilder sb = new StringBuilder("mutations (refused/solved):");
    int refused = 0;
    int solved = 0;
    for (var e : tally.entrySet()) {
      sb.append(' ').append(e.getKey()).append('=').append(e.getValue()[0]).append('/').append(e.getValue()[1]);
      refused += e.getValue()[0];
      solved += e.getValue()[1];
    }
    System.out.println(sb + " — total " + refused + " refused, " + solved + " solved");
    if (only == null) {
      assertEquals(CASES, refused + solved);
      assertTrue(refused > CASES / 4 && solved > CASES / 20, sb.toString());
    }
  }

  private static void oneCase(int n, long seed, Random rnd, Map<Kind, int[]> tally) throws Exception {
    Kind kind = Kind.values()[rnd.nextInt(Kind.values().length)];
    // a table can be broken only in a catalog that names one
    List<Source> sources = kind == Kind.BROKEN_TABLE || kind == Kind.EXTREME_TABLE_FIGURE
        ? SOURCES.stream().filter(x -> !x.tables().isEmpty()).toList() : SOURCES;
    Source src = pick(rnd, sources);
    Path dir = Files.createDirectories(tmp.resolve("case-" + n));
    JsonNode tree = src.tree().deepCopy();
    Map<String, String> tables = new LinkedHashMap<>(src.tables());
    boolean json = !kind.onText() && rnd.nextInt(4) == 0;
    List<String> extraArgs = new ArrayList<>();
    String text = null;
    String special = null;
    switch (kind) {
      case DELETE_FIELD -> {
        Slot s = pick(rnd, slots(tree, false));
        if (s.parent() instanceof ObjectNode o) {
          o.remove(s.key());
        } else {
          ((ArrayNode) s.parent()).remove(s.index());
        }
      }
      case ODD_VALUE -> pick(rnd, slots(tree, true)).set(oddValue(rnd));
      case MISSPELT_KEY -> misspell(tree, rnd);
      case EXTREME_NUMBER -> pick(rnd, numbers(tree)).set(extreme(rnd));
      case TINY_NUMBER -> pick(rnd, numbers(tree)).set(JsonNodeFactory.instance.numberNode(
          rnd.nextBoolean() ? 1e-300 : Double.MIN_VALUE));
      case DUPLICATE_ID -> duplicateId(tree, rnd);
      case UNKNOWN_REFERENCE -> unknownReference(tree, rnd);
      case WRONG_NESTING -> {
        Slot s = pick(rnd, slots(tree, false));
        JsonNode v = s.get();
        if (rnd.nextBoolean()) {
          s.set(JsonNodeFactory.instance.arrayNode().add(v));
        } else {
          s.set(JsonNodeFactory.instance.objectNode().set("inner", v));
        }
      }
      case LONG_ID -> pick(rnd, ids(tree)).set(JsonNodeFactory.instance.textNode(
          "x".repeat(rnd.nextBoolean() ? Limits.MAX_ID_LENGTH + 1 : 3 << 20)));
      case CONTROL_CHARACTERS -> pick(rnd, ids(tree)).set(JsonNodeFactory.instance.textNode(
          pick(rnd, List.of("red\u001b[31m", "bell\u0007", "cr\rx", "nul\u0000x", "bidi\u202ex"))));
      case TOO_MANY_OPTIONS -> tooManyOptions(tree, rnd);
      case SPECIAL_TABLE_FILE -> extraArgs.addAll(specialTable(tree, rnd, dir));
      case SPECIAL_CATALOG_FILE -> special = specialCatalog(rnd, dir);
      case BROKEN_TABLE, EXTREME_TABLE_FIGURE -> {
        String name = pick(rnd, List.copyOf(tables.keySet()));
        tables.put(name, kind == Kind.BROKEN_TABLE
            ? brokenTable(tables.get(name), rnd) : extremeTableFigure(tables.get(name), rnd));
      }
      default -> { }
    }
    if (kind.onText()) {
      String yaml = YAML.writeValueAsString(tree);
      text = switch (kind) {
        case TRUNCATED -> yaml.substring(0, rnd.nextInt(yaml.length()));
        case GARBAGE -> garbage(yaml, rnd);
        case YAML_TAG -> insertAfterColon(yaml, rnd, pick(rnd, List.of("!!set ", "!!binary ", "!!str ",
            "!!float ", "!custom ", "!!omap ")));
        case YAML_ANCHOR -> anchor(yaml, rnd);
        case LONG_LINE -> longLine(yaml, rnd);
        default -> duplicateKey(yaml, rnd);
      };
    } else if (kind == Kind.NON_FINITE) {
      // YAML writes .nan and .inf, JSON the bare words Jackson reads only when told to: both must be refused
      json = rnd.nextBoolean();
      pick(rnd, numbers(tree)).set(JsonNodeFactory.instance.textNode("NONFINITE"));
      String word = json ? pick(rnd, List.of("NaN", "Infinity", "-Infinity"))
          : pick(rnd, List.of(".nan", ".inf", "-.inf", ".NaN", "+.Inf"));
      text = (json ? JSON : YAML).writeValueAsString(tree).replaceFirst("['\"]?NONFINITE['\"]?", word);
      assertTrue(text.contains(word), "the non-finite figure was not written: " + text);
    }
    String name = special != null ? special : json ? "catalog.json" : "catalog.yaml";
    if (text == null) {
      text = (json ? JSON : YAML).writeValueAsString(tree);
    }
    Path file = special != null ? dir.resolve(special) : write(dir, name, text, tables);
    String what = "case " + n + " (" + kind + " of " + src.name() + (json ? " as JSON" : "") + ")";

    List<String> args = new ArrayList<>(List.of("check", file.toString(), "--count-time", "300ms"));
    args.addAll(extraArgs);
    CliRun check = CliRun.of(args.toArray(String[]::new));
    assertWellBehaved(check, "check of " + what, true);
    if (kind.refused) {
      assertEquals(2, check.code(), "must be refused: check of " + what + "\n" + check);
    }
    assertTrue(check.code() == 0 || check.code() == 2, "check of " + what + "\n" + check);

    // solve must agree with check: refuse what check refused, and solve what check found valid
    Path run = dir.resolve("run");
    List<String> solveArgs = new ArrayList<>(List.of("solve", file.toString(), "--out", run.toString(),
        "--time-limit", SOLVE_LIMIT, "--portfolio-time-limit", SOLVE_LIMIT));
    solveArgs.addAll(extraArgs.contains("--allow-outside-tables") ? List.of("--allow-outside-tables") : List.of());
    if (check.code() == 2 && rnd.nextInt(REFUSED_SOLVE_EVERY) != 0) {
      tally.get(kind)[0]++;
      return;
    }
    CliRun solve = CliRun.of(solveArgs.toArray(String[]::new));
    assertWellBehaved(solve, "solve of " + what, check.code() == 2);
    if (check.code() == 2) {
      assertEquals(2, solve.code(), "check refused it, solve did not: " + what + "\n" + check + "\n" + solve);
      tally.get(kind)[0]++;
      return;
    }
    assertTrue(solve.code() == 0 || solve.code() == 1, "check found it valid, solve did not end with a result: "
        + what + "\n" + check + "\n" + solve);
    RunResult result = RunResult.read(run);
    assertTrue(result != null, "no result.json: " + what);
    tally.get(kind)[1]++;
  }

  /** Never a fault, a stack trace or a raw control character; a refusal names a path. */
  private static void assertWellBehaved(CliRun r, String what, boolean catalogProblems) {
    String shown = what + "\n" + r.toString().replaceAll("[\\p{Cntrl}&&[^\\n]]", "?");
    if (shown.length() > 4000) {
      shown = shown.substring(0, 4000) + "...";
    }
    assertTrue(r.code() != 3, "internal fault: " + shown);
    String all = r.out() + r.err();
    assertFalse(all.contains("\tat ") || all.contains("Exception"), "stack trace or exception: " + shown);
    for (int i = 0; i < all.length(); i++) {
      char c = all.charAt(i);
      assertFalse(c < 0x20 && c != '\n' || c == 0x7f || c == '\u202e', "raw control character " + (int) c + ": "
          + shown.replaceAll("\\p{Cntrl}", "?"));
    }
    // a problem quotes at most a short excerpt of the catalog's text (CatalogProblem cuts at 1,000)
    for (String line : r.err().split("\n")) {
      assertTrue(line.length() < 1_500, "a line of " + line.length() + " characters: " + shown);
    }
    if (r.code() == 2) {
      Matcher m = PROBLEM_LINE.matcher(r.err());
      assertTrue(r.err().startsWith("mixwright: ") && (!catalogProblems || m.find()), "no path-named problem: " + shown);
    }
  }

  private static Path write(Path dir, String name, String text, Map<String, String> tables) throws IOException {
    for (var t : tables.entrySet()) {
      Files.writeString(dir.resolve(t.getKey()), t.getValue());
    }
    Path file = dir.resolve(name);
    Files.write(file, text.getBytes(StandardCharsets.UTF_8));
    return file;
  }

  // ------------------------------------------------------------------ places in a tree

  /** A place holding a value: a field of a mapping or an entry of a list. */
  record Slot(JsonNode parent, String key, int index) {
    JsonNode get() {
      return key != null ? parent.get(key) : parent.get(index);
    }

    void set(JsonNode v) {
      if (key != null) {
        ((ObjectNode) parent).set(key, v);
      } else {
        ((ArrayNode) parent).set(index, v);
      }
    }
  }

  private static List<Slot> slots(JsonNode tree, boolean leavesOnly) {
    List<Slot> out = new ArrayList<>();
    collect(tree, out, leavesOnly);
    return out;
  }

  private static void collect(JsonNode n, List<Slot> out, boolean leavesOnly) {
    if (n.isObject()) {
      for (var e : n.properties()) {
        if (!leavesOnly || e.getValue().isValueNode()) {
          out.add(new Slot(n, e.getKey(), -1));
        }
        collect(e.getValue(), out, leavesOnly);
      }
    } else if (n.isArray()) {
      for (int i = 0; i < n.size(); i++) {
        if (!leavesOnly || n.get(i).isValueNode()) {
          out.add(new Slot(n, null, i));
        }
        collect(n.get(i), out, leavesOnly);
      }
    }
  }

  private static List<Slot> numbers(JsonNode tree) {
    return slots(tree, true).stream().filter(s -> s.get().isNumber()).toList();
  }

  private static List<Slot> ids(JsonNode tree) {
    return slots(tree, true).stream().filter(s -> "id".equals(s.key())).toList();
  }

  private static <T> T pick(Random rnd, List<T> items) {
    return items.get(rnd.nextInt(items.size()));
  }

  // ------------------------------------------------------------------ mutations

  private static JsonNode oddValue(Random rnd) {
    JsonNodeFactory f = JsonNodeFactory.instance;
    return switch (rnd.nextInt(9)) {
      case 0 -> f.textNode("abc");
      case 1 -> f.booleanNode(rnd.nextBoolean());
      case 2 -> f.nullNode();
      case 3 -> f.arrayNode();
      case 4 -> f.objectNode();
      case 5 -> f.numberNode(-1);
      case 6 -> f.numberNode(0);
      case 7 -> f.textNode("");
      default -> f.textNode("12");
    };
  }

  private static JsonNode extreme(Random rnd) {
    JsonNodeFactory f = JsonNodeFactory.instance;
    return switch (rnd.nextInt(7)) {
      case 0 -> f.numberNode(1e300);
      case 1 -> f.numberNode(-1e300);
      case 2 -> f.numberNode(Double.MAX_VALUE);
      case 3 -> f.numberNode(-Double.MAX_VALUE);
      case 4 -> f.numberNode(1e10);
      case 5 -> f.numberNode(-3e9);
      default -> f.numberNode(new BigInteger("1" + "0".repeat(40)));
    };
  }

  /** Renames a field of a mapping to a near miss (a letter dropped or doubled, the case changed). */
  private static void misspell(JsonNode tree, Random rnd) {
    List<Slot> fields = slots(tree, false).stream()
        .filter(s -> s.key() != null && s.key().length() >= 3 && !isIdMap(s.parent())).toList();
    Slot s = pick(rnd, fields);
    String k = s.key();
    int at = 1 + rnd.nextInt(k.length() - 1);
    String wrong = switch (rnd.nextInt(3)) {
      case 0 -> k.substring(0, at) + k.substring(at + 1);
      case 1 -> k.substring(0, at) + k.charAt(at) + k.substring(at);
      default -> k.toUpperCase(java.util.Locale.ROOT);
    };
    ObjectNode o = (ObjectNode) s.parent();
    JsonNode v = o.remove(k);
    o.set(wrong, v);
  }

  /**
   * Mappings whose keys are ids or group names the catalog chose (uses, accepts, utility, value,
   * rule sides): a renamed key there is an unknown reference, tested as such, or may name another
   * real one.
   */
  private static boolean isIdMap(JsonNode parent) {
    for (var e : parent.properties()) {
      if (List.of("format", "name", "groups", "id", "options", "price", "prices", "cost", "capacity",
          "demand", "buyers", "portfolio", "choice", "segments", "rules", "resources", "label", "unit",
          "required", "optionsFile", "utilityFile", "currency", "period", "maxShare", "when", "require",
          "forbid", "accepts", "value", "stayOut", "priceWeight", "utility", "introductionCost",
          "maxVariants", "minLot", "tooling", "current", "variant").contains(e.getKey())) {
        return false;
      }
    }
    return true;
  }

  /** Gives an entry of a list of ids the id of another entry of the same list. */
  private static void duplicateId(JsonNode tree, Random rnd) {
    List<ArrayNode> lists = new ArrayList<>();
    for (JsonNode n : allNodes(tree)) {
      boolean allIds = true;
      for (JsonNode e : n) {
        allIds &= e.has("id") && e.get("id").isTextual();
      }
      if (n.isArray() && n.size() >= 2 && allIds) {
        lists.add((ArrayNode) n);
      }
    }
    ArrayNode list = pick(rnd, lists);
    int a = rnd.nextInt(list.size());
    int b = (a + 1 + rnd.nextInt(list.size() - 1)) % list.size();
    ((ObjectNode) list.get(b)).set("id", list.get(a).get("id"));
  }

  /** Renames a group or option referred to by a rule or a segment, or a resource an option uses. */
  private static void unknownReference(JsonNode tree, Random rnd) {
    List<Slot> refs = new ArrayList<>();
    for (String section : List.of("rules", "segments")) {
      JsonNode s = tree.get(section);
      if (s != null) {
        for (Slot slot : slots(s, true)) {
          if (slot.key() == null && slot.get().isTextual()) {
            refs.add(slot);
          }
        }
      }
    }
    List<JsonNode> uses = tree.findValues("uses");
    if (refs.isEmpty() || !uses.isEmpty() && rnd.nextInt(3) == 0) {
      ((ObjectNode) pick(rnd, uses)).put("zz-unknown-resource", 1);
      return;
    }
    pick(rnd, refs).set(JsonNodeFactory.instance.textNode("zz-unknown"));
  }

  private static void tooManyOptions(JsonNode tree, Random rnd) {
    ArrayNode groups = (ArrayNode) tree.get("groups");
    ObjectNode g = (ObjectNode) groups.get(rnd.nextInt(groups.size()));
    g.remove("optionsFile");
    ArrayNode opts = g.putArray("options");
    for (int i = 0; i <= Limits.MAX_OPTIONS_PER_GROUP; i++) {
      opts.addObject().put("id", "o" + i).put("price", i).put("cost", 0);
    }
  }

  /** Points a group's optionsFile at something no catalog may read; returns extra arguments. */
  private static List<String> specialTable(JsonNode tree, Random rnd, Path dir) throws Exception {
    ArrayNode groups = (ArrayNode) tree.get("groups");
    ObjectNode g = (ObjectNode) groups.get(rnd.nextInt(groups.size()));
    int choice = rnd.nextInt(fifos ? 7 : 6);
    List<String> extra = new ArrayList<>();
    String name;
    switch (choice) {
      case 0 -> name = "/etc/passwd";
      case 1 -> name = "/proc/self/environ";
      case 2 -> name = "../outside.csv";
      case 3 -> {
        Files.createSymbolicLink(dir.resolve("zero.csv"), Path.of("/dev/zero"));
        name = "zero.csv";
        if (rnd.nextBoolean()) {
          extra.add("--allow-outside-tables"); // allowed out, but still no device
        }
      }
      case 4 -> {
        Files.createDirectories(dir.resolve("folder.csv"));
        name = "folder.csv";
      }
      case 5 -> {
        sparse(dir.resolve("big.csv"), Limits.MAX_TABLE_BYTES + 10);
        name = "big.csv";
      }
      default -> {
        new ProcessBuilder("mkfifo", dir.resolve("pipe.csv").toString()).start().waitFor();
        name = "pipe.csv";
      }
    }
    g.put("optionsFile", name);
    return extra;
  }

  /** The catalog file itself is something no command may read: returns its name in {@code dir}. */
  private static String specialCatalog(Random rnd, Path dir) throws Exception {
    switch (rnd.nextInt(fifos ? 4 : 3)) {
      case 0 -> {
        Files.createSymbolicLink(dir.resolve("zero.yaml"), Path.of("/dev/zero"));
        return "zero.yaml";
      }
      case 1 -> {
        Files.createDirectories(dir.resolve("folder.yaml"));
        return "folder.yaml";
      }
      case 2 -> {
        sparse(dir.resolve("big.yaml"), Limits.MAX_FILE_BYTES + 10);
        return "big.yaml";
      }
      default -> {
        new ProcessBuilder("mkfifo", dir.resolve("pipe.yaml").toString()).start().waitFor();
        return "pipe.yaml";
      }
    }
  }

  /** A file of {@code size} zero bytes that takes no time to write (a hole on most file systems). */
  private static void sparse(Path file, long size) throws IOException {
    try (var f = new java.io.RandomAccessFile(file.toFile(), "rw")) {
      f.setLength(size);
    }
  }

  private static String brokenTable(String csv, Random rnd) {
    String[] lines = csv.split("\n", -1);
    int i = rnd.nextInt(lines.length);
    return switch (rnd.nextInt(6)) {
      case 0 -> csv.substring(0, rnd.nextInt(csv.length()));
      case 1 -> replaceLine(lines, i, lines[i] + ",extra");
      case 2 -> replaceLine(lines, i, lines[i].replaceFirst(",[^,]*", ",abc"));
      case 3 -> replaceLine(lines, i, lines[i].replaceFirst(",[^,]*", ",-1"));
      case 4 -> garbage(csv, rnd);
      default -> "";
    };
  }

  private static String extremeTableFigure(String csv, Random rnd) {
    String[] lines = csv.split("\n", -1);
    List<Integer> numeric = new ArrayList<>(); // (row, cell) pairs packed: the figures of the table
    for (int i = 1; i < lines.length; i++) {
      String[] cells = lines[i].split(",", -1);
      for (int c = 0; c < cells.length; c++) {
        if (cells[c].matches("\\s*-?[0-9.]+\\s*")) {
          numeric.add(i * 1000 + c);
        }
      }
    }
    int at = pick(rnd, numeric);
    String[] cells = lines[at / 1000].split(",", -1);
    cells[at % 1000] = pick(rnd, List.of("1e300", "1e10", "-3e9", "1.7976931348623157e308", "NaN", "Infinity"));
    return replaceLine(lines, at / 1000, String.join(",", cells));
  }

  private static String replaceLine(String[] lines, int i, String line) {
    String[] copy = lines.clone();
    copy[i] = line;
    return String.join("\n", copy);
  }

  private static String garbage(String text, Random rnd) {
    byte[] junk = new byte[1 + rnd.nextInt(64)];
    rnd.nextBytes(junk);
    int at = rnd.nextInt(text.length() + 1);
    return text.substring(0, at) + new String(junk, StandardCharsets.ISO_8859_1) + text.substring(at);
  }

  private static final Pattern KEY_VALUE = Pattern.compile("(?m)^(\\s*(?:- )?[A-Za-z]+): (\\S.*)$");

  private static String insertAfterColon(String yaml, Random rnd, String insert) {
    List<int[]> spots = new ArrayList<>();
    Matcher m = KEY_VALUE.matcher(yaml);
    while (m.find()) {
      spots.add(new int[] {m.start(2)});
    }
    int at = pick(rnd, spots)[0];
    return yaml.substring(0, at) + insert + yaml.substring(at);
  }

  private static String anchor(String yaml, Random rnd) {
    String anchored = insertAfterColon(yaml, rnd, "&a ");
    return rnd.nextBoolean() ? anchored : anchored + "extra: *a\n";
  }

  /** A comment, a label or a plain value run on past the longest line a YAML file may have. */
  private static String longLine(String yaml, Random rnd) {
    String unit = rnd.nextBoolean() ? "x" : "ab ";
    String run = unit.repeat((rnd.nextBoolean() ? Limits.MAX_YAML_LINE : 3 << 20) / unit.length() + 1);
    return rnd.nextBoolean() ? "# " + run + "\n" + yaml : insertAfterColon(yaml, rnd, run);
  }

  private static String duplicateKey(String yaml, Random rnd) {
    List<String> lines = new ArrayList<>(List.of(yaml.split("\n")));
    List<Integer> keyLines = new ArrayList<>();
    for (int i = 0; i < lines.size(); i++) {
      if (KEY_VALUE.matcher(lines.get(i)).matches() && !lines.get(i).strip().startsWith("- ")) {
        keyLines.add(i);
      }
    }
    int i = pick(rnd, keyLines);
    lines.add(i + 1, lines.get(i));
    return String.join("\n", lines) + "\n";
  }

  private static List<JsonNode> allNodes(JsonNode tree) {
    List<JsonNode> out = new ArrayList<>();
    out.add(tree);
    for (Slot s : slots(tree, false)) {
      out.add(s.get());
    }
    return out;
  }
}
