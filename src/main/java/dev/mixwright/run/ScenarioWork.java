package dev.mixwright.run;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.Function;

/**
 * Where the independent work of a scenario set runs (each scenario's own solve, each hold-out
 * scenario's evaluation): the thread pool of this machine, at most two threads. The one method a
 * distributed engine takes over: results come back in the order of the items, and a job's failure
 * fails the whole call.
 */
public final class ScenarioWork {
  private ScenarioWork() {}

  /** Threads for scenario jobs: each job may start solver threads of its own, so never more than two. */
  static int threads() {
    return Math.max(1, Math.min(2, Runtime.getRuntime().availableProcessors()));
  }

  /** {@code job} applied to every item, in item order. */
  public static <T, R> List<R> each(List<T> items, Function<T, R> job) {
    if (items.size() <= 1 || threads() == 1) {
      List<R> out = new ArrayList<>(items.size());
      items.forEach(t -> out.add(job.apply(t)));
      return out;
    }
    ExecutorService pool = Executors.newFixedThreadPool(threads(), r -> {
      Thread t = new Thread(r, "mixwright-scenario");
      t.setDaemon(true);
      return t;
    });
    try {
      List<Future<R>> futures = new ArrayList<>(items.size());
      for (T t : items) {
        futures.add(pool.submit(() -> job.apply(t)));
      }
      List<R> out = new ArrayList<>(items.size());
      for (Future<R> f : futures) {
        out.add(f.get());
      }
      return out;
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while scenarios were solved", e);
    } catch (ExecutionException e) {
      if (e.getCause() instanceof RuntimeException re) {
        throw re;
      }
      if (e.getCause() instanceof Error err) {
        throw err;
      }
      throw new IllegalStateException(e.getCause());
    } finally {
      pool.shutdownNow();
    }
  }
}
