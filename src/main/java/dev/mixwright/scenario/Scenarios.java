package dev.mixwright.scenario;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogProblem;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import dev.mixwright.catalog.Where;
import dev.mixwright.scenario.Scenario.Amount;
import dev.mixwright.scenario.Scenario.Field;
import dev.mixwright.scenario.Scenario.Target;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads scenario and sweep files (YAML or JSON, like catalogs) and {@code --grid} axes, checking
 * every id against the catalog they change. Problems name the exact path, as the catalog's do, and
 * all of them come in one {@link CatalogException}.
 *
 * <pre>
 * # scenario file                          # sweep file
 * format: 1                                format: 1
 * name: bigger brazing cell                name: brazing x scroll cost
 * resources: {brazing: {capacity: 16000}}  base: {rules: {propane-clearance: off}}
 * options:                                 grid:
 *   compressor.scroll: {cost: "+10%"}        - {path: resources.brazing.capacity, from: 10000, to: 16000, step: 1000}
 * segments: {retrofit: {demand: 7000}}       - {path: options.compressor.scroll.cost, values: ["-10%", "+0%", "+10%"]}
 * rules: {propane-clearance: off}          scenarios:
 * portfolio: {minLot: 200}                   - {name: no tank, options: {tank.t300: {price: 0}}}
 * </pre>
 *
 * A value is a number (the new figure) or text: {@code "+500"} / {@code "-500"} add, {@code "+10%"}
 * / {@code "-10%"} scale, {@code "x1.1"} multiplies, {@code "=5000"} sets (a number as text). Rules
 * take {@code on} / {@code off}.
 */
public final class Scenarios {
  private static final List<String> SCENARIO_FIELDS =
      List.of("format", "name", "resources", "options", "segments", "rules", "portfolio");
  private static final List<String> SWEEP_FIELDS = List.of("format", "name", "base", "grid", "scenarios");
  private static final List<String> AXIS_FIELDS = List.of("path", "from", "to", "step", "values");
  static final String PATH_FORMS = "resources.ID.capacity, options.GROUP.OPTION.price, options.GROUP.OPTION.cost,"
      + " segments.ID.demand, segments.ID.maxShare, rules.ID, portfolio.introductionCost,"
      + " portfolio.maxVariants or portfolio.minLot";

  private final Catalog catalog;
  private final List<CatalogProblem> problems = new ArrayList<>();

  private Scenarios(Catalog catalog) {
    this.catalog = catalog;
  }

  /** Reads a scenario file and checks it against {@code catalog}. */
  public static Scenario load(Path file, Catalog catalog) throws CatalogException {
    String name = CatalogLoader.displayName(file);
    JsonNode root = CatalogLoader.parseTree(CatalogLoader.readText(file, name), file.toString());
    Scenarios r = new Scenarios(catalog);
    if (root == null || !root.isObject()) {
      throw new CatalogException(new CatalogProblem(name,
          "must be a mapping of the figures to change, e.g. resources: {testbench: {capacity: 11000}}"));
    }
    r.format(root, "format");
    Scenario s = r.scenario(root, "", SCENARIO_FIELDS,
        root.path("name").isTextual() ? root.get("name").asText() : fileStem(file));
    r.check(s, Scenario.none());
    r.done();
    return s;
  }

