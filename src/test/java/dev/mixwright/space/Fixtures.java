package dev.mixwright.space;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/** Hand-built catalogs for tests (invented data). */
final class Fixtures {
  private Fixtures() {}

  static Group group(String id, boolean required, String... optionIds) {
    List<Option> opts = new ArrayList<>();
    for (String o : optionIds) {
      opts.add(new Option(o, null, 100, 60, Map.of(), 0.0));
    }
    return new Group(id, null, required, opts);
  }

  /** A group "g{i}" with options "o0".."o{k-1}". */
  static Group numbered(int i, int k) {
    String[] ids = new String[k];
    for (int j = 0; j < k; j++) {
      ids[j] = "o" + j;
    }
    return group("g" + i, true, ids);
  }

  /** Ordered map from alternating keys and comma-separated choice lists: m("motor", "a,b"). */
  static Map<String, List<String>> m(String... kv) {
    LinkedHashMap<String, List<String>> out = new LinkedHashMap<>();
    for (int i = 0; i < kv.length; i += 2) {
      out.put(kv[i], List.of(kv[i + 1].split(",")));
    }
    return out;
  }

  static Rule forbid(Map<String, List<String>> combination) {
    return new Rule(null, Map.of(), Map.of(), combination);
  }

  static Rule when(Map<String, List<String>> when, Map<String, List<String>> require) {
    return new Rule(null, when, require, Map.of());
  }

  static Segment segment(String id, Map<String, List<String>> accepts) {
    return new Segment(id, null, 100, 1.0, accepts, Map.of());
  }

  static Catalog catalog(List<Group> groups, List<Rule> rules, List<Segment> segments) {
    return new Catalog(1, "test", "EUR", "year", List.of(), groups, rules, segments, Optional.empty());
  }
}
