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

  public Tally(int total) {
    this.total = total;
  }

  public void done(int units, long ms) {
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

  /** E.g. {@code 12 done, 1 failed, 188 left, 0.84 s per point}. */
  public String line(String unit) {
    return String.format(Locale.ROOT, "%d done, %d failed, %d left, %.2f s per %s", done, failed, left(),
        secondsPerUnit(), unit);
  }
}
