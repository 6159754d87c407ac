package dev.mixwright.colgen;

import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Ends a run early. Returns the reason in words, or empty to go on. Criteria compose with
 * {@link #anyOf}.
 */
@FunctionalInterface
public interface StopCriterion {
  Optional<String> check(IterationRecord last);

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
    return r -> flag.get() ? Optional.of("interrupted by a signal") : Optional.empty();
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
