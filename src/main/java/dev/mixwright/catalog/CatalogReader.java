package dev.mixwright.catalog;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.catalog.Checks.Figure;
import dev.mixwright.catalog.Checks.IdKind;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Walks a parsed catalog tree by hand, so that every problem is reported with its exact path and
 * the walk goes on after it: one pass collects all problems. Sections are read in the order
 * resources, groups, rules, segments, so each reference can be checked against the ids declared
 * before it. Only single-rule checks happen here; what several rules do together is analysed on the
 * compiled variant space.
 *
 * <p>Not thread-safe; one instance reads one document.
 */
final class CatalogReader {
  private static final List<String> TOP_FIELDS =
      List.of(
          "format",
          "name",
          "currency",
          "period",
          "resources",
          "groups",
          "rules",
          "segments",
          "portfolio",
          "current",
          "exclude");
  private static final List<String> RESOURCE_FIELDS = List.of("id", "label", "unit", "capacity");
  private static final List<String> GROUP_FIELDS =
      List.of("id", "label", "required", "options", "optionsFile");
  private static final List<String> OPTION_FIELDS = List.of("id", "label", "price", "cost", "uses", "tooling", "prices");
  private static final List<String> RULE_FIELDS =
      List.of("id", "note", "when", "require", "forbid");
  private static final List<String> SEGMENT_FIELDS =
      List.of("id", "label", "demand", "maxShare", "accepts", "value", "choice");
  private static final List<String> CHOICE_FIELDS =
      List.of("buyers", "stayOut", "priceWeight", "utility", "utilityFile");
  private static final List<String> PORTFOLIO_FIELDS =
      List.of("introductionCost", "maxVariants", "minLot", "wholeUnits");

  static final String PRICE_HINT = "the list price this option adds, e.g. price: 520";
  static final String PRICES_HINT =
      "the price points to choose from, e.g. prices: [760, 820, 880] (each becomes a choice of its"
          + " own, written option@price in a variant)";
  static final String COST_HINT = "the variable cost this option adds, e.g. cost: 210";
  static final String TOOLING_HINT =
      "the one-off cost of offering this option at all (paid once by the portfolio, whatever the"
          + " number of variants using it), e.g. tooling: 40000; leave it out for none";

  /** The parts of a rule or segment that map groups to lists of choices. */
  private enum Clause {
    WHEN(
        "the condition of the rule, e.g. when: {refrigerant: [r290]}",
        "the rule can never fire; list the choices of '%s' that trigger it, or drop '%s'"),
    REQUIRE(
        "what must hold when the rule fires, e.g. require: {topology: [monobloc, hybrid]}",
        "it can never be satisfied, so every variant matching when would be forbidden; list the"
            + " allowed choices of '%s', or drop '%s' (to rule a combination out, use forbid)"),
    FORBID(
        "the combination never offered, e.g. forbid: {casing: [slim], coil: [oversized]}",
        "it forbids nothing; list the choices of '%s' to rule out, or drop '%s'"),
    ACCEPTS(
        "the choices a variant sold here must have, e.g. accepts: {compressor: [scroll, eviscroll]}",
        "the segment would accept no variant; list the accepted choices of '%s', or drop '%s'"
            + " to accept any");

    final String purpose;
    final String emptyList;

    Clause(String purpose, String emptyList) {
      this.purpose = purpose;
      this.emptyList = emptyList;
    }
  }

  /** What later sections may refer to in a group, known even when parts of the group are wrong. */
  static final class GroupRef {
    final String id;

    /** Null when the file's {@code required} is not a boolean: then {@code none} is not checked. */
    final Boolean required;

    final Map<String, String> optionIdAt = new LinkedHashMap<>();

    /** False when an option table could not be read: references to its options go unchecked. */
    boolean complete = true;

    GroupRef(String id, Boolean required) {
      this.id = id;
      this.required = required;
    }

    List<String> choices() {
      List<String> c = new ArrayList<>(optionIdAt.keySet());
      if (Boolean.FALSE.equals(required)) {
        c.add(Group.NONE);
      }
      return c;
    }
  }

  private final String document;
  private final Path baseDir;
  private final TableReach reach;
  private final List<CatalogProblem> problems = new ArrayList<>();
  private final Map<String, String> resourceIdAt = new LinkedHashMap<>();
  private final Map<String, GroupRef> groupsById = new LinkedHashMap<>();
  private final Map<String, String> groupIdAt = new LinkedHashMap<>();
  private final Map<String, String> segmentIdAt = new LinkedHashMap<>();
  private final Map<String, String> ruleIdAt = new LinkedHashMap<>();

  /**
   * @param document the file name, the path of problems with the document as a whole
   * @param baseDir folder option tables are read from, or null when there is none
   */
  CatalogReader(String document, Path baseDir) {
    this(document, baseDir, TableReach.CATALOG_FOLDER);
  }

  /** @param reach where the option and utility tables the catalog names may lie */
  CatalogReader(String document, Path baseDir, TableReach reach) {
    this.document = document;
    this.baseDir = baseDir;
    this.reach = reach;
  }

  TableReach reach() {
    return reach;
  }

