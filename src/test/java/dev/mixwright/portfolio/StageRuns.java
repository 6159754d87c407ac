package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Choice;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.catalog.Segment;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomCatalogs;
import dev.mixwright.testing.RandomChoiceCatalogs;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;

/** Runs both stages on a catalog and checks a portfolio against the catalog figures. */
final class StageRuns {
  private StageRuns() {}

  /** Builds the tree under test over the pool of the LP stage's columns. */
  interface TreeMaker {
    BranchAndPrice make(PortfolioTerms terms, Pool pool, StageClock clock);
  }

  /** A run of {@link #treeFromNothing} and the enumerated optimum it was checked against, within {@code tol}. */
  record TreeRun(BranchAndPrice.Result result, double optimum, double tol) {}

  /**
   * The tree alone over the pool of the LP stage's columns, started from the empty portfolio (so it
   * must find the optimum itself), against the enumerated MIP: its bound never below the optimum,
   * its value never above it. Null when the LP stage leaves it nothing to do.
   */
  static TreeRun treeFromNothing(VariantSpace space, TreeMaker make) {
    PortfolioTerms terms = PortfolioTerms.of(space);
    SolveOutcome lp = lp(space);
    if (lp.status().isInfeasible() || terms.variantCap() == 0 || !Double.isFinite(lp.result().bound())) {
      return null;
    }
    Pool pool = new Pool(space, terms);
    for (dev.mixwright.colgen.Column col : lp.master().columns()) {
      pool.add(col.choices());
    }
    StageClock clock = new StageClock(20_000, StopCriterion.never());
    BranchAndPrice.Result r = make.make(terms, pool, clock).run(Plan.empty(), lp.result().bound());
    EnumeratedMip.Result ref = EnumeratedMip.solve(space, false, 60_000);
    assertTrue(ref.optimal(), "the reference MIP was not solved to optimality");
    double tol = 1e-6 * (1 + Math.abs(ref.value()));
    assertTrue(r.bound() >= ref.value() - tol, "tree bound " + r.bound() + " below the optimum " + ref.value());
    assertTrue(r.incumbent().value() <= ref.value() + tol, "value above the optimum");
    return new TreeRun(r, ref.value(), tol);
  }

