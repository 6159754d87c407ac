package dev.mixwright.catalog;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads the catalog's {@code current} (the variants on sale today) and {@code exclude} (option
 * combinations that may not be offered) sections, after the rest of the catalog was read without
 * problems, so that groups, options and rules are known. Problems name the exact path: an unknown
 * group or option, a required group left out, a variant the rules forbid (naming the rule), a pinned
 * variant that an exclude entry forbids, a negative discontinue cost.
 */
final class CurrentRangeReader {
  private static final List<String> CURRENT_FIELDS = List.of("variant", "discontinue", "keep");

  private final Catalog catalog;
  private final List<CatalogProblem> problems = new ArrayList<>();

  private CurrentRangeReader(Catalog catalog) {
    this.catalog = catalog;
  }

  /** The catalog with its current range, or the problems found in those two sections. */
  static Catalog read(JsonNode root, Catalog catalog) throws CatalogException {
    CurrentRangeReader r = new CurrentRangeReader(catalog);
    List<Map<String, String>> exclude = r.readExclude(root.get("exclude"));
    List<CurrentVariant> current = r.readCurrent(root.get("current"), exclude);
    if (!r.problems.isEmpty()) {
      throw new CatalogException(r.problems);
    }
    return catalog.withCurrentRange(current, exclude);
  }

  private List<Map<String, String>> readExclude(JsonNode v) {
    List<Map<String, String>> out = new ArrayList<>();
    if (v == null || v.isNull()) {
      return out;
    }
    if (!v.isArray()) {
      problem("exclude", "must be a list of option combinations, e.g. [{refrigerant: r290, mounting: roof}], got "
          + Where.describe(v));
      return out;
    }
    for (int i = 0; i < v.size(); i++) {
      String path = Where.index("exclude", i);
      Map<String, String> m = choices(v.get(i), path, false);
      if (m != null) {
        if (m.isEmpty()) {
          problem(path, "empty — name the options a variant may not hold together, e.g. {refrigerant: r290, mounting: roof}");
        } else {
          out.add(m);
        }
      }
    }
    return out;
  }

  private List<CurrentVariant> readCurrent(JsonNode v, List<Map<String, String>> exclude) {
    List<CurrentVariant> out = new ArrayList<>();
    if (v == null || v.isNull()) {
      return out;
    }
    if (!v.isArray()) {
      problem("current", "must be a list of the variants on sale today, e.g. [{variant: {capacity: c8,"
          + " compressor: rotary}, discontinue: 40000}], got " + Where.describe(v));
      return out;
    }
    Map<String, String> seen = new LinkedHashMap<>();
    int pinned = 0;
    for (int i = 0; i < v.size(); i++) {
      String path = Where.index("current", i);
      JsonNode c = v.get(i);
      if (c == null || !c.isObject()) {
        problem(path, "must be a mapping, e.g. {variant: {capacity: c8, compressor: rotary}, discontinue: 40000},"
            + " got " + Where.describe(c));
        continue;
      }
      c.fieldNames().forEachRemaining(f -> {
        if (!CURRENT_FIELDS.contains(f)) {
          problem(Where.field(path, f), "unknown field '" + f + "' of a current variant (fields: "
              + Where.list(CURRENT_FIELDS) + ")" + Where.didYouMean(f, CURRENT_FIELDS));
        }
      });
      int before = problems.size();
      double discontinue = 0;
      JsonNode d = c.get("discontinue");
      if (d != null && !d.isNull()) {
        if (!d.isNumber() || !Double.isFinite(d.doubleValue())) {
          problem(Where.field(path, "discontinue"), "must be a number, got " + Where.describe(d)
              + " — the one-off cost of dropping this variant, e.g. discontinue: 40000");
        } else if (d.doubleValue() < 0) {
          problem(Where.field(path, "discontinue"), "must be >= 0, got " + Where.num(d.doubleValue())
              + " — the one-off cost of dropping this variant; write 0 (or leave it out) when dropping it costs nothing");
        } else {
          discontinue = d.doubleValue();
        }
      }
      boolean keep = false;
      JsonNode k = c.get("keep");
      if (k != null && !k.isNull()) {
        if (!k.isBoolean()) {
          problem(Where.field(path, "keep"), "must be true or false, got " + Where.describe(k)
              + " — true: the portfolio must keep this variant; false (the default): it may be dropped");
        } else {
          keep = k.booleanValue();
        }
      }
      JsonNode vv = c.get("variant");
      String vpath = Where.field(path, "variant");
      if (vv == null || vv.isNull()) {
        problem(vpath, "missing — give the variant's options, e.g. variant: {capacity: c8, compressor: rotary}");
        continue;
      }
      Map<String, String> m = choices(vv, vpath, true);
      if (m == null || problems.size() != before) {
        continue;
      }
      String forbidding = ruleForbidding(m);
      if (forbidding != null) {
        problem(vpath, "is not buildable: " + forbidding + " — fix the variant or the rule");
        continue;
      }
      for (int e = 0; e < exclude.size(); e++) {
        if (keep && holdsAll(m, exclude.get(e))) {
          problem(path, "is pinned (keep: true) but exclude[" + e + "] forbids it — drop keep or the exclusion");
        }
      }
      String canon = canonical(m);
      String first = seen.putIfAbsent(canon, path);
      if (first != null) {
        problem(vpath, "the same variant as " + first + " — list each current variant once");
        continue;
      }
      if (keep) {
        pinned++;
      }
      out.add(new CurrentVariant(m, discontinue, keep));
    }
    int limit = catalog.portfolio().map(PortfolioSpec::maxVariants).orElse(Integer.MAX_VALUE);
    if (pinned > limit) {
      problem("current", pinned + " variants are pinned (keep: true) but portfolio.maxVariants is " + limit
          + " — pin fewer or raise the limit");
    }
    return out;
  }