  Catalog read(JsonNode root) throws CatalogException {
    if (root == null || root.isMissingNode() || root.isNull()) {
      problem(
          document,
          "the file is empty — a catalog starts with format: 1, then resources, groups, rules and"
              + " segments");
      throw new CatalogException(problems);
    }
    if (!root.isObject()) {
      problem(
          document,
          "must be a mapping with format, resources, groups, rules and segments at the top, got "
              + Where.describe(root));
      throw new CatalogException(problems);
    }
    unknownFields(root, "", TOP_FIELDS, "the top level");
    int beforeSizes = problems.size();
    tooMany(root.get("resources"), "resources", Limits.MAX_RESOURCES, "resources");
    tooMany(root.get("groups"), "groups", Limits.MAX_GROUPS, "option groups");
    tooMany(root.get("rules"), "rules", Limits.MAX_RULES, "rules");
    tooMany(root.get("segments"), "segments", Limits.MAX_SEGMENTS, "segments");
    if (problems.size() != beforeSizes) {
      throw new CatalogException(problems);
    }
    int format = readFormat(root.get("format"));
    String name = optionalText(root, "", "name");
    String currency = optionalText(root, "", "currency");
    String period = optionalText(root, "", "period");
    List<Resource> resources = readResources(value(root, "resources"));
    List<Group> groups = readGroups(value(root, "groups"));
    List<Rule> rules = readRules(value(root, "rules"));
    List<Segment> segments = readSegments(value(root, "segments"));
    Optional<PortfolioSpec> portfolio = readPortfolio(value(root, "portfolio"));
    if (!problems.isEmpty()) {
      throw new CatalogException(problems);
    }
    Catalog catalog = new Catalog(
        format, name, currency, period, resources, groups, rules, segments, portfolio);
    // current range (issue 10): read once the groups and rules it refers to are known
    return CurrentRangeReader.read(root, catalog);
  }

  // ---------------------------------------------------------------- sections

  private int readFormat(JsonNode v) {
    String hint = "the catalog format this version reads";
    if (v == null || v.isNull()) {
      problem("format", "missing — add format: 1 at the top of the file (" + hint + ")");
      return 0;
    }
    if (!v.isNumber()) {
      problem(
          "format", "must be the number 1, got " + Where.describe(v) + unquoteHint(v, "format"));
      return 0;
    }
    if (v.doubleValue() != 1) {
      problem(
          "format",
          "this version reads format 1 only, got "
              + Where.num(v.doubleValue())
              + " — the file was written for another version of the format");
      return 0;
    }
    return 1;
  }

  private List<Resource> readResources(JsonNode v) {
    List<Resource> out = new ArrayList<>();
    if (v == null) {
      return out;
    }
    if (!v.isArray()) {
      problem(
          "resources",
          "must be a list of resources, e.g. [{id: brazing, capacity: 48000}], got "
              + Where.describe(v));
      return out;
    }
    for (int i = 0; i < v.size(); i++) {
      String path = Where.index("resources", i);
      JsonNode r = v.get(i);
      if (!isMapping(r, path, "{id: brazing, capacity: 48000}")) {
        continue;
      }
      unknownFields(r, path, RESOURCE_FIELDS, "a resource");
      String id = requiredId(r, path, IdKind.RESOURCE);
      if (id != null) {
        unique(resourceIdAt, id, Where.field(path, "id"), IdKind.RESOURCE);
      }
      String label = optionalText(r, path, "label");
      String unit = optionalText(r, path, "unit");
      Double capacity =
          requiredNumber(
              r,
              path,
              "capacity",
              "the capacity per period in the resource's unit, e.g. capacity: 14000",
              Figure.QUANTITY);
      if (id != null && capacity != null) {
        out.add(new Resource(id, label, unit, capacity));
      }
    }
    return out;
  }

