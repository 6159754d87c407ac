package dev.mixwright.space;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** Conflicts found on random catalogs are irreducible, checked by brute force. */
class SpaceDiagnosisProperties {

  @Property(tries = 60)
  void conflictsAreIrreducible(
      @ForAll long seed,
      @ForAll @IntRange(min = 2, max = 5) int groups,
      @ForAll @IntRange(min = 1, max = 3) int maxOptions,
      @ForAll @IntRange(min = 4, max = 25) int rules,
      @ForAll @IntRange(min = 1, max = 4) int wide,
      @ForAll @IntRange(min = 1, max = 64) int limit,
      @ForAll @IntRange(min = 0, max = 30) int quickNodes) {
    Catalog c =
        SpaceCounterProperties.withWideRules(
            SpaceCounterProperties.sized(seed, groups, maxOptions, rules, 2), seed, wide);
    // A short search budget sends questions to the counter, and a small table limit makes its
    // counts bounds only, so the full search gets used too.
    SpaceDiagnosis d = new SpaceDiagnosis(new VariantSpace(c), limit, quickNodes, Long.MAX_VALUE);
    List<Integer> all = new ArrayList<>();
    for (int r = 0; r < c.rules().size(); r++) {
      all.add(r);
    }
    Optional<RuleConflict> space = d.spaceConflict();
    assertEquals(!BruteForce.feasible(c, all, -1), space.isPresent());
    space.ifPresent(x -> assertTrue(x.irreducible()));
    space.ifPresent(x -> SpaceDiagnosisTest.assertIrreducible(c, x.rules(), -1));
    for (int s = 0; s < c.segments().size(); s++) {
      Optional<RuleConflict> seg = d.segmentConflict(s);
      assertEquals(!BruteForce.feasible(c, all, s), seg.isPresent());
      int ss = s;
      seg.ifPresent(x -> SpaceDiagnosisTest.assertIrreducible(c, x.rules(), ss));
    }
  }
}
