package dev.mixwright.report;

import java.util.Optional;
import java.util.Arrays;
import dev.mixwright.colgen.RunStatus;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.Sweep;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.runfolder.Json;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.SweepPlan;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The table of a sweep, one row per scenario: its grid values (the figures as solved), status,
 * objective, bound, gap, rounds, columns, the binding resources, each resource's shadow price and use,
 * each segment's shadow price — and, along every capacity or demand axis, the value per unit between
 * the point and the one before it on the axis, (z − z_prev) / (b − b_prev): the capacity value curve,
 * from re-solves of the whole space rather than one basis. Written as {@code sweep.json} and {@code
 * sweep.csv}, both atomically, after every scenario, so a sweep cut off keeps the rows it finished.
 * A sweep with the integer stage adds, per row, the range it would launch there ({@code portfolio}).
 */
public final class SweepTable {
  public static final String JSON_FILE = "sweep.json";
  public static final String CSV_FILE = "sweep.csv";
  /** The header field that says each point also ran the integer stage. */

  private final SweepPlan plan;
  private final Catalog base;
  private final ObjectNode header;
  private final Map<Integer, ObjectNode> rows = new TreeMap<>();

  /** @param header fields written at the top of sweep.json (catalog, definition hash, settings) */
  public SweepTable(SweepPlan plan, Catalog base, ObjectNode header) {
    this.plan = plan;
    this.base = base;
    this.header = header;
  }

  /** Rows of an earlier sweep.json to keep (matched by index). */
  public void keep(JsonNode row) {
    rows.put(row.path("index").asInt(), (ObjectNode) row.deepCopy());
  }

  public Map<Integer, ObjectNode> rows() {
    return rows;
  }

  public ObjectNode add(Sweep.Row r) {
    return add(r, null);
  }

  /** A point's LP stage as its row holds it (bound and gap null when unknown, no stopReason when none). */
  private record PointSolve(String status,
      @com.fasterxml.jackson.annotation.JsonInclude(com.fasterxml.jackson.annotation.JsonInclude.Include.NON_NULL)
      String stopReason, double objective, Double bound, Double gap, int iterations, int columnsGenerated,
      int warmStartColumns, long elapsedMs) {}

  /** A point's integer stage as its row holds it (bound and gap null when unknown). */
  private record PointPortfolio(String status, double value, Double bound, Double gap, double introductionCosts,
      double toolingCosts, long elapsedMs, List<PointVariant> variants) {}

  /** A variant a point's portfolio chooses, and its units. */
  private record PointVariant(Map<String, String> options, double units) {}

  /** The figures of one resource at one point: shadow price null when the run has none. */
  private record ResourceCell(double capacity, double used, Double shadowPrice) {}

  /**
   * A solved point and, when its integer stage ran, its portfolio: status, value, bound, gap, the
   * one-off costs and the chosen variants (their codes, shared by the whole table, are set when the
   * table is written: {@link #codes}).
   */
  public ObjectNode add(Sweep.Row r, RunResult.Portfolio portfolio) {
    ObjectNode n = Json.pretty().createObjectNode();
    SweepPlan.Point p = r.point();
    n.put("index", p.index());
    n.put("name", p.name());
    ObjectNode ax = n.putObject("axes");
    for (SweepPlan.Axis a : plan.axes()) {
      putFigure(ax, a.target(), r.catalog());
    }
    SolveOutcome o = r.outcome();
    if (o == null) {
      n.put("status", "invalid");
      n.put("problem", r.problem());
      rows.put(p.index(), n);
      return n;
    }
    n.setAll((ObjectNode) Json.pretty().valueToTree(new PointSolve(o.status().word(),
        o.stopReason().isEmpty() ? null : o.stopReason(), o.result().value(), Json.num(o.result().bound()), Json.num(o.result().gap()),
        o.iterations(), o.columnsGenerated(), r.warmColumns(), o.elapsedMs())));
    ArrayNode binding = n.putArray("binding");
    ObjectNode res = n.putObject("resources");
    Catalog c = r.catalog();
    for (int i = 0; i < c.resources().size(); i++) {
      Resource rr = c.resources().get(i);
      if (r.binding(i)) {
        binding.add(rr.id());
      }
      double price = o.duals().resource(i).orElse(Double.NaN);
      res.set(rr.id(), Json.pretty().valueToTree(new ResourceCell(rr.capacity(), r.used()[i],
          Double.isFinite(price) ? price : null)));
    }
    ObjectNode segs = n.putObject("segments");
    for (int s = 0; s < c.segments().size(); s++) {
      Segment ss = c.segments().get(s);
      ObjectNode x = segs.putObject(ss.id());
      x.put("demand", ss.demand());
      Json.putNum(x, "shadowPrice", o.duals().segment(s).orElse(Double.NaN));
      if (ss.chooses()) {
        x.put("buyers", ss.demand());
        x.put("sold", sold(o, s));
      }
    }
    if (portfolio != null) {
      List<PointVariant> vs = new ArrayList<>();
      portfolio.variants().forEach(v -> vs.add(new PointVariant(v.options(), v.units())));
      n.set("portfolio", Json.pretty().valueToTree(new PointPortfolio(portfolio.status().word(), portfolio.value(),
          portfolio.bound(), portfolio.gap(), portfolio.introductionCosts(), portfolio.toolingCosts(),
          portfolio.elapsedMs(), vs)));
    }
    rows.put(p.index(), n);
    return n;
  }

