package dev.mixwright.colgen;

import java.util.List;

/**
 * The primal side of the final restricted master: its columns in the order they entered, and per
 * column its value {@code x} and reduced cost, both aligned with {@code columns}.
 */
public record MasterColumns(List<Column> columns, double[] x, double[] reducedCost) {
  public MasterColumns {
    columns = List.copyOf(columns);
  }

  public static MasterColumns none() {
    return new MasterColumns(List.of(), new double[0], new double[0]);
  }
}
