package dev.mixwright.catalog;

import static dev.mixwright.catalog.CatalogTesting.BASE;
import static dev.mixwright.catalog.CatalogTesting.at;
import static dev.mixwright.catalog.CatalogTesting.base;
import static dev.mixwright.catalog.CatalogTesting.load;
import static dev.mixwright.catalog.CatalogTesting.onlyProblem;
import static dev.mixwright.catalog.CatalogTesting.problems;
import static dev.mixwright.catalog.CatalogTesting.says;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class CatalogLoaderTest {

  // ------------------------------------------------------------------ valid input and defaults

  @Test
  void baseCatalogLoadsWithDefaults() {
    Catalog c = load(BASE);
    assertEquals(1, c.format());
    assertEquals(
        List.of("weld", "paint", "press"), c.resources().stream().map(Resource::id).toList());
    Group frame = c.groups().get(0);
    assertTrue(frame.required(), "required defaults to true");
    assertFalse(c.groups().get(1).required());
    assertEquals(
        new Option("low", null, 480, 190, Map.of("weld", 1.4, "paint", 0.5), 0.0),
        frame.options().get(1));
    assertEquals(Map.of("frame", List.of("low")), c.rules().get(0).when());
    assertEquals(
        Map.of("frame", List.of("step"), "rack", List.of("none")), c.rules().get(1).forbid());
    assertEquals(0.35, c.segments().get(0).maxShare());
    assertEquals(1.0, c.segments().get(1).maxShare(), "maxShare defaults to 1");
    assertEquals(Map.of("rack.front", 20.0), c.segments().get(0).value());
    assertEquals(Map.of(), c.segments().get(1).accepts());
    assertEquals(Optional.empty(), c.portfolio(), "no portfolio section, no integer stage");
    assertEquals(null, c.name());
  }

  @Test
  void emptyPortfolioSectionTakesDefaults() {
    Catalog c = load(BASE + "portfolio: {}\n");
    assertEquals(Optional.of(new PortfolioSpec(0, Integer.MAX_VALUE, 0)), c.portfolio());
    Catalog d = load(BASE + "portfolio: {introductionCost: 18000, maxVariants: 24, minLot: 150}\n");
    assertEquals(Optional.of(new PortfolioSpec(18000, 24, 150)), d.portfolio());
  }

  @Test
  void optionalTextFieldsAndRuleIdAndNoteAreRead() {
    String yaml =
        "name: Range 2027\ncurrency: EUR\nperiod: year\n"
            + base(
                    "- {id: weld, capacity: 14000}",
                    "- {id: weld, label: Welding cell, unit: h, capacity: 14000}")
                .replace("  - id: frame\n", "  - id: frame\n    label: Frame\n")
                .replace(
                    "- when: {frame: [low]}",
                    "- id: low-needs-rack\n"
                        + "    note: the low frame has no mounts\n"
                        + "    when: {frame: [low]}")
                .replace("- id: families", "- id: families\n    label: Families");
    Catalog c = load(yaml);
    assertEquals("Range 2027", c.name());
    assertEquals("EUR", c.currency());
    assertEquals("year", c.period());
    assertEquals(new Resource("weld", "Welding cell", "h", 14000), c.resources().get(0));
    assertEquals("Frame", c.groups().get(0).label());
    assertEquals("low-needs-rack", c.rules().get(0).id());
    assertEquals("Families", c.segments().get(1).label());
  }

  @Test
  void sameOptionIdInTwoGroupsIsFine() {
    Catalog c =
        load(
            base(
                "- {id: front, price: 60, cost: 25}",
                "- {id: front, price: 60, cost: 25}\n      - {id: low, price: 1, cost: 1}"));
    assertEquals(2, c.groups().get(1).options().size());
  }

  @Test
  void requireListingEveryChoiceIsAccepted() {
    Catalog c = load(base("require: {rack: [front]}", "require: {rack: [front, none]}"));
    assertEquals(List.of("front", "none"), c.rules().get(0).require().get("rack"));
  }

  @Test
  void forbidWithOneGroupIsAccepted() {
    Catalog c = load(base("- forbid: {frame: [step], rack: [none]}", "- forbid: {frame: [step]}"));
    assertEquals(Map.of("frame", List.of("step")), c.rules().get(1).forbid());
  }

  @Test
  void negativeSegmentValueIsAllowed() {
    Catalog c =
        load(
            base(
                "value: {\"rack.front\": 20}",
                "value: {\"rack.front\": -35.5, \"rack.none\": 10}"));
    assertEquals(Map.of("rack.front", -35.5, "rack.none", 10.0), c.segments().get(0).value());
  }

  @Test
  void zeroIsAllowedWhereNumbersMustNotBeNegative() {
    Catalog c =
        load(
            base("capacity: 9000", "capacity: 0")
                .replace("price: 60, cost: 25", "price: 0, cost: 0"));
    assertEquals(0.0, c.resources().get(1).capacity());
    assertEquals(0.0, c.groups().get(1).options().get(0).price());
  }

  // ------------------------------------------------------------------ format

  @Test
  void missingFormatIsNamed() {
    CatalogProblem p = onlyProblem(base("format: 1\n", ""), "format");
    says(p, "missing", "format: 1");
  }

  @Test
  void otherFormatIsRejected() {
    says(onlyProblem(base("format: 1", "format: 2"), "format"), "format 1", "got 2");
    says(
        onlyProblem(base("format: 1", "format: \"1\""), "format"),
        "the number 1",
        "without quotes");
  }

  // ------------------------------------------------------------------ required fields

  static Stream<Arguments> missingFields() {
    return Stream.of(
        Arguments.of(
            "{id: press, capacity: 500}", "{capacity: 500}", "resources[2].id", "id: brazing"),
        Arguments.of(
            "{id: press, capacity: 500}",
            "{id: press}",
            "resources[2].capacity",
            "capacity: 14000"),
        Arguments.of("- id: bell\n", "- label: Bell\n", "groups[2].id", "id: compressor"),
        Arguments.of(
            "    options:\n      - {id: ring, price: 15, cost: 4}\n",
            "",
            "groups[2].options",
            "optionsFile"),
        Arguments.of("{id: ring, price: 15,", "{price: 15,", "groups[2].options[0].id", "id: scroll"),
        Arguments.of("price: 15, cost: 4", "cost: 4", "groups[2].options[0].price", "price: 520"),
        Arguments.of("price: 15, cost: 4}", "price: 15}", "groups[2].options[0].cost", "cost: 210"),
        Arguments.of(
            "  - id: families\n    demand: 2500\n",
            "  - demand: 2500\n",
            "segments[1].id",
            "id: retrofit"),
        Arguments.of(
            "  - id: families\n    demand: 2500\n",
            "  - id: families\n",
            "segments[1].demand",
            "demand: 9000"));
  }

  @ParameterizedTest(name = "{2}")
  @MethodSource("missingFields")
  void missingRequiredFieldIsNamedWithAnExample(
      String find, String replace, String path, String example) {
    says(onlyProblem(base(find, replace), path), "missing", example);
  }

  @Test
  void missingGroupsAndSegmentsSectionsAreNamed() {
    String noSegments = BASE.substring(0, BASE.indexOf("segments:"));
    says(onlyProblem(noSegments, "segments"), "missing", "at least one segment");
    says(
        onlyProblem("format: 1\nsegments: [{id: s, demand: 10}]\n", "groups"),
        "missing",
        "at least one option group");
    says(
        onlyProblem(noSegments + "segments: []\n", "segments"), "is empty", "at least one segment");
  }

  @Test
  void emptyValueOfARequiredFieldIsNamed() {
    says(
        onlyProblem(
            base("  - id: families\n    demand: 2500\n", "  - id: families\n    demand:\n"),
            "segments[1].demand"),
        "is empty",
        "demand: 9000");
  }

  // ------------------------------------------------------------------ unknown fields

  @Test
  void unknownFieldListsTheAllowedNamesAndTheLikelyTypo() {
    CatalogProblem p =
        onlyProblem(
            base("  - id: bell\n    required: false\n", "  - id: bell\n    requird: false\n"),
            "groups[2].requird");
    says(
        p,
        "unknown field",
        "id, label, required, options, optionsFile",
        "did you mean 'required'?");
  }

  @Test
  void unknownFieldsAreFoundAtEveryLevel() {
    String yaml =
        base("format: 1\n", "format: 1\nsegmnets: []\n")
                .replace("{id: weld, capacity: 14000}", "{id: weld, capacity: 14000, cap: 1}")
                .replace(
                    "{id: front, price: 60, cost: 25}",
                    "{id: front, prise: 60, price: 60, cost: 25}")
                .replace(
                    "- forbid: {frame: [step], rack: [none]}",
                    "- forbid: {frame: [step], rack: [none]}\n    comment: x")
                .replace("    maxShare: 0.35\n", "    maxshare: 0.35\n")
            + "portfolio: {introductionCosts: 1}\n";
    List<CatalogProblem> ps = problems(yaml);
    assertEquals(6, ps.size(), () -> CatalogTesting.render(ps));
    says(
        at(ps, "segmnets"),
        "format, name, currency, period, resources, groups, rules, segments, portfolio",
        "did you mean 'segments'?");
    says(at(ps, "resources[0].cap"), "id, label, unit, capacity");
    says(
        at(ps, "groups[1].options[0].prise"),
        "id, label, price, cost, uses",
        "did you mean 'price'?");
    says(at(ps, "rules[1].comment"), "id, note, when, require, forbid");
    says(at(ps, "segments[0].maxshare"), "did you mean 'maxShare'?");
    says(
        at(ps, "portfolio.introductionCosts"),
        "introductionCost, maxVariants, minLot",
        "did you mean 'introductionCost'?");
  }

  // ------------------------------------------------------------------ ids

  @Test
  void duplicateIdsNameTheFirstOccurrence() {
    String yaml =
        base("- {id: paint, capacity: 9000}", "- {id: weld, capacity: 9000}")
            .replace(
                "{id: front, price: 60, cost: 25}",
                "{id: front, price: 60, cost: 25}\n      - {id: front, price: 70, cost: 30}")
            .replace("  - id: rack\n", "  - id: frame\n    label: again\n  - id: rack\n")
            .replace("- id: families", "- id: commuters")
            .replace("- when: {frame: [low]}", "- id: r1\n    when: {frame: [low]}")
            .replace(
                "- forbid: {frame: [step], rack: [none]}",
                "- id: r1\n    forbid: {frame: [step], rack: [none]}");
    List<CatalogProblem> ps =
        problems(
            yaml.replace(
                "    label: again\n",
                "    label: again\n    options: [{id: x, price: 1, cost: 1}]\n"));
    says(
        at(ps, "resources[1].id"),
        "duplicate resource id 'weld'",
        "first at resources[0].id",
        "its own id");
    says(at(ps, "groups[1].id"), "duplicate group id 'frame'", "first at groups[0].id");
    says(
        at(ps, "groups[2].options[1].id"),
        "duplicate option id 'front' in group 'rack'",
        "first at groups[2].options[0].id");
    says(at(ps, "segments[1].id"), "duplicate segment id 'commuters'", "first at segments[0].id");
    says(at(ps, "rules[1].id"), "duplicate rule id 'r1'", "first at rules[0].id");
  }

  @Test
  void emptyIdsAreRejected() {
    says(
        onlyProblem(
            base(
                "{id: press, capacity: 500}",
                "{id: press, capacity: 500}\n  - {id: '', capacity: 1}"),
            "resources[3].id"),
        "must not be empty");
    says(
        onlyProblem(base("- id: families", "- id: \"  \""), "segments[1].id"),
        "must not be empty",
        "e.g. retrofit");
  }

  @Test
  void optionIdNoneIsReserved() {
    CatalogProblem p = onlyProblem(base("{id: ring,", "{id: none,"), "groups[2].options[0].id");
    says(
        p, "'none' is reserved", "absent choice of an optional group", "rename", "required: false");
  }

  @Test
  void idsThatWouldBreakVariantLabelsOrValueKeysAreRejected() {
    says(
        onlyProblem(base("- id: bell\n", "- id: bell.large\n"), "groups[2].id"),
        "must not contain '.'",
        "group.option");
    says(
        onlyProblem(base("{id: ring,", "{id: \"ring=1\","), "groups[2].options[0].id"),
        "must not contain ',' or '='",
        "group=option");
    says(
        onlyProblem(base("- id: families", "- id: \" families\""), "segments[1].id"),
        "spaces at the start or end",
        "remove them");
  }

  @Test
  void idWrittenAsANumberOrBooleanAsksForQuotes() {
    String yaml =
        base(
                "{id: front, price: 60, cost: 25}",
                "{id: 625, price: 60, cost: 25}\n      - {id: on, price: 1, cost: 1}")
            .replace("rack: [front]", "rack: [none]")
            .replace("\"rack.front\": 20", "\"rack.none\": 20");
    List<CatalogProblem> ps = problems(yaml);
    assertEquals(2, ps.size(), () -> CatalogTesting.render(ps));
    says(
        at(ps, "groups[1].options[0].id"),
        "must be text",
        "the number 625",
        "put it in quotes",
        "\"625\"");
    says(
        at(ps, "groups[1].options[1].id"),
        "must be text",
        "the boolean true",
        "put it in quotes",
        "yes, no, on, off");
  }

  // ------------------------------------------------------------------ none in a required group

  @Test
  void noneOfARequiredGroupIsRejectedInRulesAcceptsAndValue() {
    String yaml =
        base("- forbid: {frame: [step], rack: [none]}", "- forbid: {frame: [none], rack: [none]}")
            .replace("accepts: {frame: [step, low]}", "accepts: {frame: [step, none]}")
            .replace("value: {\"rack.front\": 20}", "value: {\"frame.none\": 20}");
    List<CatalogProblem> ps = problems(yaml);
    assertEquals(3, ps.size(), () -> CatalogTesting.render(ps));
    for (String path :
        List.of(
            "rules[1].forbid.frame[0]",
            "segments[0].accepts.frame[1]",
            "segments[0].value[\"frame.none\"]")) {
      says(
          at(ps, path),
          "group 'frame' is required",
          "'none' is only for optional groups",
          "required: false");
    }
  }

  // ------------------------------------------------------------------ references

  @Test
  void unknownResourceInUsesListsTheResources() {
    CatalogProblem p =
        onlyProblem(
            base("uses: {weld: 1.6}", "uses: {wled: 1.6}"), "groups[0].options[0].uses.wled");
    says(p, "unknown resource 'wled'", "(resources: weld, paint, press)", "did you mean 'weld'?");
  }

  @Test
  void unknownGroupsAndOptionsInRulesAcceptsAndValueListTheChoices() {
    String yaml =
        base("- when: {frame: [low]}", "- when: {frame: [lo]}")
            .replace("require: {rack: [front]}", "require: {rak: [front]}")
            .replace(
                "- forbid: {frame: [step], rack: [none]}",
                "- forbid: {frame: [step], rack: [rear]}")
            .replace("accepts: {frame: [step, low]}", "accepts: {frame: [xl]}")
            .replace("value: {\"rack.front\": 20}", "value: {\"rack.back\": 20, \"frme.step\": 5}");
    List<CatalogProblem> ps = problems(yaml);
    assertEquals(6, ps.size(), () -> CatalogTesting.render(ps));
    says(
        at(ps, "rules[0].when.frame[0]"),
        "unknown option 'lo' in group 'frame' (options: step, low)",
        "did you mean 'low'?");
    says(
        at(ps, "rules[0].require.rak"),
        "unknown group 'rak' (groups: frame, rack, bell)",
        "did you mean 'rack'?");
    says(
        at(ps, "rules[1].forbid.rack[0]"),
        "unknown option 'rear' in group 'rack' (options: front, none)");
    assertEquals(
        "unknown option 'xl' in group 'frame' (options: step, low)",
        at(ps, "segments[0].accepts.frame[0]").message());
    says(at(ps, "segments[0].value[\"rack.back\"]"), "unknown option 'back' in group 'rack'");
    says(
        at(ps, "segments[0].value[\"frme.step\"]"),
        "unknown group 'frme'",
        "did you mean 'frame'?");
  }

  @Test
  void valueKeyWithoutADotSaysTheForm() {
    CatalogProblem p =
        onlyProblem(
            base("value: {\"rack.front\": 20}", "value: {front: 20}"), "segments[0].value.front");
    says(p, "write the key as group.option", "\"rack.front\"");
  }

  // ------------------------------------------------------------------ numbers

  static Stream<Arguments> negativeNumbers() {
    return Stream.of(
        Arguments.of(
            "{id: weld, capacity: 14000}", "{id: weld, capacity: -1}", "resources[0].capacity"),
        Arguments.of("    demand: 2500\n", "    demand: -2500\n", "segments[1].demand"),
        Arguments.of("price: 60, cost: 25", "price: 60, cost: -25", "groups[1].options[0].cost"),
        Arguments.of("price: 60, cost: 25", "price: -60, cost: 25", "groups[1].options[0].price"),
        Arguments.of("uses: {weld: 1.6}", "uses: {weld: -1.6}", "groups[0].options[0].uses.weld"),
        Arguments.of(
            "families\n    demand: 2500\n",
            "families\n    demand: 2500\nportfolio: {introductionCost: -5}\n",
            "portfolio.introductionCost"),
        Arguments.of(
            "families\n    demand: 2500\n",
            "families\n    demand: 2500\nportfolio: {minLot: -0.5}\n",
            "portfolio.minLot"));
  }

  @ParameterizedTest(name = "{2}")
  @MethodSource("negativeNumbers")
  void negativeNumbersAreRejectedWithAnExample(String find, String replace, String path) {
    says(onlyProblem(base(find, replace), path), "must be >= 0, got -", "e.g.");
  }

  @Test
  void numbersMustBeFinite() {
    // JSON has no infinity literal; 1e999 overflows to it.
    String json =
        """
{"format": 1, "resources": [{"id": "weld", "capacity": 1e999}],
 "groups": [{"id": "frame", "options": [{"id": "step", "price": 1, "cost": 1, "uses": {"weld": -1e999}}]}],
 "segments": [{"id": "s", "demand": 10, "value": {"frame.step": 1e999}}]}
""";
    List<CatalogProblem> ps = problems(json, "range.json", null);
    assertEquals(3, ps.size(), () -> CatalogTesting.render(ps));
    says(at(ps, "resources[0].capacity"), "must be a finite number, got Infinity");
    says(at(ps, "groups[0].options[0].uses.weld"), "must be a finite number, got -Infinity");
    says(at(ps, "segments[0].value[\"frame.step\"]"), "must be a finite number", "pays less");
  }

  @Test
  void numberWrittenAsTextAsksToDropTheQuotes() {
    says(
        onlyProblem(
            base("price: 60, cost: 25", "price: \"60\", cost: 25"), "groups[1].options[0].price"),
        "must be a number, got \"60\"",
        "without quotes");
    says(
        onlyProblem(base("    demand: 2500\n", "    demand: lots\n"), "segments[1].demand"),
        "must be a number, got \"lots\"",
        "demand: 9000");
  }

  @Test
  void maxShareMustBeAShareOfDemand() {
    CatalogProblem p = onlyProblem(base("maxShare: 0.35", "maxShare: 1.5"), "segments[0].maxShare");
    assertEquals(
        "must be in (0, 1], got 1.5 — a share of demand, e.g. 0.35 (write 35% as 0.35; leave"
            + " maxShare out for no limit)",
        p.message());
    says(
        onlyProblem(base("maxShare: 0.35", "maxShare: 0"), "segments[0].maxShare"),
        "must be in (0, 1], got 0");
    says(
        onlyProblem(base("maxShare: 0.35", "maxShare: 35"), "segments[0].maxShare"),
        "got 35",
        "0.35");
    assertEquals(1.0, load(base("maxShare: 0.35", "maxShare: 1")).segments().get(0).maxShare());
  }

  @Test
  void maxVariantsMustBeAWholeNumberAtLeastOne() {
    String p = BASE + "portfolio: {maxVariants: X}\n";
    says(
        onlyProblem(p.replace("X", "0"), "portfolio.maxVariants"),
        "must be >= 1, got 0",
        "leave it out for no limit");
    says(onlyProblem(p.replace("X", "2.5"), "portfolio.maxVariants"), "whole number", "got 2.5");
    says(
        onlyProblem(p.replace("X", "\"24\""), "portfolio.maxVariants"),
        "whole number",
        "without quotes");
    says(onlyProblem(p.replace("X", "9999999999"), "portfolio.maxVariants"), "at most 2147483647");
    assertEquals(24, load(p.replace("X", "24")).portfolio().orElseThrow().maxVariants());
  }

  // ------------------------------------------------------------------ rules

  @Test
  void ruleWithBothFormsOrNeitherIsRejected() {
    says(
        onlyProblem(
            base(
                "- forbid: {frame: [step], rack: [none]}",
                "- forbid: {frame: [step], rack: [none]}\n"
                    + "    when: {frame: [low]}\n"
                    + "    require: {rack: [front]}"),
            "rules[1]"),
        "both forbid and when/require",
        "split it into two rules");
    says(
        onlyProblem(base("- forbid: {frame: [step], rack: [none]}", "- {id: nothing}"), "rules[1]"),
        "says nothing",
        "when",
        "require",
        "forbid");
  }

  @Test
  void whenWithoutRequireAndRequireWithoutWhenAreNamed() {
    says(
        onlyProblem(base("    require: {rack: [front]}\n", ""), "rules[0].require"),
        "missing",
        "a rule with when also needs require",
        "use forbid");
    says(
        onlyProblem(base("  - when: {frame: [low]}\n    require", "  - require"), "rules[0].when"),
        "missing",
        "a rule with require also needs when",
        "forbid");
  }

  @Test
  void emptyListsInRulesSayWhyTheyCannotWork() {
    says(
        onlyProblem(base("when: {frame: [low]}", "when: {frame: []}"), "rules[0].when.frame"),
        "empty list",
        "can never fire");
    says(
        onlyProblem(
            base("require: {rack: [front]}", "require: {rack: []}"), "rules[0].require.rack"),
        "empty list",
        "can never be satisfied");
    says(
        onlyProblem(
            base("forbid: {frame: [step], rack: [none]}", "forbid: {frame: [step], rack: []}"),
            "rules[1].forbid.rack"),
        "empty list",
        "forbids nothing");
    says(
        onlyProblem(base("when: {frame: [low]}", "when: {}"), "rules[0].when"),
        "names no group",
        "when: {refrigerant: [r290]}");
    says(
        onlyProblem(
            base("accepts: {frame: [step, low]}", "accepts: {frame: []}"),
            "segments[0].accepts.frame"),
        "empty list",
        "accept no variant",
        "drop 'frame'");
  }

  @Test
  void choiceListedTwiceOrNotAsAListIsNamed() {
    says(
        onlyProblem(
            base("accepts: {frame: [step, low]}", "accepts: {frame: [step, step]}"),
            "segments[0].accepts.frame[1]"),
        "'step' is listed twice");
    says(
        onlyProblem(base("when: {frame: [low]}", "when: {frame: low}"), "rules[0].when.frame"),
        "must be a list",
        "[low]");
  }

  // ------------------------------------------------------------------ groups and shapes

  @Test
  void groupWithZeroOptionsIsRejected() {
    says(
        onlyProblem(
            base("    options:\n      - {id: front, price: 60, cost: 25}\n", "    options: []\n")
                .replace("rack: [front]", "rack: [none]")
                .replace("\"rack.front\": 20", "\"frame.low\": 20"),
            "groups[1].options"),
        "is empty",
        "at least one option");
  }

  @Test
  void wrongShapesAreNamed() {
    says(
        onlyProblem(
            base("  - id: bell\n    required: false\n", "  - id: bell\n    required: maybe\n"),
            "groups[2].required"),
        "must be true or false",
        "got \"maybe\"",
        "none");
    says(
        onlyProblem(base("uses: {weld: 1.6}", "uses: [weld]"), "groups[0].options[0].uses"),
        "must be a mapping of resource to amount",
        "uses: {brazing: 0.85}");
    says(
        onlyProblem(base("  - {id: press, capacity: 500}\n", "  - press\n"), "resources[2]"),
        "must be a mapping such as",
        "got \"press\"");
    says(
        onlyProblem(
            base("  - id: families\n    demand: 2500\n", "") + "portfolio: 3\n", "portfolio"),
        "must be a mapping");
    says(
        onlyProblem(
            "format: 1\nresources: {id: weld}\n"
                + BASE.substring(BASE.indexOf("groups:"))
                    .replace("uses: {weld: 1.6}", "uses: {}")
                    .replace("uses: {weld: 1.4, paint: 0.5}", "uses: {}"),
            "resources"),
        "must be a list of resources");
  }

  // ------------------------------------------------------------------ the document itself

  @Test
  void malformedYamlIsOneProblemAtItsLineAndColumn() {
    String yaml = base("  - {id: paint, capacity: 9000}\n", "  - {id: paint, capacity: 9000\n");
    List<CatalogProblem> ps = problems(yaml);
    assertEquals(1, ps.size());
    assertTrue(ps.get(0).path().matches("range\\.yaml line \\d+ column \\d+"), ps.get(0).path());
    says(ps.get(0), "not valid YAML", "flow mapping", "line 4");
    assertFalse(ps.get(0).message().contains("\n"));
    assertFalse(ps.get(0).message().contains("at com."), "no stack trace");
  }

  @Test
  void yamlIndentedWithTabsSaysToUseSpaces() {
    CatalogProblem p = problems("format: 1\ngroups:\n\t- id: frame\n").get(0);
    assertEquals("range.yaml line 3 column 1", p.path());
    says(p, "not valid YAML", "spaces, not tabs");
  }

  @Test
  void misIndentedYamlPointsAtTheLine() {
    CatalogProblem p = problems("format: 1\ngroups:\n  - id: frame\n - id: rack\n").get(0);
    assertEquals("range.yaml line 4 column 2", p.path());
    says(p, "not valid YAML", "check the indentation");
  }

  @Test
  void malformedJsonIsOneProblemAtItsLineAndColumn() {
    List<CatalogProblem> ps =
        problems("{\n  \"format\": 1,\n  \"groups\": [,]\n}\n", "range.json", null);
    assertEquals(1, ps.size());
    assertEquals("range.json line 3 column 14", ps.get(0).path());
    says(ps.get(0), "not valid JSON");
  }

  @Test
  void keyTwiceInOneMappingIsASyntaxProblem() {
    CatalogProblem p =
        problems(base("    maxShare: 0.35\n", "    maxShare: 0.35\n    maxShare: 0.5\n")).get(0);
    assertEquals("range.yaml line 27 column 13", p.path());
    says(p, "the key 'maxShare' appears twice", "keep one");
    CatalogProblem q = problems("{\"format\": 1, \"format\": 1}", "range.json", null).get(0);
    says(q, "the key 'format' appears twice");
  }

  @Test
  void emptyFileAndNonMappingTopLevelAreNamed() {
    says(problems("").get(0), "the file is empty", "format: 1");
    says(problems("# only a comment\n").get(0), "the file is empty");
    CatalogProblem p = problems("- 1\n- 2\n").get(0);
    assertEquals("range.yaml", p.path());
    says(p, "must be a mapping with format, resources, groups, rules and segments", "got a list");
    says(problems("{} {}", "range.json", null).get(0), "more content after the end of the catalog");
  }

  @Test
  void unknownFileTypeIsRejected() {
    CatalogProblem p = problems(BASE, "range.txt", null).get(0);
    assertEquals("range.txt", p.path());
    says(p, ".yaml, .yml or .json");
  }

  // ------------------------------------------------------------------ all at once

  @Test
  void allProblemsComeAtOnceInFileOrderAndTheMessageListsThem() {
    String yaml =
        base("format: 1", "format: 3")
            .replace("{id: weld, capacity: 14000}", "{id: weld, capacity: -1}")
            .replace("uses: {weld: 1.6}", "uses: {wled: 1.6}")
            .replace("require: {rack: [front]}", "require: {rack: []}")
            .replace("maxShare: 0.35", "maxShare: 2")
            .replace("accepts: {frame: [step, low]}", "accepts: {frame: [xl]}");
    CatalogException e =
        assertThrows(CatalogException.class, () -> CatalogLoader.parse(yaml, "range.yaml", null));
    List<String> paths = e.problems().stream().map(CatalogProblem::path).toList();
    assertEquals(
        List.of(
            "format",
            "resources[0].capacity",
            "groups[0].options[0].uses.wled",
            "rules[0].require.rack",
            "segments[0].maxShare",
            "segments[0].accepts.frame[0]"),
        paths);
    String[] lines = e.getMessage().split("\n");
    assertEquals(6, lines.length);
    for (int i = 0; i < lines.length; i++) {
      CatalogProblem p = e.problems().get(i);
      assertEquals(p.path() + ": " + p.message(), lines[i]);
    }
  }

  // ------------------------------------------------------------------ files

  @Test
  void yamlAndJsonOfTheSameCatalogLoadEqual() throws Exception {
    Path dir = Path.of(getClass().getResource("ebike.yaml").toURI()).getParent();
    Catalog fromYaml = CatalogLoader.load(dir.resolve("ebike.yaml"));
    Catalog fromJson = CatalogLoader.load(dir.resolve("ebike.json"));
    assertEquals(fromYaml, fromJson);
    assertEquals(4, fromYaml.groups().size());
    assertEquals(Optional.of(new PortfolioSpec(18000, 24, 150)), fromYaml.portfolio());
  }

  @Test
  void loadedCatalogCompilesIntoTheVariantSpace() throws Exception {
    // VariantSpace assumes every id resolves; a loaded catalog must satisfy it.
    Catalog c = CatalogLoader.load(Path.of(getClass().getResource("ebike.yaml").toURI()));
    VariantSpace space = new VariantSpace(c);
    assertEquals(3 + 2 + 3 + 2, space.totalChoices(), "rack is optional: front, none");
    assertEquals(
        90, space.choiceValue(0, space.offset(2) + 2), "commuters pay 90 for battery.b750");
    assertEquals(-15, space.choiceValue(0, space.offset(3) + 1), "and 15 less for rack.none");
    assertFalse(
        space.allowedIn(0, space.offset(0) + 2), "commuters accept step and low frames only");
    assertEquals(1.5, space.choiceUse(space.offset(2) + 2, 1));
    // forbid cargo+hub250 and mid750 => not b500; the third rule requires every rack choice
    assertEquals(2, space.nogoodCount());
  }

  @Test
  void loadNamesAMissingFileAndReadsAYmlFile(@TempDir Path dir)
      throws IOException, CatalogException {
    CatalogException e =
        assertThrows(CatalogException.class, () -> CatalogLoader.load(dir.resolve("nope.yaml")));
    assertEquals("nope.yaml", e.problems().get(0).path());
    says(e.problems().get(0), "no such file");
    Path yml = dir.resolve("range.yml");
    Files.writeString(yml, "\uFEFF" + BASE, StandardCharsets.UTF_8);
    assertEquals(load(BASE), CatalogLoader.load(yml));
    CatalogException folder =
        assertThrows(
            CatalogException.class,
            () -> CatalogLoader.load(Files.createDirectory(dir.resolve("sub.yaml"))));
    says(folder.problems().get(0), "is a folder");
  }

  @Test
  void problemsOfAFileNameTheFile(@TempDir Path dir) throws IOException {
    Path f = dir.resolve("shop.json");
    Files.writeString(f, "{\"format\": 1,\n \"groups\": [}");
    CatalogException e = assertThrows(CatalogException.class, () -> CatalogLoader.load(f));
    assertTrue(e.problems().get(0).path().startsWith("shop.json line 2 column"), e.getMessage());
  }

  @Test
  void exceptionNeedsAProblem() {
    assertThrows(IllegalArgumentException.class, () -> new CatalogException(List.of()));
    assertEquals("a.b: c", new CatalogProblem("a.b", "c").toString());
  }
}