  /**
   * Codes for the variants the points' portfolios choose, shared by the whole table so that one code
   * is one variant on every row: by units over all rows, largest first, ties by the variant's text
   * (as {@link VariantCodes} orders a run's). Sets each row's {@code portfolio.codes}; returns code to
   * options, in code order.
   */
  private Map<String, Map<String, String>> codes() {
    Map<String, Double> units = new java.util.HashMap<>();
    Map<String, Map<String, String>> options = new java.util.HashMap<>();
    for (ObjectNode n : rows.values()) {
      for (JsonNode v : n.path("portfolio").path("variants")) {
        Map<String, String> o = new java.util.LinkedHashMap<>();
        v.path("options").fields().forEachRemaining(e -> o.put(e.getKey(), e.getValue().asText()));
        String k = VariantCodes.key(o);
        options.putIfAbsent(k, o);
        units.merge(k, v.path("units").asDouble(), Double::sum);
      }
    }
    List<String> keys = new ArrayList<>(options.keySet());
    keys.sort(java.util.Comparator.comparingDouble((String k) -> -Math.rint(units.get(k) * 1e6) / 1e6)
        .thenComparing(java.util.Comparator.naturalOrder()));
    Map<String, String> codeOf = new java.util.HashMap<>();
    Map<String, Map<String, String>> legend = new java.util.LinkedHashMap<>();
    for (int i = 0; i < keys.size(); i++) {
      String code = VariantCodes.code(i, keys.size());
      codeOf.put(keys.get(i), code);
      legend.put(code, options.get(keys.get(i)));
    }
    for (ObjectNode n : rows.values()) {
      if (n.path("portfolio").isObject()) {
        List<String> cs = new ArrayList<>();
        for (JsonNode v : n.path("portfolio").path("variants")) {
          Map<String, String> o = new java.util.LinkedHashMap<>();
          v.path("options").fields().forEachRemaining(e -> o.put(e.getKey(), e.getValue().asText()));
          String code = codeOf.get(VariantCodes.key(o));
          cs.add(code);
          ((ObjectNode) v).put("code", code);
        }
        cs.sort(java.util.Comparator.naturalOrder());
        cs.forEach(((ObjectNode) n.path("portfolio")).putArray("codes")::add);
      }
    }
    return legend;
  }

  /** Units the outcome's plan sells in segment s. */
  private static double sold(SolveOutcome o, int s) {
    double q = 0;
    for (int j = 0; j < o.master().x().length; j++) {
      if (o.master().columns().get(j).segment() == s) {
        q += o.master().x()[j];
      }
    }
    return q;
  }

  /**
   * True for a sweep whose one axis is an option's price on a catalog with a segment that chooses:
   * there the objective is a curve over the price with a best point (higher prices sell to fewer
   * buyers), and the table marks it. Fixed-demand sweeps keep their columns as they were.
   */
  public boolean marksBest() {
    return plan.axes().size() == 1 && plan.axes().get(0).target().field() == Scenario.Field.PRICE
        && base.segments().stream().anyMatch(Segment::chooses);
  }

