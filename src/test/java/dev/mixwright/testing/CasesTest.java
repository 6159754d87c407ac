package dev.mixwright.testing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.opentest4j.AssertionFailedError;

/** The seeded-case loops: the seed in every failure, the same draws from the same seed. */
class CasesTest {

  @Test
  void aFailingCaseNamesItsSeed() {
    AssertionFailedError e = assertThrows(AssertionFailedError.class,
        () -> Cases.each(10, (seed, rnd) -> assertTrue(seed != Cases.seed(7), "case 7 fails")));
    assertTrue(e.getMessage().startsWith("seed " + Cases.seed(7) + ": "), e.getMessage());
    assertTrue(e.getMessage().contains("case 7 fails"), e.getMessage());
  }

  @Test
  void anExceptionAlsoNamesItsSeed() {
    AssertionFailedError e = assertThrows(AssertionFailedError.class,
        () -> Cases.one(42, (seed, rnd) -> {
          throw new IllegalStateException("broken");
        }));
    assertTrue(e.getMessage().startsWith("seed 42: java.lang.IllegalStateException: broken"), e.getMessage());
  }

  @Test
  void theSameSeedDrawsTheSameCase() {
    List<Integer> first = new ArrayList<>();
    List<Integer> again = new ArrayList<>();
    Cases.each(50, (seed, rnd) -> first.add(rnd.nextInt()));
    Cases.each(50, (seed, rnd) -> again.add(new Random(seed).nextInt()));
    assertEquals(first, again);
  }

  @Test
  void checkedCountsOnlyTheCasesThatApply() {
    int[] applied = new int[1];
    int drawn = Cases.checked(30, (seed, rnd) -> {
      boolean applies = rnd.nextBoolean();
      applied[0] += applies ? 1 : 0;
      return applies;
    });
    assertEquals(30, applied[0]);
    assertTrue(drawn > 30, "drawn " + drawn);
  }

  @Test
  void checkedFailsWhenNothingApplies() {
    assertThrows(AssertionFailedError.class, () -> Cases.checked(5, (seed, rnd) -> false));
  }

  @Test
  void betweenStaysInRangeAndReachesBothEnds() {
    Random rnd = new Random(1);
    boolean low = false;
    boolean high = false;
    for (int i = 0; i < 1000; i++) {
      int v = Cases.between(rnd, 3, 12);
      assertTrue(v >= 3 && v <= 12, "value " + v);
      low |= v == 3;
      high |= v == 12;
    }
    assertTrue(low && high);
  }
}
