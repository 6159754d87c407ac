package dev.mixwright.colgen;

import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.BooleanSupplier;

/**
 * Ends a run early: the one stopping vocabulary of the LP stage and the integer stage. Returns the
 * reason in words, or empty to go on. Criteria compose with {@link #anyOf}.
 */
@FunctionalInterface
public interface StopCriterion {
  Optional<String> check(Progress now);

  default boolean fired(Progress now) {
    return check(now).isPresent();
  }

  static StopCriterion never() {
    return r -> Optional.empty();
  }

  static StopCriterion timeLimit(long millis) {
    return r -> r.elapsedMs() >= millis
        ? Optional.of("time limit of " + Durations.format(millis) + " reached")
        : Optional.empty();
  }

  static StopCriterion iterationLimit(int iterations) {
    return r -> r.iteration() >= iterations
        ? Optional.of("iteration limit of " + iterations + " reached")
        : Optional.empty();
  }

  /** Stops once {@code flag} is set, e.g. by a shutdown hook on Ctrl-C. */
  static StopCriterion signal(AtomicBoolean flag) {
    return signal(flag::get);
  }

  /** Stops once {@code raised} answers true. */
  static StopCriterion signal(BooleanSupplier raised) {
    return r -> raised.getAsBoolean() ? Optional.of("interrupted by a signal") : Optional.empty();
  }

  static StopCriterion anyOf(StopCriterion... criteria) {
    return r -> {
      for (StopCriterion c : criteria) {
        Optional<String> why = c.check(r);
        if (why.isPresent()) {
          return why;
        }
      }
      return Optional.empty();
    };
  }
}
