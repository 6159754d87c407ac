package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * Tiny catalogs whose integer portfolio is worked out by hand in the comments (invented data). One
 * group "model" with a (margin 20) and b (margin 15), each using 1 hour of 100; segment north takes
 * only a (demand 80), south only b (demand 50), both without a share limit. The LP sells 80 a + 20 b
 * = 1,900 on 100 hours. Each of introductionCost, maxVariants, minLot and tooling changes the answer.
 */
class HandCheckedPortfolioTest {

  private static Catalog catalog(double f, int k, double lot, double toolingA, boolean finishes) {
    List<Group> groups = new ArrayList<>();
    groups.add(new Group("model", null, true, List.of(
        new Option("a", null, 30, 10, Map.of("hours", 1.0), toolingA),
        new Option("b", null, 25, 10, Map.of("hours", 1.0), 0.0))));
    if (finishes) {
      groups.add(new Group("finish", null, true, List.of(
          new Option("plain", null, 0, 0, Map.of(), 0.0),
          new Option("gloss", null, 5, 0, Map.of(), 150))));
    }
    List<Segment> segments = List.of(
        new Segment("north", null, 80, 1.0, Map.of("model", List.of("a")), Map.of()),
        new Segment("south", null, 50, 1.0, Map.of("model", List.of("b")), Map.of()));
    return new Catalog(1, "hand", "EUR", "year", List.of(new Resource("hours", null, "h", 100)), groups, List.of(),
        segments, Optional.of(new PortfolioSpec(f, k, lot)));
  }

  private static PortfolioOutcome solve(Catalog c) {
    VariantSpace space = new VariantSpace(c);
    PortfolioOutcome o = StageRuns.stage(space, StageRuns.settings());
    StageRuns.checkFeasible(space, o);
    assertTrue(o.status().isProven(), o.reason());
    // the fully enumerated MIP (SCIP) agrees with the hand computation too
    assertEquals(EnumeratedMip.solve(space, false, 0).value(), o.result().value(), 1e-6);
    return o;
  }

  private static String models(VariantSpace space, PortfolioOutcome o) {
    return o.offer().variants().stream().map(v -> space.label(v.choices())).sorted().toList().toString();
  }

  private static double sold(PortfolioOutcome o, VariantSpace space, String label, int segment) {
    return o.offer().variants().stream().filter(v -> space.label(v.choices()).equals(label))
        .mapToDouble(v -> v.sales()[segment]).sum();
  }

  @Test
  void introductionCostDecidesHowManyToOffer() {
    // F = 100: both, 1,900 − 200 = 1,700 (a alone 1,600 − 100 = 1,500)
    Catalog low = catalog(100, Integer.MAX_VALUE, 0, 0, false);
    PortfolioOutcome o = solve(low);
    assertEquals(1700, o.result().value(), 1e-6);
    assertEquals(200, o.offer().introductionCosts(), 1e-9);
    // F = 800: both 1,900 − 1,600 = 300, a alone 1,600 − 800 = 800, b alone 750 − 800 < 0: a alone
    Catalog high = catalog(800, Integer.MAX_VALUE, 0, 0, false);
    PortfolioOutcome p = solve(high);
    assertEquals(800, p.result().value(), 1e-6);
    assertEquals("[model=a]", models(new VariantSpace(high), p));
  }

  @Test
  void theVariantLimitCanLeaveAPayingVariantOut() {
    // K = 2 as without a limit: 1,700; K = 1: a alone (1,500) beats b alone (50·15 − 100 = 650)
    assertEquals(1700, solve(catalog(100, 2, 0, 0, false)).result().value(), 1e-6);
    Catalog one = catalog(100, 1, 0, 0, false);
    PortfolioOutcome o = solve(one);
    assertEquals(1500, o.result().value(), 1e-6);
    assertEquals("[model=a]", models(new VariantSpace(one), o));
  }

  @Test
  void theMinimumLotMovesSalesOrRulesAVariantOut() {
    // lot 30: b must sell 30, so a drops to 70: 70·20 + 30·15 − 200 = 1,650 (a alone 1,500)
    Catalog thirty = catalog(100, Integer.MAX_VALUE, 30, 0, false);
    VariantSpace s30 = new VariantSpace(thirty);
    PortfolioOutcome o = solve(thirty);
    assertEquals(1650, o.result().value(), 1e-6);
    assertEquals(70, sold(o, s30, "model=a", 0), 1e-6);
    assertEquals(30, sold(o, s30, "model=b", 1), 1e-6);
    // lot 60: south buys only 50, so b can never reach its lot: a alone, 80·20 − 100 = 1,500
    Catalog sixty = catalog(100, Integer.MAX_VALUE, 60, 0, false);
    PortfolioOutcome p = solve(sixty);
    assertEquals(1500, p.result().value(), 1e-6);
    assertEquals("[model=a]", models(new VariantSpace(sixty), p));
  }

  @Test
  void toolingIsPaidOncePerOptionUsed() {
    // tooling 1,200 on a: both 1,700 − 1,200 = 500, a alone 300, b alone 50·15 − 100 = 650: b alone
    Catalog toolA = catalog(100, Integer.MAX_VALUE, 0, 1200, false);
    PortfolioOutcome o = solve(toolA);
    assertEquals(650, o.result().value(), 1e-6);
    assertEquals("[model=b]", models(new VariantSpace(toolA), o));
    // with a finish group, gloss (+5 a unit, tooling 150) on both models: 80·25 + 20·20 − 200 − 150
    // = 2,050; gloss on a only 2,000 + 300 − 200 − 150 = 1,950; plain only 1,700. Gloss's tooling is
    // paid once although two variants use it (twice would leave 1,900, below 1,950).
    Catalog fin = catalog(100, Integer.MAX_VALUE, 0, 0, true);
    PortfolioOutcome p = solve(fin);
    assertEquals(2050, p.result().value(), 1e-6);
    assertEquals(150, p.offer().toolingCosts(), 1e-9);
    assertEquals(350, p.offer().introductionCosts(), 1e-9);
    assertEquals("[model=a,finish=gloss, model=b,finish=gloss]", models(new VariantSpace(fin), p));
  }
}
