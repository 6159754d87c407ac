package dev.mixwright.colgen;

import java.util.List;

/**
 * The final restricted master by column: its columns in the order they entered, and per column its
 * value {@code x}, reduced cost and {@code columnDual} β_j (the dual of the row x_j − w_j·x_s0 ≤ 0 of
 * a choosing segment's column; 0 for a fixed segment's), all aligned with {@code columns}; and per
 * segment {@code stayingOut}, the buyers of a choosing segment who buy none (NaN for a fixed
 * segment; empty when unknown).
 */
public record MasterColumns(
    List<Column> columns, double[] x, double[] reducedCost, double[] columnDual, double[] stayingOut) {
  public MasterColumns {
    columns = List.copyOf(columns);
  }

  /** Columns of fixed segments only: every β is 0 and nobody stays out. */
  public MasterColumns(List<Column> columns, double[] x, double[] reducedCost) {
    this(columns, x, reducedCost, new double[x.length], new double[0]);
  }

  public static MasterColumns none() {
    return new MasterColumns(List.of(), new double[0], new double[0]);
  }

  /** x_s0 of segment s, NaN when s does not choose or nothing is known. */
  public double stayingOut(int s) {
    return s < stayingOut.length ? stayingOut[s] : Double.NaN;
  }
}
