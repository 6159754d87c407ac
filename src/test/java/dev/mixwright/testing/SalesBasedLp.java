package dev.mixwright.testing;

import dev.mixwright.choice.Logit;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Reference for the LP stage under choice: the sales-based linear program (SBLP) of Gallego, Ratliff
 * &amp; Shebalov 2015, "A general attraction model and sales-based linear program for network revenue
 * management under customer choice", Operations Research 63(1):212–232, written out over every
 * buildable accepted column (v, s) of a small catalog that may mix choosing and fixed segments:
 *
 * <pre>
 *   max  Σ_j margin_j x_j
 *   s.t. Σ_j use_rj x_j ≤ capacity_r                       (π_r ≥ 0)
 *        fixed s:    Σ_{j in s} x_j ≤ demand_s               (μ_s ≥ 0)
 *                    x_j ≤ maxShare_s · demand_s              (ω_j ≥ 0)
 *        choosing s: Σ_{j in s} x_j + x_s0 = buyers_s        (μ_s free)
 *                    x_j − w_s(v_j) · x_s0 ≤ 0                (β_j ≥ 0)
 *        x ≥ 0, x_s0 ≥ 0
 * </pre>
 *
 * with w_s(v) = exp(u_s(v) − stayOut_s). Solved, with its dual, by Apache Commons Math's
 * SimplexSolver through {@link DenseLp}; shares no code with the solvers under test.
 *
 * <p>{@code offerExactly}: every listed column of a choosing segment is offered, its row written
 * x_j − w x_s0 = 0, so the sales are the multinomial-logit sales of that offer list (what a plan
 * that offers these variants sells) rather than the best the LP may pick from it.
 */
public final class SalesBasedLp {
  private SalesBasedLp() {}

  /**
   * The solved SBLP. {@code x} aligned with {@code columns}; {@code stayingOut[s]} is x_s0 (NaN for a
   * fixed segment); {@code resourceDual} π, {@code segmentDual} μ (the buyers row of a choosing
   * segment, the demand row of a fixed one), {@code columnDual} β_j (choosing) or ω_j (fixed). Duals
   * of a degenerate LP are one optimal choice among several.
   */
  public record Solution(
      List<EnumeratedLp.Column> columns,
      double[] attraction,
      double objective,
      double[] x,
      double[] stayingOut,
      double[] resourceDual,
      double[] segmentDual,
      double[] columnDual) {}

  /** The SBLP over every buildable accepted column. */
  public static Solution solve(VariantSpace space) {
    return solve(space, EnumeratedLp.columns(space), false);
  }

  /** The SBLP over the given columns (the offer list of each segment). */
  public static Solution solve(VariantSpace space, List<EnumeratedLp.Column> columns, boolean offerExactly) {
    int n = columns.size();
    int segments = space.segmentCount();
    int resources = space.resourceCount();
    int[] stayVar = new int[segments];
    int vars = n;
    for (int s = 0; s < segments; s++) {
      stayVar[s] = space.chooses(s) ? vars++ : -1;
    }
    double[] w = new double[n];
    double[] c = new double[vars];
    for (int j = 0; j < n; j++) {
      EnumeratedLp.Column col = columns.get(j);
      c[j] = col.margin();
      int s = col.segment();
      w[j] = space.chooses(s) ? Logit.attraction(space.utility(col.choices(), s), space.stayOut(s)) : Double.NaN;
    }
    DenseLp lp = new DenseLp(c);
    for (int r = 0; r < resources; r++) {
      double[] a = new double[vars];
      for (int j = 0; j < n; j++) {
        a[j] = columns.get(j).use()[r];
      }
      lp.lessOrEqual(a, space.catalog().resources().get(r).capacity());
    }
    int[] segmentRow = new int[segments];
    for (int s = 0; s < segments; s++) {
      double[] a = new double[vars];
      for (int j = 0; j < n; j++) {
        a[j] = columns.get(j).segment() == s ? 1 : 0;
      }
      if (space.chooses(s)) {
        a[stayVar[s]] = 1;
        segmentRow[s] = lp.equal(a, space.buyers(s));
      } else {
        segmentRow[s] = lp.lessOrEqual(a, space.catalog().segments().get(s).demand());
      }
    }
    int[] columnRow = new int[n];
    for (int j = 0; j < n; j++) {
      int s = columns.get(j).segment();
      double[] a = new double[vars];
      a[j] = 1;
      if (space.chooses(s)) {
        a[stayVar[s]] = -w[j];
        columnRow[j] = offerExactly ? lp.equal(a, 0) : lp.lessOrEqual(a, 0);
      } else {
        columnRow[j] = lp.lessOrEqual(a, columns.get(j).upper());
      }
    }
    DenseLp.Solution sol = lp.solve();
    double[] stay = new double[segments];
    double[] mu = new double[segments];
    for (int s = 0; s < segments; s++) {
      stay[s] = stayVar[s] >= 0 ? sol.x()[stayVar[s]] : Double.NaN;
      mu[s] = sol.y()[segmentRow[s]];
    }
    double[] beta = new double[n];
    for (int j = 0; j < n; j++) {
      beta[j] = sol.y()[columnRow[j]];
    }
    return new Solution(
        List.copyOf(columns),
        w,
        sol.objective(),
        Arrays.copyOf(sol.x(), n),
        stay,
        Arrays.copyOf(sol.y(), resources),
        mu,
        beta);
  }

  /** The columns of segment s among {@code columns}. */
  public static List<EnumeratedLp.Column> ofSegment(List<EnumeratedLp.Column> columns, int s) {
    List<EnumeratedLp.Column> out = new ArrayList<>();
    for (EnumeratedLp.Column c : columns) {
      if (c.segment() == s) {
        out.add(c);
      }
    }
    return out;
  }
}