  /**
   * A mapping of group to one choice, each checked against the catalog; null when it is not a
   * mapping. With {@code complete}, every required group must be named.
   */
  private Map<String, String> choices(JsonNode v, String path, boolean complete) {
    if (v == null || !v.isObject()) {
      problem(path, "must be a mapping of group to option, e.g. {refrigerant: r290, mounting: roof}, got " + Where.describe(v));
      return null;
    }
    Map<String, String> out = new LinkedHashMap<>();
    var it = v.fields();
    while (it.hasNext()) {
      var e = it.next();
      String gid = e.getKey();
      String at = Where.field(path, gid);
      int g = catalog.groupIndex(gid);
      List<String> groupIds = catalog.groups().stream().map(Group::id).toList();
      if (g < 0) {
        problem(at, "unknown group '" + gid + "' (groups: " + Where.list(groupIds) + ")"
            + Where.didYouMean(gid, groupIds));
        continue;
      }
      if (!e.getValue().isTextual()) {
        problem(at, "must be one option id, got " + Where.describe(e.getValue()));
        continue;
      }
      String choice = e.getValue().textValue();
      Group group = catalog.groups().get(g);
      List<String> ids = new ArrayList<>();
      for (int k = 0; k < group.choiceCount(); k++) {
        ids.add(group.choiceId(k));
      }
      List<String> points = new ArrayList<>();
      for (Option o : group.options()) {
        for (int p = 0; p < o.pricePointCount(); p++) {
          points.add(o.pointId(p));
        }
      }
      if (!group.required()) {
        points.add(Group.NONE);
      }
      boolean known = complete ? points.contains(choice) : ids.contains(option(choice)) && (choice.equals(option(choice))
          || points.contains(choice));
      if (!known) {
        problem(at, "unknown option '" + choice + "' in group '" + gid + "' (choices: " + Where.list(points) + ")"
            + Where.didYouMean(choice, points));
        continue;
      }
      out.put(gid, choice);
    }
    if (complete) {
      for (Group group : catalog.groups()) {
        if (group.required() && !v.has(group.id())) {
          problem(Where.field(path, group.id()), "missing — group '" + group.id()
              + "' is required, so a variant names one of its options");
        }
      }
    }
    return out;
  }

  /** The option of a choice written {@code option@price}, or the choice itself. */
  private static String option(String choice) {
    int mark = choice.indexOf(Option.PRICE_MARK);
    return mark > 0 ? choice.substring(0, mark) : choice;
  }

  /** What a group holds in a variant, as rules name it: the option without price, none when left out. */
  private static String held(Map<String, String> variant, String gid) {
    String c = variant.get(gid);
    return c == null ? Group.NONE : option(c);
  }

  /** The first rule the variant breaks, described for a message; null when it is buildable. */
  private String ruleForbidding(Map<String, String> variant) {
    List<Rule> rules = catalog.rules();
    for (int r = 0; r < rules.size(); r++) {
      Rule rule = rules.get(r);
      String name = "rules[" + r + "]" + (rule.id() == null ? "" : " (" + rule.id() + ")");
      if (rule.isForbid()) {
        if (matches(variant, rule.forbid())) {
          return name + " forbids " + rule.forbid();
        }
      } else if (matches(variant, rule.when()) && !matches(variant, rule.require())) {
        return name + " requires " + rule.require() + " when " + rule.when();
      }
    }
    return null;
  }

  /** True when every group of the clause holds one of its listed options. */
  private static boolean matches(Map<String, String> variant, Map<String, List<String>> clause) {
    for (Map.Entry<String, List<String>> e : clause.entrySet()) {
      if (!e.getValue().contains(held(variant, e.getKey()))) {
        return false;
      }
    }
    return true;
  }

  /** True when the variant holds every choice of an exclude entry (an entry naming an option covers its price points). */
  static boolean holdsAll(Map<String, String> variant, Map<String, String> entry) {
    for (Map.Entry<String, String> e : entry.entrySet()) {
      String c = variant.get(e.getKey());
      String h = c == null ? Group.NONE : c;
      if (!(h.equals(e.getValue()) || option(h).equals(e.getValue()))) {
        return false;
      }
    }
    return true;
  }

  private String canonical(Map<String, String> m) {
    StringBuilder b = new StringBuilder();
    for (Group g : catalog.groups()) {
      b.append(g.id()).append('=').append(m.getOrDefault(g.id(), Group.NONE)).append(',');
    }
    return b.toString();
  }

  private void problem(String path, String message) {
    problems.add(new CatalogProblem(path, message));
  }
}
