package dev.mixwright.master;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPVariable;
import java.util.List;

/**
 * The restricted master LP and the portfolio MIP written out as free MPS text, so that a run's
 * models can be handed to another solver or checked by hand. Both are built with the same rows as
 * the solvers of this package ({@link Rows}: resource rows {@code r<i>}, segment rows {@code s<i>},
 * the variant limit {@code limit}, per variant the minimum-lot row {@code lot<i>} and the link rows
 * {@code link<i>_<s>}) and exported by OR-Tools' {@code MPSolver.exportModelAsMpsFormat}. A comment
 * block at the top says which resource and segment each row number stands for. MPS has no sense of
 * optimisation: OR-Tools writes a maximisation with the {@code OBJSENSE MAX} section.
 */
public final class ModelFiles {
  private ModelFiles() {}

  /** A sales column: its name in the file, segment row (−1 for none), margin, use and upper bound. */
  public record SalesColumn(String name, int segment, double margin, double[] use, double upper) {}

  /**
   * A pool variant of the portfolio: its name, the segments it can be sold in with the margin and
   * upper bound of each, its use per unit, and the tool ids it needs (indices into the tool costs).
   */
  public record PoolEntry(String name, int[] segments, double[] margin, double[] upper, double[] use,
      int[] tools) {}

  /** The restricted master max Σ m_j x_j over the given columns, as free MPS; {@code title}'s lines lead as comments. */
  public static String masterMps(String title, List<String> resourceIds, double[] capacity,
      List<String> segmentIds, double[] demand, List<SalesColumn> columns) {
    try (Rows rows = new Rows("GLOP", capacity, demand)) {
      for (SalesColumn c : columns) {
        rows.addSales(c.name(), c.upper(), c.segment(), c.margin(), c.use());
      }
      return header(title, resourceIds, segmentIds) + rows.solver.exportModelAsMpsFormat(false, false);
    }
  }

  /**
   * The portfolio MIP over a pool, formulated as {@link PortfolioMip} does: binary y per variant,
   * − F y in the objective, the variant limit K ({@code Integer.MAX_VALUE} for none), the minimum lot
   * L, the link rows x_s ≤ u_s y, and a binary per costly tool with y ≤ t.
   */
  public static String portfolioMps(String title, List<String> resourceIds, double[] capacity,
      List<String> segmentIds, double[] demand, int variantLimit, double introductionCost, double minLot,
      double[] toolCost, List<String> toolNames, List<PoolEntry> pool) {
    try (Rows rows = new Rows("SCIP", capacity, demand, variantLimit)) {
      MPVariable[] tools = new MPVariable[toolCost.length];
      for (int i = 0; i < pool.size(); i++) {
        PoolEntry v = pool.get(i);
        MPVariable y = rows.solver.makeBoolVar("y_" + v.name());
        rows.addBlock(i, y, v.segments(), v.margin(), v.use(), v.upper(), introductionCost, minLot);
        for (int t : v.tools()) {
          if (toolCost[t] <= 0) {
            continue;
          }
          if (tools[t] == null) {
            tools[t] = rows.solver.makeBoolVar("t_" + toolNames.get(t));
            rows.objective.setCoefficient(tools[t], -toolCost[t]);
          }
          MPConstraint needs = rows.solver.makeConstraint(Double.NEGATIVE_INFINITY, 0.0, "tool" + i + "_" + t);
          needs.setCoefficient(y, 1.0);
          needs.setCoefficient(tools[t], -1.0);
        }
      }
      return header(title, resourceIds, segmentIds) + rows.solver.exportModelAsMpsFormat(false, false);
    }
  }

  private static String header(String title, List<String> resourceIds, List<String> segmentIds) {
    StringBuilder b = new StringBuilder();
    for (String line : title.split("\\R")) {
      b.append("* ").append(line).append('\n');
    }
    for (int r = 0; r < resourceIds.size(); r++) {
      b.append("* row r").append(r).append(": capacity of resource ").append(oneLine(resourceIds.get(r))).append('\n');
    }
    for (int s = 0; s < segmentIds.size(); s++) {
      b.append("* row s").append(s).append(": demand of segment ").append(oneLine(segmentIds.get(s))).append('\n');
    }
    return b.toString();
  }

  private static String oneLine(String s) {
    return s.replaceAll("[\\r\\n]+", " ");
  }
}
