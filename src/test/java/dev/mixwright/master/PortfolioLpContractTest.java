package dev.mixwright.master;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.testing.Cases;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * {@link PortfolioLp} framed as the full LP: one block per enumerated variant with its sales columns,
 * no introduction cost, no minimum lot and no variant limit. Then Σ_s x_vs ≤ u_s y_v with y_v ≤ 1
 * only restates x_vs ≤ u_s, so the relaxed portfolio LP is the enumerated LP, and its π, μ are
 * optimal duals of it (the link duals take the place of w, σ_v = Σ_s u_s ρ_vs).
 */
class PortfolioLpContractTest extends EnumeratedLpContract {
  @Override
  protected Answer solveAll(Fixture f) {
    return solve(f, false);
  }

  /** @param offerAll fix every y to 1 (the LP of the portfolio that offers every variant) */
  private static Answer solve(Fixture f, boolean offerAll) {
    List<Block> blocks = blocks(f.columns());
    try (PortfolioLp lp = new PortfolioLp(f.capacity(), f.demand(), Integer.MAX_VALUE)) {
      for (Block b : blocks) {
        int i = lp.addVariant(b.segments(), b.margin(), b.use(), b.upper(), 0.0, 0.0);
        if (offerAll) {
          lp.fixIntroduction(i, 1.0, 1.0);
        }
      }
      PortfolioLpSolution sol = lp.solve();
      if (!sol.isOptimal()) {
        return new Answer(sol.status().name(), false, sol.objective(), null, null, null);
      }
      assertEquals(blocks.size(), sol.y().length, "one y per block");
      for (int i = 0; i < blocks.size(); i++) {
        double y = sol.y()[i];
        assertTrue(y >= -REL && y <= 1 + REL, "y " + y + " of block " + i);
        if (offerAll) {
          assertEquals(1.0, y, REL, "fixed introduction of block " + i);
        }
        // the link row: no sales beyond u_s·y_v
        for (int k = 0; k < sol.x()[i].length; k++) {
          double u = blocks.get(i).upper()[k];
          assertTrue(sol.x()[i][k] <= u * y + REL * Math.max(1, u), "link of block " + i + ", segment " + k);
        }
      }
      assertEquals(0.0, sol.limitDual(), "no limit, no limit dual");
      return new Answer(sol.status().name(), true, sol.objective(), onColumns(blocks, sol.x(), f.columns().size()),
          sol.resourceDual(), sol.segmentDual());
    }
  }

  /** With every variant offered, the fixed portfolio's LP is the enumerated LP too. */
  @Test
  void offeringEveryVariantGivesTheSameLp() {
    Cases.each(cases() / 2, (seed, rnd) -> {
      Fixture f = fixture(seed);
      check(f, solve(f, true));
    });
  }

  /**
   * A deadline already past ends a solve at once as STOPPED, without an answer; a deadline far ahead
   * changes nothing.
   */
  @Test
  void aSolveEndsByItsDeadline() {
    Cases.each(10, (seed, rnd) -> {
      Fixture f = fixture(seed);
      List<Block> blocks = blocks(f.columns());
      try (PortfolioLp lp = new PortfolioLp(f.capacity(), f.demand(), Integer.MAX_VALUE)) {
        for (Block b : blocks) {
          lp.addVariant(b.segments(), b.margin(), b.use(), b.upper(), 0.0, 0.0);
        }
        lp.stopAt(System.nanoTime() - 1);
        assertEquals(LpStatus.STOPPED, lp.solve().status());
        lp.stopAt(System.nanoTime() + 600_000_000_000L);
        PortfolioLpSolution sol = lp.solve();
        assertEquals(LpStatus.OPTIMAL, sol.status());
        check(f, solve(f, false));
        assertEquals(solve(f, false).objective(), sol.objective(), REL * Math.max(1, Math.abs(sol.objective())));
      }
    });
  }
}
