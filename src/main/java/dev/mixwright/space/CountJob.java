package dev.mixwright.space;

import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicReference;

/**
 * A {@link BudgetedCount} on a thread of its own, so that nothing waits for the count: start it,
 * carry on, and read {@link #current()} (what is known so far) or {@link #await} (the answer, or
 * what is known when the wait ends). The thread is a daemon and stops at the budget, at
 * {@link #stop}, or when the answer is complete.
 */
public final class CountJob implements AutoCloseable {
  /** Budget of a count that runs beside a solve: long enough for an exact count on most catalogs. */
  public static final long BACKGROUND_BUDGET_MS = 60_000;

  /**
   * How long a finished solve waits for a count still running before it takes what is known: enough
   * for the counts of small catalogs to end, short beside any solve that had to wait before.
   */
  public static final long FINISH_GRACE_MS = 500;

  private final AtomicReference<SpaceCount> current;
  private final AtomicBoolean stop = new AtomicBoolean();
  private final CompletableFuture<SpaceCount> result = new CompletableFuture<>();

  private CountJob(SpaceCount start) {
    current = new AtomicReference<>(start);
  }

  /** Counts the buildable variants of the whole space within {@code budgetMs} (≤ 0: no limit). */
  public static CountJob whole(VariantSpace space, long budgetMs) {
    return start(new BudgetedCount(space), BudgetedCount.wholeSpace(space), budgetMs);
  }

  /** Counts the buildable variants within {@code domain} (by flat choice). */
  public static CountJob start(BudgetedCount counter, boolean[] domain, long budgetMs) {
    CountJob job = new CountJob(SpaceCount.atMost(counter.product(domain)));
    Thread t = new Thread(() -> {
      try {
        SpaceCount c = counter.count(domain, budgetMs, job.stop::get, job.current::set);
        job.current.set(c);
        job.result.complete(c);
      } catch (RuntimeException | Error e) {
        job.result.completeExceptionally(e);
      }
    }, "mixwright-count");
    t.setDaemon(true);
    t.setPriority(Thread.NORM_PRIORITY - 1);
    t.start();
    return job;
  }

  /** What is known now; the final answer once {@link #done()}. */
  public SpaceCount current() {
    return current.get();
  }

  public boolean done() {
    return result.isDone();
  }

  /** The answer, at most {@code ms} from now; what is known then if the count is still running. */
  public SpaceCount await(long ms) {
    try {
      return result.get(Math.max(0, ms), TimeUnit.MILLISECONDS);
    } catch (TimeoutException e) {
      return current();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      return current();
    } catch (ExecutionException e) {
      throw new IllegalStateException("the count failed: " + e.getCause(), e.getCause());
    }
  }

  /**
   * Tells the count to stop and waits at most {@code ms} for it to say what it knows (it polls the
   * signal inside its loops, so this is short).
   */
  public SpaceCount stop(long ms) {
    stop.set(true);
    return await(ms);
  }

  /**
   * The answer if the count ends within {@link #FINISH_GRACE_MS}, else what is known then; the count
   * is stopped either way. For the end of a run.
   */
  public SpaceCount finish() {
    SpaceCount c = await(FINISH_GRACE_MS);
    return done() ? c : stop(FINISH_GRACE_MS);
  }

  /** The answer as a future, for callers that compose. */
  public CompletableFuture<SpaceCount> result() {
    return result;
  }

  @Override
  public void close() {
    stop.set(true);
  }
}