  /** Reads a sweep file and checks every scenario in it against {@code catalog}. */
  public static SweepPlan loadSweep(Path file, Catalog catalog) throws CatalogException {
    String name = CatalogLoader.displayName(file);
    JsonNode root = CatalogLoader.parseTree(CatalogLoader.readText(file, name), file.toString());
    Scenarios r = new Scenarios(catalog);
    if (root == null || !root.isObject()) {
      throw new CatalogException(new CatalogProblem(name,
          "must be a mapping with grid and/or scenarios, e.g. grid: [{path: resources.testbench.capacity,"
              + " from: 10000, to: 16000, step: 1000}]"));
    }
    r.unknownFields(root, "", SWEEP_FIELDS, "a sweep file");
    r.format(root, "format");
    String title = root.path("name").isTextual() ? root.get("name").asText() : fileStem(file);
    Scenario base = Scenario.none();
    if (root.has("base")) {
      base = r.scenario(root.get("base"), "base", SCENARIO_FIELDS.subList(2, SCENARIO_FIELDS.size()), "base");
      r.check(base, Scenario.none());
    }
    List<SweepPlan.Axis> axes = new ArrayList<>();
    JsonNode grid = root.get("grid");
    if (grid != null) {
      if (!grid.isArray()) {
        r.problem("grid", "must be a list of axes, e.g. [{path: resources.testbench.capacity, from: 10000, to: 16000,"
            + " step: 1000}], got " + Where.describe(grid));
      } else {
        for (int i = 0; i < grid.size(); i++) {
          SweepPlan.Axis a = r.axis(grid.get(i), Where.index("grid", i));
          if (a != null) {
            axes.add(a);
          }
        }
      }
    }
    List<Scenario> listed = new ArrayList<>();
    JsonNode list = root.get("scenarios");
    if (list != null) {
      if (!list.isArray()) {
        r.problem("scenarios", "must be a list of scenarios, e.g. [{name: more brazing, resources: {brazing:"
            + " {capacity: 16000}}}], got " + Where.describe(list));
      } else {
        for (int i = 0; i < list.size(); i++) {
          String path = Where.index("scenarios", i);
          JsonNode n = list.get(i);
          String nm = n != null && n.path("name").isTextual() ? n.get("name").asText() : "scenario " + (i + 1);
          Scenario s = r.scenario(n, path, SCENARIO_FIELDS.subList(1, SCENARIO_FIELDS.size()), nm);
          if (s != null) {
            r.check(s, base);
            listed.add(s);
          }
        }
      }
    }
    if (grid == null && list == null) {
      r.problem(name, "has neither grid nor scenarios — add grid: [...] (axes to cross) or scenarios: [...]");
    }
    SweepPlan plan = new SweepPlan(title, base, axes, listed);
    r.checkGrid(plan, "grid");
    r.done();
    return plan;
  }

  /**
   * A sweep from {@code --grid} texts ({@code PATH=FROM..TO:STEP} or {@code PATH=V1,V2,...}) on top
   * of {@code base}, with {@code listed} scenarios after the grid.
   */
  public static SweepPlan grid(List<String> axisTexts, Scenario base, List<Scenario> listed, Catalog catalog)
      throws CatalogException {
    Scenarios r = new Scenarios(catalog);
    List<SweepPlan.Axis> axes = new ArrayList<>();
    for (String text : axisTexts) {
      String where = "--grid " + text;
      int eq = text.indexOf('=');
      if (eq <= 0) {
        r.problem(where, "write PATH=FROM..TO:STEP or PATH=V1,V2,..., e.g. resources.testbench.capacity=9000..12000:500");
        continue;
      }
      Target t = r.target(text.substring(0, eq).trim(), where);
      if (t == null) {
        continue;
      }
      List<Amount> values = r.valuesText(text.substring(eq + 1).trim(), t, where);
      if (values != null) {
        axes.add(new SweepPlan.Axis(t, values, where));
      }
    }
    SweepPlan plan = new SweepPlan("grid", base, axes, listed);
    r.checkGrid(plan, "--grid");
    r.done();
    return plan;
  }

  /** A path such as {@code resources.testbench.capacity}, checked against the catalog; else an IllegalArgumentException saying why. */
  public static Target target(String path, Catalog catalog) {
    Scenarios r = new Scenarios(catalog);
    Target t = r.target(path, path);
    if (t == null) {
      throw new IllegalArgumentException(r.problems.get(0).message());
    }
    return t;
  }

  /**
   * An inline scenario mapping at {@code path} of another file (a scenario set's {@code change}),
   * checked against {@code catalog}; its problems go to {@code out}, and null comes back when it has any.
   */
  static Scenario inline(JsonNode n, String path, String name, Catalog catalog, List<CatalogProblem> out) {
    Scenarios r = new Scenarios(catalog);
    Scenario s = r.scenario(n, path, SCENARIO_FIELDS.subList(2, SCENARIO_FIELDS.size()), name);
    if (r.problems.isEmpty()) {
      r.check(s, Scenario.none());
    }
    out.addAll(r.problems);
    return r.problems.isEmpty() ? s : null;
  }

