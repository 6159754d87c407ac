package dev.mixwright.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogProblem;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Scenario-set files: the list and draws forms, normalised weights, and bad input named by path. */
class ScenarioSetsTest {
  static Catalog starter;

  @TempDir Path dir;

  @BeforeAll
  static void load() throws Exception {
    starter = CatalogLoader.load(Path.of("src/test/resources/fixed-demand/heatpump-starter.yaml"));
  }

  private Path file(String name, String text) throws Exception {
    Path f = dir.resolve(name);
    Files.writeString(f, text);
    return f;
  }

  private CatalogException bad(String text) throws Exception {
    Path f = file("bad.yaml", text);
    return assertThrows(CatalogException.class, () -> ScenarioSets.load(f, starter));
  }

  private static boolean names(CatalogException e, String path, String words) {
    for (CatalogProblem p : e.problems()) {
      if (p.path().equals(path) && p.message().contains(words)) {
        return true;
      }
    }
    return false;
  }

  @Test
  void aListTakesFilesInlineChangesAndTheCatalogAsItIsWithWeightsNormalised() throws Exception {
    file("low.yaml", "resources: {testbench: {capacity: 8000}}\n");
    ScenarioSet set = ScenarioSets.load(file("set.yaml", """
        scenarios:
          - {id: low, weight: 3, file: low.yaml}
          - {id: base, weight: 5}
          - {id: high, weight: 2, change: {segments: {newbuild: {demand: "+20%"}}}}
        """), starter);
    assertEquals(List.of("low", "base", "high"), set.members().stream().map(ScenarioSet.Member::id).toList());
    assertEquals(0.3, set.weights()[0], 1e-12);
    assertEquals(0.5, set.weights()[1], 1e-12);
    assertEquals(0.2, set.weights()[2], 1e-12);
    List<Catalog> cs = set.catalogs(starter);
    assertEquals(8000, cs.get(0).resources().get(cs.get(0).resourceIndex("testbench")).capacity());
    int nb = starter.segmentIndex("newbuild");
    assertEquals(starter.segments().get(nb).demand(), cs.get(1).segments().get(nb).demand());
    assertEquals(starter.segments().get(nb).demand() * 1.2, cs.get(2).segments().get(nb).demand(), 1e-9);
  }

  @Test
  void drawsAreSeededEqualWeightsAndStayWithinTheirTriangle() throws Exception {
    String text = """
        draws: {count: 400, seed: 11}
        vary:
          resources: {testbench: {capacity: {normal: {sd: "10%"}}}}
          options: {compressor.evi: {cost: {triangular: {low: "-10%", high: "+20%"}}}}
        """;
    ScenarioSet a = ScenarioSets.load(file("d.yaml", text), starter);
    ScenarioSet b = ScenarioSets.load(file("d2.yaml", text), starter);
    assertEquals(400, a.size());
    assertEquals(1.0 / 400, a.weights()[17], 1e-15);
    List<Catalog> ca = a.catalogs(starter);
    List<Catalog> cb = b.catalogs(starter);
    int g = starter.groupIndex("compressor");
    double base = starter.resources().get(starter.resourceIndex("testbench")).capacity();
    double sum = 0;
    for (int i = 0; i < ca.size(); i++) {
      double cap = ca.get(i).resources().get(starter.resourceIndex("testbench")).capacity();
      assertEquals(cap, cb.get(i).resources().get(starter.resourceIndex("testbench")).capacity(), "same seed");
      sum += cap;
      double cost = ca.get(i).groups().get(g).options().stream().filter(o -> o.id().equals("evi")).findFirst()
          .orElseThrow().cost();
      assertTrue(cost >= 960 * 0.9 - 1e-9 && cost <= 960 * 1.2 + 1e-9, "cost " + cost + " outside its triangle");
    }
    // the mean of 400 normal draws of sd 10 % lies within 4 standard errors (0.5 % each) of the figure
    assertEquals(base, sum / ca.size(), base * 0.02);
  }

  @Test
  void badInputNamesThePathAndTheFix() throws Exception {
    assertTrue(names(bad("scenarios: [{id: a, change: {segments: {nosuch: {demand: 5}}}}]\n"),
        "scenarios[0].change.segments.nosuch", "no segment 'nosuch'"));
    assertTrue(names(bad("""
        draws: {count: 10, seed: 1}
        vary: {resources: {testbench: {capacity: {normal: {sd: "-10%"}}}}}
        """), "vary.resources.testbench.capacity.normal.sd", "spread must be >= 0"));
    assertTrue(names(bad("""
        draws: {count: 10, seed: 1}
        vary: {resources: {testbench: {capacity: {triangular: {low: "+10%", high: "-10%"}}}}}
        """), "vary.resources.testbench.capacity.triangular", "negative spread"));
    assertTrue(names(bad("""
        draws: {count: 0, seed: 1}
        vary: {resources: {testbench: {capacity: {normal: {sd: 100}}}}}
        """), "draws.count", "from 1 to"));
    assertTrue(names(bad("scenarios: [{id: a, weight: 0}, {id: b, weight: 0}]\n"), "scenarios",
        "sum to a positive number"));
    assertTrue(names(bad("scenarios: [{id: a, weight: -1}]\n"), "scenarios[0].weight", ">= 0"));
    assertTrue(names(bad("scenarios: [{id: a}, {id: a}]\n"), "scenarios[1].id", "used twice"));
    assertTrue(names(bad("scenarios: [{id: a, change: {portfolio: {maxVariants: 3}}}]\n"),
        "scenarios[0].change.portfolio.maxVariants", "cannot change"));
    assertTrue(names(bad("scenarios: [{id: a, file: missing.yaml}]\n"), "scenarios[0].file", "no scenario file"));
    assertTrue(names(bad("draws: {count: 3}\nvary: {resources: {nosuch: {capacity: {normal: {sd: 1}}}}}\n"),
        "vary.resources.nosuch", "nosuch"));
  }
}
