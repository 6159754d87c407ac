package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.optim.MaxIter;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.linear.LinearConstraint;
import org.apache.commons.math3.optim.linear.LinearConstraintSet;
import org.apache.commons.math3.optim.linear.LinearObjectiveFunction;
import org.apache.commons.math3.optim.linear.NonNegativeConstraint;
import org.apache.commons.math3.optim.linear.Relationship;
import org.apache.commons.math3.optim.linear.SimplexSolver;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.junit.jupiter.api.Test;

/**
 * The tangents of a choosing segment's sales envelope ({@link SalesEnvelope}): valid for every offer,
 * checked against an independent LP solver, and a relaxation cut by them still bounds the enumerated
 * integer optimum, at the master's duals and at random envelope prices.
 */
class SalesEnvelopeTest {

  /**
   * For every offer S of up to 7 variants with random attractions, the most the segment can sell under
   * the sales-based rows (x_v ≤ w_v·x_0, Σ x_v + x_0 = N), solved by Apache Commons Math's simplex, is
   * at most the tangent at any W₀: rhs + slope·Σ_{v ∈ S} w_v; and the tangent at W₀ = Σ_S w_v meets it.
   */
  @Test
  void everyTangentBoundsWhatAnOfferSells() {
    Random rnd = new Random(20_261_203L);
    int checked = 0;
    for (int trial = 0; trial < 60; trial++) {
      int n = 1 + rnd.nextInt(7);
      double buyers = 100 + rnd.nextInt(20_000);
      double[] w = new double[n];
      for (int v = 0; v < n; v++) {
        w[v] = Math.exp(rnd.nextDouble() * 10 - 5);
      }
      for (int mask = 1; mask < 1 << n; mask++) {
        double wS = 0;
        List<Integer> offered = new ArrayList<>();
        for (int v = 0; v < n; v++) {
          if ((mask >> v & 1) == 1) {
            offered.add(v);
            wS += w[v];
          }
        }
        double most = mostSold(buyers, offered.stream().mapToDouble(v -> w[v]).toArray());
        double tol = 1e-7 * buyers;
        double tight = SalesEnvelope.rhs(buyers, wS) + SalesEnvelope.slope(buyers, wS) * wS;
        assertTrue(Math.abs(tight - most) <= 1e-6 * buyers, "the tangent at the offer's own W meets it: " + tight
            + " against " + most);
        for (int t = 0; t < 5; t++) {
          double w0 = t == 0 ? 0 : Math.exp(rnd.nextDouble() * 12 - 6);
          double rhs = SalesEnvelope.rhs(buyers, w0) + SalesEnvelope.slope(buyers, w0) * wS;
          assertTrue(most <= rhs + tol, "offer " + offered + " sells " + most + ", tangent at " + w0 + " allows "
              + rhs);
          checked++;
        }
      }
    }
    assertTrue(checked > 10_000);
  }

  /** max Σ x_v subject to x_v − w_v·x_0 ≤ 0, Σ x_v + x_0 = N, x ≥ 0 (Commons Math simplex). */
  private static double mostSold(double buyers, double[] w) {
    int n = w.length;
    double[] obj = new double[n + 1];
    for (int v = 0; v < n; v++) {
      obj[v] = 1;
    }
    List<LinearConstraint> rows = new ArrayList<>();
    for (int v = 0; v < n; v++) {
      double[] a = new double[n + 1];
      a[v] = 1;
      a[n] = -w[v];
      rows.add(new LinearConstraint(a, Relationship.LEQ, 0));
    }
    double[] all = new double[n + 1];
    java.util.Arrays.fill(all, 1);
    rows.add(new LinearConstraint(all, Relationship.EQ, buyers));
    PointValuePair p = new SimplexSolver().optimize(new MaxIter(10_000), new LinearObjectiveFunction(obj, 0),
        new LinearConstraintSet(rows), GoalType.MAXIMIZE, new NonNegativeConstraint(true));
    return p.getValue();
  }

