package dev.mixwright.catalog;

import static dev.mixwright.catalog.CatalogTesting.at;
import static dev.mixwright.catalog.CatalogTesting.says;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CsvOptionTablesTest {
  @TempDir Path dir;

  /** Invented data; the frame group takes its options from frame.csv. */
  private static final String CATALOG =
      """
      format: 1
      resources:
        - {id: weld, capacity: 14000}
        - {id: paint, capacity: 9000}
      groups:
        - id: motor
          options:
            - {id: hub250, price: 300, cost: 150}
        - id: rack
          required: false
          options:
            - {id: front, price: 60, cost: 25}
        - id: frame
          optionsFile: frame.csv
      rules:
        - forbid: {frame: [cargo], rack: [none]}
      segments:
        - id: commuters
          demand: 9000
          accepts: {frame: [step, low]}
      """;

  private Catalog load(String catalog, String csv) throws IOException, CatalogException {
    Files.writeString(dir.resolve("frame.csv"), csv, StandardCharsets.UTF_8);
    Path file = dir.resolve("range.yaml");
    Files.writeString(file, catalog, StandardCharsets.UTF_8);
    return CatalogLoader.load(file);
  }

  private List<CatalogProblem> problems(String catalog, String csv) throws IOException {
    CatalogException e = assertThrows(CatalogException.class, () -> load(catalog, csv));
    return e.problems();
  }

  private List<CatalogProblem> problems(String csv) throws IOException {
    return problems(CATALOG, csv);
  }

  private static final String PREFIX = "groups[2].optionsFile frame.csv";

  @Test
  void aToolingColumnLoadsLikeToolingInline() throws Exception {
    Catalog fromCsv = load(CATALOG, "id,price,cost,tooling\nstep,520,210,40000\nlow,480,190,\ncargo,900,420,0\n");
    Catalog inline = load(CATALOG.replace("    optionsFile: frame.csv\n", """
    options:
      - {id: step, price: 520, cost: 210, tooling: 40000}
      - {id: low, price: 480, cost: 190}
      - {id: cargo, price: 900, cost: 420}
"""), "unused\n");
    assertEquals(inline.groups().get(2).options(), fromCsv.groups().get(2).options());
    assertEquals(40000, fromCsv.groups().get(2).options().get(0).tooling());
    assertEquals(0, fromCsv.groups().get(2).options().get(1).tooling(), "an empty cell means no tooling");

    List<CatalogProblem> ps = problems("id,price,cost,tooling\nstep,520,210,lots\nlow,480,190,-5\n");
    says(at(ps, PREFIX + " line 2 column tooling"), "not a number");
    says(at(ps, PREFIX + " line 3 column tooling"), "-5");
  }

  @Test
  void optionTableLoadsLikeTheSameOptionsInline() throws Exception {
    String csv =
        "\uFEFFid,price,cost,label,uses.weld,uses.paint\n"
            + "step,520,210,Step-through,1.6,\n"
            + "\n"
            + "low , 480 ,190,,1.4,0.5\n"
            + "cargo,900.5,420,\"Long-tail, cargo\",3.1,1e-1\n";
    Catalog fromCsv = load(CATALOG, csv);
    String inline =
        CATALOG.replace(
            "    optionsFile: frame.csv\n",
            """
    options:
      - {id: step, label: Step-through, price: 520, cost: 210, uses: {weld: 1.6}}
      - {id: low, price: 480, cost: 190, uses: {weld: 1.4, paint: 0.5}}
      - {id: cargo, label: "Long-tail, cargo", price: 900.5, cost: 420, uses: {weld: 3.1, paint: 0.1}}
""");
    assertEquals(CatalogTesting.load(inline), fromCsv);
    assertEquals(
        List.of("step", "low", "cargo"),
        fromCsv.groups().get(2).options().stream().map(Option::id).toList());
  }

  @Test
  void inlineOptionsComeFirstThenTheTable() throws Exception {
    String catalog =
        CATALOG.replace(
            "    optionsFile: frame.csv\n",
            "    optionsFile: frame.csv\n    options: [{id: cargo, price: 900, cost: 420}]\n");
    Catalog c = load(catalog, "cost,id,price\n210,step,520\n190,low,480\n");
    Group frame = c.groups().get(2);
    assertEquals(
        List.of("cargo", "step", "low"), frame.options().stream().map(Option::id).toList());
    assertEquals(new Option("step", null, 520, 210, Map.of(), 0.0), frame.options().get(1));
  }

  @Test
  void tableInASubfolderIsFoundRelativeToTheCatalog() throws Exception {
    Files.createDirectories(dir.resolve("tables"));
    Files.writeString(
        dir.resolve("tables/frame.csv"), "id,price,cost\nstep,1,1\nlow,1,1\ncargo,1,1\n");
    Path file = dir.resolve("range.yaml");
    Files.writeString(
        file, CATALOG.replace("optionsFile: frame.csv", "optionsFile: tables/frame.csv"));
    assertEquals(3, CatalogLoader.load(file).groups().get(2).options().size());
  }

  @Test
  void badCellsAreNamedByLineAndColumn() throws Exception {
    String csv =
        "id,price,cost,uses.weld\n"
            + "step,520,210,1.6\n"
            + "low,abc,190,1.4\n"
            + "cargo,900,-1,x\n"
            + "none,1,1,\n"
            + ",1,1,\n"
            + "step,2,2,\n";
    List<CatalogProblem> ps = problems(csv);
    assertEquals(6, ps.size(), () -> CatalogTesting.render(ps));
    says(at(ps, PREFIX + " line 3 column price"), "not a number: \"abc\"", "e.g. 520");
    says(at(ps, PREFIX + " line 4 column cost"), "must be >= 0, got -1");
    says(
        at(ps, PREFIX + " line 4 column uses.weld"),
        "not a number: \"x\"",
        "with a dot for decimals");
    says(at(ps, PREFIX + " line 5 column id"), "'none' is reserved");
    says(at(ps, PREFIX + " line 6 column id"), "empty", "needs an id");
    says(
        at(ps, PREFIX + " line 7 column id"),
        "duplicate option id 'step' in group 'frame'",
        "first at " + PREFIX + " line 2 column id");
  }

  @Test
  void headerProblemsAreNamed() throws Exception {
    List<CatalogProblem> ps = problems("id,price,uses.wled,colour\nstep,1,1,red\n");
    says(
        at(ps, PREFIX + " line 1 column uses.wled"),
        "unknown resource 'wled' (resources: weld, paint)",
        "did you mean 'weld'?");
    says(
        at(ps, PREFIX + " line 1 column colour"),
        "unknown column",
        "id, price, cost, label, tooling, uses.<resource>",
        "uses.weld");
    says(
        at(ps, PREFIX + " line 1"),
        "missing column 'cost'",
        "id,price,cost[,label][,tooling][,uses.<resource>...]");
    says(at(problems("id;price;cost\nstep;1;1\n"), PREFIX + " line 1"), "commas, not semicolons");
    says(
        at(problems("id,price,cost,id\nstep,1,1,x\n"), PREFIX + " line 1 column id"),
        "appears twice");
  }

  @Test
  void rowWithTheWrongNumberOfCellsIsNamed() throws Exception {
    List<CatalogProblem> ps = problems("id,price,cost\nstep,1,1\nlow,1\ncargo,1,1\n");
    assertEquals(1, ps.size(), () -> CatalogTesting.render(ps));
    says(at(ps, PREFIX + " line 3"), "has 2 cells, the header has 3", "missing or extra comma");
  }

  @Test
  void referencesToTableOptionsAreChecked() throws Exception {
    List<CatalogProblem> ps = problems("id,price,cost\nstep,1,1\nlow,1,1\n");
    assertEquals(1, ps.size(), () -> CatalogTesting.render(ps));
    assertEquals(
        "unknown option 'cargo' in group 'frame' (options: step, low)",
        at(ps, "rules[0].forbid.frame[0]").message());
  }

  @Test
  void missingEmptyAndMalformedTablesAreNamed() throws Exception {
    Path file = dir.resolve("range.yaml");
    Files.writeString(file, CATALOG);
    CatalogException e = assertThrows(CatalogException.class, () -> CatalogLoader.load(file));
    // the rule and accepts name frame options that cannot be checked without the table: one problem
    assertEquals(1, e.problems().size(), e::getMessage);
    says(
        at(e.problems(), "groups[2].optionsFile"),
        "cannot read 'frame.csv'",
        "no such file",
        "relative to the catalog file's folder");

    says(at(problems(""), PREFIX), "the file is empty", "id,price,cost");
    says(at(problems("id,price,cost\n"), PREFIX), "has no option rows");
    says(at(problems("id,price,cost\n\"step,1,1\n"), PREFIX + " line 3"), "not valid CSV");
  }

  @Test
  void tableNeedsAFolder() {
    CatalogException e =
        assertThrows(
            CatalogException.class, () -> CatalogLoader.parse(CATALOG, "range.yaml", null));
    says(
        at(e.problems(), "groups[2].optionsFile"),
        "not read from a file",
        "list the options inline");
  }
}
