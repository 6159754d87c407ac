package dev.mixwright.scenario;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogProblem;
import dev.mixwright.catalog.Where;
import dev.mixwright.scenario.Scenario.Amount;
import dev.mixwright.scenario.Scenario.Field;
import dev.mixwright.scenario.Scenario.Target;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;

/**
 * Reads scenario-set files (YAML or JSON), in one of two forms:
 *
 * <pre>
 * scenarios:                                              draws: {count: 200, seed: 7}
 *   - {id: low, weight: 0.3, file: low-demand.yaml}       vary:
 *   - {id: base, weight: 0.5}                               resources: {brazing: {capacity: {normal: {sd: "10%"}}}}
 *   - {id: high, weight: 0.2, change: {segments:            options: {compressor.evi: {cost: {triangular:
 *         {renovators: {demand: "+20%"}}}}                      {low: "-20%", high: "+5%"}}}}
 * </pre>
 *
 * A listed scenario is a scenario file (relative to the set's folder), an inline change in the
 * scenario syntax, or the catalog as it is. Draws are seeded ({@link Random}, so the same seed
 * gives the same draws on every JVM): per draw, each varied figure in file order from a normal
 * (truncated at 0) or a triangular distribution around the catalog's figure; each draw weighs 1/count.
 * Weights are normalised. Members may change capacities, prices, costs, demands, shares and the
 * minimum lot; not rules, the introduction cost or the variant limit, because the range is chosen
 * once over one variant space and its introductions are paid once.
 */
public final class ScenarioSets {
  private static final List<String> SET_FIELDS = List.of("format", "name", "scenarios", "draws", "vary");
  private static final List<String> MEMBER_FIELDS = List.of("id", "weight", "file", "change");
  private static final List<String> DRAW_FIELDS = List.of("count", "seed");
  /** More draws than this are not a set to choose over, only to check on; a limit keeps memory bounded. */
  public static final int MAX_DRAWS = 100_000;

  private final Catalog catalog;
  private final Path folder;
  private final List<CatalogProblem> problems = new ArrayList<>();

  private ScenarioSets(Catalog catalog, Path folder) {
    this.catalog = catalog;
    this.folder = folder;
  }

  /** Reads a scenario-set file and checks every member against {@code catalog}. */
  public static ScenarioSet load(Path file, Catalog catalog) throws CatalogException {
    String name = CatalogLoader.displayName(file);
    JsonNode root = CatalogLoader.parseTree(CatalogLoader.readText(file, name), file.toString());
    Path dir = file.toAbsolutePath().getParent();
    ScenarioSets r = new ScenarioSets(catalog, dir == null ? Path.of(".") : dir);
    if (root == null || !root.isObject()) {
      throw new CatalogException(new CatalogProblem(name,
          "must be a mapping with scenarios: [...] or draws: {count, seed} and vary: {...}"));
    }
    for (Iterator<String> it = root.fieldNames(); it.hasNext(); ) {
      String f = it.next();
      if (!SET_FIELDS.contains(f)) {
        r.problem(f, "is not a field of a scenario set" + Where.didYouMean(f, SET_FIELDS) + "; fields are "
            + Where.list(SET_FIELDS));
      }
    }
    JsonNode format = root.get("format");
    if (format != null && !(format.isNumber() && format.asDouble() == 1)) {
      r.problem("format", "this version reads format 1, got " + Where.describe(format));
    }
    String title = root.path("name").isTextual() ? root.get("name").asText() : Scenarios.fileStem(file);
    List<Weighted> members = new ArrayList<>();
    boolean listed = root.has("scenarios");
    boolean drawn = root.has("draws") || root.has("vary");
    if (listed && drawn) {
      r.problem("draws", "a scenario set is either a list (scenarios) or draws (draws and vary), not both");
    } else if (listed) {
      r.list(root.get("scenarios"), members);
    } else if (drawn) {
      r.draws(root.get("draws"), root.get("vary"), members);
    } else {
      r.problem(name, "has neither scenarios nor draws — add scenarios: [{id: base, weight: 1}, ...] or"
          + " draws: {count: 200, seed: 7} with vary: {...}");
    }
    r.done();
    double total = 0;
    for (Weighted w : members) {
      total += w.weight();
    }
    if (!(total > 0) || !Double.isFinite(total)) {
      throw new CatalogException(new CatalogProblem(listed ? "scenarios" : name,
          "the weights sum to " + Where.num(total) + "; they must sum to a positive number (they are normalised)"
              + " — give at least one scenario a weight > 0"));
    }
    List<ScenarioSet.Member> out = new ArrayList<>();
    for (Weighted w : members) {
      out.add(new ScenarioSet.Member(w.id(), w.weight() / total, w.scenario()));
    }
    return new ScenarioSet(title, out);
  }