  private List<Group> readGroups(JsonNode v) {
    List<Group> out = new ArrayList<>();
    String example = "[{id: compressor, options: [{id: scroll, price: 520, cost: 480}]}]";
    if (v == null) {
      problem(
          "groups", "missing — a catalog needs at least one option group, e.g. groups: " + example);
      return out;
    }
    if (!v.isArray()) {
      problem(
          "groups",
          "must be a list of option groups, e.g. " + example + ", got " + Where.describe(v));
      return out;
    }
    if (v.isEmpty()) {
      problem(
          "groups",
          "is empty — a catalog needs at least one option group, e.g. groups: " + example);
    }
    long totalOptions = 0;
    for (int i = 0; i < v.size(); i++) {
      String path = Where.index("groups", i);
      JsonNode g = v.get(i);
      if (!isMapping(g, path, "{id: compressor, options: [...]}")) {
        continue;
      }
      unknownFields(g, path, GROUP_FIELDS, "a group");
      String id = requiredId(g, path, IdKind.GROUP);
      String label = optionalText(g, path, "label");
      Boolean required = optionalBoolean(g, path, "required", true);
      GroupRef ref = new GroupRef(id, required);
      if (id != null && unique(groupIdAt, id, Where.field(path, "id"), IdKind.GROUP)) {
        groupsById.put(id, ref);
      }
      List<Option> options = new ArrayList<>();
      boolean complete = true;
      int entries = 0;
      JsonNode inline = value(g, "options");
      JsonNode file = value(g, "optionsFile");
      String optionsPath = Where.field(path, "options");
      String filePath = Where.field(path, "optionsFile");
      if (inline == null && file == null) {
        problem(
            optionsPath,
            "missing — list the group's options, e.g. options: [{id: scroll, price: 520, cost: 480}],"
                + " or name a CSV table of them with optionsFile: heatpump-range-casings.csv");
        complete = false;
      }
      if (inline != null) {
        if (!inline.isArray()) {
          problem(
              optionsPath,
              "must be a list of options, e.g. [{id: scroll, price: 520, cost: 480}], got "
                  + Where.describe(inline));
          complete = false;
        } else if (inline.size() > Limits.MAX_OPTIONS_PER_GROUP) {
          problem(optionsPath, tooManyOptions(inline.size()));
          complete = false;
        } else {
          entries += inline.size();
          for (int k = 0; k < inline.size(); k++) {
            Option o = readOption(inline.get(k), Where.index(optionsPath, k), ref);
            if (o != null) {
              options.add(o);
            }
          }
        }
      }
      if (file != null) {
        if (!file.isTextual() || file.textValue().isBlank()) {
          problem(
              filePath,
              "must be the name of a CSV file next to the catalog, e.g. optionsFile: heatpump-range-casings.csv, got"
                  + " "
                  + Where.describe(file));
          complete = false;
        } else {
          int rows = CsvOptionTable.read(this, ref, filePath, file.textValue(), baseDir, options);
          if (rows < 0) {
            complete = false;
          } else {
            entries += rows;
          }
        }
      }
      ref.complete = complete;
      if (complete && entries == 0) {
        if (file == null) {
          problem(optionsPath, "is empty — a group needs at least one option");
        } else {
          problem(
              filePath + " " + file.textValue(),
              "has no option rows — a group needs at least one option; add a row below the header");
        }
      }
      if (id != null) {
        out.add(new Group(id, label, required == null || required, options));
      }
      totalOptions += entries;
    }
    if (totalOptions > Limits.MAX_OPTIONS) {
      problem(
          "groups",
          "have "
              + totalOptions
              + " options in all; a catalog has at most "
              + Limits.MAX_OPTIONS
              + ", far more than a real one needs — check that this is the right file");
    }
    return out;
  }

  private Option readOption(JsonNode o, String path, GroupRef ref) {
    if (!isMapping(o, path, "{id: scroll, price: 520, cost: 480}")) {
      return null;
    }
    unknownFields(o, path, OPTION_FIELDS, "an option");
    String id = requiredId(o, path, IdKind.OPTION);
    String label = optionalText(o, path, "label");
    List<Double> prices = readPrices(o, path);
    Double cost = requiredNumber(o, path, "cost", COST_HINT, Figure.MONEY);
    Map<String, Double> uses = readUses(value(o, "uses"), Where.field(path, "uses"));
    double tooling = optionalNumber(o, path, "tooling", 0, TOOLING_HINT, Figure.MONEY);
    if (id != null) {
      registerOption(ref, id, Where.field(path, "id"));
    }
    return id != null && prices != null && cost != null && uses != null
        ? new Option(id, label, prices, cost, uses, tooling)
        : null;
  }

  /** The option's price points: its {@code price}, or its {@code prices} list; null when wrong. */
  private List<Double> readPrices(JsonNode o, String path) {
    JsonNode list = value(o, "prices");
    String at = Where.field(path, "prices");
    if (list == null) {
      if (o.has("prices")) {
        problem(at, "is empty — give " + PRICES_HINT + ", or give a single price: 520 instead");
        return null;
      }
      Double price = requiredNumber(o, path, "price", PRICE_HINT, Figure.MONEY);
      return price == null ? null : List.of(price);
    }
    if (value(o, "price") != null) {
      problem(
          at,
          "given together with price — an option has either one price (price: 520) or price points"
              + " (prices: [760, 820, 880]); drop one of them");
      return null;
    }
    if (!list.isArray()) {
      String fix =
          list.isNumber() ? " — write it as a list, [" + Where.num(list.doubleValue()) + "], or use price" : "";
      problem(at, "must be a list of prices, got " + Where.describe(list) + fix + " — give " + PRICES_HINT);
      return null;
    }
    if (list.isEmpty()) {
      problem(at, "empty list — give at least one price point, e.g. prices: [760, 820, 880]");
      return null;
    }
    if (list.size() > Limits.MAX_PRICE_POINTS) {
      problem(
          at,
          "has "
              + list.size()
              + " price points; an option has at most "
              + Limits.MAX_PRICE_POINTS
              + " — keep the ones worth choosing between");
      return null;
    }
    List<Double> out = new ArrayList<>();
    Map<Double, String> firstAt = new LinkedHashMap<>();
    boolean ok = true;
    for (int k = 0; k < list.size(); k++) {
      String kAt = Where.index(at, k);
      Double x = number(list.get(k), kAt, "a price point of this option, e.g. 820", Figure.MONEY);
      if (x == null) {
        ok = false;
        continue;
      }
      String first = firstAt.putIfAbsent(x + 0.0, kAt);
      if (first != null) {
        problem(
            kAt,
            "repeats the price point " + Where.num(x) + " (first at " + first + ") — list each price once");
        ok = false;
        continue;
      }
      out.add(x);
    }
    return ok ? out : null;
  }

