package dev.mixwright.portfolio;

import dev.mixwright.colgen.Progress;
import dev.mixwright.colgen.StopCriterion;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * The integer stage's time and stopping criteria: the outer criterion (a signal, usually), the stage's
 * time limit, and the shares of the time left that each phase may use, all as {@link StopCriterion}s
 * on the stage's own clock.
 */
final class StageClock {
  private final long startNanos = System.nanoTime();
  private final long limitMs;
  private final StopCriterion signal;

  /** @param limitMs the stage's time limit, 0 for none */
  StageClock(long limitMs, StopCriterion signal) {
    this.limitMs = limitMs;
    this.signal = signal;
  }

  long elapsedMs() {
    return (System.nanoTime() - startNanos) / 1_000_000;
  }

  Progress now(int step) {
    return Progress.at(step, elapsedMs());
  }

  /** Why the outer criterion ends the stage, if it does. */
  Optional<String> signalled() {
    return signal.check(now(0));
  }

  /** The outer criterion as a flag for solvers that poll one. */
  BooleanSupplier signalFlag() {
    return () -> signal.fired(now(0));
  }

  boolean pastLimit() {
    return limitMs > 0 && elapsedMs() >= limitMs;
  }

  /** Milliseconds left of the limit (at least 1), 0 when there is none. */
  /** The stage's time limit. */
  long limitMs() {
    return limitMs;
  }

  long msLeft() {
    return limitMs == 0 ? 0 : Math.max(1, limitMs - elapsedMs());
  }

  /** A phase that may use {@code share} of the time left from now. */
  Phase phase(double share) {
    if (limitMs == 0) {
      return new Phase(0, signal);
    }
    long left = limitMs * 1_000_000L - (System.nanoTime() - startNanos);
    long endNanos = System.nanoTime() + (long) (Math.max(0, left) * share);
    long endMs = (endNanos - startNanos) / 1_000_000;
    return new Phase(endNanos, StopCriterion.anyOf(signal, StopCriterion.timeLimit(endMs)));
  }

  /**
   * A phase's end: {@code deadlineNanos} for the variant pricer ({@code System.nanoTime()}, 0 for
   * none) and {@code stop}, the outer criterion with the phase's time limit.
   */
  record Phase(long deadlineNanos, StopCriterion stop) {}
}