  /** Sets {@code best} on every row: true on the solved row of largest objective, the first of ties. */
  private void best() {
    if (!marksBest()) {
      return;
    }
    ObjectNode top = null;
    for (ObjectNode n : rows.values()) {
      n.remove("best");
      if (solved(n) && (top == null || n.path("objective").asDouble() > top.path("objective").asDouble())) {
        top = n;
      }
    }
    for (ObjectNode n : rows.values()) {
      n.put("best", n == top);
    }
  }

  /** The row marked best, if the sweep marks one and any row is solved. */
  public Optional<ObjectNode> bestRow() {
    best();
    return rows.values().stream().filter(n -> n.path("best").asBoolean()).findFirst();
  }

  private static void putFigure(ObjectNode ax, Scenario.Target t, Catalog c) {
    if (t.field() == Scenario.Field.RULE) {
      ax.put(t.path(), t.valueIn(c) > 0 ? "on" : "off");
    } else {
      Json.putNum(ax, t.path(), t.valueIn(c));
    }
  }

  /** Fills each row's valuePerUnit from its neighbour one step back on every capacity or demand axis. */
  private void slopes() {
    List<SweepPlan.Axis> axes = plan.axes();
    int[] stride = new int[axes.size()];
    int s = 1;
    for (int a = axes.size() - 1; a >= 0; a--) {
      stride[a] = s;
      s *= axes.get(a).values().size();
    }
    int grid = (int) Math.min(plan.gridSize(), SweepPlan.MAX_POINTS);
    for (Map.Entry<Integer, ObjectNode> e : rows.entrySet()) {
      int i = e.getKey();
      ObjectNode n = e.getValue();
      n.remove("valuePerUnit");
      if (i >= grid) {
        continue;
      }
      ObjectNode v = null;
      for (int a = 0; a < axes.size(); a++) {
        Scenario.Target t = axes.get(a).target();
        if (!t.isRightHandSide()) {
          continue;
        }
        if (v == null) {
          v = n.putObject("valuePerUnit");
        }
        int step = (i / stride[a]) % axes.get(a).values().size();
        ObjectNode prev = step == 0 ? null : rows.get(i - stride[a]);
        double slope = Double.NaN;
        if (prev != null && solved(n) && solved(prev)) {
          double b = n.path("axes").path(t.path()).asDouble();
          double bp = prev.path("axes").path(t.path()).asDouble();
          if (b != bp) {
            slope = (n.path("objective").asDouble() - prev.path("objective").asDouble()) / (b - bp);
          }
        }
        Json.putNum(v, t.path(), slope);
      }
    }
  }

  private static boolean solved(JsonNode n) {
    return status(n).filter(RunStatus::isOptimal).isPresent();
  }

  /** A row's status; empty for a scenario that could not be built ({@code invalid}). */
  public static Optional<RunStatus> status(JsonNode row) {
    String w = row.path("status").asText();
    return Arrays.stream(RunStatus.values()).filter(s -> s.word().equals(w)).findFirst();
  }

  /** A row a later run of the same sweep keeps: solved to its optimum, or proven infeasible. */
  public static boolean finished(JsonNode row) {
    return status(row).filter(s -> s != RunStatus.STOPPED).isPresent();
  }

  /** A row whose solve a limit or a signal ended. */
  public static boolean stopped(JsonNode row) {
    return status(row).filter(s -> s == RunStatus.STOPPED).isPresent();
  }

  public ObjectNode toJson() {
    slopes();
    best();
    Map<String, Map<String, String>> legend = codes();
    ObjectNode n = header.deepCopy();
    ArrayNode axes = n.putArray("axes");
    for (SweepPlan.Axis a : plan.axes()) {
      axes.add(a.target().path());
    }
    if (!legend.isEmpty()) {
      n.set("portfolioVariants", Json.pretty().valueToTree(legend));
    }
    ArrayNode rs = n.putArray("rows");
    rows.values().forEach(rs::add);
    return n;
  }

