package dev.mixwright.master;

import dev.mixwright.testing.EnumeratedLp;

/** {@link RestrictedMaster} with every enumerated column added: the full master on GLOP. */
class RestrictedMasterContractTest extends EnumeratedLpContract {
  @Override
  protected Answer solveAll(Fixture f) {
    try (RestrictedMaster master = new RestrictedMaster(f.capacity(), f.demand())) {
      for (EnumeratedLp.Column c : f.columns()) {
        master.addColumn(c.segment(), c.margin(), c.use(), c.upper());
      }
      MasterSolution sol = master.solve();
      return new Answer(sol.status().name(), sol.isOptimal(), sol.objective(), sol.x(), sol.resourceDual(),
          sol.segmentDual());
    }
  }
}
