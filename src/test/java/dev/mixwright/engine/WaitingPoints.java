package dev.mixwright.engine;

/**
 * Test work: point 0 answers at once; every other point waits until its thread is interrupted (as a
 * stop interrupts the points in progress), so a test of stopping depends on no timing.
 */
public final class WaitingPoints implements PointWork {
  @Override
  public byte[] compute(byte[] shared, byte[] point) throws InterruptedException {
    if (point.length == 1 && point[0] == 0) {
      return point;
    }
    Thread.sleep(Long.MAX_VALUE);
    return point;
  }
}
