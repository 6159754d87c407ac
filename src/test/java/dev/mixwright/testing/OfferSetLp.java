package dev.mixwright.testing;

import dev.mixwright.choice.Logit;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;

/**
 * Reference for the LP stage under choice, built differently from {@link SalesBasedLp}: the
 * choice-based deterministic LP over offer sets (CDLP) of Liu &amp; van Ryzin 2008, "On the
 * choice-based linear programming model for network revenue management", Manufacturing &amp;
 * Service Operations Management 10(2):288–310, with every offer set of every choosing segment
 * listed. t_sS is the number of buyers of segment s to whom the set S is offered (S = ∅ included):
 *
 * <pre>
 *   max  Σ_s Σ_S t_sS · Σ_{v∈S} margin_s(v) P_s(v|S)  +  Σ_{fixed j} margin_j x_j
 *   s.t. Σ_s Σ_S t_sS · Σ_{v∈S} P_s(v|S) use_r(v) + Σ_{fixed j} use_rj x_j ≤ capacity_r
 *        choosing s: Σ_S t_sS = buyers_s   (written Σ_{S≠∅} t_sS ≤ buyers_s, t_s∅ the slack)
 *        fixed s:    Σ_{j in s} x_j ≤ demand_s,  x_j ≤ maxShare_s · demand_s
 * </pre>
 *
 * with P_s(v|S) = w_s(v) / (1 + Σ_S w_s) (multinomial logit). Gallego, Ratliff &amp; Shebalov 2015
 * (Operations Research 63(1)) prove its optimum equal to the SBLP's. There are 2^n offer sets for a
 * segment with n columns, so this is for tiny spaces only: at most {@link #MAX_COLUMNS_PER_SEGMENT}.
 */
public final class OfferSetLp {
  public static final int MAX_COLUMNS_PER_SEGMENT = 8;

  private OfferSetLp() {}

  /** The optimum, and the sales each column gets from the optimal mix of offer sets. */
  public record Solution(List<EnumeratedLp.Column> columns, double objective, double[] sales) {}

  public static Solution solve(VariantSpace space) {
    List<EnumeratedLp.Column> columns = EnumeratedLp.columns(space);
    int segments = space.segmentCount();
    int n = columns.size();
    List<int[]> members = new ArrayList<>(); // per choosing segment: its column indices
    List<double[]> weights = new ArrayList<>();
    int vars = 0;
    int[] firstSet = new int[segments];
    for (int s = 0; s < segments; s++) {
      int[] idx = new int[0];
      double[] w = new double[0];
      if (space.chooses(s)) {
        List<Integer> js = new ArrayList<>();
        for (int j = 0; j < n; j++) {
          if (columns.get(j).segment() == s) {
            js.add(j);
          }
        }
        if (js.size() > MAX_COLUMNS_PER_SEGMENT) {
          throw new IllegalArgumentException(
              "segment " + s + " has " + js.size() + " columns; offer sets are listed up to "
                  + MAX_COLUMNS_PER_SEGMENT);
        }
        idx = js.stream().mapToInt(Integer::intValue).toArray();
        w = new double[idx.length];
        for (int k = 0; k < idx.length; k++) {
          w[k] = Logit.attraction(space.utility(columns.get(idx[k]).choices(), s), space.stayOut(s));
        }
        firstSet[s] = vars;
        vars += 1 << idx.length;
      } else {
        firstSet[s] = -1;
      }
      members.add(idx);
      weights.add(w);
    }
    int[] fixedVar = new int[n];
    for (int j = 0; j < n; j++) {
      fixedVar[j] = space.chooses(columns.get(j).segment()) ? -1 : vars++;
    }
    int resources = space.resourceCount();
    double[] c = new double[vars];
    double[][] use = new double[resources][vars];
    double[][] shares = new double[vars][]; // per offer-set variable: P(v|S) over the segment's columns
    for (int s = 0; s < segments; s++) {
      if (firstSet[s] < 0) {
        continue;
      }
      int[] idx = members.get(s);
      double[] w = weights.get(s);
      for (int mask = 0; mask < 1 << idx.length; mask++) {
        int var = firstSet[s] + mask;
        double denominator = 1;
        for (int k = 0; k < idx.length; k++) {
          if ((mask >> k & 1) != 0) {
            denominator += w[k];
          }
        }
        double[] p = new double[idx.length];
        for (int k = 0; k < idx.length; k++) {
          if ((mask >> k & 1) != 0) {
            p[k] = w[k] / denominator;
            EnumeratedLp.Column col = columns.get(idx[k]);
            c[var] += col.margin() * p[k];
            for (int r = 0; r < resources; r++) {
              use[r][var] += col.use()[r] * p[k];
            }
          }
        }
        shares[var] = p;
      }
    }
    for (int j = 0; j < n; j++) {
      if (fixedVar[j] >= 0) {
        EnumeratedLp.Column col = columns.get(j);
        c[fixedVar[j]] = col.margin();
        for (int r = 0; r < resources; r++) {
          use[r][fixedVar[j]] = col.use()[r];
        }
      }
    }
    DenseLp lp = new DenseLp(c);
    for (int r = 0; r < resources; r++) {
      lp.lessOrEqual(use[r], space.catalog().resources().get(r).capacity());
    }
    for (int s = 0; s < segments; s++) {
      double[] a = new double[vars];
      if (firstSet[s] >= 0) {
        // Σ_S t_sS = buyers written as Σ_{S≠∅} t_sS ≤ buyers (t_s∅ is the slack: it earns and uses
        // nothing). Measured: with the equality row Commons Math 3.6.1 stopped at t_s∅ = buyers, a
        // feasible vertex of value 0, on seed 16 of ChoiceReferencesTest.
        for (int mask = 1; mask < 1 << members.get(s).length; mask++) {
          a[firstSet[s] + mask] = 1;
        }
        lp.lessOrEqual(a, space.buyers(s));
      } else {
        for (int j = 0; j < n; j++) {
          if (fixedVar[j] >= 0 && columns.get(j).segment() == s) {
            a[fixedVar[j]] = 1;
          }
        }
        lp.lessOrEqual(a, space.catalog().segments().get(s).demand());
      }
    }
    for (int j = 0; j < n; j++) {
      if (fixedVar[j] >= 0) {
        double[] a = new double[vars];
        a[fixedVar[j]] = 1;
        lp.lessOrEqual(a, columns.get(j).upper());
      }
    }
    DenseLp.Solution sol = lp.solve();
    double[] sales = new double[n];
    for (int s = 0; s < segments; s++) {
      int[] idx = members.get(s);
      for (int mask = 0; firstSet[s] >= 0 && mask < 1 << idx.length; mask++) {
        double t = sol.x()[firstSet[s] + mask];
        for (int k = 0; k < idx.length; k++) {
          sales[idx[k]] += t * shares[firstSet[s] + mask][k];
        }
      }
    }
    for (int j = 0; j < n; j++) {
      if (fixedVar[j] >= 0) {
        sales[j] = sol.x()[fixedVar[j]];
      }
    }
    return new Solution(columns, sol.objective(), sales);
  }
}
