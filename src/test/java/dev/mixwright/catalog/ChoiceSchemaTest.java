package dev.mixwright.catalog;

import static dev.mixwright.catalog.CatalogTesting.at;
import static dev.mixwright.catalog.CatalogTesting.base;
import static dev.mixwright.catalog.CatalogTesting.load;
import static dev.mixwright.catalog.CatalogTesting.onlyProblem;
import static dev.mixwright.catalog.CatalogTesting.problems;
import static dev.mixwright.catalog.CatalogTesting.says;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The choice section of a segment and option price points: reading, problems, canonical writing. */
class ChoiceSchemaTest {
  @TempDir Path dir;

  /** BASE with families choosing and the frame's step option at three price points. */
  static final String CHOOSING =
      base(
              "  - id: families\n    demand: 2500\n",
              "  - id: families\n"
                  + "    choice:\n"
                  + "      buyers: 60000\n"
                  + "      stayOut: 1.2\n"
                  + "      priceWeight: -0.0045\n"
                  + "      utility: {\"frame.low\": 0.7, \"rack.none\": -0.4}\n")
          .replace(
              "{id: step, price: 520, cost: 210, uses: {weld: 1.6}}",
              "{id: step, prices: [500, 520, 560], cost: 210, uses: {weld: 1.6}}");

  @Test
  void choosingSegmentAndPricePointsLoad() {
    Catalog c = load(CHOOSING);
    Segment fam = c.segments().get(1);
    assertTrue(fam.chooses());
    assertFalse(c.segments().get(0).chooses());
    Choice ch = fam.choice().orElseThrow();
    assertEquals(new Choice(60000, 1.2, -0.0045, Map.of("frame.low", 0.7, "rack.none", -0.4)), ch);
    // buyers cap the segment's sales, so they stand as its demand, one column up to all of them
    assertEquals(60000, fam.demand());
    assertEquals(60000, fam.columnBound());
    Option step = c.groups().get(0).options().get(0);
    assertEquals(List.of(500.0, 520.0, 560.0), step.prices());
    assertEquals("step@520", step.pointId(1));
    assertTrue(c.hasChoosingSegments());
    assertTrue(c.hasPricePoints());
  }

  @Test
  void todaysCatalogsHaveNoChoice() {
    Catalog c = load(CatalogTesting.BASE);
    assertFalse(c.hasChoosingSegments());
    assertFalse(c.hasPricePoints());
    assertEquals(
        new Option("step", null, 520, 210, Map.of("weld", 1.6), 0.0), c.groups().get(0).options().get(0));
    assertEquals(new Segment("families", null, 2500, 1, Map.of(), Map.of()), c.segments().get(1));
  }

  @Test
  void oneListedPriceIsTheSameOptionAsAPrice() {
    Catalog a = load(CatalogTesting.BASE);
    Catalog b = load(base("{id: step, price: 520,", "{id: step, prices: [520],"));
    assertEquals(a, b);
  }

  @Test
  void canonicalWriterRoundTripsChoiceAndPricePoints() throws Exception {
    Files.writeString(dir.resolve("fam.csv"), "group,option,utility\nbell,ring,0.25\nbell,none,-1.5\n");
    Catalog c =
        CatalogLoader.parse(
            CHOOSING.replace("stayOut: 1.2", "stayOut: 1.2\n      utilityFile: fam.csv"),
            "range.yaml",
            dir);
    assertEquals(0.25, c.segments().get(1).choice().orElseThrow().utility().get("bell.ring"));
    assertEquals(c, CatalogLoader.parse(CatalogWriter.toJson(c), "x.json", null));
    assertEquals(c, CatalogLoader.parse(CatalogWriter.toYaml(c), "x.yaml", null));
    assertFalse(CatalogWriter.toJson(c).contains("utilityFile"));
  }

  @Test
  void priceWeightAboveZeroIsCalledASignError() {
    says(
        onlyProblem(CHOOSING.replace("-0.0045", "0.0045"), "segments[1].choice.priceWeight"),
        "almost always a sign error",
        "-0.0045");
  }

  @Test
  void buyersMustBePositive() {
    says(onlyProblem(CHOOSING.replace("buyers: 60000", "buyers: 0"), "segments[1].choice.buyers"), "> 0");
    says(
        onlyProblem(CHOOSING.replace("buyers: 60000", "buyers: -5"), "segments[1].choice.buyers"),
        "> 0");
  }

  @Test
  void nonFiniteUtilitiesAreRefused() {
    // .inf and .nan are refused by the YAML reading itself; numbers too large for a double are not
    says(
        onlyProblem(CHOOSING.replace("\"frame.low\": 0.7", "\"frame.low\": .inf"), "range.yaml line 34 column 34"),
        "finite");
    says(
        onlyProblem(
            CHOOSING.replace("\"frame.low\": 0.7", "\"frame.low\": 1e999"),
            "segments[1].choice.utility[\"frame.low\"]"),
        "finite");
    says(
        onlyProblem(CHOOSING.replace("stayOut: 1.2", "stayOut: -1e999"), "segments[1].choice.stayOut"),
        "finite");
  }