  private record Weighted(String id, double weight, Scenario scenario) {}

  // ------------------------------------------------------------------ list form

  private void list(JsonNode n, List<Weighted> out) {
    if (n == null || !n.isArray() || n.isEmpty()) {
      problem("scenarios", "must be a non-empty list, e.g. [{id: base, weight: 0.5}, {id: high, weight: 0.5,"
          + " change: {segments: {retrofit: {demand: \"+20%\"}}}}], got " + Where.describe(n));
      return;
    }
    Set<String> ids = new HashSet<>();
    for (int i = 0; i < n.size(); i++) {
      String path = Where.index("scenarios", i);
      JsonNode m = n.get(i);
      if (m == null || !m.isObject()) {
        problem(path, "must be a mapping {id, weight, file or change}, got " + Where.describe(m));
        continue;
      }
      for (Iterator<String> it = m.fieldNames(); it.hasNext(); ) {
        String f = it.next();
        if (!MEMBER_FIELDS.contains(f)) {
          problem(Where.field(path, f), "is not a field of a listed scenario" + Where.didYouMean(f, MEMBER_FIELDS)
              + "; fields are " + Where.list(MEMBER_FIELDS));
        }
      }
      JsonNode idNode = m.get("id");
      if (idNode == null || !idNode.isTextual() || idNode.asText().isBlank()) {
        problem(Where.field(path, "id"), "missing — give each scenario an id, e.g. id: high-demand");
        continue;
      }
      String id = idNode.asText();
      if (!ids.add(id)) {
        problem(Where.field(path, "id"), "'" + id + "' is used twice; scenario ids must differ");
      }
      double weight = 1;
      JsonNode w = m.get("weight");
      if (w != null) {
        if (!w.isNumber() || !(w.asDouble() >= 0) || !Double.isFinite(w.asDouble())) {
          problem(Where.field(path, "weight"), "must be a number >= 0, got " + Where.describe(w));
          continue;
        }
        weight = w.asDouble();
      }
      if (m.has("file") && m.has("change")) {
        problem(path, "give either file or change, not both");
        continue;
      }
      Scenario s = Scenario.none();
      if (m.has("file")) {
        s = fromFile(m.get("file"), Where.field(path, "file"), id);
      } else if (m.has("change")) {
        s = Scenarios.inline(m.get("change"), Where.field(path, "change"), id, catalog, problems);
      }
      if (s != null) {
        shared(s, path);
        out.add(new Weighted(id, weight, new Scenario(id, s.changes())));
      }
    }
  }

  private Scenario fromFile(JsonNode f, String path, String id) {
    if (f == null || !f.isTextual() || f.asText().isBlank()) {
      problem(path, "must be the name of a scenario file, e.g. file: low-demand.yaml");
      return null;
    }
    Path p = folder.resolve(f.asText());
    if (!Files.isRegularFile(p)) {
      problem(path, "no scenario file at " + f.asText() + " (relative to the scenario set's folder)");
      return null;
    }
    try {
      return Scenarios.load(p, catalog);
    } catch (CatalogException e) {
      for (CatalogProblem q : e.problems()) {
        problem(path, f.asText() + ": " + q.path() + ": " + q.message());
      }
      return null;
    }
  }

  /** The figures every member must leave alone: one variant space, introductions paid once. */
  private void shared(Scenario s, String path) {
    for (Scenario.Change c : s.changes()) {
      Field f = c.target().field();
      if (f == Field.RULE || f == Field.INTRODUCTION_COST || f == Field.MAX_VARIANTS) {
        // an inline change names its own path; a file's change is named within the member's file
        String at = c.where().startsWith(path) ? c.where() : Where.field(path, "file") + " (" + c.where() + ")";
        problem(at, "a scenario of a set cannot change " + c.target().path()
            + ": the range is chosen once over one variant space, with its introductions paid once; change it in"
            + " the catalog instead");
      }
    }
  }

  // ------------------------------------------------------------------ draws form