  private Map<String, Double> readUses(JsonNode v, String path) {
    Map<String, Double> uses = new LinkedHashMap<>();
    if (v == null) {
      return uses;
    }
    if (!v.isObject()) {
      problem(
          path,
          "must be a mapping of resource to amount per unit, e.g. uses: {brazing: 0.85}, got "
              + Where.describe(v));
      return null;
    }
    boolean ok = true;
    for (Map.Entry<String, JsonNode> e : v.properties()) {
      String at = Where.field(path, e.getKey());
      if (!resourceIdAt.containsKey(e.getKey())) {
        unknownResource(e.getKey(), at);
        ok = false;
      }
      Double amount =
          number(
              e.getValue(),
              at,
              "the amount of '" + e.getKey() + "' one unit with this option uses, e.g. 1.6",
              Figure.USE);
      if (amount == null) {
        ok = false;
      } else {
        uses.put(e.getKey(), amount);
      }
    }
    return ok ? uses : null;
  }

  private List<Rule> readRules(JsonNode v) {
    List<Rule> out = new ArrayList<>();
    if (v == null) {
      return out;
    }
    if (!v.isArray()) {
      problem(
          "rules",
          "must be a list of rules, e.g. [{when: {refrigerant: [r290]}, require: {topology: [monobloc]}}],"
              + " got "
              + Where.describe(v));
      return out;
    }
    for (int i = 0; i < v.size(); i++) {
      String path = Where.index("rules", i);
      JsonNode r = v.get(i);
      if (!isMapping(r, path, "{when: {refrigerant: [r290]}, require: {topology: [monobloc]}}")) {
        continue;
      }
      int before = problems.size();
      unknownFields(r, path, RULE_FIELDS, "a rule");
      String id = null;
      JsonNode idNode = value(r, "id");
      if (idNode != null) {
        id = idText(idNode, Where.field(path, "id"), IdKind.RULE);
        if (id != null) {
          unique(ruleIdAt, id, Where.field(path, "id"), IdKind.RULE);
        }
      }
      optionalText(r, path, "note"); // a note is for the people who read the file
      JsonNode w = value(r, "when");
      JsonNode q = value(r, "require");
      JsonNode f = value(r, "forbid");
      Map<String, List<String>> when =
          w == null ? Map.of() : clause(w, Where.field(path, "when"), Clause.WHEN);
      Map<String, List<String>> require =
          q == null ? Map.of() : clause(q, Where.field(path, "require"), Clause.REQUIRE);
      Map<String, List<String>> forbid =
          f == null ? Map.of() : clause(f, Where.field(path, "forbid"), Clause.FORBID);
      if (f != null && (w != null || q != null)) {
        problem(
            path,
            "has both forbid and when/require — a rule is either when + require (if ... then ...)"
                + " or forbid (never together); split it into two rules");
      } else if (f == null && w == null && q == null) {
        problem(
            path,
            "says nothing — write when: {group: [choices]} with require: {group: [choices]}, or"
                + " forbid: {group: [choices], group: [choices]}");
      } else if (w != null && q == null) {
        problem(
            Where.field(path, "require"),
            "missing — a rule with when also needs require: "
                + Clause.REQUIRE.purpose
                + "; to rule a combination out instead, use forbid");
      } else if (q != null && w == null) {
        problem(
            Where.field(path, "when"),
            "missing — a rule with require also needs when: "
                + Clause.WHEN.purpose
                + "; to rule choices out outright, use forbid: {group: [choices]}");
      }
      if (problems.size() == before) {
        out.add(new Rule(id, when, require, forbid));
      }
    }
    return out;
  }

  private List<Segment> readSegments(JsonNode v) {
    List<Segment> out = new ArrayList<>();
    String example = "[{id: retrofit, demand: 9000}]";
    if (v == null) {
      problem(
          "segments",
          "missing — a catalog needs at least one segment to sell to, e.g. segments: " + example);
      return out;
    }
    if (!v.isArray()) {
      problem(
          "segments", "must be a list of segments, e.g. " + example + ", got " + Where.describe(v));
      return out;
    }
    if (v.isEmpty()) {
      problem(
          "segments",
          "is empty — a catalog needs at least one segment to sell to, e.g. segments: " + example);
    }
    for (int i = 0; i < v.size(); i++) {
      String path = Where.index("segments", i);
      JsonNode s = v.get(i);
      if (!isMapping(s, path, "{id: retrofit, demand: 9000}")) {
        continue;
      }
      int before = problems.size();
      unknownFields(s, path, SEGMENT_FIELDS, "a segment");
      String id = requiredId(s, path, IdKind.SEGMENT);
      if (id != null) {
        unique(segmentIdAt, id, Where.field(path, "id"), IdKind.SEGMENT);
      }
      String label = optionalText(s, path, "label");
      JsonNode ch = value(s, "choice");
      if (ch == null && s.has("choice")) {
        ch = s.get("choice"); // written but empty: read as a choice section, so its fields are named
      }
      Choice choice = ch == null ? null : readChoice(s, ch, path);
      Double demand = null;
      double maxShare = 1;
      if (ch == null) {
        demand =
            requiredNumber(
                s,
                path,
                "demand",
                "the units per period this segment buys at most, e.g. demand: 9000",
                Figure.QUANTITY);
        JsonNode ms = value(s, "maxShare");
        if (ms != null) {
          String at = Where.field(path, "maxShare");
          Double x = number(ms, at, "a share of demand, e.g. maxShare: 0.35", Figure.SHARE);
          if (x != null) {
            String p = Checks.shareProblem(x);
            if (p != null) {
              problem(at, p);
            } else {
              maxShare = x;
            }
          }
        }
      }
      JsonNode a = value(s, "accepts");
      Map<String, List<String>> accepts =
          a == null ? Map.of() : clause(a, Where.field(path, "accepts"), Clause.ACCEPTS);
      JsonNode val = value(s, "value");
      Map<String, Double> valueMap =
          val == null ? Map.of() : readValue(val, Where.field(path, "value"));
      if (problems.size() == before) {
        out.add(
            choice != null
                ? Segment.choosing(id, label, accepts, valueMap, choice)
                : new Segment(id, label, demand, maxShare, accepts, valueMap));
      }
    }
    return out;
  }