  @Test
  void choiceWithDemandOrMaxShareIsRefused() {
    List<CatalogProblem> ps =
        problems(CHOOSING.replace("  - id: families\n", "  - id: families\n    demand: 10\n    maxShare: 0.5\n"));
    says(at(ps, "segments[1].demand"), "together with choice", "choice.buyers");
    says(at(ps, "segments[1].maxShare"), "together with choice");
  }

  @Test
  void utilityForUnknownGroupOrOptionIsNamed() {
    says(
        onlyProblem(
            CHOOSING.replace("\"frame.low\"", "\"fram.low\""), "segments[1].choice.utility[\"fram.low\"]"),
        "unknown group 'fram'",
        "did you mean 'frame'");
    says(
        onlyProblem(
            CHOOSING.replace("\"frame.low\"", "\"frame.lo\""), "segments[1].choice.utility[\"frame.lo\"]"),
        "unknown option 'lo'");
    says(
        onlyProblem(
            CHOOSING.replace("\"frame.low\"", "\"frame.step@520\""),
            "segments[1].choice.utility[\"frame.step@520\"]"),
        "without a price",
        "'step'");
  }

  @Test
  void badUtilityTableRowsAreNamedByLineAndColumn() throws Exception {
    Files.writeString(
        dir.resolve("fam.csv"),
        "group,option,utility\nbell,ring,lots\nbel,ring,1\nbell,gong,1\nframe,low,2\nbell\n");
    List<CatalogProblem> ps =
        problems(
            CHOOSING.replace("stayOut: 1.2", "stayOut: 1.2\n      utilityFile: fam.csv"),
            "range.yaml",
            dir);
    String file = "segments[1].choice.utilityFile fam.csv";
    says(at(ps, file + " line 2 column utility"), "not a number", "\"lots\"");
    says(at(ps, file + " line 3 column group"), "unknown group 'bel'");
    says(at(ps, file + " line 4 column option"), "unknown option 'gong'");
    says(at(ps, file + " line 5"), "again", "segments[1].choice.utility[\"frame.low\"]");
    says(at(ps, file + " line 6"), "1 cells, the header has 3");
    assertEquals(5, ps.size(), () -> CatalogTesting.render(ps));
  }

  @Test
  void utilityTableHeaderAndFileProblemsAreNamed() throws Exception {
    Files.writeString(dir.resolve("fam.csv"), "group,option,value\n");
    List<CatalogProblem> ps =
        problems(
            CHOOSING.replace("stayOut: 1.2", "stayOut: 1.2\n      utilityFile: fam.csv"),
            "range.yaml",
            dir);
    says(at(ps, "segments[1].choice.utilityFile fam.csv line 1 column value"), "unknown column");
    says(at(ps, "segments[1].choice.utilityFile fam.csv line 1"), "missing column 'utility'");
    says(
        onlyProblem(
            CHOOSING.replace("stayOut: 1.2", "stayOut: 1.2\n      utilityFile: fam.csv"),
            "segments[1].choice.utilityFile"),
        "no folder");
  }

  @Test
  void pricePointListProblemsAreNamed() {
    String step = "{id: step, prices: [500, 520, 560],";
    says(
        onlyProblem(CHOOSING.replace(step, "{id: step, prices: [],"), "groups[0].options[0].prices"),
        "empty list");
    says(
        onlyProblem(
            CHOOSING.replace(step, "{id: step, prices: [500, 520, 500],"),
            "groups[0].options[0].prices[2]"),
        "repeats the price point 500",
        "prices[0]");
    says(
        onlyProblem(
            CHOOSING.replace(step, "{id: step, price: 520, prices: [500, 520],"),
            "groups[0].options[0].prices"),
        "together with price");
    says(
        onlyProblem(
            CHOOSING.replace(step, "{id: step, prices: [500, -1],"), "groups[0].options[0].prices[1]"),
        ">= 0");
  }

  @Test
  void optionIdsMayNotHoldThePriceMark() {
    says(
        onlyProblem(
            CatalogTesting.BASE.replace("{id: bell,", "{id: bell,").replace("{id: ring,", "{id: ring@1,"),
            "groups[2].options[0].id"),
        "'@'");
  }

  @Test
  void anEmptyChoiceSectionIsNamed() {
    says(
        onlyProblem(
            CatalogTesting.BASE.replace("  - id: families\n    demand: 2500\n", "  - id: families\n    choice:\n"),
            "segments[1].choice"),
        "must be a mapping");
  }

  @Test
  void choiceSectionFieldsAreChecked() {
    says(
        onlyProblem(CHOOSING.replace("      priceWeight: -0.0045\n", ""), "segments[1].choice.priceWeight"),
        "missing");
    says(
        onlyProblem(CHOOSING.replace("stayOut:", "stayout:"), "segments[1].choice.stayout"),
        "did you mean 'stayOut'");
  }
}
