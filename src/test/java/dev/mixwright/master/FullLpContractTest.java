package dev.mixwright.master;

import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedLp;
import org.junit.jupiter.api.Test;

/**
 * {@link FullLp}, the benchmark's baseline, with GLOP's dual simplex (its setting in the benchmark)
 * and, in a second run, with GLOP's default.
 */
class FullLpContractTest extends EnumeratedLpContract {
  @Override
  protected Answer solveAll(Fixture f) {
    return solve(f, true);
  }

  static Answer solve(Fixture f, boolean dualSimplex) {
    try (FullLp lp = new FullLp(f.capacity(), f.demand(), dualSimplex)) {
      for (EnumeratedLp.Column c : f.columns()) {
        lp.addColumn(c.segment(), c.margin(), c.use(), c.upper());
      }
      FullLp.Result r = lp.solve();
      double[] x = r.status().isOptimal() ? lp.columnValues() : null;
      return new Answer(r.status().name(), r.status().isOptimal(), r.objective(), x, r.resourceDual(),
          r.segmentDual());
    }
  }

  @Test
  void primalSimplexSolvesItToo() {
    Cases.each(cases() / 2, (seed, rnd) -> {
      Fixture f = fixture(seed);
      check(f, solve(f, false));
    });
  }
}
