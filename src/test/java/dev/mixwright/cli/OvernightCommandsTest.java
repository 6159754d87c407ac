package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.runfolder.Json;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** sweep, compare and explain --capacity-ranges through the command line. */
class OvernightCommandsTest {
  static final String STARTER = "src/test/resources/fixed-demand/heatpump-starter.yaml";

  @TempDir Path dir;

  @Test
  void aSweepWritesOneTableAsCsvAndJsonAndFinishesWhatAnEarlierRunLeft() throws Exception {
    Path out = dir.resolve("sweep");
    String[] args = {"sweep", "--no-portfolio", STARTER, "--grid", "resources.testbench.capacity=8000..10000:1000",
        "--grid", "options.compressor.evi.cost=-10%,+10%", "--out", out.toString()};
    CliRun r = CliRun.of(args);
    assertEquals(0, r.code(), r.toString());
    JsonNode table = Json.pretty().readTree(out.resolve("sweep.json").toFile());
    assertEquals(6, table.path("rows").size());
    assertEquals(List.of("resources.testbench.capacity", "options.compressor.evi.cost"),
        List.of(table.path("axes").get(0).asText(), table.path("axes").get(1).asText()));
    JsonNode row = table.path("rows").get(2);
    assertEquals(9000, row.path("axes").path("resources.testbench.capacity").asDouble());
    assertEquals(960 * 0.9, row.path("axes").path("options.compressor.evi.cost").asDouble(), 1e-9);
    assertTrue(row.path("resources").path("testbench").path("shadowPrice").isNumber());
    assertTrue(row.path("valuePerUnit").path("resources.testbench.capacity").isNumber(),
        "the value per unit of testbench from 8000 to 9000");
    List<String> csv = Files.readAllLines(out.resolve("sweep.csv"));
    assertEquals(7, csv.size());
    assertTrue(csv.get(0).startsWith("index,name,resources.testbench.capacity,options.compressor.evi.cost,status,"
        + "objective,bound,gap"), csv.get(0));
    assertTrue(csv.get(0).contains("shadowPrice.testbench") && csv.get(0).contains("valuePerUnit."), csv.get(0));

    // As if the sweep had been cut off after four scenarios: the rerun solves the last two only.
    ObjectNode cut = (ObjectNode) table.deepCopy();
    ((ArrayNode) cut.path("rows")).remove(5);
    ((ArrayNode) cut.path("rows")).remove(4);
    Files.writeString(out.resolve("sweep.json"), Json.pretty().writeValueAsString(cut));
    CliRun again = CliRun.of(args);
    assertEquals(0, again.code(), again.toString());
    assertTrue(again.err().contains("4 scenarios already solved"), again.err());
    assertTrue(again.out().contains("2 solved now, 4 kept"), again.out());
    JsonNode after = Json.pretty().readTree(out.resolve("sweep.json").toFile());
    for (int i = 0; i < 6; i++) {
      assertEquals(table.path("rows").get(i).path("objective").asDouble(),
          after.path("rows").get(i).path("objective").asDouble(), 1e-6 * table.path("rows").get(i).path("objective").asDouble());
    }

    CliRun other = CliRun.of("sweep", "--no-portfolio", STARTER, "--grid", "resources.testbench.capacity=8000..9000:1000",
        "--out", out.toString());
    assertEquals(2, other.code(), other.toString());
    assertTrue(other.err().contains("holds another sweep"), other.err());
  }

  @Test
  void sweepJsonOnStdoutIsJustJson() throws Exception {
    CliRun r = CliRun.of("sweep", "--no-portfolio", STARTER, "--grid", "rules.propane-clearance=on,off", "--out",
        dir.resolve("s").toString(), "--json", "--progress");
    assertEquals(0, r.code(), r.toString());
    JsonNode n = Json.pretty().readTree(r.out());
    assertEquals(2, n.path("rows").size());
    assertTrue(n.path("rows").get(1).path("objective").asDouble() >= n.path("rows").get(0).path("objective").asDouble() - 1e-6);
    assertTrue(r.err().contains("2 done, 0 failed, 0 left"), "progress goes to stderr: " + r.err());
  }

  @Test
  void anEngineThatIsNotInTheJarIsExitTwoAndWritesNothing() throws Exception {
    Path out = dir.resolve("on-spark");
    CliRun r = CliRun.of("sweep", STARTER, "--grid", "rules.propane-clearance=on,off", "--out", out.toString(),
        "--engine", "spark");
    assertEquals(2, r.code(), r.toString());
    assertTrue(r.err().contains("no engine named 'spark'") && r.err().contains("spark-submit"), r.err());
    assertFalse(Files.exists(out), "nothing written");
  }

