package dev.mixwright.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.BooleanSupplier;

/**
 * The default engine: the points on a pool of threads of this JVM, one per processor (at most one per
 * point). Results reach the watch on the calling thread, in the order they finish. A stop interrupts
 * the points in progress (work that watches its thread's interrupt flag ends them early and still
 * reports them) and starts no other. A point that throws fails the job, without retry: in one JVM a
 * second attempt would meet the same fault.
 */
public final class ThreadPoolEngine implements Engine {
  static final String NAME = "local";

  private final int threads;

  public ThreadPoolEngine() {
    this(Runtime.getRuntime().availableProcessors());
  }

  public ThreadPoolEngine(int threads) {
    if (threads < 1) {
      throw new IllegalArgumentException("threads must be >= 1");
    }
    this.threads = threads;
  }

  @Override
  public String name() {
    return NAME;
  }

  /** One finished attempt, handed from a pool thread to the caller's. */
  private record Finished(int point, byte[] result, long millis, Throwable fault) {}

  @Override
  public int run(Job job, Watch watch, BooleanSupplier stop) throws JobFailed {
    int n = job.size();
    if (n == 0) {
      return 0;
    }
    if (stop.getAsBoolean()) {
      return 0;
    }
    LinkedBlockingQueue<Finished> finished = new LinkedBlockingQueue<>();
    AtomicBoolean halt = new AtomicBoolean();
    ExecutorService pool = Executors.newFixedThreadPool(Math.min(threads, n), r -> {
      Thread t = new Thread(r, "mixwright-point");
      t.setDaemon(true);
      return t;
    });
    List<Future<?>> futures = new ArrayList<>();
    try {
      for (int i = 0; i < n; i++) {
        int point = i;
        futures.add(pool.submit(() -> {
          if (halt.get() || Thread.currentThread().isInterrupted()) {
            return;
          }
          long t0 = System.nanoTime();
          try {
            byte[] out = PointWork.named(job.work()).compute(job.shared(), job.points().get(point));
            finished.add(new Finished(point, out, (System.nanoTime() - t0) / 1_000_000, null));
          } catch (Throwable e) {
            finished.add(new Finished(point, null, (System.nanoTime() - t0) / 1_000_000, e));
          }
        }));
      }
      pool.shutdown();
      int done = 0;
      boolean stopping = false;
      while (true) {
        if (!stopping && stop.getAsBoolean()) {
          stopping = true;
          halt.set(true);
          futures.forEach(f -> f.cancel(true));
        }
        if (done == n || pool.isTerminated() && finished.isEmpty()) {
          return done;
        }
        Finished f = finished.poll(100, TimeUnit.MILLISECONDS);
        if (f == null) {
          continue;
        }
        if (f.fault() != null && stopping) {
          continue; // a point in progress when the stop came, interrupted by it: abandoned, not failed
        }
        if (f.fault() != null) {
          watch.failed(f.point(), 0, String.valueOf(f.fault()));
          throw new JobFailed("point " + f.point() + " failed: " + f.fault(), f.fault());
        }
        watch.done(f.point(), f.result(), f.millis());
        done++;
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new JobFailed("interrupted while waiting for the points", e);
    } finally {
      pool.shutdownNow();
    }
  }
}
