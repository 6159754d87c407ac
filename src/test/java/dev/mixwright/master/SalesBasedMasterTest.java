package dev.mixwright.master;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.choice.Logit;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.RandomChoiceCatalogs;
import dev.mixwright.testing.SalesBasedLp;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * {@link RestrictedMaster} with segments that choose (the sales-based LP), every enumerated column
 * added, on seeded random tiny catalogs ({@link RandomChoiceCatalogs}); a failure names its seed.
 */
class SalesBasedMasterTest {
  private static final int SEEDS = 40;

  private static double[] capacity(VariantSpace space) {
    return space.catalog().resources().stream().mapToDouble(Resource::capacity).toArray();
  }

  private static double[] demand(VariantSpace space) {
    return space.catalog().segments().stream().mapToDouble(s -> s.demand()).toArray();
  }

  private static boolean[] chooses(VariantSpace space) {
    boolean[] out = new boolean[space.segmentCount()];
    for (int s = 0; s < out.length; s++) {
      out[s] = space.chooses(s);
    }
    return out;
  }

  private static double attraction(VariantSpace space, EnumeratedLp.Column c) {
    return Logit.attraction(space.utility(c.choices(), c.segment()), space.stayOut(c.segment()));
  }

  private static MasterSolution solveAll(VariantSpace space, List<EnumeratedLp.Column> columns, double[] margin) {
    return solveAll(space, columns, margin, 0.0);
  }

  private static MasterSolution solveAll(VariantSpace space, List<EnumeratedLp.Column> columns, double[] margin,
      double slack) {
    try (RestrictedMaster master = new RestrictedMaster(capacity(space), demand(space), chooses(space))) {
      for (int j = 0; j < columns.size(); j++) {
        EnumeratedLp.Column c = columns.get(j);
        if (space.chooses(c.segment())) {
          master.addChoiceColumn(c.segment(), margin[j], c.use(), attraction(space, c));
        } else {
          master.addColumn(c.segment(), margin[j], c.use(), c.upper());
        }
      }
      return master.solve(slack);
    }
  }