  @Test
  void aBadGridOrScenarioIsExitTwoWithThePath() throws Exception {
    CliRun r = CliRun.of("sweep", "--no-portfolio", STARTER, "--grid", "resources.testbnch.capacity=1..2:1", "--out", dir.toString());
    assertEquals(2, r.code(), r.toString());
    assertTrue(r.err().contains("--grid resources.testbnch.capacity=1..2:1: the catalog has no resource 'testbnch'"
        + " — did you mean 'testbench'?"), r.err());
    Path sc = dir.resolve("s.yaml");
    Files.writeString(sc, "segments: {quiet: {maxShare: 2}}\n");
    CliRun s = CliRun.of("solve", STARTER, "--scenario", sc.toString(), "--out", dir.resolve("run").toString());
    assertEquals(2, s.code(), s.toString());
    assertTrue(s.err().contains("segments.quiet.maxShare: gives 2; maxShare must be in (0, 1]"), s.err());
    assertFalse(s.err().contains("Exception"), s.err());
  }

  @Test
  void aSweepRunsTheIntegerStageAtEachPointAndNamesTheChosenVariantsByOneCodeList() throws Exception {
    Path out = dir.resolve("ranges");
    CliRun r = CliRun.of("sweep", STARTER, "--grid", "portfolio.maxVariants=3,6", "--portfolio-time-limit", "8s",
        "--out", out.toString());
    assertEquals(0, r.code(), r.toString());
    JsonNode table = Json.pretty().readTree(out.resolve("sweep.json").toFile());
    JsonNode legend = table.path("portfolioVariants");
    assertTrue(legend.isObject() && legend.size() > 0, "a code list for the whole sweep");
    java.util.Set<String> distinct = new java.util.HashSet<>();
    legend.fields().forEachRemaining(e -> distinct.add(e.getValue().toString()));
    assertEquals(legend.size(), distinct.size(), "one code, one variant");
    double[] value = new double[2];
    boolean[] proven = new boolean[2];
    for (int i = 0; i < 2; i++) {
      JsonNode row = table.path("rows").get(i);
      JsonNode pf = row.path("portfolio");
      assertTrue(pf.isObject(), "row " + i + " has its portfolio");
      int limit = i == 0 ? 3 : 6;
      assertTrue(pf.path("codes").size() >= 1 && pf.path("codes").size() <= limit, pf.toString());
      // the integer answer never beats the LP optimum of the same point (its relaxation)
      assertTrue(pf.path("value").asDouble() <= row.path("objective").asDouble() * (1 + 1e-9), pf.toString());
      for (JsonNode v : pf.path("variants")) {
        assertEquals(v.path("options"), legend.path(v.path("code").asText()), "the legend names the row's variant");
      }
      value[i] = pf.path("value").asDouble();
      proven[i] = pf.path("status").asText().equals("proven");
    }
    if (proven[0] && proven[1]) {
      assertTrue(value[0] <= value[1] + 1e-6, "at most 3 variants cannot beat at most 6");
    }
    List<String> csv = Files.readAllLines(out.resolve("sweep.csv"));
    assertTrue(csv.get(0).contains("portfolio.value") && csv.get(0).contains("portfolio.codes"), csv.get(0));
    assertTrue(r.out().contains("variants of the ranges"), r.out());
    assertTrue(r.out().contains("range: V"), r.out());
  }

  @Test
  void aPortfolioAxisIsRefusedWhereNoIntegerStageRuns() {
    CliRun none = CliRun.of("sweep", "src/test/resources/dev/mixwright/choice/rowing-boats.yaml", "--grid",
        "portfolio.minLot=10,20", "--out", dir.resolve("a").toString());
    assertEquals(2, none.code(), none.toString());
    assertTrue(none.err().contains("--grid portfolio.minLot=10,20: the catalog has no portfolio section to change"),
        none.err());
    assertFalse(none.err().contains("Exception"), none.err());
    CliRun skipped = CliRun.of("sweep", "--no-portfolio", STARTER, "--grid", "portfolio.minLot=100,200", "--out",
        dir.resolve("b").toString());
    assertEquals(2, skipped.code(), skipped.toString());
    assertTrue(skipped.err().contains("which --no-portfolio skips"), skipped.err());
  }