  /** One varied figure: where it is, its distribution and what the catalog holds. */
  private record Varied(Target target, double base, boolean normal, double sd, double low, double high) {
    double draw(Random rnd) {
      if (normal) {
        return Math.max(0.0, base + sd * rnd.nextGaussian());
      }
      // inverse CDF of the triangular distribution on [low, high] with its mode at the catalog's figure
      double mode = Math.min(Math.max(base, low), high);
      double u = rnd.nextDouble();
      double width = high - low;
      if (width <= 0) {
        return Math.max(0.0, low);
      }
      double cut = (mode - low) / width;
      double x = u < cut ? low + Math.sqrt(u * width * (mode - low)) : high - Math.sqrt((1 - u) * width * (high - mode));
      return Math.max(0.0, x);
    }
  }

  private void draws(JsonNode d, JsonNode vary, List<Weighted> out) {
    int count = 0;
    long seed = 0;
    if (d == null || !d.isObject()) {
      problem("draws", "must be a mapping {count, seed}, e.g. draws: {count: 200, seed: 7}, got " + Where.describe(d));
    } else {
      for (Iterator<String> it = d.fieldNames(); it.hasNext(); ) {
        String f = it.next();
        if (!DRAW_FIELDS.contains(f)) {
          problem(Where.field("draws", f), "is not a field of draws" + Where.didYouMean(f, DRAW_FIELDS)
              + "; fields are count and seed");
        }
      }
      JsonNode c = d.get("count");
      if (c == null || !c.canConvertToInt() || !c.isIntegralNumber() || c.asInt() < 1 || c.asInt() > MAX_DRAWS) {
        problem("draws.count", "must be a whole number from 1 to " + MAX_DRAWS + ", got " + Where.describe(c));
      } else {
        count = c.asInt();
      }
      JsonNode s = d.get("seed");
      if (s != null && !(s.isIntegralNumber() && s.canConvertToLong())) {
        problem("draws.seed", "must be a whole number, got " + Where.describe(s));
      } else if (s != null) {
        seed = s.asLong();
      }
    }
    List<Varied> varied = new ArrayList<>();
    if (vary == null || !vary.isObject() || vary.isEmpty()) {
      problem("vary", "must name the figures to draw, e.g. vary: {resources: {brazing: {capacity: {normal: {sd:"
          + " \"10%\"}}}}}, got " + Where.describe(vary));
    } else {
      for (Iterator<Map.Entry<String, JsonNode>> it = vary.fields(); it.hasNext(); ) {
        Map.Entry<String, JsonNode> e = it.next();
        String path = Where.field("vary", e.getKey());
        List<Field> fields = switch (e.getKey()) {
          case "resources" -> List.of(Field.CAPACITY);
          case "options" -> List.of(Field.PRICE, Field.COST);
          case "segments" -> List.of(Field.DEMAND);
          default -> null;
        };
        if (fields == null) {
          problem(path, "draws vary resources (capacity), options (price, cost) and segments (demand)"
              + Where.didYouMean(e.getKey(), List.of("resources", "options", "segments")));
          continue;
        }
        entity(e.getValue(), path, e.getKey(), fields, varied);
      }
    }
    if (!problems.isEmpty()) {
      return;
    }
    Random rnd = new Random(seed);
    for (int i = 0; i < count; i++) {
      List<Scenario.Change> changes = new ArrayList<>();
      for (Varied v : varied) {
        // a change by difference moves every price point of an option alike
        changes.add(new Scenario.Change(v.target(), Amount.add(v.draw(rnd) - v.base()), "draw " + (i + 1)));
      }
      String id = "draw-" + (i + 1);
      out.add(new Weighted(id, 1.0, new Scenario(id, changes)));
    }
  }

