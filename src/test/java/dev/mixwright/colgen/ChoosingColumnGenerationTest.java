package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.pricing.BruteForcePricer;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.OfferSetLp;
import dev.mixwright.testing.RandomChoiceCatalogs;
import dev.mixwright.testing.SalesBasedLp;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Column-and-row generation of the sales-based LP against independent references, on seeded random
 * tiny catalogs ({@link RandomChoiceCatalogs}) that mix choosing and fixed segments and have price
 * points; every failure names its seed.
 */
class ChoosingColumnGenerationTest {
  private static final int SEEDS = 60;

  private record Run(SolveOutcome outcome, List<IterationRecord> rounds) {}

  private static Run solve(VariantSpace space, Random rnd) {
    Pricer pricer = rnd.nextBoolean()
        ? new BruteForcePricer(space)
        : new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT);
    ChoiceEntry entry = ChoiceEntry.values()[rnd.nextInt(ChoiceEntry.values().length)];
    SolveSettings settings = SolveSettings.defaults().withPerRound(1 + rnd.nextInt(3));
    List<IterationRecord> rounds = new ArrayList<>();
    ColumnGeneration cg = new ColumnGeneration(space, pricer, null, settings, StopCriterion.never(), System.nanoTime())
        .withChoiceEntry(entry);
    cg.addListener(new ColGenListener() {
      @Override
      public void iteration(IterationRecord record) {
        rounds.add(record);
      }
    });
    return new Run(cg.run(), rounds);
  }

  private static double tol(double scale) {
    return 1e-6 * Math.max(1.0, Math.abs(scale));
  }

  /**
   * The loop's optimum is the fully enumerated sales-based LP's (Gallego, Ratliff &amp; Shebalov 2015,
   * solved by Apache Commons Math's SimplexSolver in {@link SalesBasedLp}), and the proven bound is
   * above it in every round.
   */
  @Test
  void equalsEnumeratedSalesBasedLpAndBoundHoldsEveryRound() {
    for (long seed = 0; seed < SEEDS; seed++) {
      long s0 = seed;
      Random rnd = new Random(seed);
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, seed % 2 == 0));
      SalesBasedLp.Solution ref = SalesBasedLp.solve(space);
      Run run = solve(space, rnd);
      SolveOutcome out = run.outcome();
      assertEquals(RunStatus.OPTIMAL, out.status(), () -> "seed " + s0);
      // source: Commons Math SimplexSolver on the enumerated SBLP
      assertEquals(ref.objective(), out.result().value(), tol(ref.objective()), () -> "seed " + s0 + ": objective");
      for (IterationRecord r : run.rounds()) {
        assertTrue(r.bound() >= ref.objective() - tol(ref.objective()),
            () -> "seed " + s0 + ": round " + r.iteration() + " bound " + r.bound() + " < " + ref.objective());
        assertTrue(r.objective() <= ref.objective() + tol(ref.objective()), () -> "seed " + s0 + ": objective above optimum");
      }
    }
  }

  /**
   * The final duals are feasible for the dual of the full SBLP (enumerated here): with β = 0 for every
   * column not in the master, every enumerated column satisfies π·a + μ_s + β ≥ m, and every stay-out
   * column μ_s − Σ w β ≥ 0; their dual objective equals the optimum (weak duality made tight).
   */
  @Test
  void finalDualsPriceOutEveryEnumeratedColumn() {
    for (long seed = 300; seed < 300 + SEEDS; seed++) {
      long s0 = seed;
      Random rnd = new Random(seed);
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, true));
      Run run = solve(space, rnd);
      SolveOutcome out = run.outcome();
      double[] pi = out.duals().resource();
      double[] mu = out.duals().segment();
      Map<Integer, Map<VariantKey, Integer>> present = new HashMap<>();
      for (int j = 0; j < out.master().columns().size(); j++) {
        Column c = out.master().columns().get(j);
        present.computeIfAbsent(c.segment(), k -> new HashMap<>()).put(space.key(c.choices()), j);
      }
      double[] beta = out.master().columnDual();
      double[] stayRow = mu.clone();
      double dualObjective = 0;
      for (int r = 0; r < pi.length; r++) {
        assertTrue(pi[r] >= 0, () -> "seed " + s0 + ": π < 0");
        dualObjective += pi[r] * space.catalog().resources().get(r).capacity();
      }
      for (int s = 0; s < mu.length; s++) {
        dualObjective += mu[s] * space.catalog().segments().get(s).demand();
      }
      double scale = 1;
      for (EnumeratedLp.Column col : EnumeratedLp.columns(space)) {
        int s = col.segment();
        double d = col.margin() - mu[s];
        for (int r = 0; r < pi.length; r++) {
          d -= pi[r] * col.use()[r];
        }
        scale = Math.max(scale, Math.abs(col.margin()));
        Integer j = present.getOrDefault(s, Map.of()).get(col.key());
        double b = j == null ? 0.0 : beta[j];
        if (space.chooses(s)) {
          stayRow[s] -= MasterPool.attraction(space, col.choices(), s) * b;
          double slack = d - b;
          double sc = scale;
          assertTrue(slack <= 1e-7 * sc, () -> "seed " + s0 + ": a column of a choosing segment pays " + slack);
        } else if (j == null) {
          double sc = scale;
          double dd = d;
          assertTrue(dd <= 1e-7 * sc, () -> "seed " + s0 + ": a fixed column outside the master pays " + dd);
        } else {
          // a fixed column's upper bound carries max(0, d) in the dual objective
          dualObjective += col.upper() * Math.max(0, d);
        }
      }
      for (int s = 0; s < mu.length; s++) {
        if (space.chooses(s)) {
          int ss = s;
          double sc = scale;
          assertTrue(stayRow[s] >= -1e-7 * sc, () -> "seed " + s0 + ": stay-out row of " + ss + " is " + stayRow[ss]);
        }
      }
      // LP duality: a feasible dual's objective bounds the optimum, and equals it at optimal duals
      assertEquals(out.result().value(), dualObjective, tol(out.result().value()) * 10, () -> "seed " + s0 + ": dual objective");
    }
  }

  /**
   * On tiny catalogs the optimum equals the choice-based LP over every offer set (Liu &amp; van Ryzin
   * 2008, MSOM 10(2), enumerated in {@link OfferSetLp}); equality is a theorem of Gallego, Ratliff
   * &amp; Shebalov 2015.
   */
  @Test
  void equalsOfferSetLp() {
    for (long seed = 600; seed < 600 + SEEDS / 2; seed++) {
      long s0 = seed;
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, seed % 3 == 0));
      double cdlp = OfferSetLp.solve(space).objective();
      SolveOutcome out = solve(space, new Random(seed)).outcome();
      // source: the offer-set LP of Liu & van Ryzin 2008 on Commons Math
      assertEquals(cdlp, out.result().value(), tol(cdlp), () -> "seed " + s0);
    }
  }

  /** Stay-out plus sales make up the buyers of each choosing segment; nothing sells above w·x_s0. */
  @Test
  void salesAndStayOutAddUpToTheBuyers() {
    for (long seed = 900; seed < 900 + SEEDS / 2; seed++) {
      long s0 = seed;
      VariantSpace space = new VariantSpace(RandomChoiceCatalogs.tiny(seed, true));
      SolveOutcome out = solve(space, new Random(seed)).outcome();
      double[] sold = new double[space.segmentCount()];
      for (int j = 0; j < out.master().columns().size(); j++) {
        Column c = out.master().columns().get(j);
        sold[c.segment()] += out.master().x()[j];
        if (space.chooses(c.segment())) {
          double cap = MasterPool.attraction(space, c.choices(), c.segment()) * out.master().stayingOut(c.segment());
          assertTrue(out.master().x()[j] <= cap + tol(space.buyers(c.segment())), () -> "seed " + s0 + ": sells above w·x_s0");
        }
      }
      for (int s = 0; s < sold.length; s++) {
        if (space.chooses(s)) {
          assertEquals(space.buyers(s), sold[s] + out.master().stayingOut(s), tol(space.buyers(s)), "seed " + s0);
        } else {
          assertTrue(Double.isNaN(out.master().stayingOut(s)));
        }
      }
    }
  }
}