  @Test
  void solveRefusesAMinimumLotNoVariantCanReach() throws Exception {
    Path sc = dir.resolve("lot.yaml");
    Files.writeString(sc, "portfolio: {minLot: 90000}\n");
    CliRun r = CliRun.of("solve", STARTER, "--scenario", sc.toString(), "--out", dir.resolve("lot").toString());
    assertEquals(2, r.code(), r.toString());
    // by hand from the catalog: the sum of demand x maxShare over its segments
    dev.mixwright.catalog.Catalog c = dev.mixwright.catalog.CatalogLoader.load(Path.of(STARTER));
    double most = c.segments().stream().mapToDouble(s -> s.demand() * s.maxShare()).sum();
    assertTrue(r.err().contains("portfolio.minLot: 90,000 units, but one variant can sell at most "
        + String.format(java.util.Locale.ROOT, "%,.0f", most)), r.err());
    assertFalse(Files.exists(dir.resolve("lot").resolve("result.json")), "nothing solved");
    // the same lot without the integer stage is no problem
    assertEquals(0, CliRun.of("solve", STARTER, "--scenario", sc.toString(), "--no-portfolio", "--out",
        dir.resolve("lp").toString()).code());
  }

  @Test
  void compareSaysWhatChangedBetweenTwoRuns() throws Exception {
    Path sc = dir.resolve("tight.yaml");
    Files.writeString(sc, "resources: {testbench: {capacity: 8000}}\n");
    assertEquals(0, CliRun.of("solve", STARTER, "--out", dir.resolve("a").toString()).code());
    assertEquals(0, CliRun.of("solve", STARTER, "--scenario", sc.toString(), "--out", dir.resolve("b").toString()).code());
    CliRun text = CliRun.of("compare", dir.resolve("a").toString(), dir.resolve("b").toString());
    assertEquals(0, text.code(), text.toString());
    assertTrue(text.out().contains("resources.testbench.capacity"), text.out());
    assertTrue(text.out().contains("9,500 -> 8,000"), text.out());
    CliRun js = CliRun.of("compare", dir.resolve("a").toString(), dir.resolve("b").toString(), "--json");
    JsonNode n = Json.pretty().readTree(js.out());
    JsonNode a = ResumeTest.result(dir.resolve("a"));
    JsonNode b = ResumeTest.result(dir.resolve("b"));
    assertEquals(b.path("objective").asDouble() - a.path("objective").asDouble(),
        n.path("summary").path("objective").path("change").asDouble(), 1e-6);
    assertFalse(n.path("sameCatalog").asBoolean());
    assertEquals(1, n.path("catalogChanges").size());
    JsonNode tb = null;
    for (JsonNode r : n.path("resources")) {
      if (r.path("id").asText().equals("testbench")) {
        tb = r;
      }
    }
    assertEquals(a.path("resources").get(1).path("shadowPrice").asDouble(), tb.path("shadowPrice").path("a").asDouble());
    assertEquals(b.path("resources").get(1).path("shadowPrice").asDouble(), tb.path("shadowPrice").path("b").asDouble());
    int offersB = n.path("offers").path("new").size() + n.path("offers").path("changed").size()
        + n.path("offers").path("unchanged").asInt();
    assertEquals(b.path("offers").size(), offersB);

    // the integer portfolios: value, costs, and the variants added and dropped, each by its code in its run
    JsonNode pf = n.path("portfolio");
    assertEquals(a.path("portfolio").path("value").asDouble(), pf.path("value").path("a").asDouble());
    assertEquals(b.path("portfolio").path("value").asDouble() - a.path("portfolio").path("value").asDouble(),
        pf.path("value").path("change").asDouble(), 1e-6);
    assertEquals(b.path("portfolio").path("introductionCosts").asDouble(),
        pf.path("introductionCosts").path("b").asDouble());
    java.util.Set<String> inA = new java.util.HashSet<>();
    java.util.Set<String> inB = new java.util.HashSet<>();
    a.path("portfolio").path("variants").forEach(v -> inA.add(v.path("options").toString()));
    b.path("portfolio").path("variants").forEach(v -> inB.add(v.path("options").toString()));
    java.util.Set<String> added = new java.util.HashSet<>(inB);
    added.removeAll(inA);
    java.util.Set<String> dropped = new java.util.HashSet<>(inA);
    dropped.removeAll(inB);
    assertEquals(added.size(), pf.path("added").size());
    assertEquals(dropped.size(), pf.path("dropped").size());
    assertEquals(inA.size() - dropped.size(), pf.path("inBoth").asInt());
    dev.mixwright.report.VariantCodes codesB = dev.mixwright.report.VariantCodes.of(
        dev.mixwright.report.RunResult.read(dir.resolve("b")));
    for (JsonNode x : pf.path("added")) {
      assertTrue(added.contains(x.path("options").toString()));
      java.util.Map<String, String> opts = new java.util.LinkedHashMap<>();
      x.path("options").fields().forEachRemaining(e -> opts.put(e.getKey(), e.getValue().asText()));
      assertEquals(codesB.code(opts), x.path("codeB").asText(), "the code B's own summary gives it");
      assertTrue(x.path("codeA").isNull() || x.path("codeA").isTextual());
    }
    for (JsonNode x : pf.path("dropped")) {
      assertTrue(dropped.contains(x.path("options").toString()));
      assertTrue(x.path("codeA").asText().matches("V\\d+"));
    }
    assertTrue(text.out().contains("  portfolio   " + a.path("portfolio").path("status").asText()), text.out());
    assertTrue(text.out().contains("variants      " + pf.path("inBoth").asInt() + " in both"), text.out());
    assertFalse(text.out().contains("capacity=c"), "variants by code and label, not group=option");
    Path page = dir.resolve("cmp.html");
    CliRun withPage = CliRun.of("compare", dir.resolve("a").toString(), dir.resolve("b").toString(), "--page",
        page.toString());
    assertEquals(0, withPage.code(), withPage.toString());
    String html = Files.readString(page);
    assertTrue(html.contains("<h1>Run A against run B</h1>"));
    assertTrue(html.contains(dev.mixwright.report.Figures.money(pf.path("value").path("b").asDouble())));
    assertTrue(html.contains("resources.testbench.capacity"));
    for (JsonNode x : pf.path("added")) {
      assertTrue(html.contains(x.path("codeB").asText()), "added variant's code on the page");
    }
    assertFalse(html.contains("<script"));
    assertEquals(2, CliRun.of("compare", dir.resolve("a").toString(), dir.resolve("b").toString(), "--page",
        dir.toString()).code(), "a folder is not a page");

    CliRun self = CliRun.of("compare", dir.resolve("a").toString(), dir.resolve("a").toString());
    assertTrue(self.out().contains("catalog: the same") && self.out().contains("0 new, 0 dropped, 0 changed"), self.out());
    assertEquals(2, CliRun.of("compare", dir.resolve("a").toString(), dir.resolve("none").toString()).code());
  }