  private void entity(JsonNode n, String path, String kind, List<Field> fields, List<Varied> out) {
    if (n == null || !n.isObject()) {
      problem(path, "must be a mapping by id, got " + Where.describe(n));
      return;
    }
    for (Iterator<Map.Entry<String, JsonNode>> it = n.fields(); it.hasNext(); ) {
      Map.Entry<String, JsonNode> e = it.next();
      String at = Where.field(path, e.getKey());
      if (e.getValue() == null || !e.getValue().isObject()) {
        problem(at, "must be a mapping of figures to distributions, e.g. {" + fields.get(0).word
            + ": {normal: {sd: \"10%\"}}}, got " + Where.describe(e.getValue()));
        continue;
      }
      for (Iterator<Map.Entry<String, JsonNode>> ft = e.getValue().fields(); ft.hasNext(); ) {
        Map.Entry<String, JsonNode> f = ft.next();
        String fat = Where.field(at, f.getKey());
        Field field = fields.stream().filter(x -> x.word.equals(f.getKey())).findFirst().orElse(null);
        if (field == null) {
          problem(fat, "draws vary " + Where.list(fields.stream().map(x -> x.word).toList()) + " here"
              + Where.didYouMean(f.getKey(), fields.stream().map(x -> x.word).toList()));
          continue;
        }
        Target t = target(kind, e.getKey(), field, at);
        if (t == null) {
          continue;
        }
        Varied v = distribution(f.getValue(), fat, t, t.valueIn(catalog));
        if (v != null) {
          out.add(v);
        }
      }
    }
  }

  private Target target(String kind, String id, Field field, String at) {
    String path = switch (kind) {
      case "resources" -> "resources." + id + "." + field.word;
      case "segments" -> "segments." + id + "." + field.word;
      default -> "options." + id + "." + field.word;
    };
    try {
      return Scenarios.target(path, catalog);
    } catch (IllegalArgumentException e) {
      problem(at, e.getMessage());
      return null;
    }
  }

  private Varied distribution(JsonNode d, String path, Target t, double base) {
    if (d == null || !d.isObject() || d.size() != 1 || !(d.has("normal") || d.has("triangular"))) {
      problem(path, "must be one distribution: {normal: {sd: \"10%\"}} or {triangular: {low: \"-20%\", high:"
          + " \"+5%\"}}, got " + Where.describe(d));
      return null;
    }
    if (d.has("normal")) {
      JsonNode p = d.get("normal");
      String at = Where.field(Where.field(path, "normal"), "sd");
      JsonNode sd = p == null ? null : p.get("sd");
      double value;
      if (sd != null && sd.isNumber()) {
        value = sd.asDouble();
      } else if (sd != null && sd.isTextual() && sd.asText().trim().endsWith("%")) {
        String body = sd.asText().trim();
        try {
          value = Double.parseDouble(body.substring(0, body.length() - 1)) / 100 * base;
          if (body.startsWith("-")) {
            value = -Math.abs(value);
          }
        } catch (NumberFormatException e) {
          problem(at, "'" + body + "' is not a percentage; write e.g. sd: \"10%\" or sd: 500");
          return null;
        }
      } else {
        problem(at, "missing or not a spread — write sd: \"10%\" (of the catalog's figure) or sd: 500, got "
            + Where.describe(sd));
        return null;
      }
      if (!(value >= 0) || !Double.isFinite(value)) {
        problem(at, "a spread must be >= 0, got " + Where.num(value) + " — write a positive sd such as \"10%\"");
        return null;
      }
      return new Varied(t, base, true, value, 0, 0);
    }
    JsonNode p = d.get("triangular");
    String at = Where.field(path, "triangular");
    if (p == null || !p.isObject() || !p.has("low") || !p.has("high")) {
      problem(at, "must be {low: ..., high: ...}, e.g. {low: \"-20%\", high: \"+5%\"}, got " + Where.describe(p));
      return null;
    }
    Amount lo = Scenarios.amount(p.get("low"), Where.field(at, "low"), catalog, problems);
    Amount hi = Scenarios.amount(p.get("high"), Where.field(at, "high"), catalog, problems);
    if (lo == null || hi == null) {
      return null;
    }
    double low = lo.apply(base);
    double high = hi.apply(base);
    if (!(high >= low)) {
      problem(at, "low (" + Where.num(low) + ") is above high (" + Where.num(high) + "): a negative spread; swap"
          + " them");
      return null;
    }
    if (base < low || base > high) {
      problem(at, "the catalog's figure " + Where.num(base) + " lies outside [" + Where.num(low) + ", "
          + Where.num(high) + "]; the distribution peaks at the catalog's figure, so the range must hold it");
      return null;
    }
    return new Varied(t, base, false, 0, low, high);
  }

  // ------------------------------------------------------------------ problems

  private void problem(String path, String message) {
    problems.add(new CatalogProblem(path, message));
  }

  private void done() throws CatalogException {
    if (!problems.isEmpty()) {
      throw new CatalogException(problems);
    }
  }
}
