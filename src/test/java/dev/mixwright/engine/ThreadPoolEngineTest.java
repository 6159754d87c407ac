package dev.mixwright.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;

class ThreadPoolEngineTest {
  private static Job job(int from, int to) {
    List<byte[]> points = new ArrayList<>();
    for (int i = from; i < to; i++) {
      points.add(BigInteger.valueOf(i).toByteArray());
    }
    return new Job(Squares.class.getName(), BigInteger.valueOf(7).toByteArray(), points);
  }

  @Test
  void everyPointIsDoneOnceWithItsOwnResult() throws Exception {
    Job job = job(0, 12);
    long[] got = new long[job.size()];
    int[] times = new int[job.size()];
    int done = new ThreadPoolEngine(3).run(job, (point, result, millis) -> {
      got[point] = new BigInteger(result).longValue();
      times[point]++;
    }, () -> false);
    assertEquals(12, done);
    for (int i = 0; i < 12; i++) {
      assertEquals((long) i * i + 7, got[i], "point " + i);
      assertEquals(1, times[i], "point " + i);
    }
  }

  @Test
  void aPointThatThrowsFailsTheJobAndIsHeard() {
    List<Integer> failed = new ArrayList<>();
    Engine.JobFailed e = assertThrows(Engine.JobFailed.class, () -> new ThreadPoolEngine(1).run(job(10, 16),
        new Watch() {
          @Override
          public void done(int point, byte[] result, long millis) {}

          @Override
          public void failed(int point, int attempt, String why) {
            failed.add(point);
          }
        }, () -> false));
    assertEquals(List.of(3), failed);
    assertTrue(e.getMessage().contains("13 is refused"), e.getMessage());
  }

  @Test
  void aStopBeforeTheStartDoesNothing() throws Exception {
    int done = new ThreadPoolEngine(2).run(job(0, 5), (point, result, millis) -> {
      throw new AssertionError("no point should run");
    }, () -> true);
    assertEquals(0, done);
  }

  @Test
  void aStopMidwayKeepsWhatIsDoneAndStartsNoMore() throws Exception {
    int[] seen = {0};
    AtomicBoolean stop = new AtomicBoolean();
    List<byte[]> points = new ArrayList<>();
    for (int i = 0; i < 50; i++) {
      points.add(BigInteger.valueOf(i).toByteArray());
    }
    Job waiting = new Job(WaitingPoints.class.getName(), new byte[0], points);
    // point 0 is done and asks for the stop; point 1 waits until the stop interrupts it, which is no
    // failure of the job; no later point starts
    int done = new ThreadPoolEngine(1).run(waiting, (point, result, millis) -> {
      seen[0]++;
      stop.set(true);
    }, stop::get);
    assertEquals(1, seen[0]);
    assertEquals(1, done);
  }

  @Test
  void theThreadPoolIsAlwaysThereAndSparkOnlyWithItsModule() {
    assertEquals(Engines.LOCAL, Engines.find("LOCAL").orElseThrow().name());
    // This module's class path has no other engine; the spark module's tests find its engine.
    assertTrue(Engines.find("spark").isEmpty());
    assertEquals(List.of(Engines.LOCAL), Engines.names());
    assertTrue(Engines.exists("Local"));
    assertFalse(Engines.exists("spark"));
  }
}
