package dev.mixwright.master;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPSolver;

/**
 * What every solver wrapper here shares: the solver itself, the "use ≤ capacity" and "sold ≤
 * demand" rows of the product-mix LP, and the check run on a returned point before anything reads
 * its duals.
 */
final class Rows {
  /** Slack allowed on a row, relative to the size of its right-hand side (at least 1). */
  static final double FEASIBILITY_TOLERANCE = 1e-6;

  private Rows() {}

  /** A fresh OR-Tools solver ({@code GLOP}, {@code SCIP}, {@code CP_SAT}, ...), natives loaded. */
  static MPSolver solver(String id) {
    Natives.load();
    MPSolver solver = MPSolver.createSolver(id);
    if (solver == null) {
      throw new IllegalStateException("OR-Tools has no " + id + " solver in this build");
    }
    return solver;
  }

  /** One row {@code Σ ≤ rhs[i]} per entry, named {@code prefix + i}, with no coefficients yet. */
  static MPConstraint[] atMost(MPSolver solver, double[] rhs, String prefix) {
    MPConstraint[] out = new MPConstraint[rhs.length];
    for (int i = 0; i < rhs.length; i++) {
      out[i] = solver.makeConstraint(Double.NEGATIVE_INFINITY, rhs[i], prefix + i);
    }
    return out;
  }

  /** True when every row's use stays within its right-hand side, up to the scaled tolerance. */
  static boolean within(double[] use, double[] rhs) {
    for (int i = 0; i < use.length; i++) {
      if (use[i] > rhs[i] + FEASIBILITY_TOLERANCE * Math.max(1.0, Math.abs(rhs[i]))) {
        return false;
      }
    }
    return true;
  }
}
