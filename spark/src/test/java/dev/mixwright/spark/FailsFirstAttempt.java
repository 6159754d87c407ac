package dev.mixwright.spark;

import dev.mixwright.run.SweepWork;
import org.apache.spark.TaskContext;

/**
 * A sweep's work that fails on purpose the first time a Spark executor tries point 1 of its job, as a
 * lost executor or a full disk would, and computes every other attempt as {@link SweepWork} does.
 */
public final class FailsFirstAttempt extends SweepWorkDelegate {
  static final int POINT = 1;

  @Override
  public byte[] compute(byte[] shared, byte[] point) throws Exception {
    TaskContext t = TaskContext.get();
    if (t != null && t.partitionId() == POINT && t.attemptNumber() == 0) {
      throw new IllegalStateException("failing point " + POINT + " on purpose, first attempt");
    }
    return super.compute(shared, point);
  }
}
