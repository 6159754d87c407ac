package dev.mixwright.portfolio;

import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.ValueBound;
import dev.mixwright.master.PortfolioLp;
import dev.mixwright.master.PortfolioLpSolution;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;

/**
 * Column generation on the relaxed portfolio master ({@link PortfolioLp}: introductions 0 ≤ y_v ≤ 1
 * per variant, shared by its segments), where a "column" is a whole variant block.
 *
 * <pre>
 * Pricing, at the master's duals π (resources), μ (segments), λ (variant limit):
 *   a variant v outside the pool improves the master iff
 *     max { Σ_s d_s(v) x_s − (F + λ) y : 0 ≤ y ≤ 1, 0 ≤ x_s ≤ u_s y, Σ_s x_s ≥ L y }  &gt; 0,
 *   where d_s(v) = m(v, s) − π·a(v) − μ_s (−∞ where s does not accept v). The set is {0} joined
 *   to {1} × P_v, P_v = {0 ≤ x ≤ u, Σ x ≥ L}, so the maximum is max(0, ψ(v) − λ) with
 *     ψ(v) = g(d(v)) − F,   g(d) = max_{x ∈ P_v} Σ_s d_s x_s          ({@link LotValue})
 *   and the pricing problem is max_v ψ(v) over the whole space ({@link VariantPricer}, exact).
 * Bound (valid for any π, μ ≥ 0, so for every round): {@link LagrangianPortfolioBound}, with the
 *   pool's variants valued at their attraction rows' duals β ({@link ChoicePrices}).
 * </pre>
 *
 * The Lagrangian subproblem (per variant, over conv({0} ∪ {1} × P_v)) has the integrality property,
 * so the best bound over all prices equals the relaxed master's optimum over the whole space
 * (Geoffrion 1974, "Lagrangean relaxation for integer programming", Mathematical Programming Study
 * 2); at convergence the two meet. Each round costs one warm-started GLOP re-solve and one pricing
 * call; rounds are few because the LP stage's columns seed the pool. Once pricing finds nothing, the
 * master is cut on segments' demand rows ({@link SegmentCuts}) and priced again, within the same round
 * limit; the cuts' duals enter the bound ({@link ChoicePrices#of}).
 */
final class Relaxation {
  private final VariantSpace space;
  private final PortfolioTerms terms;
  private final VariantPricer pricer;
  private final PortfolioSettings settings;
  private final PortfolioListener listener;
  private final StageClock clock;
  private final long deadlineNanos;
  private final int cap;
  private final StopCriterion stop;

  /** Runs within {@code phase}, and at most the settings' relaxation rounds. */
  Relaxation(VariantSpace space, PortfolioTerms terms, VariantPricer pricer, PortfolioSettings settings,
      PortfolioListener listener, StageClock clock, StageClock.Phase phase) {
    this.space = space;
    this.terms = terms;
    this.pricer = pricer;
    this.settings = settings;
    this.listener = listener;
    this.clock = clock;
    this.deadlineNanos = phase.deadlineNanos();
    this.cap = terms.variantCap();
    this.stop = StopCriterion.anyOf(phase.stop(), StopCriterion.iterationLimit(settings.relaxationRounds()));
  }

  /** Bounds are exact top-K sums up to this many listed values; beyond it the λ-form keeps them valid. */
  private static final int BOUND_DEPTH = 64;

  /** A bound and the pricing behind it. */
  record Probe(LagrangianPortfolioBound bound, List<PricedVariant> found, boolean exact) {}

  /**
   * The bound at prices (π, μ) and the attraction rows' β ({@link ChoicePrices}): one pricing call for
   * the k best outside the pool.
   */
  Probe bound(Pool pool, double[] pi, double[] mu, ChoicePrices beta, int k) {
    double[] column = beta.columnPrice(mu);
    VariantQuery q = new VariantQuery(pi, column, terms.introductionCost(), null, 0.0, k, pool.keys(), deadlineNanos)
        .withAttractionBonus(beta.attractionBonus());
    PricingOutcome out = pricer.price(q);
    double[] listed = new double[pool.size() + out.found().size()];
    for (int i = 0; i < pool.size(); i++) {
      // a current variant carries its own fixed cost (CurrentRange)
      listed[i] = beta.psi(space.offsets(), pool.get(i), i, pi, mu, pool.get(i).fixedCost(), null, terms.minLot());
    }
    for (int i = 0; i < out.found().size(); i++) {
      listed[pool.size() + i] = out.found().get(i).reducedCost();
    }
    double constant = terms.rowValue(pi, mu) + beta.constant(terms, mu) + pool.current().constant();
    return new Probe(LagrangianPortfolioBound.of(constant, listed, out.restBound(), cap, pi.clone(), column.clone())
        .withPoolBonus(beta.bonus()).withAttractionBonus(beta.attractionBonus()), out.found(), out.exact());
  }

