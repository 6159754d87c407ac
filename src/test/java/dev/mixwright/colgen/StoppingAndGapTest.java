package dev.mixwright.colgen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;

/** The stopping vocabulary, the one gap definition and the duals' explicit absence, on hand-made figures. */
class StoppingAndGapTest {

  @Test
  void limitsFireAtTheirThresholdAndNotBefore() {
    StopCriterion time = StopCriterion.timeLimit(1000);
    assertFalse(time.fired(Progress.at(50, 999)));
    assertEquals(Optional.of("time limit of 1.0 s reached"), time.check(Progress.at(0, 1000)));
    StopCriterion rounds = StopCriterion.iterationLimit(8);
    assertFalse(rounds.fired(Progress.at(7, 1_000_000)));
    assertTrue(rounds.fired(Progress.at(8, 0)));
  }

  @Test
  void anyOfGivesTheFirstReasonThatFires() {
    AtomicBoolean flag = new AtomicBoolean();
    StopCriterion all = StopCriterion.anyOf(StopCriterion.never(), StopCriterion.signal(flag),
        StopCriterion.iterationLimit(3));
    assertEquals(Optional.empty(), all.check(Progress.at(2, 0)));
    assertEquals(Optional.of("iteration limit of 3 reached"), all.check(Progress.at(3, 0)));
    flag.set(true);
    assertEquals(Optional.of("interrupted by a signal"), all.check(Progress.at(3, 0)));
  }

  @Test
  void anIterationRecordIsProgress() {
    IterationRecord rec = new IterationRecord(4, 10, 12, 0.2, 30, 5, true, 2500);
    assertTrue(StopCriterion.iterationLimit(4).fired(rec));
    assertTrue(StopCriterion.timeLimit(2500).fired(rec));
  }

  @Test
  void theGapIsRelativeToTheLargerOfValueAndBound() {
    assertEquals(0.2, ValueBound.gap(400, 500), 1e-15);
    assertEquals(0.25, ValueBound.gap(-400, -300), 1e-15);
    // small figures keep their relative gap (a fixed scale of 1 once made this 0.5)
    assertEquals(0.5 / 0.6, ValueBound.gap(0.1, 0.6), 1e-15);
    assertEquals(0.0, ValueBound.gap(500, 499), 0.0, "a bound below the value (round-off) is no gap");
    assertEquals(Double.POSITIVE_INFINITY, ValueBound.gap(500, Double.POSITIVE_INFINITY));
    assertEquals(Double.POSITIVE_INFINITY, new ValueBound(500, Double.NaN).gap());
  }

  @Test
  void unknownDualsHaveNoValuesRatherThanZeros() {
    Duals none = Duals.unknown();
    assertFalse(none.known());
    assertTrue(none.resource(0).isEmpty());
    assertTrue(none.segment(2).isEmpty());
    assertThrows(IllegalStateException.class, none::resource);
    Duals some = new Duals(new double[] {3.5, 0}, new double[] {7});
    assertTrue(some.known());
    assertEquals(0.0, some.resource(1).getAsDouble());
    assertEquals(7.0, some.segment()[0]);
    assertThrows(IllegalArgumentException.class, () -> new Duals(new double[1], null));
  }

  @Test
  void anInfeasibleOutcomeHasNoDualsAndNoGap() {
    SolveOutcome o = SolveOutcome.infeasible("nothing to sell", 12);
    assertTrue(o.status().isInfeasible() && o.status().isFinished() && !o.status().isStopped());
    assertFalse(o.duals().known());
    assertEquals(0.0, o.result().gap());
    assertEquals(0, o.master().columns().size());
  }
}
