package dev.mixwright.engine;

/**
 * What the driver hears while a job runs. Calls come one at a time (an engine serialises them), so an
 * implementation need not lock; each point is reported done exactly once, even when a worker computed
 * it twice.
 */
public interface Watch {
  /** Point {@code point} (its place in the job) is computed; {@code millis} the attempt that counted took. */
  void done(int point, byte[] result, long millis);

  /** An attempt at a point failed; the engine may try it again ({@code attempt} counts from 0). */
  default void failed(int point, int attempt, String why) {}
}
