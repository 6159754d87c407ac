package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Short names of variants a run does not hold: the nearest code and what differs, each choice findable by its group. */
class VariantNamesTest {
  /** Invented: two groups numbering their options alike (o1, o2), as generated catalogs do. */
  private static final String CATALOG = """
      format: 1
      name: bikes
      currency: EUR
      period: year
      resources:
        - {id: frames, unit: h, capacity: 100}
      groups:
        - id: g1
          label: Frame
          options:
            - {id: o1, label: Steel frame, price: 10, cost: 5, uses: {frames: 1}}
            - {id: o2, price: 12, cost: 6, uses: {frames: 1}}
            - {id: o3, prices: [14, 15], cost: 7, uses: {frames: 1}}
        - id: g2
          required: false
          options:
            - {id: o1, price: 3, cost: 1}
            - {id: o2, price: 4, cost: 2}
      segments:
        - {id: s, demand: 10}
      """;

  private static Map<String, String> v(String g1, String g2) {
    Map<String, String> m = new LinkedHashMap<>();
    m.put("g1", g1);
    m.put("g2", g2);
    return m;
  }

  private static VariantNames names(Catalog catalog) {
    List<RunResult.Offer> offers = List.of(
        new RunResult.Offer("s", v("o2", "o1"), 6, 5, 0, false, 30),
        new RunResult.Offer("s", v("o2", "o2"), 4, 5, 0, false, 20));
    return VariantNames.of(new RunResult(null, "", 0, null, null, 0, 0, 0, "1", null, null, null, 0, null, null, offers,
        null, null, null, null, null, null), catalog);
  }

  @Test
  void anOptionWithoutALabelIsNamedWithItsGroup() throws Exception {
    Catalog c = CatalogLoader.parse(CATALOG, "bikes.yaml", null);
    VariantNames labelled = names(c);
    assertEquals("V01", labelled.shortName(v("o2", "o1")));
    assertEquals("V01 but Steel frame", labelled.shortName(v("o1", "o1")));
    assertEquals("V01 but g1=o3@15", labelled.shortName(v("o3@15", "o1")));
    // V01 and V02 each differ in g2 alone: the lower code
    assertEquals("V01 but no g2", labelled.shortName(v("o2", "none")));
    VariantNames plain = names(null);
    assertEquals("V01 but g1=o1", plain.shortName(v("o1", "o1")));
    assertEquals("V02 but g1=o3", plain.shortName(v("o3", "o2")));
    assertEquals("V01 but g1=o3, no g2", plain.shortName(Map.of("g1", "o3")));
  }
}
