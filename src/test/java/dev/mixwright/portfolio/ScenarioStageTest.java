package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CurrentVariant;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.Scenario.Amount;
import dev.mixwright.scenario.Scenario.Change;
import dev.mixwright.scenario.Scenario.Field;
import dev.mixwright.scenario.Scenario.Target;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.EnumeratedScenarioMip;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * One range across scenarios against the fully enumerated two-stage MIP (every variant, every
 * scenario, SCIP in one piece: {@link EnumeratedScenarioMip}) on small random catalogs whose
 * scenarios move capacities, demands and costs; and with one scenario against today's integer stage.
 */
class ScenarioStageTest {
  private static final int CASES = 24;

  private static double tol(double x) {
    return 1e-6 * (1 + Math.abs(x));
  }

  private static Catalog base(Random rnd, int i) {
    Catalog c = RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(2), 1 + rnd.nextInt(3),
        rnd.nextInt(6), true);
    return i % 3 == 2 ? StageRuns.withTooling(c, rnd) : c;
  }

  /** A scenario moving every capacity and demand by up to ±40 % and the first option's cost of each group. */
  static Scenario draw(Catalog c, Random rnd, String id) {
    List<Change> ch = new ArrayList<>();
    for (var r : c.resources()) {
      ch.add(new Change(new Target(Field.CAPACITY, r.id(), null), Amount.percent(rnd.nextInt(81) - 40), id));
    }
    for (var s : c.segments()) {
      ch.add(new Change(new Target(Field.DEMAND, s.id(), null), Amount.percent(rnd.nextInt(81) - 40), id));
    }
    for (var g : c.groups()) {
      ch.add(new Change(new Target(Field.COST, g.id(), g.options().get(0).id()), Amount.add(rnd.nextInt(21) - 10), id));
    }
    return new Scenario(id, ch);
  }

  static List<VariantSpace> spaces(Catalog c, Random rnd, int n) throws Exception {
    List<VariantSpace> out = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      out.add(new VariantSpace((k == 0 ? Scenario.none() : draw(c, rnd, "s" + k)).applyTo(c)));
    }
    return out;
  }

  private static double[] weights(Random rnd, int n) {
    double[] w = new double[n];
    double sum = 0;
    for (int k = 0; k < n; k++) {
      w[k] = 1 + rnd.nextInt(4);
      sum += w[k];
    }
    for (int k = 0; k < n; k++) {
      w[k] /= sum;
    }
    return w;
  }

  @Test
  void provenMeansTheEnumeratedTwoStageOptimumAndTheBoundNeverFallsBelowIt() {
    int[] proven = new int[1];
    Cases.each(CASES, (seed, rnd) -> {
      Catalog c = base(rnd, (int) (seed & 7));
      int n = 2 + rnd.nextInt(2);
      List<VariantSpace> spaces = spaces(c, rnd, n);
      double[] w = weights(rnd, n);
      boolean worst = rnd.nextInt(3) == 0;
      List<SolveOutcome> lps = spaces.stream().map(StageRuns::lp).toList();
      // half the cases without each scenario's own range, so the stage finds its incumbent alone
      List<List<int[]>> alone = new ArrayList<>();
      double[] aloneBounds = new double[n];
      java.util.Arrays.fill(aloneBounds, Double.POSITIVE_INFINITY);
      if (rnd.nextBoolean()) {
        for (int k = 0; k < n; k++) {
          PortfolioOutcome best = StageRuns.stage(spaces.get(k), StageRuns.settings());
          alone.add(best.offer().variants().stream().map(OfferedVariant::choices).toList());
          aloneBounds[k] = best.result().bound();
        }
      }
      ScenarioStage.Outcome o = new ScenarioStage(spaces, w, worst ? ScenarioStage.Aim.WORST : ScenarioStage.Aim.MEAN,
          StageRuns.settings()).run(lps, alone, aloneBounds);
      // SCIP over every variant and every scenario in one model
      EnumeratedScenarioMip.Result full = EnumeratedScenarioMip.solve(spaces, w, worst, 60_000);
      assertTrue(full.optimal(), "the reference should solve a small case");
      String where = (worst ? "worst case" : "mean") + ", " + n + " scenarios, " + o.status().word() + " " + o.reason();
      assertTrue(full.value() <= o.bound() + tol(full.value()), where + ": bound " + o.bound()
          + " below the enumerated optimum " + full.value());
      assertTrue(o.value() <= full.value() + tol(full.value()), where + ": better than the optimum?");
      // the value is what the range earns, scenario by scenario, by the stage's own evaluation
      double mean = 0;
      double min = Double.POSITIVE_INFINITY;
      for (int k = 0; k < n; k++) {
        mean += w[k] * o.scenarioValue()[k];
        min = Math.min(min, o.scenarioValue()[k]);
      }
      assertEquals(worst ? min : mean, o.value(), tol(o.value()), where);
      if (o.status().isProven()) {
        proven[0]++;
        assertEquals(full.value(), o.value(), tol(full.value()), where);
      }
    });
    assertTrue(proven[0] >= CASES * 2 / 3, "most small cases should be proven, got " + proven[0] + " of " + CASES);
  }

  @Test
  void oneScenarioGivesTodaysIntegerStage() {
    Cases.each(CASES / 2, (seed, rnd) -> {
      Catalog c = base(rnd, (int) (seed & 7));
      VariantSpace space = new VariantSpace(c);
      PortfolioOutcome today = StageRuns.stage(space, StageRuns.settings());
      ScenarioStage.Outcome one = new ScenarioStage(List.of(space), new double[] {1}, ScenarioStage.Aim.MEAN,
          StageRuns.settings()).run(List.of(StageRuns.lp(space)), List.of());
      EnumeratedMip.Result full = EnumeratedMip.solve(space, false, 60_000); // SCIP over all variants
      assertTrue(full.value() <= one.bound() + tol(full.value()), "bound below the enumerated optimum");
      if (today.status().isProven() && one.status().isProven()) {
        assertEquals(today.result().value(), one.value(), tol(today.result().value()));
        assertEquals(full.value(), one.value(), tol(full.value()));
      }
      // the worst of one scenario is that scenario
      ScenarioStage.Outcome worst = new ScenarioStage(List.of(space), new double[] {1}, ScenarioStage.Aim.WORST,
          StageRuns.settings()).run(List.of(StageRuns.lp(space)), List.of());
      assertTrue(full.value() <= worst.bound() + tol(full.value()), "worst-case bound below the enumerated optimum");
      if (worst.status().isProven()) {
        assertEquals(full.value(), worst.value(), tol(full.value()));
      }
    });
  }

  /** Up to three of the base's sellable variants on sale today, the first sometimes pinned. */
  private static Catalog withTodaysRange(Catalog base, Random rnd) {
    VariantSpace plain = new VariantSpace(base);
    List<int[]> all = new ArrayList<>(EnumeratedMip.sellable(plain));
    if (all.isEmpty()) {
      return base;
    }
    double f = base.portfolio().orElseThrow().introductionCost();
    List<CurrentVariant> cur = new ArrayList<>();
    int n = 1 + rnd.nextInt(Math.min(3, all.size()));
    for (int j = 0; j < n; j++) {
      int[] v = all.remove(rnd.nextInt(all.size()));
      cur.add(new CurrentVariant(plain.describe(v), rnd.nextInt(3) * (f + 50), j == 0 && rnd.nextDouble() < 0.4));
    }
    return base.withCurrentRange(cur, List.of());
  }

  @Test
  void aRangeOnSaleTodayIsKeptDroppedOrReplacedAsTheEnumeratedTwoStageMipSays() {
    int[] compared = new int[1];
    int[] proven = new int[1];
    Cases.each(CASES, (seed, rnd) -> {
      Catalog c = withTodaysRange(base(rnd, (int) (seed & 7)), rnd);
      int n = 2 + rnd.nextInt(2);
      List<VariantSpace> spaces = spaces(c, rnd, n);
      double[] w = weights(rnd, n);
      boolean worst = rnd.nextInt(3) == 0;
      EnumeratedScenarioMip.Result full;
      try {
        full = EnumeratedScenarioMip.solve(spaces, w, worst, 60_000); // SCIP over every variant and scenario
      } catch (IllegalStateException pinnedLotsDoNotFit) {
        return;
      }
      assertTrue(full.optimal(), "the reference should solve a small case");
      compared[0]++;
      ScenarioStage.Outcome o = new ScenarioStage(spaces, w, worst ? ScenarioStage.Aim.WORST : ScenarioStage.Aim.MEAN,
          StageRuns.settings()).run(spaces.stream().map(StageRuns::lp).toList(), List.of());
      String where = (worst ? "worst case" : "mean") + ", " + n + " scenarios, " + c.current().size()
          + " on sale today, " + o.status().word() + " " + o.reason();
      assertTrue(full.value() <= o.bound() + tol(full.value()), where + ": bound " + o.bound()
          + " below the enumerated optimum " + full.value());
      assertTrue(o.value() <= full.value() + tol(full.value()), where + ": better than the optimum?");
      for (CurrentVariant cv : c.current()) {
        int[] v = spaces.get(0).parse(cv.variant());
        if (cv.keep()) {
          assertTrue(o.range().stream().anyMatch(r -> java.util.Arrays.equals(r, v)), where + ": a pinned variant dropped");
        }
      }
      // the change against today's range, as the report lists it: kept and added make up the range,
      // kept are today's, dropped are today's outside the range and pay exactly their discontinue costs
      VariantSpace sp = spaces.get(0);
      java.util.Set<dev.mixwright.space.VariantKey> inRange = new java.util.HashSet<>();
      o.range().forEach(r -> inRange.add(sp.key(r)));
      java.util.Set<dev.mixwright.space.VariantKey> today = new java.util.HashSet<>();
      double paid = 0;
      for (CurrentVariant cv : c.current()) {
        int[] v = sp.parse(cv.variant());
        today.add(sp.key(v));
        if (!inRange.contains(sp.key(v))) {
          paid += cv.discontinue();
        }
      }
      RangeChange ch = o.change();
      assertEquals(inRange.size(), ch.kept().size() + ch.added().size(), where + ": kept and added make the range");
      ch.kept().forEach(k -> assertTrue(today.contains(sp.key(k.choices())), where + ": kept but not on sale today"));
      ch.added().forEach(a -> assertFalse(today.contains(sp.key(a.choices())), where + ": added but on sale today"));
      assertEquals(today.size() - ch.kept().size(), ch.dropped().size(), where + ": dropped");
      assertEquals(paid, ch.discontinueCosts(), 1e-9, where + ": discontinue costs paid");
      assertEquals(o.range().size(), o.mean().size(), where);
      // today's range is one of the ranges the enumerated MIP chooses among when it fits the variant limit
      double todays = ch.currentRangeValue();
      if (!Double.isNaN(todays) && c.current().size() <= c.portfolio().orElseThrow().maxVariants()) {
        assertTrue(todays <= full.value() + tol(full.value()), where + ": today's range " + todays
            + " above the enumerated optimum " + full.value());
      }
      if (o.status().isProven()) {
        proven[0]++;
        assertEquals(full.value(), o.value(), tol(full.value()), where);
      }
    });
    assertTrue(compared[0] >= CASES / 2, "most cases should be feasible, got " + compared[0] + " of " + CASES);
    assertTrue(proven[0] >= compared[0] * 2 / 3, "most compared cases should be proven, got " + proven[0] + " of "
        + compared[0]);
  }
}
