package dev.mixwright.portfolio;

/**
 * One variant of the integer portfolio: its choices, what it sells per segment (aligned with the
 * catalog's segments; 0 where it sells nothing or is not accepted), and its margin Σ_s m_s · sales_s.
 */
public record OfferedVariant(int[] choices, double[] sales, double margin) {
  public double units() {
    double t = 0;
    for (double x : sales) {
      t += x;
    }
    return t;
  }
}
