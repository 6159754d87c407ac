package dev.mixwright.report;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import dev.mixwright.runfolder.Json;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * What changed from run A to run B: status, objective, bound and gap; the catalog figures that
 * differ (when both runs kept their catalog.json); offers that are new, dropped or sold in another
 * quantity; the integer portfolios (value, bound, one-off costs, variants added and dropped); and
 * each resource's and segment's shadow price and use. Offers and portfolio variants are matched by
 * options (and segment), resources and segments by id. A variant carries its code in each run it is
 * in ({@code codeA}, {@code codeB}: the codes of that run's summary, report and export).
 */
public final class RunComparison {
  /** Quantities and prices closer than this are the same. */
  static final double SAME = 1e-6;

  private RunComparison() {}

  public static ObjectNode compare(RunResult a, RunResult b, Catalog catA, Catalog catB) {
    ObjectNode n = Json.pretty().createObjectNode();
    ObjectNode head = n.putObject("summary");
    ObjectNode st = head.putObject("status");
    st.put("a", a.status().word());
    st.put("b", b.status().word());
    pair(head.putObject("objective"), a.objective(), b.objective());
    pair(head.putObject("bound"), a.bound(), b.bound());
    pair(head.putObject("gap"), a.gap(), b.gap());
    pair(head.putObject("iterations"), a.iterations(), b.iterations());
    pair(head.putObject("columnsGenerated"), a.columnsGenerated(), b.columnsGenerated());
    n.put("sameCatalog", a.catalog().sha256().equals(b.catalog().sha256()) && (catA == null || catA.equals(catB)));
    if (catA != null && catB != null) {
      n.set("catalogChanges", catalogChanges(catA, catB));
    }
    VariantCodes ca = VariantCodes.of(a);
    VariantCodes cb = VariantCodes.of(b);
    n.set("offers", offers(a, b, ca, cb));
    if (a.portfolio() != null || b.portfolio() != null) {
      n.set("portfolio", portfolio(a.portfolio(), b.portfolio(), ca, cb));
    }
    n.set("resources", byId(rows(a.resources()), rows(b.resources()), List.of("capacity", "used", "shadowPrice")));
    n.set("segments", byId(rows(a.segments()), rows(b.segments()),
        List.of("demand", "sold", "shadowPrice")));
    ArrayNode choosing = choosing(a, b, ca, cb);
    if (!choosing.isEmpty()) {
      n.set("choosing", choosing);
    }
    return n;
  }

  /** {a, b, change}; a missing figure (a bound not yet proven) is null and has no change. */
  private static void pair(ObjectNode o, Number x, Number y) {
    putNumber(o, "a", x);
    putNumber(o, "b", y);
    if (x != null && y != null) {
      o.put("change", y.doubleValue() - x.doubleValue());
    }
  }

  private static void putNumber(ObjectNode o, String f, Number v) {
    if (v == null) {
      o.putNull(f);
    } else if (v instanceof Integer i) {
      o.put(f, i);
    } else {
      o.put(f, v.doubleValue());
    }
  }

  /**
   * Per segment that chooses in either run: buyers, those who buy, those who stay out and the
   * buyers-row shadow price, each as {a, b, change}, and every offer's share of the buyers in A and
   * B (0 where it is not offered). Absent when no segment chooses, so fixed-demand comparisons read
   * as before.
   */
  private static ArrayNode choosing(RunResult a, RunResult b, VariantCodes ca, VariantCodes cb) {
    ArrayNode out = Json.pretty().createArrayNode();
    Map<String, RunResult.SegmentRow> sa = new LinkedHashMap<>();
    Map<String, RunResult.SegmentRow> sb = new LinkedHashMap<>();
    a.segments().forEach(s -> sa.put(s.id(), s));
    b.segments().forEach(s -> sb.put(s.id(), s));
    Set<String> ids = new LinkedHashSet<>(sa.keySet());
    ids.addAll(sb.keySet());
    for (String id : ids) {
      RunResult.SegmentRow x = sa.get(id);
      RunResult.SegmentRow y = sb.get(id);
      boolean xc = x != null && x.chooses();
      boolean yc = y != null && y.chooses();
      if (!xc && !yc) {
        continue;
      }
      ObjectNode o = out.addObject();
      o.put("id", id);
      pair(o.putObject("buyers"), xc ? x.buyers() : null, yc ? y.buyers() : null);
      pair(o.putObject("sold"), xc ? x.sold() : null, yc ? y.sold() : null);
      pair(o.putObject("stayOut"), xc ? x.stayOut() : null, yc ? y.stayOut() : null);
      pair(o.putObject("shadowPrice"), xc ? x.shadowPrice() : null, yc ? y.shadowPrice() : null);
      Map<String, double[]> shares = new LinkedHashMap<>();
      Map<String, Map<String, String>> options = new LinkedHashMap<>();
      collectShares(a, id, xc ? x.buyers() : Double.NaN, 0, shares, options);
      collectShares(b, id, yc ? y.buyers() : Double.NaN, 1, shares, options);
      ArrayNode offers = o.putArray("offers");
      shares.forEach((k, v) -> {
        ObjectNode r = coded(offers.addObject(), options.get(k), ca, cb);
        r.put("shareA", v[0]);
        r.put("shareB", v[1]);
      });
    }
    return out;
  }

  private static void collectShares(RunResult r, String segment, double buyers, int side,
      Map<String, double[]> shares, Map<String, Map<String, String>> options) {
    for (RunResult.Offer o : r.offers()) {
      if (o.segment().equals(segment)) {
        String k = variant(o.options());
        options.putIfAbsent(k, o.options());
        double share = o.share() != null ? o.share() : o.quantity() / buyers;
        shares.computeIfAbsent(k, x -> new double[2])[side] = share;
      }
    }
  }

  /** A resource's or segment's figures by id, in the order the comparison lists them. */
  private static Map<String, double[]> rows(List<?> rows) {
    Map<String, double[]> m = new LinkedHashMap<>();
    for (Object r : rows) {
      if (r instanceof RunResult.ResourceRow x) {
        m.put(x.id(), new double[] {x.capacity(), x.used(), x.shadowPrice() == null ? Double.NaN : x.shadowPrice()});
      } else if (r instanceof RunResult.SegmentRow x) {
        m.put(x.id(), new double[] {x.demand(), x.sold(), x.shadowPrice() == null ? Double.NaN : x.shadowPrice()});
      }
    }
    return m;
  }

  /** The figures that differ, each as {path, a, b}; ids only in one catalog as added or removed. */
  static ArrayNode catalogChanges(Catalog a, Catalog b) {
    ArrayNode out = Json.pretty().createArrayNode();
    Map<String, Double> fa = figures(a);
    Map<String, Double> fb = figures(b);
    Set<String> keys = new LinkedHashSet<>(fa.keySet());
    keys.addAll(fb.keySet());
    for (String k : keys) {
      Double x = fa.get(k);
      Double y = fb.get(k);
      if (x == null || y == null || !x.equals(y)) {
        ObjectNode o = out.addObject();
        o.put("path", k);
        if (x == null) {
          o.putNull("a");
        } else {
          o.put("a", x);
        }
        if (y == null) {
          o.putNull("b");
        } else {
          o.put("b", y);
        }
      }
    }
    Set<String> ra = ruleKeys(a);
    Set<String> rb = ruleKeys(b);
    for (String r : ra) {
      if (!rb.contains(r)) {
        out.addObject().put("path", "rules." + r).put("a", "on").put("b", "off");
      }
    }
    for (String r : rb) {
      if (!ra.contains(r)) {
        out.addObject().put("path", "rules." + r).put("a", "off").put("b", "on");
      }
    }
    return out;
  }

  private static Map<String, Double> figures(Catalog c) {
    Map<String, Double> m = new LinkedHashMap<>();
    for (Resource r : c.resources()) {
      m.put("resources." + r.id() + ".capacity", r.capacity());
      for (Group g : c.groups()) {
        for (Option o : g.options()) {
          Double u = o.uses().get(r.id());
          if (u != null && u != 0) {
            m.put("options." + g.id() + "." + o.id() + ".uses." + r.id(), u);
          }
        }
      }
    }
    for (Group g : c.groups()) {
      for (Option o : g.options()) {
        m.put("options." + g.id() + "." + o.id() + ".price", o.price());
        m.put("options." + g.id() + "." + o.id() + ".cost", o.cost());
      }
    }
    for (Segment s : c.segments()) {
      m.put("segments." + s.id() + ".demand", s.demand());
      m.put("segments." + s.id() + ".maxShare", s.maxShare());
      s.value().forEach((k, v) -> m.put("segments." + s.id() + ".value." + k, v));
    }
    c.portfolio().ifPresent(p -> {
      m.put("portfolio.introductionCost", p.introductionCost());
      m.put("portfolio.maxVariants", (double) p.maxVariants());
      m.put("portfolio.minLot", p.minLot());
    });
    return m;
  }

  /** A rule by its id, or by its content when it has none. */
  private static Set<String> ruleKeys(Catalog c) {
    Set<String> s = new LinkedHashSet<>();
    for (Rule r : c.rules()) {
      s.add(r.id() != null ? r.id()
          : (r.isForbid() ? "forbid " + r.forbid() : "when " + r.when() + " require " + r.require()));
    }
    return s;
  }

  /**
   * Both integer portfolios: status, value, bound, introduction, tooling and discontinue costs (each
   * {a, b, change}; a run without a portfolio has nulls), the number of variants, and the variants
   * added (in B only) and dropped (in A only) with their codes and units.
   */
  private static ObjectNode portfolio(RunResult.Portfolio a, RunResult.Portfolio b, VariantCodes ca,
      VariantCodes cb) {
    ObjectNode n = Json.pretty().createObjectNode();
    ObjectNode st = n.putObject("status");
    st.put("a", a == null || a.status() == null ? null : a.status().word());
    st.put("b", b == null || b.status() == null ? null : b.status().word());
    pair(n.putObject("value"), a == null ? null : a.value(), b == null ? null : b.value());
    pair(n.putObject("bound"), a == null ? null : a.bound(), b == null ? null : b.bound());
    pair(n.putObject("introductionCosts"), a == null ? null : a.introductionCosts(),
        b == null ? null : b.introductionCosts());
    pair(n.putObject("toolingCosts"), a == null ? null : a.toolingCosts(), b == null ? null : b.toolingCosts());
    pair(n.putObject("discontinueCosts"), a == null ? null : a.discontinueCosts(),
        b == null ? null : b.discontinueCosts());
    pair(n.putObject("variants"), a == null ? null : a.variants().size(), b == null ? null : b.variants().size());
    Map<String, RunResult.PortfolioVariant> va = new LinkedHashMap<>();
    Map<String, RunResult.PortfolioVariant> vb = new LinkedHashMap<>();
    if (a != null) {
      a.variants().forEach(v -> va.put(variant(v.options()), v));
    }
    if (b != null) {
      b.variants().forEach(v -> vb.put(variant(v.options()), v));
    }
    ArrayNode added = n.putArray("added");
    ArrayNode dropped = n.putArray("dropped");
    int kept = 0;
    for (Map.Entry<String, RunResult.PortfolioVariant> e : vb.entrySet()) {
      if (va.containsKey(e.getKey())) {
        kept++;
      } else {
        added.add(portfolioVariant(e.getValue(), ca, cb, 0, e.getValue().units()));
      }
    }
    for (Map.Entry<String, RunResult.PortfolioVariant> e : va.entrySet()) {
      if (!vb.containsKey(e.getKey())) {
        dropped.add(portfolioVariant(e.getValue(), ca, cb, e.getValue().units(), 0));
      }
    }
    n.put("inBoth", kept);
    return n;
  }

  private static ObjectNode portfolioVariant(RunResult.PortfolioVariant v, VariantCodes ca, VariantCodes cb,
      double ua, double ub) {
    ObjectNode o = coded(Json.pretty().createObjectNode(), v.options(), ca, cb);
    o.put("unitsA", ua);
    o.put("unitsB", ub);
    return o;
  }

  private static ObjectNode offers(RunResult a, RunResult b, VariantCodes ca, VariantCodes cb) {
    Map<String, RunResult.Offer> oa = offerMap(a);
    Map<String, RunResult.Offer> ob = offerMap(b);
    ObjectNode n = Json.pretty().createObjectNode();
    ArrayNode added = n.putArray("new");
    ArrayNode dropped = n.putArray("dropped");
    ArrayNode changed = n.putArray("changed");
    int same = 0;
    for (Map.Entry<String, RunResult.Offer> e : ob.entrySet()) {
      RunResult.Offer x = oa.get(e.getKey());
      if (x == null) {
        added.add(offer(e.getValue(), 0, e.getValue().quantity(), ca, cb));
      } else {
        double qa = x.quantity();
        double qb = e.getValue().quantity();
        if (Math.abs(qa - qb) > SAME * Math.max(1, Math.abs(qa))) {
          changed.add(offer(e.getValue(), qa, qb, ca, cb));
        } else {
          same++;
        }
      }
    }
    for (Map.Entry<String, RunResult.Offer> e : oa.entrySet()) {
      if (!ob.containsKey(e.getKey())) {
        dropped.add(offer(e.getValue(), e.getValue().quantity(), 0, ca, cb));
      }
    }
    n.put("unchanged", same);
    return n;
  }

  private static ObjectNode offer(RunResult.Offer any, double qa, double qb, VariantCodes ca, VariantCodes cb) {
    ObjectNode o = Json.pretty().createObjectNode();
    o.put("segment", any.segment());
    coded(o, any.options(), ca, cb);
    o.put("quantityA", qa);
    o.put("quantityB", qb);
    return o;
  }

  /** The variant's code in each run (null where the run does not hold it) and its options. */
  private static ObjectNode coded(ObjectNode o, Map<String, String> options, VariantCodes ca, VariantCodes cb) {
    o.put("codeA", ca.code(options));
    o.put("codeB", cb.code(options));
    ObjectNode opts = o.putObject("options");
    options.forEach(opts::put);
    return o;
  }

  private static Map<String, RunResult.Offer> offerMap(RunResult result) {
    Map<String, RunResult.Offer> m = new LinkedHashMap<>();
    for (RunResult.Offer o : result.offers()) {
      m.put(o.segment() + " " + variant(o.options()), o);
    }
    return m;
  }

  /** {@code group=option,...} without the optional groups at none. */
  public static String variant(Map<String, String> options) {
    List<String> parts = new ArrayList<>();
    options.forEach((g, c) -> {
      if (!c.equals(Group.NONE)) {
        parts.add(g + "=" + c);
      }
    });
    return String.join(",", parts);
  }

  /**
   * A compared variant for people: its code in each run ({@code V03→V01}; {@code A V05} or {@code B
   * V02} when only one run holds it) and the labels of the choices in which that run's variants
   * differ ({@code a}, {@code b}: the runs' matrix views), or its options when the view has none.
   */
  public static String name(JsonNode x, MatrixView a, MatrixView b) {
    String ca = x.path("codeA").isTextual() ? x.path("codeA").asText() : null;
    String cb = x.path("codeB").isTextual() ? x.path("codeB").asText() : null;
    String code = ca != null && cb != null ? (ca.equals(cb) ? ca : ca + "→" + cb) : cb != null ? "B " + cb
        : ca != null ? "A " + ca : "";
    String what = cb != null ? b.describe(cb) : ca != null ? a.describe(ca) : "";
    return (code + "  " + (what.isEmpty() ? variant(x.path("options")) : what)).strip();
  }

  /** The same for the options object of a comparison's offer. */
  public static String variant(JsonNode options) {
    Map<String, String> m = new LinkedHashMap<>();
    options.fields().forEachRemaining(e -> m.put(e.getKey(), e.getValue().asText()));
    return variant(m);
  }

  private static ArrayNode byId(Map<String, double[]> ma, Map<String, double[]> mb, List<String> fields) {
    Set<String> ids = new LinkedHashSet<>(ma.keySet());
    ids.addAll(mb.keySet());
    ArrayNode out = Json.pretty().createArrayNode();
    for (String id : ids) {
      ObjectNode o = out.addObject();
      o.put("id", id);
      for (int f = 0; f < fields.size(); f++) {
        double[] x = ma.get(id);
        double[] y = mb.get(id);
        pair(o.putObject(fields.get(f)), x == null ? null : x[f], y == null ? null : y[f]);
      }
    }
    return out;
  }
}