  RelaxationResult run(Pool pool, double[] lpPi, double[] lpMu) {
    SalesEnvelope envelope = pool.choice().envelope(); // the tangents found here serve the tree and the MIPs
    long t0 = clock.elapsedMs();
    int k = Math.max(settings.perRound(), cap == PortfolioTerms.UNLIMITED ? BOUND_DEPTH : Math.min(cap, BOUND_DEPTH));
    LagrangianPortfolioBound best = bound(pool, lpPi, lpMu, ChoicePrices.none(terms.segmentCount()), k).bound();
    double lpPriceBound = best.value();
    LagrangianPortfolioBound plain = best;
    try (PortfolioLp lp = new PortfolioLp(terms.capacity(), terms.demand(), cap)) {
      pool.choice().enter(lp);
      for (PoolVariant v : pool.all()) {
        add(lp, pool, v);
      }
      envelope.sync(lp);
      lp.reserveRows(); // the variants column generation adds keep GLOP's warm start
      PortfolioLpSolution sol = null;
      boolean converged = false;
      int round = 0;
      while (true) {
        round++;
        sol = lp.solve();
        if (!sol.isOptimal()) {
          // y = 0, x = 0 is feasible and every variable is bounded: anything else is a solver fault
          throw new IllegalStateException("the relaxed portfolio master ended " + sol.status()
              + "; it is feasible and bounded by construction, so this is a solver fault");
        }
        Probe probe = bound(pool, sol.resourceDual(), sol.segmentDual(), ChoicePrices.of(lp, pool.size()), k);
        if (probe.bound().value() < best.value()) {
          best = probe.bound();
        }
        int cuts = lp.segmentCutCount();
        int tangents = lp.envelopeCount();
        if (cuts + tangents == 0 && probe.bound().value() < plain.value()) {
          plain = probe.bound();
        }
        double z = sol.objective() + pool.current().constant();
        double entry = sol.limitDual() + 1e-9 * (1 + Math.abs(z));
        List<PricedVariant> entering = new ArrayList<>();
        double bestOutside = Double.NEGATIVE_INFINITY;
        for (PricedVariant f : probe.found()) {
          bestOutside = Math.max(bestOutside, f.reducedCost());
          if (f.reducedCost() > entry && entering.size() < settings.perRound()) {
            entering.add(f);
          }
        }
        boolean exact = probe.exact();
        // No variant outside the pool has ψ above the variant limit's price λ: with zero duals on
        // their rows, the master's duals are feasible for the relaxation over the whole space.
        converged = exact && bestOutside <= sol.limitDual();
        double shown = converged ? Math.min(z, best.value()) : best.value();
        boolean closed = new ValueBound(z, shown, terms.gapFloor()).within(settings.gap());
        listener.event(new PortfolioEvent(PortfolioEvent.Kind.RELAXATION, clock.elapsedMs(), z, shown, pool.size(),
            entering.size(), "round " + round + (cuts == 0 ? "" : ", " + cuts + " segment cuts")
                + (tangents == 0 ? "" : ", " + tangents + " sales envelope tangents")));
        if (stop.fired(clock.now(round))) {
          break;
        }
        if (entering.isEmpty() && exact || closed) {
          // priced to the end (or to the gap): cut off this point if a choosing segment's sales envelope
          // or a segment's demand row allows it, then price again
          if (envelope.separate(lp, sol) == 0 && SegmentCuts.separate(lp, sol, pool, terms) == 0) {
            break;
          }
          continue;
        }
        for (PricedVariant f : entering) {
          if (pool.add(f.choices())) {
            add(lp, pool, pool.get(pool.size() - 1));
          }
        }
      }
      double[] y = sol.y().clone();
      return new RelaxationResult(sol.objective() + pool.current().constant(), best, converged, round, y, lpPriceBound,
          clock.elapsedMs() - t0, lp.segmentCutCount(), plain);
    }
  }

  private void add(PortfolioLp lp, Pool pool, PoolVariant v) {
    // pinned variants stay free here: dropping the pin only widens (R), so its bound stays valid,
    // and pinned lots that do not fit cannot make the relaxation infeasible
    int i = lp.addVariant(v.segments(), v.margin(), v.use(), v.upper(), v.fixedCost(), terms.minLot());
    pool.choice().attract(lp, i, v);
  }
}