  /** One CSV line per row; columns named as in sweep.json, nested fields joined with dots. */
  public String toCsv() {
    slopes();
    best();
    boolean portfolios = !codes().isEmpty() || rows.values().stream().anyMatch(n -> n.path("portfolio").isObject());
    List<Segment> choosing = base.segments().stream().filter(Segment::chooses).toList();
    List<String> head = new ArrayList<>(List.of("index", "name"));
    for (SweepPlan.Axis a : plan.axes()) {
      head.add(a.target().path());
    }
    head.addAll(List.of("status", "objective", "bound", "gap", "iterations", "columnsGenerated",
        "warmStartColumns", "elapsedMs", "binding"));
    for (Resource r : base.resources()) {
      head.add("shadowPrice." + r.id());
    }
    for (Resource r : base.resources()) {
      head.add("used." + r.id());
    }
    for (Segment s : base.segments()) {
      head.add("demandPrice." + s.id());
    }
    List<String> slopeCols = new ArrayList<>();
    for (SweepPlan.Axis a : plan.axes()) {
      if (a.target().isRightHandSide()) {
        slopeCols.add(a.target().path());
        head.add("valuePerUnit." + a.target().path());
      }
    }
    for (Segment c : choosing) {
      head.add("sold." + c.id());
    }
    if (marksBest()) {
      head.add("best");
    }
    if (portfolios) {
      head.addAll(List.of("portfolio.status", "portfolio.value", "portfolio.gap", "portfolio.introductionCosts",
          "portfolio.toolingCosts", "portfolio.codes"));
    }
    head.add("problem");
    StringBuilder sb = new StringBuilder();
    line(sb, head);
    for (ObjectNode n : rows.values()) {
      List<String> cells = new ArrayList<>();
      cells.add(n.path("index").asText());
      cells.add(n.path("name").asText());
      for (SweepPlan.Axis a : plan.axes()) {
        cells.add(text(n.path("axes").path(a.target().path())));
      }
      for (String f : List.of("status", "objective", "bound", "gap", "iterations", "columnsGenerated",
          "warmStartColumns", "elapsedMs")) {
        cells.add(text(n.path(f)));
      }
      List<String> b = new ArrayList<>();
      n.path("binding").forEach(x -> b.add(x.asText()));
      cells.add(String.join(" ", b));
      for (Resource r : base.resources()) {
        cells.add(text(n.path("resources").path(r.id()).path("shadowPrice")));
      }
      for (Resource r : base.resources()) {
        cells.add(text(n.path("resources").path(r.id()).path("used")));
      }
      for (Segment s : base.segments()) {
        cells.add(text(n.path("segments").path(s.id()).path("shadowPrice")));
      }
      for (String p : slopeCols) {
        cells.add(text(n.path("valuePerUnit").path(p)));
      }
      for (Segment c : choosing) {
        cells.add(text(n.path("segments").path(c.id()).path("sold")));
      }
      if (marksBest()) {
        cells.add(text(n.path("best")));
      }
      if (portfolios) {
        JsonNode pf = n.path("portfolio");
        for (String f : List.of("status", "value", "gap", "introductionCosts", "toolingCosts")) {
          cells.add(text(pf.path(f)));
        }
        List<String> cs = new ArrayList<>();
        pf.path("codes").forEach(x -> cs.add(x.asText()));
        cells.add(String.join(" ", cs));
      }
      cells.add(n.path("problem").asText(""));
      line(sb, cells);
    }
    return sb.toString();
  }

  private static String text(JsonNode v) {
    return v.isMissingNode() || v.isNull() ? "" : v.asText();
  }

  private static void line(StringBuilder sb, List<String> cells) {
    for (int i = 0; i < cells.size(); i++) {
      if (i > 0) {
        sb.append(',');
      }
      String c = cells.get(i);
      if (c.indexOf(',') >= 0 || c.indexOf('"') >= 0 || c.indexOf('\n') >= 0) {
        sb.append('"').append(c.replace("\"", "\"\"")).append('"');
      } else {
        sb.append(c);
      }
    }
    sb.append('\n');
  }

  /** Writes both files, each atomically. */
  public void write(Path dir) throws IOException {
    AtomicFiles.write(dir.resolve(JSON_FILE), Json.pretty().writeValueAsString(toJson()) + "\n");
    AtomicFiles.write(dir.resolve(CSV_FILE), toCsv());
  }
}
