package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.testing.Cases;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Writing a catalog and loading it back gives the same catalog, in JSON and in YAML. Seeded cases
 * ({@link Cases}); a failure names its seed.
 */
class CatalogRoundTripProperties {

  @Test
  void randomCatalogsRoundTripThroughJsonAndYaml() {
    Cases.checked(300, (seed, rnd) -> {
      Catalog c = RandomCatalogs.random(rnd, Cases.between(rnd, 1, 6), 4, Cases.between(rnd, 0, 4), 3,
          6, rnd.nextBoolean());
      // RandomCatalogs may draw a price below zero (cost + [-15, 65) with cost >= 10), which the
      // loader rejects; those draws say nothing about the writer.
      if (!c.groups().stream().flatMap(g -> g.options().stream()).allMatch(o -> o.price() >= 0)) {
        return false;
      }
      assertRoundTrips(c);
      return true;
    });
  }

  @Test
  void trickyTextAndNumbersRoundTrip() {
    Cases.each(200, (seed, rnd) -> assertRoundTrips(tricky(rnd)));
  }

  @Test
  void writingIsCanonical() {
    Cases.each(50, (seed, rnd) -> {
      Catalog c = tricky(rnd);
      String json = CatalogWriter.toJson(c);
      assertEquals(json, CatalogWriter.toJson(CatalogLoader.parse(json, "c.json", null)));
      String yaml = CatalogWriter.toYaml(c);
      assertEquals(yaml, CatalogWriter.toYaml(CatalogLoader.parse(yaml, "c.yaml", null)));
    });
  }

  private static void assertRoundTrips(Catalog c) throws CatalogException {
    String json = CatalogWriter.toJson(c);
    assertEquals(c, CatalogLoader.parse(json, "c.json", null), json);
    String yaml = CatalogWriter.toYaml(c);
    assertEquals(c, CatalogLoader.parse(yaml, "c.yaml", null), yaml);
  }

  // ------------------------------------------------------------------ a generator of awkward
  // catalogs

  /** Words that YAML or JSON could misread when written carelessly (invented test data). */
  private static final List<String> WORDS =
      List.of(
          "yes", "no", "on", "off", "true", "false", "null", "~", "007", "1e3", "0x1F", ".inf",
          "1_000", "-5", "a b", "é", "中文", "x:y", "#c", "- d", "'q'", "\"dq\"", "[x]", "{y}",
          "None", "NONE", "@at", "`b`", "%p", "&a", "*s", "!t", "|p", ">f", "a\\b", "tab\tin", "🚲",
          "weld", "frame", "step", "b750");

  private static final List<String> LABELS =
      List.of(
          "",
          "line1\nline2",
          "  spaced  ",
          "ünïcödé ✓",
          "emoji 🚲",
          "colon: here",
          "quote \" and '");