  static SolveOutcome lp(VariantSpace space) {
    return new ColumnGeneration(space, new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT), null, SolveSettings.defaults(), StopCriterion.never(), System.nanoTime()).run();
  }

  static PortfolioOutcome stage(VariantSpace space, PortfolioSettings settings) {
    return new IntegerStage(space, settings).run(lp(space));
  }

  static PortfolioSettings settings() {
    return PortfolioSettings.defaults().withTimeLimit(30_000);
  }

  /**
   * Checks a stage's outcome against the fully enumerated MIP solved by SCIP ({@link EnumeratedMip}, every
   * buildable variant, written from the catalog figures): feasible, the bound never below the optimum, the
   * value never above it, equal when proven. Returns whether it was proven.
   */
  static boolean againstEnumerated(VariantSpace space, PortfolioOutcome o) {
    checkFeasible(space, o);
    EnumeratedMip.Result ref = EnumeratedMip.solve(space, false, 60_000);
    assertTrue(ref.optimal(), "the reference MIP was not solved to optimality");
    double tol = 1e-6 * (1 + Math.abs(ref.value()));
    assertTrue(o.result().bound() >= ref.value() - tol, "bound " + o.result().bound() + " below " + ref.value());
    assertTrue(o.result().value() <= ref.value() + tol, "value above the optimum");
    if (o.status().isProven()) {
      assertEquals(ref.value(), o.result().value(), tol, "proven but not the enumerated optimum");
      return true;
    }
    return false;
  }

  /**
   * A small random catalog for the tree's tests, with a portfolio section: half of the draws with
   * fixed demand, half with segments that choose (random introduction cost, limit and lot).
   */
  static Catalog fixedOrChoosing(long seed, Random rnd) {
    return rnd.nextBoolean()
        ? RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(3),
            1 + rnd.nextInt(3), rnd.nextInt(7), true)
        : withTerms(RandomChoiceCatalogs.tiny(seed, true), 100 + rnd.nextInt(1500),
            1 + rnd.nextInt(3), rnd.nextBoolean() ? 0 : 5 + rnd.nextInt(40));
  }

  /** A copy of c with new portfolio terms. */
  static Catalog withTerms(Catalog c, double introductionCost, int maxVariants, double minLot) {
    return new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), c.rules(),
        c.segments(), Optional.of(new PortfolioSpec(introductionCost, maxVariants, minLot)));
  }

  /**
   * A copy of c where most segments accept about half of the choices of one or two random groups, so that
   * acceptance varies within the subtrees the pricer bounds.
   */
  static Catalog withMasks(Catalog c, Random rnd) {
    List<Segment> segs = new ArrayList<>();
    for (Segment s : c.segments()) {
      Map<String, List<String>> accepts = new LinkedHashMap<>();
      for (int n = 0; n < 2 && rnd.nextDouble() < 0.8; n++) {
        Group g = c.groups().get(rnd.nextInt(c.groups().size()));
        List<String> ok = new ArrayList<>();
        for (int k = 0; k < g.choiceCount(); k++) {
          if (rnd.nextBoolean()) {
            ok.add(g.choiceId(k));
          }
        }
        if (!ok.isEmpty()) {
          accepts.put(g.id(), ok);
        }
      }
      segs.add(new Segment(s.id(), s.label(), s.demand(), s.maxShare(), accepts, s.value(), s.choice()));
    }
    return new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), c.rules(), segs,
        c.portfolio());
  }

  /**
   * A copy of c where each segment chooses by multinomial logit with probability {@code share}: its
   * demand becomes its buyers, with random part-worths, a stay-out utility and a price weight drawn so
   * that attractions range over about e^-6 to e^4 (invented data).
   */
  static Catalog withChoice(Catalog c, Random rnd, double share) {
    List<Segment> segs = new ArrayList<>();
    for (Segment s : c.segments()) {
      if (rnd.nextDouble() >= share) {
        segs.add(s);
        continue;
      }
      Map<String, Double> utility = new LinkedHashMap<>();
      for (Group g : c.groups()) {
        for (int k = 0; k < g.choiceCount(); k++) {
          if (rnd.nextDouble() < 0.6) {
            utility.put(g.id() + "." + g.choiceId(k), Math.round((-1.5 + 3.5 * rnd.nextDouble()) * 100) / 100.0);
          }
        }
      }
      double stayOut = Math.round((-4 + 4 * rnd.nextDouble()) * 100) / 100.0;
      double priceWeight = -Math.round(2 + 15 * rnd.nextDouble()) / 1000.0;
      segs.add(Segment.choosing(s.id(), s.label(), s.accepts(), s.value(),
          new Choice(s.demand(), stayOut, priceWeight, utility)));
    }
    return new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), c.groups(), c.rules(), segs,
        c.portfolio());
  }

  /** A copy of c where about a third of the options carry a random tooling cost. */
  static Catalog withTooling(Catalog c, Random rnd) {
    List<Group> gs = new ArrayList<>();
    for (Group g : c.groups()) {
      List<Option> os = new ArrayList<>();
      for (Option o : g.options()) {
        double t = rnd.nextDouble() < 0.35 ? 50 + rnd.nextInt(400) : 0;
        os.add(new Option(o.id(), o.label(), o.price(), o.cost(), o.uses(), t));
      }
      gs.add(new Group(g.id(), g.label(), g.required(), os));
    }
    return new Catalog(c.format(), c.name(), c.currency(), c.period(), c.resources(), gs, c.rules(), c.segments(),
        c.portfolio());
  }

  /**
   * Checks that the portfolio is feasible and worth what it says, from the catalog figures alone:
   * capacities, demands, share limits, minimum lots, the variant limit, and value = Σ margin · sales −
   * introduction costs − tooling of the options used (each once).
   */
  static void checkFeasible(VariantSpace space, PortfolioOutcome o) {
    Catalog c = space.catalog();
    PortfolioSpec p = c.portfolio().orElseThrow();
    double tol = 1e-6;
    double[] used = new double[c.resources().size()];
    double[] sold = new double[c.segments().size()];
    double value = 0;
    java.util.Set<Integer> tools = new java.util.HashSet<>();
    assertTrue(o.offer().variants().size() <= p.maxVariants(), "variant limit");
    for (OfferedVariant v : o.offer().variants()) {
      assertTrue(space.isBuildable(v.choices()), "buildable");
      double units = 0;
      double[] a = space.use(v.choices());
      for (int s = 0; s < sold.length; s++) {
        double q = v.sales()[s];
        if (q == 0) {
          continue;
        }
        assertTrue(space.isColumn(v.choices(), s), "sold where accepted");
        assertTrue(q >= -tol && q <= c.segments().get(s).columnBound() * (1 + tol) + tol, "share limit");
        units += q;
        sold[s] += q;
        value += q * space.margin(v.choices(), s);
        for (int r = 0; r < used.length; r++) {
          used[r] += a[r] * q;
        }
      }
      assertTrue(units >= p.minLot() * (1 - tol) - tol, "minimum lot: " + units + " < " + p.minLot());
      value -= p.introductionCost();
      for (int g = 0; g < v.choices().length; g++) {
        if (v.choices()[g] < c.groups().get(g).options().size()
            && c.groups().get(g).options().get(v.choices()[g]).tooling() > 0) {
          tools.add(space.offset(g) + v.choices()[g]);
        }
      }
    }
    for (int f : tools) {
      for (int g = 0; g < space.groupCount(); g++) {
        if (f >= space.offset(g) && f < space.offset(g) + space.choiceCount(g)) {
          value -= c.groups().get(g).options().get(f - space.offset(g)).tooling();
        }
      }
    }
    for (int r = 0; r < used.length; r++) {
      double cap = c.resources().get(r).capacity();
      assertTrue(used[r] <= cap * (1 + tol) + tol, "capacity of " + c.resources().get(r).id());
    }
    for (int s = 0; s < sold.length; s++) {
      double d = c.segments().get(s).demand();
      assertTrue(sold[s] <= d * (1 + tol) + tol, "demand of " + c.segments().get(s).id());
    }
    assertEquals(value, o.result().value(), 1e-6 * (1 + Math.abs(value)), "value from the catalog figures");
  }
}