  private Map<String, Double> readValue(JsonNode v, String path) {
    return readPerChoice(
        v,
        path,
        "must be a mapping of group.option to the extra value per unit, e.g. value:"
            + " {\"warranty.w5\": 90}, got ",
        "what this segment pays extra per unit for the choice (negative: pays less), e.g. 90",
        Figure.SIGNED_MONEY);
  }

  /** A mapping of {@code group.option} to a finite number, every key checked. */
  private Map<String, Double> readPerChoice(
      JsonNode v, String path, String notMapping, String hint, Figure kind) {
    Map<String, Double> out = new LinkedHashMap<>();
    if (!v.isObject()) {
      problem(path, notMapping + Where.describe(v));
      return out;
    }
    if (v.size() > Limits.MAX_UTILITY_ROWS) {
      problem(path, "has " + v.size() + " entries; at most " + Limits.MAX_UTILITY_ROWS + " are read");
      return out;
    }
    for (Map.Entry<String, JsonNode> e : v.properties()) {
      String key = e.getKey();
      String at = Where.field(path, key);
      Double x = number(e.getValue(), at, hint, kind);
      int dot = key.indexOf('.');
      if (dot <= 0 || dot == key.length() - 1) {
        problem(at, "write the key as group.option, " + valueKeyExample(key));
        continue;
      }
      String gid = key.substring(0, dot);
      GroupRef g = groupsById.get(gid);
      if (g == null) {
        unknownGroup(gid, at);
      } else {
        checkChoice(g, key.substring(dot + 1), at);
      }
      if (x != null) {
        out.put(key, x);
      }
    }
    return out;
  }

  private static final String CHOICE_EXAMPLE =
      "{buyers: 60000, stayOut: 1.2, priceWeight: -0.0045, utility: {\"capacity.c12\": 0.7}}";

  /** The {@code choice} section of a segment; null when it is wrong (the problems are recorded). */
  private Choice readChoice(JsonNode segment, JsonNode ch, String path) {
    int before = problems.size();
    String at = Where.field(path, "choice");
    if (value(segment, "demand") != null) {
      problem(
          Where.field(path, "demand"),
          "given together with choice — a segment that chooses has no fixed demand: its sales"
              + " follow from its buyers and what is offered to it; drop demand and give the"
              + " potential buyers as choice.buyers (or drop choice to keep a fixed demand)");
    }
    if (value(segment, "maxShare") != null) {
      problem(
          Where.field(path, "maxShare"),
          "given together with choice — in a segment that chooses the multinomial logit decides"
              + " each variant's share; drop maxShare (or drop choice to keep a fixed demand)");
    }
    if (!isMapping(ch, at, CHOICE_EXAMPLE)) {
      return null;
    }
    unknownFields(ch, at, CHOICE_FIELDS, "a choice section");
    Double buyers =
        requiredNumber(
            ch, at, "buyers", "the potential buyers per period, e.g. buyers: 60000", Figure.SIGNED_QUANTITY);
    if (buyers != null && buyers <= 0) {
      problem(
          Where.field(at, "buyers"),
          "must be > 0, got "
              + Where.num(buyers)
              + " — the number of potential buyers per period, e.g. buyers: 60000 (to leave the"
              + " segment out, delete it)");
    }
    double stayOut = 0;
    JsonNode so = value(ch, "stayOut");
    if (so != null) {
      Double x =
          number(
              so,
              Where.field(at, "stayOut"),
              "the utility of buying none of the offered variants, e.g. stayOut: 1.2",
              Figure.UTILITY);
      stayOut = x == null ? 0 : x;
    }
    String weightHint =
        "the utility per currency unit of the price the segment pays, e.g. priceWeight: -0.0045";
    Double priceWeight =
        requiredNumber(
            ch,
            at,
            "priceWeight",
            weightHint + " (0 if price does not matter to it)",
            Figure.UTILITY);
    if (priceWeight != null && priceWeight > 0) {
      problem(
          Where.field(at, "priceWeight"),
          "is positive ("
              + Where.num(priceWeight)
              + "), so buyers would prefer dearer variants — this is almost always a sign error;"
              + " write it negative, e.g. priceWeight: -"
              + Where.num(priceWeight));
    }
    Map<String, Double> utility = new LinkedHashMap<>();
    Map<String, String> utilityAt = new LinkedHashMap<>();
    JsonNode u = value(ch, "utility");
    String uPath = Where.field(at, "utility");
    if (u != null) {
      readPerChoice(
              u,
              uPath,
              "must be a mapping of group.option to the part-worth, e.g. utility: {\"capacity.c12\": 0.7,"
                  + " \"app.none\": -0.4}, got ",
              "the part-worth of the choice for this segment, e.g. 0.7",
              Figure.UTILITY)
          .forEach(
              (k, x) -> {
                utility.put(k, x);
                utilityAt.put(k, Where.field(uPath, k));
              });
    }
    JsonNode file = value(ch, "utilityFile");
    String filePath = Where.field(at, "utilityFile");
    if (file != null) {
      if (!file.isTextual() || file.textValue().isBlank()) {
        problem(
            filePath,
            "must be the name of a CSV file next to the catalog, e.g. utilityFile: homeowners.csv,"
                + " got "
                + Where.describe(file));
      } else {
        List<CsvUtilityTable.Entry> rows =
            CsvUtilityTable.read(this, filePath, file.textValue(), baseDir);
        for (CsvUtilityTable.Entry e : rows == null ? List.<CsvUtilityTable.Entry>of() : rows) {
          String first = utilityAt.putIfAbsent(e.key(), e.at());
          if (first != null) {
            problem(
                e.at(),
                "gives a part-worth for "
                    + e.key()
                    + " again (first at "
                    + first
                    + ") — inline utility and utilityFile are merged and each part-worth may be"
                    + " given once; keep one");
          } else {
            utility.put(e.key(), e.utility());
          }
        }
      }
    }
    if (problems.size() != before || buyers == null || priceWeight == null) {
      return null;
    }
    return new Choice(buyers, stayOut, priceWeight, utility);
  }

