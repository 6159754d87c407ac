package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.Column;
import dev.mixwright.colgen.Duals;
import dev.mixwright.colgen.MasterColumns;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.Sweep;
import dev.mixwright.colgen.ValueBound;
import dev.mixwright.runfolder.Json;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.Scenarios;
import dev.mixwright.scenario.SweepPlan;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A one-axis price sweep on a catalog with a segment that chooses is a curve with a best price: the
 * table marks the row of largest objective. Outcomes are made by hand (objectives 10, 30, 20 along
 * the axis), so the mark is checked on its own; a sweep on a fixed-demand catalog keeps its columns.
 */
class SweepBestTest {
  private static Catalog load(String resource) throws Exception {
    return CatalogLoader.load(Path.of(SweepBestTest.class.getResource(resource).toURI()));
  }

  private static SweepTable table(Catalog c, String axis, double... objectives) throws Exception {
    SweepPlan plan = Scenarios.grid(List.of(axis), Scenario.none(), List.of(), c);
    SweepTable t = new SweepTable(plan, c, Json.pretty().createObjectNode());
    int s = c.segments().size();
    for (SweepPlan.Point p : plan.points()) {
      double z = objectives[p.index()];
      int groups = c.groups().size();
      Column col = new Column(0, new int[groups], z, new double[c.resources().size()], 1e9, 1, 0);
      SolveOutcome o = new SolveOutcome(RunStatus.OPTIMAL, "", new ValueBound(z, z), 1,
          new MasterColumns(List.of(col), new double[] {1}, new double[] {0}),
          new Duals(new double[c.resources().size()], new double[s]), List.of(), 0);
      t.add(new Sweep.Row(p, p.scenario().applyTo(c), o, new double[c.resources().size()], 0, ""));
    }
    return t;
  }

  @Test
  void aPriceSweepOnAChoosingCatalogMarksItsBestPoint() throws Exception {
    SweepTable t = table(load("/dev/mixwright/choice/rowing-boats.yaml"), "options.oars.carbon.price=+0,+100,+200",
        10, 30, 20);
    assertTrue(t.marksBest());
    JsonNode rows = t.toJson().path("rows");
    assertFalse(rows.get(0).path("best").asBoolean());
    assertTrue(rows.get(1).path("best").asBoolean());
    assertFalse(rows.get(2).path("best").asBoolean());
    assertEquals(1, t.bestRow().orElseThrow().path("index").asInt());
    assertEquals(1.0, rows.get(1).path("segments").path("clubs").path("sold").asDouble(), 1e-12);
    String[] lines = t.toCsv().split("\n");
    List<String> head = List.of(lines[0].split(","));
    int best = head.indexOf("best");
    assertTrue(best > 0, lines[0]);
    assertTrue(head.contains("sold.clubs"), lines[0]);
    assertFalse(head.contains("sold.hire"), "a fixed segment gets no sold column: " + lines[0]);
    assertEquals("false", lines[1].split(",")[best]);
    assertEquals("true", lines[2].split(",")[best]);
  }

  @Test
  void aFixedDemandSweepKeepsItsColumns() throws Exception {
    SweepTable t = table(load("/dev/mixwright/catalog/ebike.yaml"), "options.frame.step.price=+0,+100", 10, 30);
    assertFalse(t.marksBest());
    String csv = t.toCsv();
    assertFalse(csv.split("\n")[0].contains("best"));
    assertFalse(csv.split("\n")[0].contains("sold."));
    assertTrue(t.toJson().path("rows").get(1).path("best").isMissingNode());
  }
}
