package dev.mixwright.master;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

/**
 * {@link PortfolioMip} on SCIP framed as the full LP: every enumerated variant in the pool, no
 * introduction cost, no minimum lot, no tooling, no variant limit. Offering everything then costs
 * nothing and loses nothing, so the MIP optimum is the enumerated LP's optimum, and so is SCIP's
 * bound. The MIP gives no duals. CP-SAT is left out: it scales continuous sales to integers, and
 * {@link PortfolioMip.Engine#provesContinuous()} says its answers are incumbents only.
 */
class PortfolioMipContractTest extends EnumeratedLpContract {
  @Override
  protected Answer solveAll(Fixture f) {
    List<Block> blocks = blocks(f.columns());
    try (PortfolioMip mip = new PortfolioMip(PortfolioMip.Engine.SCIP, f.capacity(), f.demand(),
        Integer.MAX_VALUE, new double[f.space().totalChoices()])) {
      for (Block b : blocks) {
        mip.addVariant(b.segments(), b.margin(), b.use(), b.upper(), 0.0, 0.0, new int[0]);
      }
      MipSolution sol = mip.solve(0, 1e-9);
      if (sol.status() != MipStatus.OPTIMAL) {
        return new Answer(sol.status().name(), false, sol.objective(), null, null, null);
      }
      double z = f.ref().objective();
      double zTol = REL * Math.max(1, Math.abs(z));
      // the bound of a MIP whose relaxation is the enumerated LP: at or above the incumbent, and
      // not above the LP optimum
      assertTrue(sol.bound() >= sol.objective() - zTol, "bound " + sol.bound() + " below " + sol.objective());
      assertTrue(sol.bound() <= z + zTol, "bound " + sol.bound() + " above the LP optimum " + z);
      for (int i = 0; i < blocks.size(); i++) {
        double y = sol.y()[i];
        assertTrue(y == 0.0 || y == 1.0, "y " + y + " of block " + i);
        for (int k = 0; k < sol.x()[i].length; k++) {
          double u = blocks.get(i).upper()[k];
          assertTrue(sol.x()[i][k] <= u * y + REL * Math.max(1, u), "link of block " + i + ", segment " + k);
        }
      }
      assertEquals(blocks.size(), sol.y().length, "one y per pool variant");
      return new Answer(sol.status().name(), true, sol.objective(), onColumns(blocks, sol.x(), f.columns().size()),
          null, null);
    }
  }
}
