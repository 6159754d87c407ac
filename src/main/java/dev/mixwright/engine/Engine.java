package dev.mixwright.engine;

import java.util.function.BooleanSupplier;

/**
 * Computes every point of a job and hands each result to the driver's {@link Watch}; the driver closes it
 * after its last job. Implementations
 * other than the built-in thread pool are found by {@link java.util.ServiceLoader} (see {@link
 * Engines}) and need a public no-argument constructor.
 */
public interface Engine extends AutoCloseable {
  /** The name a person asks for it by. */
  String name();

  /**
   * Runs the job until every point is done, {@code stop} says to stop (points not started then stay
   * undone), or a point has failed more often than the engine retries (then {@link JobFailed}).
   * Returns how many points were done.
   */
  int run(Job job, Watch watch, BooleanSupplier stop) throws JobFailed;

  /**
   * Lets go of what the engine started for its jobs (a Spark context it made), so that one driver can
   * run several jobs on what it started once. Nothing for the thread pool, which keeps no pool between jobs.
   */
  @Override
  default void close() {}

  /** A job that could not finish: a point failed on every attempt, or the engine itself failed. */
  final class JobFailed extends Exception {
    private static final long serialVersionUID = 1L;

    public JobFailed(String message, Throwable cause) {
      super(message, cause);
    }
  }
}
