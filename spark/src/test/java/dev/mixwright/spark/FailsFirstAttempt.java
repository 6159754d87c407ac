package dev.mixwright.spark;

import dev.mixwright.engine.PointWork;
import dev.mixwright.run.ScenarioWork;
import dev.mixwright.run.SweepWork;
import org.apache.spark.TaskContext;

/**
 * Work that fails on purpose the first time a Spark executor tries point 1 of its job, as a lost
 * executor or a full disk would, and computes every other attempt as the work it wraps does: a
 * sweep's ({@link SweepWork}) itself, a scenario set's ({@link ScenarioWork}) as {@link Scenarios}.
 */
public class FailsFirstAttempt implements PointWork {
  static final int POINT = 1;

  private final PointWork work;

  public FailsFirstAttempt() {
    this(new SweepWork());
  }

  FailsFirstAttempt(PointWork work) {
    this.work = work;
  }

  @Override
  public byte[] compute(byte[] shared, byte[] point) throws Exception {
    TaskContext t = TaskContext.get();
    if (t != null && t.partitionId() == POINT && t.attemptNumber() == 0) {
      throw new IllegalStateException("failing point " + POINT + " on purpose, first attempt");
    }
    return work.compute(shared, point);
  }

  /** A scenario set's per-scenario work, failing once in the same way. */
  public static final class Scenarios extends FailsFirstAttempt {
    public Scenarios() {
      super(new ScenarioWork());
    }
  }
}
