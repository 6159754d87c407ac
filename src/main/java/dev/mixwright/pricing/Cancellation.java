package dev.mixwright.pricing;

import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.BooleanSupplier;

/**
 * When to abandon a pricing search under way: a signal (process-wide, set by the signal handler) or
 * the caller's own criterion carried by the query (the loop's time limit), so that a round over a huge
 * space ends within a few thousand search nodes instead of at its end. An abandoned search ends as its
 * node limit would (the outcome is not exact and proves only what it explored), so the loop's own stop
 * criteria then end the run as stopped. The signal is cleared when the command that installed the
 * handler ends.
 */
public final class Cancellation {
  private static final AtomicBoolean SIGNALLED = new AtomicBoolean();

  /** Only the signal: a query that sets no criterion of its own. */
  public static final Cancellation SIGNAL = new Cancellation(() -> false);

  private final BooleanSupplier own;

  private Cancellation(BooleanSupplier own) {
    this.own = own;
  }

  /**
   * The signal or {@code stop}, whichever comes first. {@code stop} is polled every few thousand
   * search nodes (microseconds apart), from the thread that prices, so it must be cheap and safe to
   * call from there.
   */
  public static Cancellation signalOr(BooleanSupplier stop) {
    return new Cancellation(stop);
  }

  /** Whether the search should stop now. */
  public boolean requested() {
    return SIGNALLED.get() || own.getAsBoolean();
  }

  /** Asks every search under way, and every one started until {@link #clear}, to stop. */
  public static void request() {
    SIGNALLED.set(true);
  }

  public static void clear() {
    SIGNALLED.set(false);
  }

  /** Whether a signal asked to stop. */
  public static boolean signalled() {
    return SIGNALLED.get();
  }
}
