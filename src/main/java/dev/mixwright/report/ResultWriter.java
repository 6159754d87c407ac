package dev.mixwright.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.colgen.Column;
import dev.mixwright.colgen.IterationRecord;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.space.SpaceCount;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.math.BigInteger;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/** Builds {@code result.json} (fields of PRODUCT.md and more) and writes it atomically. */
public final class ResultWriter {
  public static final String FILE = "result.json";
  /** A quantity below this is reported as not sold. */
  static final double QUANTITY_EPS = 1e-7;

  private ResultWriter() {}

  /** What result.json says about the variant space's size. */
  public record SpaceSize(SpaceCount count) {
    /** An exact count, or only an upper bound. */
    public SpaceSize(BigInteger value, boolean exact) {
      this(exact ? SpaceCount.exact(value) : SpaceCount.atMost(value));
    }
  }

  /** Facts about the run that the outcome does not hold. */
  public record RunInfo(String catalogFile, String catalogSha256, String pricer, SpaceSize size, long elapsedMs) {}

  public static ObjectNode build(VariantSpace space, SolveOutcome out, RunInfo info) {
    Catalog cat = space.catalog();
    ObjectNode n = Json.pretty().createObjectNode();
    n.put("status", out.status().word());
    if (!out.stopReason().isEmpty()) {
      n.put("stopReason", out.stopReason());
    }
    n.put("objective", out.objective());
    putNum(n, "bound", out.bound());
    putNum(n, "gap", out.gap());
    n.put("iterations", out.iterations());
    n.put("columnsGenerated", out.columnsGenerated());
    n.put("columnsInMaster", out.columns().size());
    putCount(n, "buildableVariants", info.size().count());
    n.put("elapsedMs", info.elapsedMs());
    ObjectNode c = n.putObject("catalog");
    c.put("name", cat.name());
    c.put("file", info.catalogFile());
    c.put("sha256", info.catalogSha256());
    c.put("currency", cat.currency());
    c.put("period", cat.period());
    n.put("pricer", info.pricer());

    ArrayNode offers = n.putArray("offers");
    List<Integer> sold = new ArrayList<>();
    for (int j = 0; j < out.x().length; j++) {
      if (out.x()[j] > QUANTITY_EPS) {
        sold.add(j);
      }
    }
    sold.sort(Comparator.comparingInt((Integer j) -> out.columns().get(j).segment())
        .thenComparing(j -> -out.x()[j] * out.columns().get(j).margin()));
    double[] used = new double[cat.resources().size()];
    double[] segSold = new double[cat.segments().size()];
    for (int j : sold) {
      Column col = out.columns().get(j);
      double q = out.x()[j];
      ObjectNode o = offers.addObject();
      o.put("segment", cat.segments().get(col.segment()).id());
      ObjectNode opts = o.putObject("options");
      space.describe(col.choices()).forEach(opts::put);
      o.put("quantity", q);
      o.put("unitMargin", col.margin());
      o.put("reducedCost", out.reducedCost()[j]);
      o.put("atLimit", q >= col.upper() * (1 - 1e-9));
      o.put("contribution", q * col.margin());
      for (int r = 0; r < used.length; r++) {
        used[r] += col.use()[r] * q;
      }
      segSold[col.segment()] += q;
    }
    ArrayNode res = n.putArray("resources");
    for (int r = 0; r < cat.resources().size(); r++) {
      Resource rr = cat.resources().get(r);
      ObjectNode o = res.addObject();
      o.put("id", rr.id());
      o.put("capacity", rr.capacity());
      o.put("used", used[r]);
      putNum(o, "shadowPrice", out.duals().resource(r).orElse(Double.NaN));
      o.put("binding", used[r] >= rr.capacity() * (1 - 1e-7) - 1e-9);
    }
    ArrayNode segs = n.putArray("segments");
    for (int s = 0; s < cat.segments().size(); s++) {
      Segment ss = cat.segments().get(s);
      ObjectNode o = segs.addObject();
      o.put("id", ss.id());
      o.put("demand", ss.demand());
      o.put("sold", segSold[s]);
      putNum(o, "shadowPrice", out.duals().segment(s).orElse(Double.NaN));
    }
    ArrayNode rounds = n.putArray("rounds");
    for (IterationRecord r : out.history()) {
      ObjectNode o = rounds.addObject();
      o.put("iteration", r.iteration());
      o.put("objective", r.objective());
      putNum(o, "bound", r.bound());
      putNum(o, "gap", r.gap());
      o.put("columns", r.columns());
      o.put("added", r.added());
      o.put("exactPricing", r.exactPricing());
      o.put("elapsedMs", r.elapsedMs());
    }
    return n;
  }

  /**
   * {@code field}: the count as a decimal string when exact, else null with {@code fieldAtMost} and
   * {@code fieldAtLeast} (decimal strings) and, when sampled, {@code fieldEstimate}: value, standard
   * error and number of samples.
   */
  public static void putCount(ObjectNode n, String field, SpaceCount count) {
    if (count.exact()) {
      n.put(field, count.upper().toString());
      return;
    }
    n.putNull(field);
    n.put(field + "AtMost", count.upper().toString());
    n.put(field + "AtLeast", count.lower().toString());
    count.estimate().ifPresent(e -> {
      ObjectNode o = n.putObject(field + "Estimate");
      o.put("value", e.value().doubleValue());
      o.put("standardError", e.standardError().doubleValue());
      o.put("samples", e.samples());
    });
  }

  static void putNum(ObjectNode n, String field, double v) {
    if (Double.isFinite(v)) {
      n.put(field, v);
    } else {
      n.putNull(field);
    }
  }

  public static void write(Path runDir, ObjectNode result) throws IOException {
    AtomicFiles.write(runDir.resolve(FILE), Json.pretty().writeValueAsString(result) + "\n");
  }
}