  /**
   * Checks a group id and a choice id given in separate places (a CSV row); false when either is
   * wrong (the problem is recorded).
   */
  boolean checkChoiceOf(String gid, String choice, String groupAt, String choiceAt) {
    GroupRef g = groupsById.get(gid);
    if (g == null) {
      unknownGroup(gid, groupAt);
      return false;
    }
    int before = problems.size();
    checkChoice(g, choice, choiceAt);
    return problems.size() == before;
  }

  /** An example key for a value entry, built from the catalog when the intended option is clear. */
  private String valueKeyExample(String key) {
    String bare = key.replace(".", "");
    List<String> owners = new ArrayList<>();
    for (GroupRef g : groupsById.values()) {
      if (g.optionIdAt.containsKey(bare)) {
        owners.add(g.id);
      }
    }
    if (owners.size() == 1) {
      return "e.g. \"" + owners.get(0) + "." + bare + "\" (the group, a dot, the option)";
    }
    return "e.g. \"warranty.w5\" (the group, a dot, the option)";
  }

  private Optional<PortfolioSpec> readPortfolio(JsonNode v) {
    if (v == null) {
      return Optional.empty();
    }
    if (!isMapping(v, "portfolio", "{introductionCost: 18000, maxVariants: 24, minLot: 150}")) {
      return Optional.empty();
    }
    unknownFields(v, "portfolio", PORTFOLIO_FIELDS, "the portfolio section");
    double introductionCost =
        optionalNumber(
            v,
            "portfolio",
            "introductionCost",
            0,
            "the fixed cost per distinct variant offered, e.g. introductionCost: 18000",
            Figure.MONEY);
    double minLot =
        optionalNumber(
            v,
            "portfolio",
            "minLot",
            0,
            "the least a variant offered is built, all segments together, e.g. minLot: 150",
            Figure.QUANTITY);
    int maxVariants = Integer.MAX_VALUE;
    JsonNode mv = value(v, "maxVariants");
    if (mv != null) {
      String at = "portfolio.maxVariants";
      String hint =
          "the most distinct variants offered, e.g. maxVariants: 24; leave it out for no limit";
      if (!mv.isNumber()) {
        problem(
            at,
            "must be a whole number >= 1, got "
                + Where.describe(mv)
                + unquoteHint(mv, "maxVariants")
                + " — "
                + hint);
      } else {
        double d = mv.doubleValue();
        if (!Double.isFinite(d) || d != Math.rint(d)) {
          problem(at, "must be a whole number >= 1, got " + Where.num(d) + " — " + hint);
        } else if (d < 1) {
          problem(at, "must be >= 1, got " + Where.num(d) + " — " + hint);
        } else if (d > Integer.MAX_VALUE) {
          problem(
              at, "must be at most " + Integer.MAX_VALUE + ", got " + Where.num(d) + " — " + hint);
        } else {
          maxVariants = (int) d;
        }
      }
    }
    boolean wholeUnits = false;
    JsonNode wu = value(v, "wholeUnits");
    if (wu != null) {
      if (wu.isBoolean()) {
        wholeUnits = wu.booleanValue();
      } else {
        problem(
            "portfolio.wholeUnits",
            "must be true or false, got "
                + Where.describe(wu)
                + unquoteHint(wu, "wholeUnits")
                + " — true: the integer stage sells whole units only; false (the default): any quantity");
      }
    }
    return Optional.of(new PortfolioSpec(introductionCost, maxVariants, minLot, wholeUnits));
  }

  static String tooManyOptions(int n) {
    return "has "
        + n
        + " options; a group has at most "
        + Limits.MAX_OPTIONS_PER_GROUP
        + " — split it into groups, or leave out options no one would choose";
  }

