package dev.mixwright.explain;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import dev.mixwright.space.VariantSpace;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** Why a variant cannot be sold, on a tiny catalog whose answer is read off its rules by hand. */
class ExplainerTest {

  private static Catalog catalog() {
    Group body = new Group("body", null, true, List.of(
        new Option("a", null, 10, 5, Map.of(), 0.0), new Option("b", null, 12, 6, Map.of(), 0.0)));
    Group trim = new Group("trim", null, true, List.of(
        new Option("x", null, 3, 1, Map.of(), 0.0), new Option("y", null, 4, 1, Map.of(), 0.0)));
    List<Rule> rules = List.of(
        // names body=b together with trim=x: forbids that pair, not body=b as such
        new Rule("pair", Map.of(), Map.of(), Map.of("body", List.of("b"), "trim", List.of("x"))),
        // a single-group forbid: body=b is never buildable
        new Rule("no-b", Map.of(), Map.of(), Map.of("body", List.of("b"))),
        // an unconditional require with body=b left out says the same
        new Rule("only-a", Map.of(), Map.of("body", List.of("a")), Map.of()));
    return new Catalog(1, "tiny", "EUR", "year", List.of(new Resource("line", null, "h", 10)),
        List.of(body, trim), rules, List.of(new Segment("all", null, 5, 1, Map.of(), Map.of())), Optional.empty());
  }

  @Test
  void namesExactlyTheRulesThatRemoveAChoice() {
    VariantSpace space = new VariantSpace(catalog());
    int[] v = space.parse(Map.of("body", "b", "trim", "y"));
    List<String> problems = new Explainer(space).problems(v, 0);
    assertEquals(1, problems.size(), problems.toString());
    String p = problems.get(0);
    assertTrue(p.contains("body=b is ruled out by rules[1] (no-b), rules[2] (only-a)"), p);
    assertTrue(!p.contains("rules[0]"), "the pair rule does not remove body=b: " + p);
  }

  @Test
  void reducedCostIsMarginLessCharges() {
    VariantSpace space = new VariantSpace(catalog());
    int[] v = space.parse(Map.of("body", "a", "trim", "y"));
    Explanation e = new Explainer(space).explain(v, 0, new double[] {2.0}, new double[] {1.5});
    // margin (10-5) + (4-1) = 8; no resource use; segment charge 1.5
    assertEquals(8.0, e.margin(), 1e-12);
    assertEquals(6.5, e.reducedCost(), 1e-12);
    assertTrue(e.sellable());
  }
}
