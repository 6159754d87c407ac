package dev.mixwright.colgen;

/**
 * Where a run stands when a {@link StopCriterion} is asked: rounds (or steps) done and time since it
 * began. {@link IterationRecord} is one; the integer stage passes {@link #at}.
 */
public interface Progress {
  int iteration();

  long elapsedMs();

  static Progress at(int iteration, long elapsedMs) {
    return new At(iteration, elapsedMs);
  }

  /** A bare progress point. */
  record At(int iteration, long elapsedMs) implements Progress {}
}