  /**
   * A figure written as text or number relative to {@code base}, as scenario values are ({@code
   * "+10%"}, {@code "-500"}, {@code 16000}); null with a problem in {@code out} when it is not one.
   */
  static Amount amount(JsonNode v, String path, Catalog catalog, List<CatalogProblem> out) {
    Scenarios r = new Scenarios(catalog);
    Amount a = r.amount(v, path);
    out.addAll(r.problems);
    return a;
  }

  // ------------------------------------------------------------------ scenario mappings

  private Scenario scenario(JsonNode n, String path, List<String> fields, String name) {
    if (n == null || !n.isObject()) {
      problem(path.isEmpty() ? "(top)" : path, "must be a mapping of figures to change, e.g. {resources: {testbench:"
          + " {capacity: 16000}}}, got " + Where.describe(n));
      return null;
    }
    unknownFields(n, path, fields, "a scenario");
    List<Scenario.Change> changes = new ArrayList<>();
    JsonNode nm = n.get("name");
    if (nm != null && !nm.isTextual()) {
      problem(Where.field(path, "name"), "must be text, got " + Where.describe(nm));
    }
    eachEntry(n.get("resources"), Where.field(path, "resources"), "{testbench: {capacity: 11000}}", (id, v, at) -> {
      if (catalog.resourceIndex(id) < 0) {
        problem(at, "the catalog has no resource '" + id + "'" + Where.didYouMean(id, resourceIds()));
        return;
      }
      figures(v, at, List.of(Field.CAPACITY), f -> new Target(f, id, null), changes);
    });
    eachEntry(n.get("options"), Where.field(path, "options"), "{\"compressor.evi\": {cost: \"+10%\"}}", (key, v, at) -> {
      int dot = key.indexOf('.');
      Target probe = dot <= 0 ? null : optionTarget(Field.PRICE, key.substring(0, dot), key.substring(dot + 1), at);
      if (dot <= 0) {
        problem(at, "an option is named group.option, e.g. compressor.evi; got '" + key + "'");
      }
      if (probe != null) {
        figures(v, at, List.of(Field.PRICE, Field.COST), f -> new Target(f, probe.id(), probe.option()), changes);
      }
    });
    eachEntry(n.get("segments"), Where.field(path, "segments"), "{retrofit: {demand: 7000}}", (id, v, at) -> {
      if (catalog.segmentIndex(id) < 0) {
        problem(at, "the catalog has no segment '" + id + "'" + Where.didYouMean(id, segmentIds()));
        return;
      }
      figures(v, at, List.of(Field.DEMAND, Field.MAX_SHARE), f -> new Target(f, id, null), changes);
    });
    eachEntry(n.get("rules"), Where.field(path, "rules"), "{propane-clearance: off}", (id, v, at) -> {
      Target t = ruleTarget(id, at);
      Amount a = t == null ? null : switchOf(v, at);
      if (a != null) {
        changes.add(new Scenario.Change(t, a, at));
      }
    });
    JsonNode p = n.get("portfolio");
    if (p != null) {
      String at = Where.field(path, "portfolio");
      if (catalog.portfolio().isEmpty()) {
        problem(at, "the catalog has no portfolio section to change; add one to the catalog first");
      } else {
        figures(p, at, List.of(Field.INTRODUCTION_COST, Field.MAX_VARIANTS, Field.MIN_LOT),
            f -> new Target(f, null, null), changes);
      }
    }
    return new Scenario(name, changes);
  }

  private interface EntryReader {
    void read(String key, JsonNode value, String path);
  }

  private void eachEntry(JsonNode n, String path, String example, EntryReader reader) {
    if (n == null) {
      return;
    }
    if (!n.isObject()) {
      problem(path, "must be a mapping by id, e.g. " + example + ", got " + Where.describe(n));
      return;
    }
    for (Iterator<Map.Entry<String, JsonNode>> it = n.fields(); it.hasNext(); ) {
      Map.Entry<String, JsonNode> e = it.next();
      reader.read(e.getKey(), e.getValue(), Where.field(path, e.getKey()));
    }
  }

