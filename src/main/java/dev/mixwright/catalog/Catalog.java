package dev.mixwright.catalog;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/** A validated catalog: everything a solve needs, in the order of the file. */
public record Catalog(
    int format,
    String name,
    String currency,
    String period,
    List<Resource> resources,
    List<Group> groups,
    List<Rule> rules,
    List<Segment> segments,
    Optional<PortfolioSpec> portfolio,
    List<CurrentVariant> current,
    List<Map<String, String>> exclude) {

  public Catalog {
    current = current == null ? List.of() : List.copyOf(current);
    exclude = exclude == null ? List.of() : exclude.stream().map(Catalog::orderedChoices).toList();
    resources = List.copyOf(resources);
    groups = List.copyOf(groups);
    rules = List.copyOf(rules);
    segments = List.copyOf(segments);
  }

  /** A catalog without a current range or exclusions (the form before issue 10). */
  public Catalog(int format, String name, String currency, String period, List<Resource> resources,
      List<Group> groups, List<Rule> rules, List<Segment> segments, Optional<PortfolioSpec> portfolio) {
    this(format, name, currency, period, resources, groups, rules, segments, portfolio, List.of(), List.of());
  }

  /** This catalog with a current range and exclusions (replacing any it had). */
  public Catalog withCurrentRange(List<CurrentVariant> current, List<Map<String, String>> exclude) {
    return new Catalog(format, name, currency, period, resources, groups, rules, segments, portfolio, current, exclude);
  }

  public int resourceIndex(String id) {
    for (int i = 0; i < resources.size(); i++) {
      if (resources.get(i).id().equals(id)) {
        return i;
      }
    }
    return -1;
  }

  public int groupIndex(String id) {
    for (int i = 0; i < groups.size(); i++) {
      if (groups.get(i).id().equals(id)) {
        return i;
      }
    }
    return -1;
  }

  public int segmentIndex(String id) {
    for (int i = 0; i < segments.size(); i++) {
      if (segments.get(i).id().equals(id)) {
        return i;
      }
    }
    return -1;
  }

  /** True when some segment chooses by multinomial logit (has a {@code choice} section). */
  public boolean hasChoosingSegments() {
    return segments.stream().anyMatch(Segment::chooses);
  }

  /** True when some option lists several price points. */
  public boolean hasPricePoints() {
    return groups.stream().flatMap(g -> g.options().stream()).anyMatch(Option::hasPricePoints);
  }

  static Map<String, String> orderedChoices(Map<String, String> m) {
    return Collections.unmodifiableMap(new LinkedHashMap<>(m));
  }

  static Map<String, List<String>> orderedCopy(Map<String, List<String>> m) {
    if (m == null || m.isEmpty()) {
      return Map.of();
    }
    LinkedHashMap<String, List<String>> copy = new LinkedHashMap<>();
    m.forEach((k, v) -> copy.put(k, List.copyOf(v)));
    return Collections.unmodifiableMap(copy);
  }
}
