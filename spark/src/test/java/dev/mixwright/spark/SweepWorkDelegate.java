package dev.mixwright.spark;

import dev.mixwright.engine.PointWork;
import dev.mixwright.run.SweepWork;

/** A sweep's work, to extend in tests (SweepWork itself is final). */
public class SweepWorkDelegate implements PointWork {
  private final SweepWork work = new SweepWork();

  @Override
  public byte[] compute(byte[] shared, byte[] point) throws Exception {
    return work.compute(shared, point);
  }
}
