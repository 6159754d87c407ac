package dev.mixwright.spark;

import dev.mixwright.engine.Engine;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.PointWork;
import dev.mixwright.engine.Watch;
import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;
import java.util.function.BooleanSupplier;
import org.apache.spark.ExceptionFailure;
import org.apache.spark.SparkConf;
import org.apache.spark.SparkContext;
import org.apache.spark.SimpleFutureAction;
import org.apache.spark.Success$;
import org.apache.spark.TaskEndReason;
import org.apache.spark.api.java.JavaRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerTaskEnd;
import scala.collection.Iterator;
import scala.jdk.javaapi.CollectionConverters;
import scala.reflect.ClassTag$;
import scala.runtime.BoxedUnit;

/**
 * Runs a job's points as the tasks of one Spark job, one partition a point, so that Spark retries a
 * failed point on its own ({@code spark.task.maxFailures}, 4 unless set) and spreads the points over
 * the executors as they free up. The job itself travels once per executor as a broadcast. Each
 * finished partition's result is handed to the driver's {@link Watch} once, on the calling thread,
 * as it arrives; a retried or speculative second copy of a point that was already done is dropped.
 * Uses the active Spark context (a test's, spark-shell's) and otherwise starts one: on the master
 * that {@code spark.master} names (spark-submit's {@code --master}, or {@code -Dspark.master=...}), or
 * in local mode on every core with 4 tries a task. A context it started serves every job of the
 * driver (a scenario set runs two: the scenarios' own solves, then the hold-out check) and is
 * stopped by {@link #close}.
 */
public final class SparkEngine implements Engine {
  static final String NAME = "spark";
  /** Tries of a task in local mode, where Spark's default is a single one. */
  static final int LOCAL_TRIES = 4;
  /** Set on the conf of a context this engine starts, so it knows to stop it. */
  private static final String STARTED_HERE = "spark.mixwright.startedByEngine";

  /** The context this engine started, stopped by {@link #close}; null while it uses none of its own. */
  private SparkContext started;

  @Override
  public String name() {
    return NAME;
  }

  /** What the driver hears from Spark, queued so that the calling thread handles it. */
  private sealed interface Event permits Finished, Failed, Ended {}

  private record Finished(int point, Outcome outcome) implements Event {}

  private record Failed(int point, int attempt, String why) implements Event {}

  private record Ended(Throwable fault) implements Event {}

  /** A task's answer: the point's result and the time its computation took on the executor. */
  record Outcome(byte[] result, long millis) implements Serializable {
    private static final long serialVersionUID = 1L;
  }

  @Override
  public int run(Job job, Watch watch, BooleanSupplier stop) throws JobFailed {
    int n = job.size();
    if (n == 0) {
      return 0;
    }
    // A context that was running before (spark-shell's, a test's) is used and left running; one this
    // engine starts, it stops on close, before the JVM exits, so that a local cluster's workers are not
    // left relaunching executors during the shutdown.
    SparkContext sc = SparkContext.getOrCreate(conf());
    if (sc.getConf().contains(STARTED_HERE)) {
      started = sc;
    }
    LinkedBlockingQueue<Event> events = new LinkedBlockingQueue<>();
    SparkListener listener = new SparkListener() {
      @Override
      public void onTaskEnd(SparkListenerTaskEnd end) {
        if (end.reason() != Success$.MODULE$ && end.taskInfo() != null) {
          events.add(new Failed(end.taskInfo().partitionId(), end.taskInfo().attemptNumber(), why(end.reason())));
        }
      }
    };
    sc.addSparkListener(listener);
    try {
      JavaSparkContext jsc = JavaSparkContext.fromSparkContext(sc);
      List<Integer> indices = new ArrayList<>(n);
      List<Object> partitions = new ArrayList<>(n);
      for (int i = 0; i < n; i++) {
        indices.add(i);
        partitions.add(i);
      }
      Broadcast<Job> shared = jsc.broadcast(job);
      // One slice per point: a slice of a parallelised list of n items in n slices holds exactly one.
      JavaRDD<Integer> points = jsc.parallelize(indices, n);
      sc.setJobDescription("mixwright: " + n + " points of " + job.work());
      SimpleFutureAction<BoxedUnit> future = sc.submitJob(points.rdd(), new Compute(shared),
          CollectionConverters.asScala(partitions).toSeq(),
          (Object partition, Outcome o) -> {
            events.add(new Finished((Integer) partition, o));
            return BoxedUnit.UNIT;
          },
          () -> BoxedUnit.UNIT);
      future.onComplete(t -> {
        events.add(new Ended(t.isFailure() ? t.failed().get() : null));
        return BoxedUnit.UNIT;
      }, scala.concurrent.ExecutionContext.global());
      return drain(n, events, watch, stop, future);
    } finally {
      sc.removeSparkListener(listener);
    }
  }

