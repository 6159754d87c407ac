package dev.mixwright.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import java.util.Map;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogProblem;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.Segment;
import dev.mixwright.scenario.Scenario.Amount;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ScenariosTest {
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

  private static Option option(Catalog c, String g, String o) {
    return c.groups().get(c.groupIndex(g)).options().stream().filter(x -> x.id().equals(o)).findFirst().orElseThrow();
  }

  @Test
  void aScenarioChangesFiguresByIdAndLeavesTheRestAlone() throws Exception {
    Scenario s = Scenarios.load(file("s.yaml", """
        format: 1
        name: tight bench
        resources: {testbench: {capacity: 8000}, assembly: {capacity: "-10%"}}
        options:
          compressor.evi: {cost: "+120", price: "x1.05"}
          tank.t300: {price: "=50"}
        segments: {quiet: {demand: "+500", maxShare: 0.5}}
        rules: {propane-clearance: off, big-tank-needs-output: on}
        """), starter);
    assertEquals("tight bench", s.name());
    Catalog c = s.applyTo(starter);
    assertEquals(8000, c.resources().get(c.resourceIndex("testbench")).capacity());
    assertEquals(45000, c.resources().get(c.resourceIndex("assembly")).capacity(), 1e-9);
    assertEquals(11000, c.resources().get(c.resourceIndex("inverter")).capacity());
    assertEquals(960 + 120, option(c, "compressor", "evi").cost());
    assertEquals(1250 * 1.05, option(c, "compressor", "evi").price(), 1e-9);
    assertEquals(50, option(c, "tank", "t300").price());
    assertEquals(option(starter, "tank", "t300").cost(), option(c, "tank", "t300").cost());
    Segment quiet = c.segments().get(c.segmentIndex("quiet"));
    assertEquals(starter.segments().get(starter.segmentIndex("quiet")).demand() + 500, quiet.demand());
    assertEquals(0.5, quiet.maxShare());
    assertEquals(starter.rules().size() - 1, c.rules().size());
    assertTrue(c.rules().stream().noneMatch(r -> "propane-clearance".equals(r.id())));
    // The result is a catalog the loader accepts as it stands.
    assertEquals(c, CatalogLoader.parse(CatalogWriter.toJson(c), "c.json", null));
  }

  @Test
  void aScenarioKeepsTodaysRangeTheExclusionsAndTheChoiceOfASegment() throws Exception {
    // the shipped starter: segments that choose, a range on sale today; before, a scenario dropped
    // the range and the exclusions, and a demand change made a choosing segment a fixed one
    Catalog shipped = CatalogLoader.load(Path.of("catalogs/heatpump-starter.yaml"));
    Catalog withExclude = shipped.withCurrentRange(shipped.current(), List.of(Map.of("capacity", "c9",
        "refrigerant", "r32")));
    Scenario s = Scenarios.load(file("s.yaml", """
        format: 1
        resources: {inverter: {capacity: "-10%"}}
        segments: {retrofit: {demand: "+20%"}}
        """), withExclude);
    Catalog c = s.applyTo(withExclude);
    assertEquals(withExclude.current(), c.current());
    assertEquals(withExclude.exclude(), c.exclude());
    Segment before = withExclude.segments().get(withExclude.segmentIndex("retrofit"));
    Segment after = c.segments().get(c.segmentIndex("retrofit"));
    assertTrue(after.chooses(), "still a segment that chooses");
    assertEquals(before.choice().get().buyers() * 1.2, after.choice().get().buyers(), 1e-6);
    assertEquals(before.choice().get().utility(), after.choice().get().utility());
    assertEquals(after.choice().get().buyers(), after.demand());

    CatalogException e = assertThrows(CatalogException.class, () -> Scenarios.load(file("m.yaml", """
        format: 1
        segments: {retrofit: {maxShare: 0.5}}
        """), withExclude).applyTo(withExclude));
    assertTrue(e.getMessage().contains("chooses"), e.getMessage());
  }

  @Test
  void changingAPriceOrCostKeepsEveryOtherFieldOfTheOption() throws Exception {
    // A price or cost change once rebuilt the option without its tooling, so a scenario's
    // portfolio paid no tooling and looked better than it is.
    Catalog tooled = CatalogLoader.parse("""
        format: 1
        resources: [{id: hours, capacity: 100}]
        groups:
          - id: body
            options:
              - {id: steel, label: Steel body, price: 50, cost: 20, uses: {hours: 2}, tooling: 4000}
              - {id: alloy, price: 70, cost: 30, tooling: 9000}
        segments: [{id: all, demand: 40}]
        """, "tooled.yaml", null);
    Catalog c = Scenarios.load(file("s.yaml", """
        options:
          body.steel: {price: "+5"}
          body.alloy: {cost: "x2"}
        """), tooled).applyTo(tooled);
    Option steel = option(c, "body", "steel");
    Option alloy = option(c, "body", "alloy");
    assertEquals(4000, steel.tooling());
    assertEquals(9000, alloy.tooling());
    assertEquals(new Option("steel", "Steel body", 55, 20, java.util.Map.of("hours", 2.0), 4000), steel);
    assertEquals(60, alloy.cost());
  }

  @Test
  void everyProblemIsReportedAtItsPathInOnePass() throws Exception {
    CatalogException e = assertThrows(CatalogException.class, () -> Scenarios.load(file("bad.yaml", """
        resources:
          testbnch: {capacity: 8000}
          assembly: {capcity: 1}
        options:
          compressor.evi: {cost: "10%"}
          tank.none: {price: 3}
          nodot: {price: 3}
        segments: {quiet: {demand: -5}}
        rules: {big-tank-needs-output: maybe, nosuchrule: off}
        colour: red
        """), starter));
    List<String> paths = e.problems().stream().map(CatalogProblem::path).toList();
    assertEquals(List.of("colour", "resources.testbnch", "resources.assembly.capcity",
        "options[\"compressor.evi\"].cost", "options[\"tank.none\"]", "options.nodot",
        "rules.big-tank-needs-output", "rules.nosuchrule", "segments.quiet.demand"), paths, e.getMessage());
    String m = e.getMessage();
    assertTrue(m.contains("did you mean 'testbench'"), m);
    assertTrue(m.contains("did you mean 'capacity'"), m);
    assertTrue(m.contains("+10% or -10%"), m);
    assertTrue(m.contains("must be >= 0"), m);
    assertTrue(m.contains("rule ids are"), m);
  }

  @Test
  void aRelativeChangeThatGivesAnInvalidFigureIsAProblemAtItsPath() throws Exception {
    CatalogException e = assertThrows(CatalogException.class, () -> Scenarios.load(
        file("neg.json", "{\"resources\": {\"inverter\": {\"capacity\": \"-12000\"}}}"), starter));
    assertEquals("resources.inverter.capacity", e.problems().get(0).path());
    assertTrue(e.problems().get(0).message().contains("-12000 of 11000 gives -1000"), e.getMessage());
  }

  @Test
  void aNegativePriceIsRefusedAsTheCatalogWouldRefuseIt() throws Exception {
    CatalogException e = assertThrows(CatalogException.class, () -> Scenarios.load(
        file("p.yaml", "options: {tank.t300: {price: \"=-50\"}}"), starter));
    assertEquals("options[\"tank.t300\"].price", e.problems().get(0).path());
    assertTrue(e.problems().get(0).message().contains("a price must be >= 0"), e.getMessage());
  }

  @Test
  void notYamlIsOneProblemWithLineAndColumn() throws Exception {
    CatalogException e = assertThrows(CatalogException.class,
        () -> Scenarios.load(file("broken.yaml", "resources: {testbench: {capacity: 8000}\n"), starter));
    assertTrue(e.problems().get(0).path().startsWith("broken.yaml line"), e.getMessage());
  }

  @Test
  void gridRangesStepInExactDecimals() throws Exception {
    SweepPlan p = Scenarios.grid(List.of("segments.quiet.maxShare=0.1..0.5:0.1",
        "options.compressor.evi.cost=-10%..+10%:5%", "rules.propane-clearance=on,off"), Scenario.none(), List.of(),
        starter);
    assertEquals(3, p.axes().size());
    assertEquals(List.of("0.1", "0.2", "0.3", "0.4", "0.5"),
        p.axes().get(0).values().stream().map(Amount::text).toList());
    assertEquals(List.of("-10%", "-5%", "+0%", "+5%", "+10%"),
        p.axes().get(1).values().stream().map(Amount::text).toList());
    assertEquals(50, p.points().size());
    Catalog c = p.points().get(0).scenario().applyTo(starter);
    assertEquals(0.1, c.segments().get(c.segmentIndex("quiet")).maxShare());
    assertEquals(960 * 0.9, option(c, "compressor", "evi").cost(), 1e-9);
  }

  @Test
  void gridProblemsNameTheAxis() {
    CatalogException e = assertThrows(CatalogException.class, () -> Scenarios.grid(List.of(
        "resource.testbench.capacity=1..2:1", "resources.testbench.capacity=9..1:1",
        "resources.testbench.capacity=1..2", "resources.testbench.capacity=0..1e9:1",
        "segments.quiet.maxShare=0.5..1.5:0.5"), Scenario.none(), List.of(), starter));
    String m = e.getMessage();
    assertTrue(m.contains("--grid resource.testbench.capacity=1..2:1: 'resource.testbench.capacity' names no figure"), m);
    assertTrue(m.contains("must not be above"), m);
    assertTrue(m.contains("needs a step"), m);
    assertTrue(m.contains("more than 10000 values"), m);
  }

  @Test
  void aGridPointThatBreaksAFigureIsReported() {
    CatalogException e = assertThrows(CatalogException.class, () -> Scenarios.grid(
        List.of("segments.quiet.maxShare=0.5..1.5:0.5"), Scenario.none(), List.of(), starter));
    assertTrue(e.getMessage().contains("maxShare must be in (0, 1]"), e.getMessage());
  }

  @Test
  void aSweepFileHasABaseAGridAndListedScenarios() throws Exception {
    SweepPlan p = Scenarios.loadSweep(file("sw.yaml", """
        format: 1
        name: bench x evi
        base: {rules: {propane-clearance: off}}
        grid:
          - {path: resources.testbench.capacity, from: 8000, to: 10000, step: 1000}
          - {path: options.compressor.evi.cost, values: ["-10%", "+0%"]}
        scenarios:
          - {name: cheap evi, options: {compressor.evi: {cost: 700}}}
        """), starter);
    assertEquals("bench x evi", p.name());
    List<SweepPlan.Point> pts = p.points();
    assertEquals(7, pts.size());
    assertEquals("resources.testbench.capacity=8000, options.compressor.evi.cost=-10%", pts.get(0).name());
    assertEquals("cheap evi", pts.get(6).name());
    for (SweepPlan.Point pt : pts) {
      Catalog c = pt.scenario().applyTo(starter);
      assertTrue(c.rules().stream().noneMatch(r -> "propane-clearance".equals(r.id())), "the base applies to " + pt.name());
    }
    assertEquals(700, option(pts.get(6).scenario().applyTo(starter), "compressor", "evi").cost());
    CatalogException e = assertThrows(CatalogException.class, () -> Scenarios.loadSweep(file("sw2.yaml", """
        grid:
          - {path: resources.testbench.capacity, from: 8000, to: 10000}
          - {path: options.compressor.evi.cost, values: ["-10%"], from: 1}
        scenarios: [{name: x, resources: {nope: {capacity: 1}}}]
        """), starter));
    List<String> paths = e.problems().stream().map(CatalogProblem::path).toList();
    assertEquals(List.of("grid[0].step", "grid[1]", "scenarios[0].resources.nope"), paths, e.getMessage());
  }

  @Test
  void theSolveOrderVisitsEveryPointOnceEachANeighbourOfTheOneBefore() throws Exception {
    for (List<String> grid : List.of(
        List.of("resources.testbench.capacity=1..3:1", "resources.assembly.capacity=1..4:1"),
        List.of("resources.testbench.capacity=1..2:1", "resources.assembly.capacity=1..3:1",
            "resources.inverter.capacity=1..2:1"),
        List.of("resources.testbench.capacity=1..5:1"))) {
      SweepPlan p = Scenarios.grid(grid, Scenario.none(), List.of(), starter);
      List<Integer> order = p.solveOrder();
      assertEquals(p.points().size(), order.size());
      assertEquals(p.points().size(), new HashSet<>(order).size());
      List<SweepPlan.Point> pts = p.points();
      for (int k = 1; k < order.size(); k++) {
        List<Amount> a = pts.get(order.get(k - 1)).coordinates();
        List<Amount> b = pts.get(order.get(k)).coordinates();
        int differing = 0;
        for (int i = 0; i < a.size(); i++) {
          if (a.get(i).value() != b.get(i).value()) {
            differing++;
            assertEquals(1, Math.abs(a.get(i).value() - b.get(i).value()), 1e-12, "one step on the axis");
          }
        }
        assertEquals(1, differing, "points " + order.get(k - 1) + " and " + order.get(k) + " of " + grid);
      }
    }
  }

  @Test
  void listedScenariosFollowTheGridInTheTableAndTheOrder() throws Exception {
    Scenario extra = new Scenario("extra", List.of());
    SweepPlan p = Scenarios.grid(List.of("resources.testbench.capacity=1..2:1"), Scenario.none(), List.of(extra),
        starter);
    List<Integer> order = new ArrayList<>(p.solveOrder());
    assertEquals(List.of(0, 1, 2), order);
    Set<String> names = new HashSet<>();
    p.points().forEach(x -> names.add(x.name()));
    assertTrue(names.contains("extra"));
  }
}
