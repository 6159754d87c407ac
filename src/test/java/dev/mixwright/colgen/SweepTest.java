package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.Scenarios;
import dev.mixwright.scenario.SweepPlan;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomCatalogs;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Sweeps against what LP theory says of the value function z(b) of a maximisation LP in one
 * right-hand side b: it is concave, piecewise linear and, for a ≤ row, non-decreasing; a dual
 * value π(b) is a supergradient, z(b') ≤ z(b) + π(b)(b' − b) (Bertsimas &amp; Tsitsiklis,
 * "Introduction to Linear Optimization", ch. 5, sensitivity analysis — recalled from memory). So
 * between neighbouring points the slope lies in [π(b_{i+1}), π(b_i)], and equals both where they
 * agree.
 */
class SweepTest {
  static Catalog starter;

  @BeforeAll
  static void load() throws Exception {
    starter = CatalogLoader.load(Path.of("catalogs/heatpump-starter.yaml"));
  }

  private static final SolveSettings TIGHT = SolveSettings.defaults().withGapTolerance(1e-9).withPerRound(5);

  private static List<Sweep.Row> sweep(Catalog c, SweepPlan plan, boolean warm) {
    List<Sweep.Row> rows = new ArrayList<>(new Sweep(c, plan, BranchAndBoundPricer::withDefaultLimits, TIGHT, warm).run(Set.of(), () -> false,
        new Sweep.Listener() {}));
    rows.sort(Comparator.comparingInt(r -> r.point().index()));
    return rows;
  }

  private static void assertOptimal(List<Sweep.Row> rows) {
    for (Sweep.Row r : rows) {
      assertEquals(RunStatus.OPTIMAL, r.outcome().status(), r.point().name());
    }
  }

  @Test
  void theValueCurveOfACapacityRisesIsConcaveAndHasTheShadowPricesAsSlopes() throws Exception {
    SweepPlan plan = Scenarios.grid(List.of("resources.testbench.capacity=5000..13000:250"), Scenario.none(),
        List.of(), starter);
    List<Sweep.Row> warm = sweep(starter, plan, true);
    List<Sweep.Row> cold = sweep(starter, plan, false);
    assertOptimal(warm);
    assertOptimal(cold);
    int r = starter.resourceIndex("testbench");
    int samePrice = 0;
    int sameBindingAndPrice = 0;
    for (int i = 0; i < warm.size(); i++) {
      double z = warm.get(i).outcome().result().value();
      // A warm start changes the work, never the answer: independent cold re-solves agree.
      assertEquals(cold.get(i).outcome().result().value(), z, 1e-9 * z, warm.get(i).point().name());
      assertTrue(warm.get(i).warmColumns() > 0 || i == 0);
      if (i == 0) {
        continue;
      }
      Sweep.Row a = warm.get(i - 1);
      Sweep.Row b = warm.get(i);
      double za = a.outcome().result().value();
      double zb = b.outcome().result().value();
      double db = b.catalog().resources().get(r).capacity() - a.catalog().resources().get(r).capacity();
      double slope = (zb - za) / db;
      double pa = a.outcome().duals().resource()[r];
      double pb = b.outcome().duals().resource()[r];
      double tol = 1e-6 * Math.max(1, pa) + 4e-9 * zb / db;
      assertTrue(zb >= za - 1e-9 * zb, "more capacity never hurts: " + a.point().name() + " -> " + b.point().name());
      assertTrue(slope <= pa + tol && slope >= pb - tol,
          "slope " + slope + " outside [" + pb + ", " + pa + "] at " + b.point().name());
      if (Math.abs(pa - pb) <= 1e-6 * Math.max(1, pa)) {
        samePrice++;
        assertEquals(pa, slope, tol, "the price holds between " + a.point().name() + " and " + b.point().name());
        boolean sameBinding = true;
        for (int k = 0; k < starter.resources().size(); k++) {
          sameBinding &= a.binding(k) == b.binding(k);
        }
        if (sameBinding) {
          sameBindingAndPrice++;
        }
      }
    }
    assertTrue(sameBindingAndPrice >= 3, "the grid has stretches with one binding set and one price ("
        + sameBindingAndPrice + " of " + samePrice + ")");
  }

