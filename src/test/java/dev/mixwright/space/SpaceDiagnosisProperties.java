package dev.mixwright.space;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import dev.mixwright.testing.Cases;
import org.junit.jupiter.api.Test;

/**
 * Conflicts found on random catalogs are irreducible, checked by brute force, on seeded cases
 * ({@link Cases}); a failure names its seed.
 */
class SpaceDiagnosisProperties {

  @Test
  void conflictsAreIrreducible() {
    Cases.each(200, (seed, rnd) -> {
      int wide = Cases.between(rnd, 1, 4);
      Catalog c = SpaceCounterProperties.draw(
          rnd, new int[] {2, 5}, new int[] {1, 3}, new int[] {4, 25}, 2, wide);
      int limit = Cases.between(rnd, 1, 64);
      int quickNodes = Cases.between(rnd, 0, 30);
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
    });
  }
}