  private interface TargetOf {
    Target of(Field f);
  }

  /** The {field: value} mapping of one entity: each field one of {@code allowed}. */
  private void figures(JsonNode v, String path, List<Field> allowed, TargetOf target, List<Scenario.Change> out) {
    List<String> words = allowed.stream().map(f -> f.word).toList();
    if (v == null || !v.isObject()) {
      problem(path, "must be a mapping of " + Where.list(words) + " to new values, e.g. {" + words.get(0)
          + ": 16000}, got " + Where.describe(v));
      return;
    }
    for (Iterator<Map.Entry<String, JsonNode>> it = v.fields(); it.hasNext(); ) {
      Map.Entry<String, JsonNode> e = it.next();
      String at = Where.field(path, e.getKey());
      Field f = null;
      for (Field x : allowed) {
        if (x.word.equals(e.getKey())) {
          f = x;
        }
      }
      if (f == null) {
        problem(at, "a scenario cannot change '" + e.getKey() + "' here; it changes " + Where.list(words)
            + Where.didYouMean(e.getKey(), words));
        continue;
      }
      Amount a = amount(e.getValue(), at);
      if (a != null) {
        out.add(new Scenario.Change(target.of(f), a, at));
      }
    }
  }

  // ------------------------------------------------------------------ axes

  private SweepPlan.Axis axis(JsonNode n, String path) {
    if (n == null || !n.isObject()) {
      problem(path, "must be a mapping {path: ..., from: ..., to: ..., step: ...} or {path: ..., values: [...]},"
          + " got " + Where.describe(n));
      return null;
    }
    unknownFields(n, path, AXIS_FIELDS, "a grid axis");
    JsonNode p = n.get("path");
    if (p == null || !p.isTextual()) {
      problem(Where.field(path, "path"), "missing — name the figure to vary, one of " + PATH_FORMS);
      return null;
    }
    Target t = target(p.asText(), Where.field(path, "path"));
    if (t == null) {
      return null;
    }
    boolean range = n.has("from") || n.has("to") || n.has("step");
    if (range == n.has("values")) {
      problem(path, range ? "give either from/to/step or values, not both"
          : "missing the values — add from, to and step, or values: [...]");
      return null;
    }
    List<Amount> values = new ArrayList<>();
    if (range) {
      String[] parts = new String[3];
      String[] names = {"from", "to", "step"};
      for (int i = 0; i < 3; i++) {
        JsonNode v = n.get(names[i]);
        if (v == null || !(v.isNumber() || v.isTextual())) {
          problem(Where.field(path, names[i]), "missing or not a number — e.g. from: 10000, to: 16000, step: 1000,"
              + " or from: \"-10%\", to: \"+10%\", step: \"5%\"");
          return null;
        }
        // A number in a file is the figure itself; only text such as "+500" or "-10%" is a change.
        parts[i] = v.isNumber() ? "=" + v.decimalValue().toPlainString() : v.asText().trim();
      }
      return rangeAxis(t, parts[0], parts[1], parts[2], path);
    }
    JsonNode list = n.get("values");
    if (!list.isArray() || list.isEmpty()) {
      problem(Where.field(path, "values"), "must be a non-empty list, e.g. [10000, 12000, 16000] or [\"-10%\", \"+0%\","
          + " \"+10%\"]");
      return null;
    }
    for (int i = 0; i < list.size(); i++) {
      String at = Where.index(Where.field(path, "values"), i);
      Amount a = t.field() == Field.RULE ? switchOf(list.get(i), at) : amount(list.get(i), at);
      if (a == null) {
        return null;
      }
      values.add(a);
    }
    return new SweepPlan.Axis(t, values, Where.field(path, "values"));
  }

