package dev.mixwright.catalog;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.core.util.Separators;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectWriter;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.dataformat.yaml.YAMLGenerator;
import com.fasterxml.jackson.dataformat.yaml.YAMLMapper;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Writes a catalog in the schema {@link CatalogLoader} reads, in one canonical form: fields in a
 * fixed order, options inline (never as CSV tables), defaults written out ({@code required}, {@code
 * maxShare}, {@code uses}, {@code accepts}, {@code value}, {@code introductionCost}, {@code
 * minLot}, a choosing segment's {@code stayOut} and {@code utility}); an option with one price
 * point is written with {@code price}, one with several with {@code prices}; a choosing segment's
 * part-worths are all written inline (never as a {@code utilityFile}); absent labels and names are left out, and so is {@code maxVariants} when there is no
 * limit, and an option's {@code tooling} when it is 0. Whole numbers are written without a fraction; other numbers in Java's shortest round-trip
 * form, so {@code CatalogLoader.parse(toJson(c), "x.json", null)} equals {@code c} for any catalog
 * the loader accepts.
 */
public final class CatalogWriter {
  /** Doubles up to 2^53 in magnitude are exact as longs. */
  private static final double EXACT_LONG = 9007199254740992.0;

  private static final JsonNodeFactory NODES = JsonNodeFactory.instance;
  private static final ObjectWriter JSON = jsonWriter();
  private static final ObjectMapper YAML =
      YAMLMapper.builder()
          .disable(YAMLGenerator.Feature.WRITE_DOC_START_MARKER)
          .disable(YAMLGenerator.Feature.SPLIT_LINES)
          .enable(YAMLGenerator.Feature.INDENT_ARRAYS_WITH_INDICATOR)
          .build();

  private CatalogWriter() {}

  private static ObjectWriter jsonWriter() {
    DefaultIndenter indent = new DefaultIndenter("  ", "\n");
    Separators separators =
        Separators.createDefaultInstance()
            .withObjectFieldValueSpacing(Separators.Spacing.AFTER)
            .withObjectEmptySeparator("")
            .withArrayEmptySeparator("");
    DefaultPrettyPrinter printer =
        new DefaultPrettyPrinter(separators).withObjectIndenter(indent).withArrayIndenter(indent);
    return JsonMapper.builder().build().writer(printer);
  }

  public static String toJson(Catalog catalog) {
    try {
      return JSON.writeValueAsString(tree(catalog)) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("writing a JSON tree to a string cannot fail", e);
    }
  }

  /**
   * The same content as {@link #toJson} in YAML; every string is quoted, so none reads back as a
   * number or boolean.
   */
  public static String toYaml(Catalog catalog) {
    try {
      return YAML.writeValueAsString(tree(catalog));
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("writing a YAML tree to a string cannot fail", e);
    }
  }

  /** The catalog as a tree in the file schema. */
  public static ObjectNode tree(Catalog c) {
    ObjectNode root = NODES.objectNode();
    root.put("format", c.format());
    putText(root, "name", c.name());
    putText(root, "currency", c.currency());
    putText(root, "period", c.period());
    ArrayNode resources = root.putArray("resources");
    for (Resource r : c.resources()) {
      ObjectNode n = item(resources, r.id(), r.label());
      putText(n, "unit", r.unit());
      putNumber(n, "capacity", r.capacity());
    }
    ArrayNode groups = root.putArray("groups");
    for (Group g : c.groups()) {
      ObjectNode n = item(groups, g.id(), g.label());
      n.put("required", g.required());
      ArrayNode options = n.putArray("options");
      for (Option o : g.options()) {
        ObjectNode on = item(options, o.id(), o.label());
        if (o.hasPricePoints()) {
          ArrayNode prices = on.putArray("prices");
          o.prices().forEach(x -> addNumber(prices, x));
        } else {
          putNumber(on, "price", o.price());
        }
        putNumber(on, "cost", o.cost());
        putNumbers(on.putObject("uses"), inResourceOrder(c, o.uses()), o.uses());
        if (o.tooling() != 0) {
          putNumber(on, "tooling", o.tooling());
        }
      }
    }
    ArrayNode rules = root.putArray("rules");
    for (Rule r : c.rules()) {
      ObjectNode n = rules.addObject();
      putText(n, "id", r.id());
      putClause(n, "when", r.when());
      putClause(n, "require", r.require());
      putClause(n, "forbid", r.forbid());
    }
    ArrayNode segments = root.putArray("segments");
    for (Segment s : c.segments()) {
      ObjectNode n = item(segments, s.id(), s.label());
      if (!s.chooses()) {
        putNumber(n, "demand", s.demand());
        putNumber(n, "maxShare", s.maxShare());
      }
      ObjectNode accepts = n.putObject("accepts");
      s.accepts().forEach((g, choices) -> choices.forEach(accepts.putArray(g)::add));
      putNumbers(n.putObject("value"), inChoiceOrder(c, s.value()), s.value());
      s.choice()
          .ifPresent(
              ch -> {
                ObjectNode cn = n.putObject("choice");
                putNumber(cn, "buyers", ch.buyers());
                putNumber(cn, "stayOut", ch.stayOut());
                putNumber(cn, "priceWeight", ch.priceWeight());
                putNumbers(cn.putObject("utility"), inChoiceOrder(c, ch.utility()), ch.utility());
              });
    }
    c.portfolio()
        .ifPresent(
            p -> {
              ObjectNode n = root.putObject("portfolio");
              putNumber(n, "introductionCost", p.introductionCost());
              if (p.maxVariants() != Integer.MAX_VALUE) {
                n.put("maxVariants", p.maxVariants());
              }
              putNumber(n, "minLot", p.minLot());
              if (p.wholeUnits()) {
                n.put("wholeUnits", true);
              }
            });
    // current range (issue 10)
    if (!c.current().isEmpty()) {
      var list = root.putArray("current");
      for (CurrentVariant cv : c.current()) {
        ObjectNode n = list.addObject();
        cv.variant().forEach(n.putObject("variant")::put);
        putNumber(n, "discontinue", cv.discontinue());
        if (cv.keep()) {
          n.put("keep", true);
        }
      }
    }
    if (!c.exclude().isEmpty()) {
      var list = root.putArray("exclude");
      c.exclude().forEach(e -> e.forEach(list.addObject()::put));
    }
    return root;
  }

  /** A new entry of a list with its id and, when it has one, its label. */
  private static ObjectNode item(ArrayNode list, String id, String label) {
    ObjectNode n = list.addObject();
    n.put("id", id);
    putText(n, "label", label);
    return n;
  }

  private static void putNumbers(ObjectNode n, List<String> keys, Map<String, Double> figures) {
    keys.forEach(key -> putNumber(n, key, figures.get(key)));
  }

  private static void putText(ObjectNode n, String field, String text) {
    if (text != null) {
      n.put(field, text);
    }
  }

  private static void putClause(ObjectNode n, String field, Map<String, List<String>> clause) {
    if (!clause.isEmpty()) {
      ObjectNode c = n.putObject(field);
      clause.forEach((g, choices) -> choices.forEach(c.putArray(g)::add));
    }
  }

  /** 520 rather than 520.0; -0.0 keeps its sign so that it reads back equal. */
  private static void putNumber(ObjectNode n, String field, double x) {
    n.set(field, number(x));
  }

  private static void addNumber(ArrayNode a, double x) {
    a.add(number(x));
  }

  private static JsonNode number(double x) {
    boolean negativeZero = x == 0 && Double.doubleToRawLongBits(x) != 0;
    boolean whole = x == Math.rint(x) && Math.abs(x) <= EXACT_LONG && !negativeZero;
    return whole ? NODES.numberNode((long) x) : NODES.numberNode(x);
  }

  /** Keys of a uses map in the catalog's resource order; unknown keys after, sorted. */
  private static List<String> inResourceOrder(Catalog c, Map<String, Double> uses) {
    List<String> keys = new ArrayList<>();
    for (Resource r : c.resources()) {
      if (uses.containsKey(r.id())) {
        keys.add(r.id());
      }
    }
    new TreeMap<>(uses).keySet().stream().filter(k -> !keys.contains(k)).forEach(keys::add);
    return keys;
  }

  /**
   * Keys of a value map ({@code group.option}) in group, then choice order; unknown keys after,
   * sorted.
   */
  private static List<String> inChoiceOrder(Catalog c, Map<String, Double> value) {
    List<String> keys = new ArrayList<>();
    for (Group g : c.groups()) {
      for (int k = 0; k < g.choiceCount(); k++) {
        String key = g.id() + "." + g.choiceId(k);
        if (value.containsKey(key)) {
          keys.add(key);
        }
      }
    }
    new TreeMap<>(value).keySet().stream().filter(k -> !keys.contains(k)).forEach(keys::add);
    return keys;
  }
}
