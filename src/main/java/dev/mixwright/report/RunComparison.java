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
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * What changed from run A to run B: status, objective, bound and gap; the catalog figures that
 * differ (when both runs kept their catalog.json); offers that are new, dropped or sold in another
 * quantity; and each resource's and segment's shadow price and use. Offers are matched by segment
 * and options, resources and segments by id.
 */
public final class RunComparison {
  /** Quantities and prices closer than this are the same. */
  static final double SAME = 1e-6;

  private RunComparison() {}

  public static ObjectNode compare(JsonNode a, JsonNode b, Catalog catA, Catalog catB) {
    ObjectNode n = Json.pretty().createObjectNode();
    ObjectNode head = n.putObject("summary");
    for (String f : List.of("status", "objective", "bound", "gap", "iterations", "columnsGenerated")) {
      ObjectNode o = head.putObject(f);
      o.set("a", a.path(f).deepCopy());
      o.set("b", b.path(f).deepCopy());
      if (a.path(f).isNumber() && b.path(f).isNumber()) {
        o.put("change", b.path(f).asDouble() - a.path(f).asDouble());
      }
    }
    n.put("sameCatalog", a.path("catalog").path("sha256").asText("a").equals(b.path("catalog").path("sha256").asText("b"))
        && (catA == null || catA.equals(catB)));
    if (catA != null && catB != null) {
      n.set("catalogChanges", catalogChanges(catA, catB));
    }
    n.set("offers", offers(a, b));
    n.set("resources", byId(a.path("resources"), b.path("resources"), List.of("capacity", "used", "shadowPrice")));
    n.set("segments", byId(a.path("segments"), b.path("segments"), List.of("demand", "sold", "shadowPrice")));
    return n;
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

  private static ObjectNode offers(JsonNode a, JsonNode b) {
    Map<String, JsonNode> oa = offerMap(a);
    Map<String, JsonNode> ob = offerMap(b);
    ObjectNode n = Json.pretty().createObjectNode();
    ArrayNode added = n.putArray("new");
    ArrayNode dropped = n.putArray("dropped");
    ArrayNode changed = n.putArray("changed");
    int same = 0;
    for (Map.Entry<String, JsonNode> e : ob.entrySet()) {
      JsonNode x = oa.get(e.getKey());
      if (x == null) {
        added.add(offer(e.getValue(), null, e.getValue()));
      } else {
        double qa = x.path("quantity").asDouble();
        double qb = e.getValue().path("quantity").asDouble();
        if (Math.abs(qa - qb) > SAME * Math.max(1, Math.abs(qa))) {
          changed.add(offer(e.getValue(), x, e.getValue()));
        } else {
          same++;
        }
      }
    }
    for (Map.Entry<String, JsonNode> e : oa.entrySet()) {
      if (!ob.containsKey(e.getKey())) {
        dropped.add(offer(e.getValue(), e.getValue(), null));
      }
    }
    n.put("unchanged", same);
    return n;
  }

  private static ObjectNode offer(JsonNode any, JsonNode a, JsonNode b) {
    ObjectNode o = Json.pretty().createObjectNode();
    o.put("segment", any.path("segment").asText());
    o.set("options", any.path("options").deepCopy());
    o.put("quantityA", a == null ? 0.0 : a.path("quantity").asDouble());
    o.put("quantityB", b == null ? 0.0 : b.path("quantity").asDouble());
    return o;
  }

  private static Map<String, JsonNode> offerMap(JsonNode result) {
    Map<String, JsonNode> m = new LinkedHashMap<>();
    for (JsonNode o : result.path("offers")) {
      m.put(o.path("segment").asText() + " " + variant(o.path("options")), o);
    }
    return m;
  }

  /** {@code group=option,...} without the optional groups at none. */
  public static String variant(JsonNode options) {
    List<String> parts = new ArrayList<>();
    for (Iterator<Map.Entry<String, JsonNode>> it = options.fields(); it.hasNext(); ) {
      Map.Entry<String, JsonNode> e = it.next();
      if (!e.getValue().asText().equals(Group.NONE)) {
        parts.add(e.getKey() + "=" + e.getValue().asText());
      }
    }
    return String.join(",", parts);
  }

  private static ArrayNode byId(JsonNode a, JsonNode b, List<String> fields) {
    Map<String, JsonNode> ma = new LinkedHashMap<>();
    a.forEach(x -> ma.put(x.path("id").asText(), x));
    Map<String, JsonNode> mb = new LinkedHashMap<>();
    b.forEach(x -> mb.put(x.path("id").asText(), x));
    Set<String> ids = new LinkedHashSet<>(ma.keySet());
    ids.addAll(mb.keySet());
    ArrayNode out = Json.pretty().createArrayNode();
    for (String id : ids) {
      ObjectNode o = out.addObject();
      o.put("id", id);
      for (String f : fields) {
        ObjectNode v = o.putObject(f);
        JsonNode x = ma.containsKey(id) ? ma.get(id).path(f) : null;
        JsonNode y = mb.containsKey(id) ? mb.get(id).path(f) : null;
        v.set("a", x == null || x.isMissingNode() ? null : x.deepCopy());
        v.set("b", y == null || y.isMissingNode() ? null : y.deepCopy());
        if (x != null && y != null && x.isNumber() && y.isNumber()) {
          v.put("change", y.asDouble() - x.asDouble());
        }
      }
    }
    return out;
  }
}