  private List<Amount> valuesText(String spec, Target t, String where) {
    int dots = spec.indexOf("..");
    if (dots >= 0) {
      int colon = spec.indexOf(':', dots);
      if (colon < 0) {
        problem(where, "a range needs a step: FROM..TO:STEP, e.g. 10000..16000:1000 or -10%..+10%:5%");
        return null;
      }
      SweepPlan.Axis a = rangeAxis(t, spec.substring(0, dots).trim(), spec.substring(dots + 2, colon).trim(),
          spec.substring(colon + 1).trim(), where);
      return a == null ? null : a.values();
    }
    List<Amount> out = new ArrayList<>();
    for (String part : spec.split(",")) {
      String p = part.trim();
      Amount a = t.field() == Field.RULE ? switchText(p, where) : amountText(p, where, true);
      if (a == null) {
        return null;
      }
      out.add(a);
    }
    return out;
  }

  /** FROM..TO:STEP in exact decimal steps, so 0.1 steps land on 0.3 and not on 0.30000000000000004. */
  private SweepPlan.Axis rangeAxis(Target t, String from, String to, String step, String where) {
    if (t.field() == Field.RULE) {
      problem(where, "a rule takes values: [on, off], not a range");
      return null;
    }
    boolean pct = from.endsWith("%");
    if (pct != to.endsWith("%") || pct != step.endsWith("%")) {
      problem(where, "from, to and step must all be percentages (-10%..+10%:5%) or all plain numbers");
      return null;
    }
    boolean delta = !pct && (from.startsWith("+") || (from.startsWith("-") && !from.startsWith("=")));
    BigDecimal a = decimal(strip(from), where);
    BigDecimal b = decimal(strip(to), where);
    BigDecimal s = decimal(strip(step), where);
    if (a == null || b == null || s == null) {
      return null;
    }
    if (s.signum() <= 0) {
      problem(where, "the step must be > 0, got " + step);
      return null;
    }
    if (a.compareTo(b) > 0) {
      problem(where, "from (" + from + ") must not be above to (" + to + ")");
      return null;
    }
    BigDecimal count = b.subtract(a).divideToIntegralValue(s);
    if (count.compareTo(BigDecimal.valueOf(SweepPlan.MAX_POINTS)) >= 0) {
      problem(where, "gives more than " + SweepPlan.MAX_POINTS + " values; use a larger step");
      return null;
    }
    List<Amount> values = new ArrayList<>();
    for (BigDecimal x = a; x.compareTo(b) <= 0; x = x.add(s)) {
      double v = x.doubleValue();
      values.add(pct ? Amount.percent(v) : delta ? Amount.add(v) : Amount.set(v));
    }
    return new SweepPlan.Axis(t, values, where);
  }

  private static String strip(String s) {
    String t = s.startsWith("=") ? s.substring(1) : s;
    return t.endsWith("%") ? t.substring(0, t.length() - 1) : t;
  }

  private BigDecimal decimal(String s, String where) {
    try {
      return new BigDecimal(s.startsWith("+") ? s.substring(1) : s);
    } catch (NumberFormatException e) {
      problem(where, "'" + s + "' is not a number");
      return null;
    }
  }

  // ------------------------------------------------------------------ values and targets

  private Amount amount(JsonNode v, String path) {
    if (v != null && v.isNumber()) {
      return Amount.set(v.doubleValue());
    }
    if (v != null && v.isTextual()) {
      return amountText(v.asText().trim(), path, false);
    }
    problem(path, "must be a number (the new figure) or a change as text such as \"+10%\", \"-500\" or \"x1.2\","
        + " got " + Where.describe(v));
    return null;
  }

  /** {@code plainIsSet}: on the command line a plain number sets; in a file a number is a number already. */
  private Amount amountText(String t, String path, boolean plainIsSet) {
    String hint = " — write a number to set the figure, \"+500\" or \"-500\" to add, \"+10%\" or \"-10%\" to"
        + " scale, \"x1.2\" to multiply";
    try {
      if (t.startsWith("=")) {
        return Amount.set(Double.parseDouble(t.substring(1)));
      }
      if (t.endsWith("%")) {
        String body = t.substring(0, t.length() - 1).trim();
        boolean signed = body.startsWith("+") || body.startsWith("-");
        double p = Double.parseDouble(body);
        if (!signed && p != 0) {
          problem(path, "'" + t + "' is ambiguous: write +" + body + "% or -" + body + "% for a change, or x"
              + Where.num(p / 100) + " for " + body + "% of the figure");
          return null;
        }
        return finite(Amount.percent(p), t, path);
      }
      if (t.startsWith("x") || t.startsWith("*")) {
        return finite(new Amount(Scenario.Op.SCALE, Double.parseDouble(t.substring(1))), t, path);
      }
      if (t.startsWith("+") || t.startsWith("-")) {
        return finite(Amount.add(Double.parseDouble(t)), t, path);
      }
      if (plainIsSet) {
        return finite(Amount.set(Double.parseDouble(t)), t, path);
      }
    } catch (NumberFormatException e) {
      // reported below
    }
    problem(path, "'" + t + "' is not a value" + hint);
    return null;
  }