  /**
   * On random catalogs whose segments choose (some also with fixed ones), the relaxation priced to the
   * end with its sales envelope tangents, against the fully enumerated MIP ({@link EnumeratedMip}, SCIP
   * on every buildable variant): its bound and, when converged, its objective never below the integer
   * optimum; and the bound at random envelope prices (random tangents and duals γ ≥ 0, besides random
   * π and μ) never below it either, which checks the pricer's attraction bonus over the whole space.
   * Tangents are added in most of them; a bound that leaves the bonus γ·slope·w out falls below the
   * optimum.
   */
  @Test
  void relaxationCutByTangentsStillBoundsTheEnumeratedOptimum() {
    int[] cut = new int[1];
    Cases.each(60, (seed, rnd) -> {
      Catalog c = StageRuns.withTerms(RandomChoiceCatalogs.tiny(seed, seed % 2 == 0), 100 + rnd.nextInt(1500),
          1 + rnd.nextInt(3), rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40));
      VariantSpace space = new VariantSpace(c);
      PortfolioTerms terms = PortfolioTerms.of(space);
      EnumeratedMip.Result ref = EnumeratedMip.solve(space, false, 60_000);
      assertTrue(ref.optimal(), "the reference MIP was not solved to optimality");
      double opt = ref.value();
      double tol = 1e-6 * (1 + Math.abs(opt));
      Pool pool = new Pool(space, terms);
      for (int[] v : EnumeratedMip.sellable(space)) {
        if (rnd.nextDouble() < 0.3) {
          pool.add(v);
        }
      }
      StageClock clock = new StageClock(60_000, StopCriterion.never());
      Relaxation rx = new Relaxation(space, terms, new VariantPricer(space, terms, Long.MAX_VALUE),
          PortfolioSettings.defaults(), e -> {}, clock, clock.phase(1.0));
      RelaxationResult r = rx.run(pool, new double[space.resourceCount()], new double[space.segmentCount()]);
      SalesEnvelope envelope = pool.choice().envelope();
      if (envelope.size() > 0) {
        cut[0]++;
      }
      assertTrue(r.bound().value() >= opt - tol, "bound " + r.bound().value() + " below the optimum " + opt);
      if (r.converged()) {
        assertTrue(r.objective() >= opt - tol, "relaxed objective " + r.objective() + " below the optimum " + opt);
      }
      for (int trial = 0; trial < 6; trial++) {
        double[] pi = new double[space.resourceCount()];
        for (int q = 0; q < pi.length; q++) {
          pi[q] = rnd.nextDouble() < 0.3 ? 0 : rnd.nextDouble() * 10;
        }
        double[] mu = new double[space.segmentCount()];
        double[] unit = new double[space.segmentCount()];
        double[] att = new double[space.segmentCount()];
        double constant = 0;
        for (int s = 0; s < mu.length; s++) {
          mu[s] = rnd.nextDouble() < 0.3 ? 0 : (space.chooses(s) ? -10 : 0) + rnd.nextDouble() * 40;
          for (int t = 0; space.chooses(s) && t < 3; t++) {
            double w0 = Math.exp(rnd.nextDouble() * 8 - 4);
            double gamma = rnd.nextDouble() < 0.3 ? 0 : rnd.nextDouble() * 30;
            double buyers = terms.demand()[s];
            unit[s] += gamma;
            att[s] += gamma * SalesEnvelope.slope(buyers, w0);
            constant += gamma * SalesEnvelope.rhs(buyers, w0);
          }
        }
        ChoicePrices prices = new ChoicePrices(new double[0][], new double[space.segmentCount()], new double[0],
            constant, unit, att);
        double at = rx.bound(pool, pi, mu, prices, 1 + rnd.nextInt(3)).bound().value();
        assertTrue(at >= opt - tol, "at random envelope prices: bound " + at + " below the optimum " + opt);
      }
    });
    System.out.println("sales envelope tangents added in " + cut[0] + " of 60 relaxations");
    assertTrue(cut[0] >= 12, "tangents were added in only " + cut[0] + " of 60 relaxations");
  }
}
