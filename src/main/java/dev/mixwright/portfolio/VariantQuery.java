package dev.mixwright.portfolio;

import dev.mixwright.space.VariantKey;
import java.util.Set;

/**
 * One pricing problem of the portfolio relaxation: at resource prices π and segment prices μ, find up
 * to {@code k} buildable variants of value ψ(v) strictly above {@code threshold}, best first, none in
 * {@code excluded}, where
 *
 * <pre>
 *   ψ(v) = g(d_1(v), ..., d_S(v)) − charge − Σ_g penalty[choice of v in g]
 *   d_s(v) = margin(v, s) − Σ_r π_r use_r(v) − μ_s       (−∞ where s does not accept v)
 * </pre>
 *
 * and g is {@link LotValue#best}. {@code penalty} may be null (all zero). {@code deadlineNanos}: a
 * {@code System.nanoTime()} after which the search stops with a valid bound, 0 for none.
 */
public record VariantQuery(
    double[] resourcePrice,
    double[] segmentPrice,
    double charge,
    double[] penalty,
    double threshold,
    int k,
    Set<VariantKey> excluded,
    long deadlineNanos) {

  public VariantQuery {
    if (k < 1) {
      throw new IllegalArgumentException("k must be >= 1");
    }
    if (Double.isNaN(threshold) || !Double.isFinite(charge)) {
      throw new IllegalArgumentException("threshold must be a number and charge finite");
    }
    excluded = excluded == null ? Set.of() : excluded;
  }
}