  @Override
  public void close() {
    if (started != null) {
      started.stop();
      started = null;
    }
  }

  /** Hands events to the watch until the job ends; on a stop, cancels it and keeps what was done. */
  private static int drain(int n, LinkedBlockingQueue<Event> events, Watch watch, BooleanSupplier stop,
      SimpleFutureAction<BoxedUnit> future) throws JobFailed {
    boolean[] seen = new boolean[n];
    int done = 0;
    boolean cancelled = false;
    try {
      while (true) {
        if (!cancelled && stop.getAsBoolean()) {
          cancelled = true;
          future.cancel();
        }
        Event e = events.poll(100, TimeUnit.MILLISECONDS);
        if (e instanceof Finished f) {
          if (!seen[f.point()]) {
            seen[f.point()] = true;
            done++;
            watch.done(f.point(), f.outcome().result(), f.outcome().millis());
          }
        } else if (e instanceof Failed f) {
          watch.failed(f.point(), f.attempt(), f.why());
        } else if (e instanceof Ended end) {
          // Results queued before the end are already handled: the handler runs before completion.
          drainLeft(events, seen, watch);
          done = count(seen);
          if (end.fault() != null && !cancelled) {
            throw new JobFailed("Spark gave up on the job: " + end.fault().getMessage(), end.fault());
          }
          return done;
        }
      }
    } catch (InterruptedException ex) {
      Thread.currentThread().interrupt();
      future.cancel();
      throw new JobFailed("interrupted while waiting for Spark", ex);
    }
  }

  private static void drainLeft(LinkedBlockingQueue<Event> events, boolean[] seen, Watch watch) {
    for (Event e; (e = events.poll()) != null; ) {
      if (e instanceof Finished f && !seen[f.point()]) {
        seen[f.point()] = true;
        watch.done(f.point(), f.outcome().result(), f.outcome().millis());
      } else if (e instanceof Failed f) {
        watch.failed(f.point(), f.attempt(), f.why());
      }
    }
  }

  /** A failed attempt in one line: the exception and its message, or Spark's word for a lost task. */
  private static String why(TaskEndReason reason) {
    if (reason instanceof ExceptionFailure e) {
      return e.className() + ": " + e.description();
    }
    return reason.toString();
  }

  private static int count(boolean[] seen) {
    int c = 0;
    for (boolean b : seen) {
      c += b ? 1 : 0;
    }
    return c;
  }

  private static SparkConf conf() {
    SparkConf conf = new SparkConf().setAppName("mixwright").set(STARTED_HERE, "true");
    if (!conf.contains("spark.master")) {
      conf.setMaster("local[*," + LOCAL_TRIES + "]");
    }
    // A stop cancels the job; its running tasks are interrupted, not left to finish.
    conf.setIfMissing("spark.job.interruptOnCancel", "true");
    conf.setIfMissing("spark.ui.enabled", "false");
    return conf;
  }

  /** The task: computes the partition's one point with the work the job names. */
  static final class Compute implements scala.Function1<Iterator<Integer>, Outcome>, Serializable {
    private static final long serialVersionUID = 1L;
    private final Broadcast<Job> job;

    Compute(Broadcast<Job> job) {
      this.job = job;
    }

    @Override
    public Outcome apply(Iterator<Integer> partition) {
      Job j = job.value();
      int point = partition.next();
      long t0 = System.nanoTime();
      try {
        byte[] out = PointWork.named(j.work()).compute(j.shared(), j.points().get(point));
        return new Outcome(out, (System.nanoTime() - t0) / 1_000_000);
      } catch (RuntimeException e) {
        throw e;
      } catch (Exception e) {
        throw new IllegalStateException("point " + point + ": " + e, e);
      }
    }
  }
}