  private static Catalog tricky(Random rnd) {
    List<Resource> resources = new ArrayList<>();
    for (String id : ids(rnd, Checks.IdKind.RESOURCE, rnd.nextInt(4))) {
      resources.add(new Resource(id, text(rnd), text(rnd), nonNegative(rnd)));
    }
    List<Group> groups = new ArrayList<>();
    for (String gid : ids(rnd, Checks.IdKind.GROUP, 1 + rnd.nextInt(3))) {
      List<Option> options = new ArrayList<>();
      for (String oid : ids(rnd, Checks.IdKind.OPTION, 1 + rnd.nextInt(3))) {
        Map<String, Double> uses = new LinkedHashMap<>();
        for (Resource r : resources) {
          if (rnd.nextBoolean()) {
            uses.put(r.id(), nonNegative(rnd));
          }
        }
        options.add(new Option(oid, text(rnd), nonNegative(rnd), nonNegative(rnd), uses, 0.0));
      }
      groups.add(new Group(gid, text(rnd), rnd.nextBoolean(), options));
    }
    List<Rule> rules = new ArrayList<>();
    for (int i = 0; i < rnd.nextInt(3); i++) {
      Group a = groups.get(rnd.nextInt(groups.size()));
      Group b = groups.get(rnd.nextInt(groups.size()));
      String id = rnd.nextBoolean() ? null : "rule " + i + " " + ids(rnd, Checks.IdKind.RULE, 1).get(0);
      if (rnd.nextBoolean() || a == b) {
        rules.add(new Rule(id, Map.of(), Map.of(), Map.of(a.id(), List.of(choice(rnd, a)))));
      } else {
        rules.add(
            new Rule(
                id,
                Map.of(a.id(), List.of(choice(rnd, a))),
                Map.of(b.id(), List.of(choice(rnd, b))),
                Map.of()));
      }
    }
    List<Segment> segments = new ArrayList<>();
    for (String sid : ids(rnd, Checks.IdKind.SEGMENT, 1 + rnd.nextInt(2))) {
      Group g = groups.get(rnd.nextInt(groups.size()));
      Map<String, List<String>> accepts =
          rnd.nextBoolean() ? Map.of(g.id(), List.of(choice(rnd, g))) : Map.of();
      Map<String, Double> value = new LinkedHashMap<>();
      for (Group h : groups) {
        if (rnd.nextBoolean()) {
          value.put(h.id() + "." + choice(rnd, h), finite(rnd));
        }
      }
      double share = rnd.nextBoolean() ? 1.0 : 1.0 - rnd.nextDouble(); // in (0, 1]
      segments.add(new Segment(sid, text(rnd), nonNegative(rnd), share, accepts, value));
    }
    Optional<PortfolioSpec> portfolio =
        rnd.nextBoolean()
            ? Optional.empty()
            : Optional.of(
                new PortfolioSpec(
                    nonNegative(rnd),
                    rnd.nextBoolean() ? Integer.MAX_VALUE : 1 + rnd.nextInt(Integer.MAX_VALUE),
                    nonNegative(rnd)));
    return new Catalog(
        1, text(rnd), text(rnd), text(rnd), resources, groups, rules, segments, portfolio);
  }

  /** Distinct ids the loader accepts for this kind. */
  private static List<String> ids(Random rnd, Checks.IdKind kind, int n) {
    List<String> pool =
        new ArrayList<>(WORDS.stream().filter(w -> Checks.idProblem(w, kind) == null).toList());
    java.util.Collections.shuffle(pool, rnd);
    return pool.subList(0, Math.min(n, pool.size()));
  }

  private static String choice(Random rnd, Group g) {
    return g.choiceId(rnd.nextInt(g.choiceCount()));
  }

  private static String text(Random rnd) {
    int k = rnd.nextInt(3);
    return k == 0 ? null : k == 1 ? pick(rnd, WORDS) : pick(rnd, LABELS);
  }

  private static <T> T pick(Random rnd, List<T> items) {
    return items.get(rnd.nextInt(items.size()));
  }

  /**
   * A double >= 0 that every figure of a catalog accepts (0, or within [1e-6, 1e6]; see Limits):
   * often a plain value, else a full 53-bit mantissa at a random binary exponent, which only a
   * shortest-round-trip writer gets back exactly.
   */
  private static double nonNegative(Random rnd) {
    if (rnd.nextBoolean()) {
      return pick(
          rnd,
          List.of(
              0.0,
              1.0,
              0.1,
              1.6,
              14000.0,
              1e-6,
              0.35,
              Math.nextUp(1.0),
              999999.9999999999,
              123456.78901234567,
              1e6));
    }
    return Math.scalb(1 + rnd.nextDouble(), rnd.nextInt(37) - 19); // in [2^-19, 2^18)
  }

  /** Any finite double, negative ones and -0.0 included. */
  private static double finite(Random rnd) {
    if (rnd.nextInt(8) == 0) {
      return -0.0;
    }
    return rnd.nextBoolean() ? nonNegative(rnd) : -nonNegative(rnd);
  }
}
