package dev.mixwright.pricing;

import java.util.concurrent.atomic.AtomicBoolean;

/**
 * A request, from outside the loop, to abandon the pricing searches under way: a signal handler sets
 * it so that a round over a huge space ends within a few thousand search nodes instead of at its end.
 * An abandoned search ends as its node limit would (the outcome is not exact and proves only what it
 * explored), so the loop's own stop criteria then end the run as stopped. Process-wide, as the signal
 * is; cleared when the command that installed the handler ends.
 */
public final class Cancellation {
  private static final AtomicBoolean REQUESTED = new AtomicBoolean();

  private Cancellation() {}

  public static void request() {
    REQUESTED.set(true);
  }

  public static void clear() {
    REQUESTED.set(false);
  }

  public static boolean requested() {
    return REQUESTED.get();
  }
}
