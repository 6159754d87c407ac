package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.catalog.Segment;
import dev.mixwright.master.PortfolioMip;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The integer stage proves by the LP stage's gap rule, relative to the figures: a catalog whose money
 * figures are all scaled down (margins far below 1, portfolios worth a few hundredths) is proven
 * exactly where the same catalog at full scale is, at the same plan. An absolute 1 in the tree's
 * pruning tolerance pruned nodes up to a whole gap's worth of the portfolio above the incumbent.
 */
class TinyFiguresPortfolioTest {
  private static final int CASES = 16;
  private static final double GAP = 1e-4;

  /** The stage with the quick proof off, so that the branch-and-price tree proves what is proven. */
  private static PortfolioOutcome treeStage(VariantSpace space) {
    PortfolioSettings s = new PortfolioSettings(30_000, PortfolioMip.Engine.SCIP,
        PortfolioSettings.DEFAULT_SURVIVOR_LIMIT, 200, 10, GAP);
    return new IntegerStage(space, s).workers(1).quickProof(false).run(StageRuns.lp(space));
  }

  @Test
  void tinyFiguresAreProvenWhereTheSameCatalogAtFullScaleIs() {
    int proven = 0;
    int tinyProven = 0;
    for (int i = 0; i < CASES; i++) {
      Random rnd = new Random(9100 + i);
      Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3), 1 + rnd.nextInt(3),
          rnd.nextInt(7), true);
      VariantSpace full = new VariantSpace(c);
      EnumeratedMip.Result ref = EnumeratedMip.solve(full, false, 60_000); // SCIP over all variants
      PortfolioOutcome big = treeStage(full);
      if (!ref.optimal() || !big.status().isProven() || ref.value() <= 0) {
        continue;
      }
      proven++;
      // a power of ten that brings the optimum to a few hundredths: every margin far below 1
      double f = Math.pow(10, -Math.ceil(Math.log10(ref.value())) - 1);
      VariantSpace tiny = new VariantSpace(scaledMoney(c, f));
      PortfolioOutcome o = treeStage(tiny);
      StageRuns.checkFeasible(tiny, o);
      String where = "case " + i + ", money x " + f + " (" + o.status().word() + " " + o.reason() + ", value "
          + o.result().value() + ", bound " + o.result().bound() + ")";
      double optimum = ref.value() * f;
      assertTrue(o.result().bound() >= optimum * (1 - 1e-9), where + ": bound below the optimum " + optimum);
      assertTrue(o.status().isProven(), where + ": proven at full scale (" + big.result().value() + ") but not here");
      tinyProven++;
      assertEquals(optimum, o.result().value(), GAP * optimum, where);
    }
    assertTrue(proven >= CASES / 2, "too few cases proven at full scale to compare: " + proven);
    assertEquals(proven, tinyProven);
  }

  /** c with every money figure times f: the same plans, each worth f times as much. */
  static Catalog scaledMoney(Catalog c, double f) {
    List<Group> groups = new ArrayList<>();
    for (Group g : c.groups()) {
      List<Option> os = new ArrayList<>();
      for (Option o : g.options()) {
        os.add(new Option(o.id(), o.label(), o.prices().stream().map(p -> p * f).toList(), o.cost() * f, o.uses(),
            o.tooling() * f));
      }
      groups.add(new Group(g.id(), g.label(), g.required(), os));
    }
    List<Segment> segments = new ArrayList<>();
    for (Segment s : c.segments()) {
      Map<String, Double> value = new HashMap<>();
      s.value().forEach((k, v) -> value.put(k, v * f));
      segments.add(new Segment(s.id(), s.label(), s.demand(), s.maxShare(), s.accepts(), value, s.choice()));
    }
    PortfolioSpec p = c.portfolio().orElseThrow();
    return new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), groups, c.rules(), segments,
        Optional.of(new PortfolioSpec(p.introductionCost() * f, p.maxVariants(), p.minLot(), p.wholeUnits())));
  }
}
