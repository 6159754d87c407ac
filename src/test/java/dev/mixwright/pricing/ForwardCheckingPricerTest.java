package dev.mixwright.pricing;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.pricing.PricingCases.Case;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.Cases;
import dev.mixwright.testing.RandomCatalogs;
import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** The forward-checking search alone, on any space. */
class ForwardCheckingPricerTest extends ExactPricerContract {
  @Override
  protected Pricer create(VariantSpace space) {
    return new ForwardCheckingPricer(space, Long.MAX_VALUE);
  }

  @Test
  void nodeLimitKeepsAValidBound() {
    NodeLimits.keepValidBounds(ForwardCheckingPricer::new);
  }

  @Test
  void constrainedGroupsComeFirstInTheOrder() {
    VariantSpace space = new VariantSpace(PricingCases.large(3, 12, 4, 10));
    int[] order = new ForwardCheckingPricer(space, Long.MAX_VALUE).groupOrder();
    boolean free = false;
    for (int g : order) {
      if (space.nogoodsOf(g).length == 0) {
        free = true;
      } else {
        assertFalse(free, "a group with rules after one without");
      }
    }
  }

  /**
   * The order is chosen per query, so one instance must stay exact as the weights, and with them the
   * order, change between queries, as they do between the rounds of column generation: on catalogs
   * with the multi family's rules (nogoods of three and four groups), at duals of whole numbers so
   * that weights tie, six queries per instance are judged against the enumeration (brute force), and
   * the order each used puts the groups with rules first, by non-increasing regret.
   */
  @Test
  void oneInstanceStaysExactAsTheOrderChangesWithTheWeights() {
    Cases.each(80, (seed, rnd) -> {
      VariantSpace space = new VariantSpace(PricingCases.withMultiRules(
          RandomCatalogs.random(rnd, 4 + rnd.nextInt(4), 4, 3, 2, rnd.nextInt(6), false), rnd, 2 + rnd.nextInt(5)));
      ForwardCheckingPricer pricer = new ForwardCheckingPricer(space, Long.MAX_VALUE);
      for (int query = 0; query < 6; query++) {
        int s = rnd.nextInt(space.segmentCount());
        double[] pi = new double[space.resourceCount()];
        for (int r = 0; r < pi.length; r++) {
          pi[r] = rnd.nextDouble() < 0.3 ? 0 : rnd.nextInt(20);
        }
        double mu = rnd.nextInt(100);
        Case c = new Case(space, s, pi, mu, PricingCases.enumerate(space, s, pi, mu));
        Set<VariantKey> excluded = new HashSet<>();
        for (PricingCases.Scored col : c.columns()) {
          if (rnd.nextDouble() < 0.2) {
            excluded.add(space.key(col.v()));
          }
        }
        PricingQuery q = c.query(1 + rnd.nextInt(6), rnd.nextBoolean() ? 0.0 : Double.NEGATIVE_INFINITY, excluded);
        ExactPricerContract.checkExact(c, q, pricer.price(q));
        checkRegretOrder(space, q.weight(), pricer.groupOrder());
      }
    });
  }

  private static void checkRegretOrder(VariantSpace space, double[] w, int[] order) {
    double last = Double.POSITIVE_INFINITY;
    boolean free = false;
    for (int g : order) {
      if (space.nogoodsOf(g).length == 0) {
        free = true;
        continue;
      }
      assertFalse(free, "a group with rules after one without");
      double best = Double.NEGATIVE_INFINITY;
      double second = Double.NEGATIVE_INFINITY;
      for (int f = space.offset(g); f < space.offset(g + 1); f++) {
        if (space.allowed(f) && w[f] > Double.NEGATIVE_INFINITY) {
          second = Math.max(second, Math.min(best, w[f]));
          best = Math.max(best, w[f]);
        }
      }
      double regret = second == Double.NEGATIVE_INFINITY ? Double.POSITIVE_INFINITY : best - second;
      assertTrue(regret <= last, "regret rises along the order at group " + g);
      last = regret;
    }
  }
}
