package dev.mixwright.engine;

import java.util.Locale;

/**
 * Counts for the driver's progress line: points done, failed attempts, points left, and the mean time
 * of a point (the attempts that counted). Each point may stand for several units (a chain of sweep
 * points), so the counts are in units.
 */
public final class Tally {
  private final int total;
  private int done;
  private int failed;
  private long millis;
  private final long startNanos = System.nanoTime();
  private long firstNanos;
  private long lastNanos;

  public Tally(int total) {
    this.total = total;
  }

  public void done(int units, long ms) {
    lastNanos = System.nanoTime();
    if (done == 0) {
      firstNanos = lastNanos;
    }
    done += units;
    millis += ms;
  }

  public void failed(int units) {
    failed += units;
  }

  public int done() {
    return done;
  }

  public int failed() {
    return failed;
  }

  public int left() {
    return total - done;
  }

  /** Mean wall time of a done unit on its worker, in seconds; 0 before the first. */
  public double secondsPerUnit() {
    return done == 0 ? 0 : millis / 1000.0 / done;
  }

  /**
   * The line after the job: the counts, and when the first and the last results came in (seconds
   * after the job was handed to the engine), which shows the engine's start apart from its pace.
   */
  public String summary(String unit) {
    return done == 0 ? line(unit) : String.format(Locale.ROOT, "%s; first result after %.1f s, last after %.1f s",
        line(unit), (firstNanos - startNanos) / 1e9, (lastNanos - startNanos) / 1e9);
  }

  /** E.g. {@code 12 done, 1 failed, 188 left, 0.84 s per point}. */
  public String line(String unit) {
    return String.format(Locale.ROOT, "%d done, %d failed, %d left, %.2f s per %s", done, failed, left(),
        secondsPerUnit(), unit);
  }
}
