package dev.mixwright.testing;

import java.util.Random;
import org.opentest4j.AssertionFailedError;

/**
 * Seeded cases for property tests, as plain JUnit 5 loops. Case i draws everything it needs from
 * {@code new Random(seed(i))}; when it fails, the failure message starts with its seed, and
 * {@link #one} runs that seed alone.
 */
public final class Cases {
  /** Draws allowed per counted case before a property is called vacuous. */
  private static final int MAX_DRAWS_PER_CASE = 10;

  private Cases() {}

  /** One case; throws on failure. */
  @FunctionalInterface
  public interface Body {
    void run(long seed, Random rnd) throws Exception;
  }

  /** One case that may find its draw does not apply; returns true when it checked something. */
  @FunctionalInterface
  public interface Filtered {
    boolean run(long seed, Random rnd) throws Exception;
  }

  /**
   * The seed of case i. Consecutive seeds are spread over the longs because java.util.Random's first
   * draws from nearby seeds are alike.
   */
  public static long seed(int i) {
    return i * 0x9E3779B97F4A7C15L;
  }

  /** Runs cases 0 .. count − 1. */
  public static void each(int count, Body body) {
    for (int i = 0; i < count; i++) {
      one(seed(i), body);
    }
  }

  /**
   * Runs cases 0, 1, ... until {@code count} of them have checked something, and returns how many
   * were drawn; a case that does not apply is not counted. Fails when fewer than one draw in
   * {@value #MAX_DRAWS_PER_CASE} applies, so a property cannot pass by checking nothing.
   */
  public static int checked(int count, Filtered body) {
    int done = 0;
    int i = 0;
    while (done < count) {
      if (i >= MAX_DRAWS_PER_CASE * count) {
        throw new AssertionFailedError(
            "only " + done + " of " + i + " draws applied; wanted " + count + " checked cases");
      }
      long seed = seed(i++);
      boolean[] applied = new boolean[1];
      one(seed, (s, rnd) -> applied[0] = body.run(s, rnd));
      if (applied[0]) {
        done++;
      }
    }
    return i;
  }

  /** Runs the case of one seed; any failure comes back as an assertion error naming the seed. */
  public static void one(long seed, Body body) {
    try {
      body.run(seed, new Random(seed));
    } catch (Exception | AssertionError e) {
      throw new AssertionFailedError("seed " + seed + ": " + e, e);
    }
  }

  /**
   * An int in [min, max]; one draw in eight is an end of the range, since the ends are where
   * counting and indexing go wrong.
   */
  public static int between(Random rnd, int min, int max) {
    int pick = rnd.nextInt(8);
    if (pick == 0) {
      return rnd.nextBoolean() ? min : max;
    }
    return min + rnd.nextInt(max - min + 1);
  }
}
