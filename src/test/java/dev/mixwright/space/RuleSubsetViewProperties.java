package dev.mixwright.space;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Rule;
import dev.mixwright.testing.Cases;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * {@link VariantSpace#withRulesOnly} gives what compiling the catalog with only the kept rules gives:
 * the same allowed choices per segment, the same nogoods (groups, members, renumbered rule) and the
 * same nogoods per group, on seeded random catalogs with single-group rules mixed in (those fold
 * into the allowed choices instead of becoming nogoods).
 */
class RuleSubsetViewProperties {

  @Test
  void aViewEqualsACompileOfTheSubCatalog() {
    Cases.each(150, (seed, rnd) -> {
      Catalog drawn = SpaceCounterProperties.draw(rnd, new int[] {2, 6}, new int[] {1, 4}, new int[] {0, 20}, 2, 2);
      List<Rule> rules = new ArrayList<>(drawn.rules());
      for (int i = 0; i < 3; i++) {
        Group g = drawn.groups().get(rnd.nextInt(drawn.groups().size()));
        String option = g.options().get(rnd.nextInt(g.options().size())).id();
        int at = rnd.nextInt(rules.size() + 1);
        rules.add(at, i == 1
            ? Fixtures.when(Map.of(), Map.of(g.id(), List.of(option)))
            : Fixtures.forbid(Map.of(g.id(), List.of(option))));
      }
      Catalog c = new Catalog(drawn.format(), drawn.name(), drawn.currency(), drawn.period(), drawn.resources(),
          drawn.groups(), rules, drawn.segments(), drawn.portfolio());
      boolean[] keep = new boolean[rules.size()];
      List<Rule> kept = new ArrayList<>();
      for (int r = 0; r < keep.length; r++) {
        keep[r] = rnd.nextBoolean();
        if (keep[r]) {
          kept.add(rules.get(r));
        }
      }
      VariantSpace view = new VariantSpace(c).withRulesOnly(keep);
      VariantSpace compiled = new VariantSpace(new Catalog(c.format(), c.name(), c.currency(), c.period(),
          c.resources(), c.groups(), kept, c.segments(), c.portfolio()));
      assertEquals(compiled.catalog(), view.catalog());
      for (int f = 0; f < compiled.totalChoices(); f++) {
        assertEquals(compiled.allowed(f), view.allowed(f), "choice " + f);
        for (int s = 0; s < compiled.segmentCount(); s++) {
          assertEquals(compiled.allowedIn(s, f), view.allowedIn(s, f), "segment " + s + ", choice " + f);
        }
      }
      assertEquals(compiled.nogoodCount(), view.nogoodCount());
      for (int i = 0; i < compiled.nogoodCount(); i++) {
        assertArrayEquals(compiled.nogood(i).groups(), view.nogood(i).groups());
        assertArrayEquals(compiled.nogood(i).member(), view.nogood(i).member());
        assertEquals(compiled.nogood(i).rule(), view.nogood(i).rule());
      }
      for (int g = 0; g < compiled.groupCount(); g++) {
        assertArrayEquals(compiled.nogoodsOf(g), view.nogoodsOf(g));
      }
    });
  }
}