  /** A problem when a list has more entries than its limit (before anything in it is read). */
  private void tooMany(JsonNode list, String path, int max, String what) {
    if (list != null && list.isArray() && list.size() > max) {
      problem(
          path,
          "has "
              + list.size()
              + " "
              + what
              + "; a catalog has at most "
              + max
              + ", far more than a real one needs — check that this is the right file");
    }
  }

  // ---------------------------------------------------------------- clauses and references

  /** A mapping of group to choices, every group and choice checked; null when any is wrong. */
  private Map<String, List<String>> clause(JsonNode v, String path, Clause kind) {
    if (!v.isObject()) {
      problem(
          path,
          "must be a mapping of group to a list of choices, "
              + kind.purpose
              + ", got "
              + Where.describe(v));
      return null;
    }
    if (v.isEmpty() && kind != Clause.ACCEPTS) {
      problem(path, "names no group — it should give " + kind.purpose);
      return null;
    }
    boolean ok = true;
    Map<String, List<String>> out = new LinkedHashMap<>();
    for (Map.Entry<String, JsonNode> e : v.properties()) {
      String gid = e.getKey();
      String at = Where.field(path, gid);
      GroupRef g = groupsById.get(gid);
      if (g == null) {
        unknownGroup(gid, at);
        ok = false;
      }
      List<String> choices =
          choiceList(e.getValue(), at, g, String.format(kind.emptyList, gid, gid));
      if (choices == null) {
        ok = false;
      } else {
        out.put(gid, choices);
      }
    }
    return ok ? out : null;
  }

  private List<String> choiceList(JsonNode v, String path, GroupRef g, String whyNotEmpty) {
    if (!v.isArray()) {
      String fix =
          v.isTextual()
              ? " — write it as a list: [" + v.textValue() + "]"
              : " — write a list of choices, e.g. [scroll, eviscroll]";
      problem(path, "must be a list of choices, got " + Where.describe(v) + fix);
      return null;
    }
    if (v.isEmpty()) {
      problem(path, "empty list — " + whyNotEmpty);
      return null;
    }
    int before = problems.size();
    List<String> out = new ArrayList<>();
    Set<String> seen = new LinkedHashSet<>();
    for (int k = 0; k < v.size(); k++) {
      String at = Where.index(path, k);
      JsonNode c = v.get(k);
      if (!c.isTextual()) {
        problem(at, "must be an option id, got " + Where.describe(c) + quoteHint(c));
        continue;
      }
      String choice = c.textValue();
      if (!seen.add(choice)) {
        problem(at, "'" + choice + "' is listed twice; keep one");
        continue;
      }
      checkChoice(g, choice, at);
      out.add(choice);
    }
    return problems.size() == before ? out : null;
  }

  /** A choice of a known group: one of its options, or {@code none} when the group is optional. */
  private void checkChoice(GroupRef g, String choice, String path) {
    if (g == null) {
      return;
    }
    if (Group.NONE.equals(choice)) {
      if (Boolean.TRUE.equals(g.required)) {
        problem(
            path,
            "group '"
                + g.id
                + "' is required, so 'none' is not one of its choices — 'none' is only for optional"
                + " groups (required: false); list options of '"
                + g.id
                + "' here, or make the group optional");
      }
      return;
    }
    int mark = choice.indexOf(Option.PRICE_MARK);
    if (mark > 0 && g.optionIdAt.containsKey(choice.substring(0, mark))) {
      problem(
          path,
          "names a price point ('"
              + choice
              + "') — rules, accepts, value and utility name the option without a price and apply to"
              + " every price point of it; write '"
              + choice.substring(0, mark)
              + "'");
      return;
    }
    if (g.complete && !g.optionIdAt.containsKey(choice)) {
      problem(
          path,
          "unknown option '"
              + choice
              + "' in group '"
              + g.id
              + "' (options: "
              + Where.list(g.choices())
              + ")"
              + Where.didYouMean(choice, g.choices()));
    }
  }

  private void unknownGroup(String gid, String path) {
    problem(
        path,
        "unknown group '"
            + gid
            + "' (groups: "
            + Where.list(groupsById.keySet())
            + ")"
            + Where.didYouMean(gid, groupsById.keySet()));
  }

  void unknownResource(String rid, String path) {
    String known =
        resourceIdAt.isEmpty()
            ? " (the catalog declares no resources; add it under resources)"
            : " (resources: " + Where.list(resourceIdAt.keySet()) + ")";
    problem(
        path,
        "unknown resource '" + rid + "'" + known + Where.didYouMean(rid, resourceIdAt.keySet()));
  }

  Set<String> resourceIds() {
    return resourceIdAt.keySet();
  }

  /**
   * Records an option id of a group, reporting a duplicate; used by inline options and CSV rows.
   */
  void registerOption(GroupRef ref, String id, String path) {
    String first = ref.optionIdAt.putIfAbsent(id, path);
    if (first != null) {
      String in = ref.id == null ? "" : " in group '" + ref.id + "'";
      problem(
          path,
          "duplicate option id '"
              + id
              + "'"
              + in
              + " (first at "
              + first
              + ") — give each option its own id");
    }
  }

  /** Records an id in its namespace; false (and a problem) when it was declared before. */
  private boolean unique(Map<String, String> idAt, String id, String path, IdKind kind) {
    String first = idAt.putIfAbsent(id, path);
    if (first == null) {
      return true;
    }
    problem(
        path,
        "duplicate "
            + kind.noun
            + " id '"
            + id
            + "' (first at "
            + first
            + ") — give each "
            + kind.noun
            + " its own id");
    return false;
  }