  private Amount finite(Amount a, String t, String path) {
    if (!Double.isFinite(a.value())) {
      problem(path, "'" + t + "' is not a finite number");
      return null;
    }
    return a;
  }

  private Amount switchOf(JsonNode v, String path) {
    if (v != null && v.isBoolean()) {
      return Amount.rule(v.booleanValue());
    }
    if (v != null && v.isTextual()) {
      return switchText(v.asText().trim(), path);
    }
    problem(path, "must be on or off, got " + Where.describe(v));
    return null;
  }

  private Amount switchText(String t, String path) {
    switch (t.toLowerCase(Locale.ROOT)) {
      case "on", "true", "yes" -> {
        return Amount.rule(true);
      }
      case "off", "false", "no" -> {
        return Amount.rule(false);
      }
      default -> {
        problem(path, "'" + t + "' is not on or off");
        return null;
      }
    }
  }

  private Target target(String path, String where) {
    String[] kinds = {"resources.", "options.", "segments.", "rules.", "portfolio."};
    if (path.startsWith("rules.")) {
      return ruleTarget(path.substring(6), where);
    }
    if (path.startsWith("portfolio.")) {
      String f = path.substring(10);
      for (Field x : List.of(Field.INTRODUCTION_COST, Field.MAX_VARIANTS, Field.MIN_LOT)) {
        if (x.word.equals(f)) {
          if (catalog.portfolio().isEmpty()) {
            problem(where, "the catalog has no portfolio section to change");
            return null;
          }
          return new Target(x, null, null);
        }
      }
      problem(where, "portfolio has introductionCost, maxVariants and minLot, not '" + f + "'");
      return null;
    }
    int last = path.lastIndexOf('.');
    String field = last < 0 ? "" : path.substring(last + 1);
    if (path.startsWith("resources.") && last > 10) {
      String id = path.substring(10, last);
      if (!field.equals("capacity")) {
        problem(where, "a resource's figure is capacity: resources." + id + ".capacity");
        return null;
      }
      if (catalog.resourceIndex(id) < 0) {
        problem(where, "the catalog has no resource '" + id + "'" + Where.didYouMean(id, resourceIds())
            + "; resources are " + Where.list(resourceIds()));
        return null;
      }
      return new Target(Field.CAPACITY, id, null);
    }
    if (path.startsWith("segments.") && last > 9) {
      String id = path.substring(9, last);
      Field f = field.equals("demand") ? Field.DEMAND : field.equals("maxShare") ? Field.MAX_SHARE : null;
      if (f == null) {
        problem(where, "a segment's figures are demand and maxShare: segments." + id + ".demand");
        return null;
      }
      if (catalog.segmentIndex(id) < 0) {
        problem(where, "the catalog has no segment '" + id + "'" + Where.didYouMean(id, segmentIds())
            + "; segments are " + Where.list(segmentIds()));
        return null;
      }
      return new Target(f, id, null);
    }
    if (path.startsWith("options.") && last > 8) {
      String rest = path.substring(8, last);
      int dot = rest.indexOf('.');
      Field f = field.equals("price") ? Field.PRICE : field.equals("cost") ? Field.COST : null;
      if (dot <= 0 || f == null) {
        problem(where, "an option's figures are written options.GROUP.OPTION.price or .cost, e.g."
            + " options.compressor.evi.cost");
        return null;
      }
      return optionTarget(f, rest.substring(0, dot), rest.substring(dot + 1), where);
    }
    String head = path.contains(".") ? path.substring(0, path.indexOf('.') + 1) : path;
    problem(where, "'" + path + "' names no figure a scenario changes" + Where.didYouMean(head, List.of(kinds))
        + "; write one of " + PATH_FORMS);
    return null;
  }

