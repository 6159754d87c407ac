package dev.mixwright.master;

/**
 * A solved {@link PortfolioLp}: {@code y[i]} and {@code x[i][k]} per block in the order added (x in
 * the order of the block's segments); duals π (resources), μ (segments) and λ (the variant limit,
 * 0 when there is none). Everything but the status is empty or NaN unless optimal.
 */
public record PortfolioLpSolution(
    LpStatus status,
    double objective,
    double[] y,
    double[][] x,
    double[] resourceDual,
    double[] segmentDual,
    double limitDual) {

  static PortfolioLpSolution failed(LpStatus status) {
    return new PortfolioLpSolution(status, Double.NaN, new double[0], new double[0][], new double[0],
        new double[0], Double.NaN);
  }

  public boolean isOptimal() {
    return status.isOptimal();
  }
}