  // ---------------------------------------------------------------- fields and values

  void problem(String path, String message) {
    problems.add(new CatalogProblem(path, message));
  }

  /** A field's value, or null when absent or written as null (an empty YAML value). */
  private static JsonNode value(JsonNode o, String field) {
    JsonNode v = o.get(field);
    return v == null || v.isNull() ? null : v;
  }

  private boolean isMapping(JsonNode v, String path, String example) {
    if (v != null && v.isObject()) {
      return true;
    }
    problem(path, "must be a mapping such as " + example + ", got " + Where.describe(v));
    return false;
  }

  private void unknownFields(JsonNode o, String path, List<String> allowed, String what) {
    for (Map.Entry<String, JsonNode> field : o.properties()) {
      String f = field.getKey();
      if (!allowed.contains(f)) {
        problem(
            Where.field(path, f),
            "unknown field ("
                + what
                + " takes: "
                + Where.list(allowed)
                + ")"
                + Where.didYouMean(f, allowed));
      }
    }
  }

  private String requiredId(JsonNode o, String path, IdKind kind) {
    String at = Where.field(path, "id");
    JsonNode v = o.get("id");
    if (v == null || v.isNull()) {
      problem(
          at,
          (v == null ? "missing" : "is empty")
              + " — every "
              + kind.noun
              + " needs an id, e.g. id: "
              + kind.example);
      return null;
    }
    return idText(v, at, kind);
  }

  /**
   * The id as text, even when its spelling breaks a rule (so that references to it still resolve).
   */
  private String idText(JsonNode v, String path, IdKind kind) {
    if (!v.isTextual()) {
      problem(path, "must be text, got " + Where.describe(v) + quoteHint(v));
      return null;
    }
    String id = v.textValue();
    String p = Checks.idProblem(id, kind);
    if (p != null) {
      problem(path, p);
    }
    return id;
  }

  private String optionalText(JsonNode o, String path, String field) {
    JsonNode v = value(o, field);
    if (v == null) {
      return null;
    }
    if (!v.isTextual()) {
      problem(Where.field(path, field), "must be text, got " + Where.describe(v) + quoteHint(v));
      return null;
    }
    String p = Checks.textProblem(v.textValue());
    if (p != null) {
      problem(Where.field(path, field), p);
      return null;
    }
    return v.textValue();
  }

  private Boolean optionalBoolean(JsonNode o, String path, String field, boolean absent) {
    JsonNode v = value(o, field);
    if (v == null) {
      return absent;
    }
    if (!v.isBoolean()) {
      problem(
          Where.field(path, field),
          "must be true or false, got "
              + Where.describe(v)
              + unquoteHint(v, field)
              + " — true: a variant holds exactly one option of the group; false: at most one"
              + " (the absent choice is written none)");
      return null;
    }
    return v.booleanValue();
  }

  private Double requiredNumber(
      JsonNode o, String path, String field, String hint, Figure kind) {
    String at = Where.field(path, field);
    JsonNode v = o.get(field);
    if (v == null || v.isNull()) {
      problem(at, (v == null ? "missing" : "is empty") + " — give " + hint);
      return null;
    }
    return number(v, at, hint, kind);
  }

  private double optionalNumber(
      JsonNode o, String path, String field, double absent, String hint, Figure kind) {
    JsonNode v = value(o, field);
    if (v == null) {
      return absent;
    }
    Double x = number(v, Where.field(path, field), hint, kind);
    return x == null ? absent : x;
  }

  /**
   * A number; {@code nonNegative} also rules out values below zero. Every number must be finite.
   * Null (and a problem) when the value is wrong.
   */
  private Double number(JsonNode v, String path, String hint, Figure kind) {
    if (v == null || v.isNull()) {
      problem(path, "is empty — give " + hint);
      return null;
    }
    if (v.isTextual() && v.textValue().isBlank()) {
      problem(path, "is empty — give " + hint);
      return null;
    }
    if (!v.isNumber()) {
      problem(
          path, "must be a number, got " + Where.describe(v) + unquoteHint(v, null) + " — " + hint);
      return null;
    }
    double x = v.doubleValue();
    String p = Checks.figureProblem(x, kind, hint);
    if (p != null) {
      problem(path, p);
      return null;
    }
    return x;
  }

  /** For text that holds a number or boolean: say to drop the quotes. */
  private static String unquoteHint(JsonNode v, String field) {
    if (!v.isTextual()) {
      return "";
    }
    String t = v.textValue().strip();
    boolean looksLikeValue = Checks.decimal(t) != null || t.equals("true") || t.equals("false");
    if (!looksLikeValue) {
      return "";
    }
    return field == null
        ? " (write it without quotes)"
        : " (write it without quotes: " + field + ": " + t + ")";
  }

  /** For a number or boolean where text belongs: YAML turned an unquoted word into a value. */
  private static String quoteHint(JsonNode v) {
    if (v.isNumber()) {
      return " — put it in quotes, e.g. \"" + Where.num(v.doubleValue()) + "\"";
    }
    if (v.isBoolean()) {
      return " — put it in quotes (YAML reads unquoted yes, no, on, off, true and false as true or"
                 + " false)";
    }
    return "";
  }
}
