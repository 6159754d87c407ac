package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.run.PricerChoice;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.ReducedCosts;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedMip;
import dev.mixwright.testing.RandomCatalogs;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * An exclude entry is never returned by any pricer: on random small catalogs with random exclusions
 * and random duals, every pricer of {@link Pricers} and the integer stage's {@link VariantPricer} list
 * all the variants they can (k above the space's size), and each list is checked variant by variant
 * against the exclusions read from the catalog's option ids (brute force, {@link EnumeratedMip#excluded}).
 * The exact pricers must also list exactly as many as brute-force enumeration of the allowed columns.
 */
class ExcludeNeverPricedTest {

  @Test
  void noPricerReturnsAnExcludedVariant() {
    for (int i = 0; i < 25; i++) {
      long seed = 7700 + i;
      Random rnd = new Random(seed);
      Catalog base = RandomCatalogs.random(rnd, 2 + rnd.nextInt(3), 4, 1 + rnd.nextInt(2), 1 + rnd.nextInt(2),
          rnd.nextInt(5), true);
      List<Map<String, String>> exclude = new ArrayList<>();
      for (int e = 0; e < 1 + rnd.nextInt(3); e++) {
        Map<String, String> entry = new LinkedHashMap<>();
        for (int g = 0; g < base.groups().size(); g++) {
          if (entry.isEmpty() || rnd.nextDouble() < 0.4) {
            var group = base.groups().get(g);
            entry.put(group.id(), group.choiceId(rnd.nextInt(group.choiceCount())));
          }
        }
        exclude.add(entry);
      }
      VariantSpace space = new VariantSpace(base.withCurrentRange(List.of(), exclude));
      double[] pi = new double[space.resourceCount()];
      for (int r = 0; r < pi.length; r++) {
        pi[r] = rnd.nextDouble() * 5;
      }
      for (int s = 0; s < space.segmentCount(); s++) {
        int allowed = brute(space, s);
        for (PricerChoice choice : PricerChoice.values()) {
          String name = choice.word();
          Pricer p = choice.create(space);
          List<PricedVariant> found = p.price(ReducedCosts.query(space, s, pi, 0, 100_000,
              Double.NEGATIVE_INFINITY, null)).found();
          for (PricedVariant f : found) {
            assertFalse(EnumeratedMip.excluded(space, f.choices()), "seed " + seed + ", pricer " + name
                + " returned excluded " + space.label(f.choices()));
          }
          if (!name.equals("heuristic")) {
            assertEquals(allowed, found.size(), "seed " + seed + ", pricer " + name + ", segment " + s);
          }
        }
      }
      PortfolioTerms terms = PortfolioTerms.of(space);
      double[] mu = new double[space.segmentCount()];
      var out = new VariantPricer(space, terms, Long.MAX_VALUE).price(new VariantQuery(pi, mu, terms.introductionCost(),
          null, Double.NEGATIVE_INFINITY, 100_000, null, 0));
      for (PricedVariant f : out.found()) {
        assertFalse(EnumeratedMip.excluded(space, f.choices()), "seed " + seed + ": variant pricer returned excluded "
            + space.label(f.choices()));
      }
    }
  }

  /** Columns of segment s that are buildable under the rules and not excluded, by an odometer. */
  private static int brute(VariantSpace space, int s) {
    Catalog plain = new Catalog(space.catalog().format(), space.catalog().name(), space.catalog().currency(),
        space.catalog().period(), space.catalog().resources(), space.catalog().groups(), space.catalog().rules(),
        space.catalog().segments(), space.catalog().portfolio());
    VariantSpace rulesOnly = new VariantSpace(plain);
    int n = 0;
    int[] v = new int[space.groupCount()];
    while (true) {
      if (rulesOnly.isColumn(v, s) && !EnumeratedMip.excluded(space, v)) {
        n++;
      }
      int g = space.groupCount() - 1;
      while (g >= 0 && ++v[g] == space.choiceCount(g)) {
        v[g] = 0;
        g--;
      }
      if (g < 0) {
        return n;
      }
    }
  }
}
