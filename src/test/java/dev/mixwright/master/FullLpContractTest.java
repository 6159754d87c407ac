package dev.mixwright.master;

import dev.mixwright.testing.Cases;
import dev.mixwright.testing.EnumeratedLp;
import org.junit.jupiter.api.Test;

/**
 * {@link FullLp}, the benchmark's baseline, with GLOP's dual simplex (its setting in the benchmark)
 * and, in further runs, with GLOP's default and with HiGHS.
 */
class FullLpContractTest extends EnumeratedLpContract {
  @Override
  protected Answer solveAll(Fixture f) {
    return solve(f, FullLp.Solver.GLOP_DUAL);
  }

  static Answer solve(Fixture f, FullLp.Solver solver) {
    try (FullLp lp = new FullLp(f.capacity(), f.demand(), solver)) {
      for (EnumeratedLp.Column c : f.columns()) {
        lp.addColumn(c.segment(), c.margin(), c.use(), c.upper());
      }
      FullLp.Result r = lp.solve();
      double[] x = r.status().isOptimal() ? lp.columnValues() : null;
      // HiGHS's duals are not read (FullLp.Solver.HIGHS says why): its point and objective are checked
      boolean duals = solver.readsDuals();
      return new Answer(r.status().name(), r.status().isOptimal(), r.objective(), x,
          duals ? r.resourceDual() : null, duals ? r.segmentDual() : null);
    }
  }

  @Test
  void primalSimplexSolvesItToo() {
    Cases.each(cases() / 2, (seed, rnd) -> {
      Fixture f = fixture(seed);
      check(f, solve(f, FullLp.Solver.GLOP));
    });
  }

  @Test
  void highsSolvesItToo() {
    Cases.each(cases() / 2, (seed, rnd) -> {
      Fixture f = fixture(seed);
      check(f, solve(f, FullLp.Solver.HIGHS));
    });
  }
}