  @Test
  void sweepObjectivesMatchAnIndependentLpOfTheWholeSpaceOnRandomCatalogs() throws Exception {
    int compared = 0;
    for (long seed = 1; seed <= 12; seed++) {
      Catalog c = RandomCatalogs.small(seed);
      double b = c.resources().get(0).capacity();
      SweepPlan plan = Scenarios.grid(List.of("resources.r0.capacity=" + Math.round(0.25 * b) + ".."
          + Math.round(1.75 * b) + ":" + Math.round(0.25 * b)), Scenario.none(), List.of(), c);
      List<Sweep.Row> rows = sweep(c, plan, true);
      double prev = Double.NEGATIVE_INFINITY;
      for (Sweep.Row row : rows) {
        if (row.outcome().status() == RunStatus.INFEASIBLE) {
          continue;
        }
        // Apache Commons Math SimplexSolver over every (variant, segment) column, via EnumeratedLp.
        double ref = EnumeratedLp.solve(new VariantSpace(row.catalog())).objective();
        double z = row.outcome().result().value();
        assertEquals(ref, z, 1e-6 * Math.max(1, Math.abs(ref)), "seed " + seed + " " + row.point().name());
        assertTrue(z >= prev - 1e-6 * Math.max(1, Math.abs(z)));
        prev = z;
        compared++;
      }
    }
    assertTrue(compared > 40);
  }

  @Test
  void aHigherPriceOrARuleSwitchedOffNeverLowersTheOptimum() throws Exception {
    SweepPlan price = Scenarios.grid(List.of("options.compressor.evi.price=-20%..+20%:10%"), Scenario.none(),
        List.of(), starter);
    SweepPlan rule = Scenarios.grid(List.of("rules.evi-needs-smart-control=on,off",
        "rules.propane-clearance=on,off"), Scenario.none(), List.of(), starter);
    for (SweepPlan plan : List.of(price, rule)) {
      List<Sweep.Row> rows = sweep(starter, plan, true);
      assertOptimal(rows);
      for (int i = 1; i < rows.size(); i++) {
        double za = rows.get(i - 1).outcome().result().value();
        double zb = rows.get(i).outcome().result().value();
        boolean ordered = plan == price || (i != 2); // rule grid: on,on / on,off / off,on / off,off
        if (ordered) {
          assertTrue(zb >= za - 1e-9 * za, rows.get(i - 1).point().name() + " -> " + rows.get(i).point().name());
        }
      }
    }
  }

  @Test
  void aStoppedSweepLeavesTheRestForALaterRunThatSkipsWhatIsDone() throws Exception {
    SweepPlan plan = Scenarios.grid(List.of("resources.testbench.capacity=6000..12000:1000"), Scenario.none(),
        List.of(), starter);
    List<Sweep.Row> all = sweep(starter, plan, true);
    int[] solved = {0};
    List<Sweep.Row> first = new Sweep(starter, plan, BranchAndBoundPricer::withDefaultLimits, TIGHT, true).run(Set.of(), () -> solved[0] >= 3,
        new Sweep.Listener() {
          @Override
          public void solved(Sweep.Row row) {
            solved[0]++;
          }
        });
    assertEquals(3, first.size());
    Set<Integer> done = new java.util.HashSet<>();
    first.forEach(r -> done.add(r.point().index()));
    List<Sweep.Row> rest = new Sweep(starter, plan, BranchAndBoundPricer::withDefaultLimits, TIGHT, true).run(done, () -> false, new Sweep.Listener() {});
    assertEquals(all.size() - 3, rest.size());
    for (Sweep.Row r : rest) {
      assertTrue(!done.contains(r.point().index()));
      assertEquals(all.get(r.point().index()).outcome().result().value(), r.outcome().result().value(),
          1e-9 * r.outcome().result().value());
    }
  }
}