  /**
   * A master solved with slack (its inner rounds cut short) still returns duals feasible for the
   * whole SBLP (every column here is in it): μ_s + β_j ≥ r_j, μ_s ≥ Σ w β, β ≥ 0; and its objective
   * and dual objective bracket the optimum of Apache Commons Math's SimplexSolver on the same SBLP.
   * The slacks run from none to one that stops after the first inner round.
   */
  @Test
  void masterWithSlackKeepsFeasibleDualsAndBracketsTheOptimum() {
    double[] slacks = {0.0, 1e-3, 1e2, 1e12};
    for (long seed = 300; seed < 300 + SEEDS; seed++) {
      long s0 = seed;
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, true));
      List<EnumeratedLp.Column> cols = EnumeratedLp.columns(space);
      double[] margin = cols.stream().mapToDouble(EnumeratedLp.Column::margin).toArray();
      // source: Apache Commons Math SimplexSolver (SalesBasedLp)
      double ref = SalesBasedLp.solve(space, cols, false).objective();
      double tol = 1e-6 * Math.max(1, Math.abs(ref));
      for (double slack : slacks) {
        MasterSolution sol = solveAll(space, cols, margin, slack);
        String at = "seed " + s0 + ", slack " + slack;
        assertTrue(sol.isOptimal(), at);
        assertTrue(sol.objective() <= ref + tol, () -> at + ": objective " + sol.objective() + " above " + ref);
        assertTrue(sol.dualObjective() >= ref - tol, () -> at + ": dual objective " + sol.dualObjective() + " below " + ref);
        assertTrue(sol.dualObjective() >= sol.objective() - tol, at);
        if (slack == 0.0) {
          assertEquals(ref, sol.dualObjective(), tol, at);
        }
        for (int s = 0; s < space.segmentCount(); s++) {
          if (!space.chooses(s)) {
            continue;
          }
          double mu = sol.segmentDual()[s];
          double sum = 0;
          for (int j = 0; j < cols.size(); j++) {
            EnumeratedLp.Column c = cols.get(j);
            if (c.segment() != s) {
              continue;
            }
            double r = margin[j];
            for (int q = 0; q < c.use().length; q++) {
              r -= sol.resourceDual()[q] * c.use()[q];
            }
            double beta = sol.columnDual()[j];
            assertTrue(beta >= 0, at);
            assertTrue(mu + beta >= r - tol, at + ": column " + j + " prices out positive");
            sum += attraction(space, c) * beta;
          }
          double total = sum;
          assertTrue(mu >= total - 1e-6 * Math.max(1, total), () -> at + ": stay-out dual row, μ " + mu + " < " + total);
        }
      }
    }
  }

  /** GLOP's sales-based master equals Apache Commons Math's SimplexSolver on the same enumerated SBLP. */
  @Test
  void fullMasterEqualsCommonsMathSalesBasedLp() {
    for (long seed = 0; seed < SEEDS; seed++) {
      long s0 = seed;
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, true));
      List<EnumeratedLp.Column> cols = EnumeratedLp.columns(space);
      double[] margin = cols.stream().mapToDouble(EnumeratedLp.Column::margin).toArray();
      MasterSolution sol = solveAll(space, cols, margin);
      SalesBasedLp.Solution ref = SalesBasedLp.solve(space, cols, false);
      assertTrue(sol.isOptimal(), () -> "seed " + s0);
      // source: Apache Commons Math SimplexSolver (SalesBasedLp)
      assertEquals(ref.objective(), sol.objective(), 1e-6 * Math.max(1, Math.abs(ref.objective())), () -> "seed " + s0);
      for (int s = 0; s < space.segmentCount(); s++) {
        if (space.chooses(s)) {
          // x_s0's dual row μ_s ≥ Σ_j w_j β_j with every β_j ≥ 0
          double sum = 0;
          for (int j = 0; j < cols.size(); j++) {
            if (cols.get(j).segment() == s) {
              assertTrue(sol.columnDual()[j] >= 0);
              sum += attraction(space, cols.get(j)) * sol.columnDual()[j];
            }
          }
          int ss = s;
          double total = sum;
          assertTrue(sol.segmentDual()[s] >= total - 1e-6 * Math.max(1, total), () -> "seed " + s0 + " segment " + ss);
        } else {
          assertTrue(Double.isNaN(sol.stayingOut()[s]));
        }
      }
    }
  }

  /**
   * Offered a fixed list at equal margins with capacity to spare, the SBLP sells as much as the rows
   * allow, which is the logit: buyers · w_i / (1 + Σ w) of each and buyers / (1 + Σ w) stay out
   * (Train, <i>Discrete Choice Methods with Simulation</i>, 2nd ed. 2009, ch. 3), computed here by
   * plain arithmetic.
   */
  @Test
  void equalMarginsAndRoomSellTheLogitShares() {
    for (long seed = 100; seed < 100 + SEEDS; seed++) {
      long s0 = seed;
      Catalog c = RandomChoiceCatalogs.tiny(seed, false);
      List<Resource> roomy = new ArrayList<>();
      for (Resource r : c.resources()) {
        roomy.add(new Resource(r.id(), r.label(), r.unit(), 1e12));
      }
      VariantSpace space = new VariantSpace(new Catalog(c.format(), c.name(), c.currency(), c.period(), roomy,
          c.groups(), c.rules(), c.segments(), c.portfolio()));
      List<EnumeratedLp.Column> cols = EnumeratedLp.columns(space);
      double[] margin = new double[cols.size()];
      java.util.Arrays.fill(margin, 10.0);
      MasterSolution sol = solveAll(space, cols, margin);
      for (int s = 0; s < space.segmentCount(); s++) {
        double sumW = 0;
        for (EnumeratedLp.Column col : cols) {
          if (col.segment() == s) {
            sumW += attraction(space, col);
          }
        }
        double buyers = space.buyers(s);
        double tol = 1e-6 * buyers;
        assertEquals(buyers / (1 + sumW), sol.stayingOut()[s], tol, "seed " + s0 + ": stay-out (Train ch. 3)");
        for (int j = 0; j < cols.size(); j++) {
          if (cols.get(j).segment() == s) {
            assertEquals(buyers * attraction(space, cols.get(j)) / (1 + sumW), sol.x()[j], tol,
                "seed " + s0 + ": logit sales (Train ch. 3)");
          }
        }
      }
    }
  }

  @Test
  void columnsGoThroughTheMethodOfTheirSegment() {
    try (RestrictedMaster master = new RestrictedMaster(new double[] {10}, new double[] {5, 7}, new boolean[] {true, false})) {
      assertThrows(IllegalArgumentException.class, () -> master.addColumn(0, 1, new double[] {1}, 3));
      assertThrows(IllegalArgumentException.class, () -> master.addChoiceColumn(1, 1, new double[] {1}, 0.5));
      assertThrows(IllegalArgumentException.class, () -> master.addChoiceColumn(0, 1, new double[] {1}, 0));
      // nothing offered: every buyer stays out, the plan sells nothing
      MasterSolution sol = master.solve();
      assertEquals(5, sol.stayingOut()[0], 1e-9);
      assertEquals(0, sol.objective(), 1e-9);
    }
  }
}