  @Test
  void explainShowsTheCapacityRangeOfEveryShadowPrice() throws Exception {
    Path run = dir.resolve("run");
    assertEquals(0, CliRun.of("solve", STARTER, "--out", run.toString()).code());
    CliRun r = CliRun.of("explain", run.toString(), "--capacity-ranges", "--json");
    assertEquals(0, r.code(), r.toString());
    JsonNode ranges = Json.pretty().readTree(r.out()).path("capacityRanges");
    assertEquals(3, ranges.size());
    JsonNode result = ResumeTest.result(run);
    for (int i = 0; i < 3; i++) {
      JsonNode x = ranges.get(i);
      double cap = x.path("capacity").asDouble();
      assertTrue(x.path("holdsFrom").asDouble() <= cap);
      assertTrue(x.path("holdsTo").isNull() || x.path("holdsTo").asDouble() >= cap);
      assertEquals(result.path("resources").get(i).path("shadowPrice").asDouble(), x.path("shadowPrice").asDouble(),
          1e-6 * Math.max(1, x.path("shadowPrice").asDouble()));
    }
    CliRun text = CliRun.of("explain", run.toString(), "--capacity-ranges", "--resource", "testbench",
        "--segment", "quiet", "--variant", "capacity=c9,compressor=rotary,refrigerant=r32,casing=acoustic,controller=zone,tank=t250");
    assertEquals(0, text.code(), text.toString());
    assertTrue(text.out().contains("reduced cost") && text.out().contains("holds for capacity in"), text.out());
    String section = text.out().substring(text.out().indexOf("capacity ranges"));
    assertTrue(section.contains("\n  testbench "), section);
    assertFalse(section.contains("\n  assembly "), "only the resource asked for: " + section);
    CliRun none = CliRun.of("explain", run.toString());
    assertEquals(2, none.code());
    assertTrue(none.err().contains("--capacity-ranges"), none.err());
  }

  @Test
  void solveProgressGoesToStderrAndLeavesStdoutToTheSummary() throws Exception {
    CliRun r = CliRun.of("solve", STARTER, "--out", dir.resolve("run").toString(), "--progress");
    assertEquals(0, r.code());
    assertTrue(r.err().contains("round    1  objective"), r.err());
    assertFalse(r.out().contains("round    1"), r.out());
  }
}