  private Target optionTarget(Field f, String group, String option, String where) {
    int g = catalog.groupIndex(group);
    if (g < 0) {
      List<String> ids = catalog.groups().stream().map(Group::id).toList();
      problem(where, "the catalog has no group '" + group + "'" + Where.didYouMean(group, ids));
      return null;
    }
    List<String> ids = catalog.groups().get(g).options().stream().map(Option::id).toList();
    if (!ids.contains(option)) {
      problem(where, "group '" + group + "' has no option '" + option + "'" + Where.didYouMean(option, ids)
          + (option.equals(Group.NONE) ? " ('none' has no price or cost to change)" : ""));
      return null;
    }
    return new Target(f, group, option);
  }

  private Target ruleTarget(String id, String where) {
    List<String> ids = catalog.rules().stream().map(Rule::id).filter(x -> x != null).toList();
    if (!ids.contains(id)) {
      problem(where, "the catalog has no rule with id '" + id + "'" + Where.didYouMean(id, ids)
          + (Where.closest(id, ids) == null ? "; rule ids are " + Where.list(ids) : "")
          + (ids.size() < catalog.rules().size()
              ? " (only rules with an id can be switched: give the rule an id: in the catalog)" : ""));
      return null;
    }
    return new Target(Field.RULE, id, null);
  }

  // ------------------------------------------------------------------ checks

  /** The scenario applied after {@code base} must still be a valid catalog. */
  private void check(Scenario s, Scenario base) {
    if (s == null) {
      return;
    }
    try {
      base.then(s, s.name()).applyTo(catalog);
    } catch (CatalogException e) {
      problems.addAll(e.problems());
    }
  }

  /** Every grid point must give a valid catalog; the first few that do not are reported. */
  private void checkGrid(SweepPlan plan, String where) {
    if (!problems.isEmpty()) {
      return;
    }
    if (plan.gridSize() > SweepPlan.MAX_POINTS) {
      problem(where, "has " + plan.gridSize() + " points, more than " + SweepPlan.MAX_POINTS
          + "; use fewer values or split the sweep");
      return;
    }
    int reported = 0;
    for (SweepPlan.Point p : plan.points()) {
      if (!p.onGrid()) {
        continue;
      }
      try {
        p.scenario().applyTo(catalog);
      } catch (CatalogException e) {
        for (CatalogProblem q : e.problems()) {
          if (reported++ < 5) {
            problems.add(new CatalogProblem(q.path(), "at grid point " + p.name() + ": " + q.message()));
          }
        }
      }
    }
  }

  private void format(JsonNode root, String path) {
    JsonNode f = root.get("format");
    if (f != null && !(f.isNumber() && f.asDouble() == 1)) {
      problem(path, "this version reads format 1, got " + Where.describe(f));
    }
  }

  private void unknownFields(JsonNode n, String path, List<String> allowed, String what) {
    for (Iterator<String> it = n.fieldNames(); it.hasNext(); ) {
      String f = it.next();
      if (!allowed.contains(f)) {
        problem(Where.field(path, f), "is not a field of " + what + Where.didYouMean(f, allowed) + "; fields are "
            + Where.list(allowed));
      }
    }
  }

  private List<String> resourceIds() {
    return catalog.resources().stream().map(Resource::id).toList();
  }

  private List<String> segmentIds() {
    return catalog.segments().stream().map(Segment::id).toList();
  }

  private void problem(String path, String message) {
    problems.add(new CatalogProblem(path, message));
  }

  private void done() throws CatalogException {
    if (!problems.isEmpty()) {
      throw new CatalogException(problems);
    }
  }

  static String fileStem(Path file) {
    String n = file.getFileName() == null ? file.toString() : file.getFileName().toString();
    int dot = n.lastIndexOf('.');
    return dot > 0 ? n.substring(0, dot) : n;
  }
}
