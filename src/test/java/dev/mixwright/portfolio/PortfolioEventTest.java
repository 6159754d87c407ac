package dev.mixwright.portfolio;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.colgen.Progress;
import dev.mixwright.colgen.StopCriterion;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;

/** The integer stage's event kinds keep the words portfolio.jsonl has always held; its clock's phases. */
class PortfolioEventTest {

  @Test
  void kindsAreWrittenWithTheirLogWords() {
    assertEquals(List.of("relaxation", "incumbent", "mip", "survivors", "tree", "end"),
        Arrays.stream(PortfolioEvent.Kind.values()).map(PortfolioEvent.Kind::word).toList());
    assertTrue(PortfolioEvent.Kind.INCUMBENT.isPortfolio());
    assertFalse(PortfolioEvent.Kind.MIP.isPortfolio());
  }

  @Test
  void withoutATimeLimitAPhaseEndsOnlyOnTheSignal() {
    AtomicBoolean flag = new AtomicBoolean();
    StageClock clock = new StageClock(0, StopCriterion.signal(flag));
    StageClock.Phase phase = clock.phase(0.3);
    assertEquals(0, phase.deadlineNanos());
    assertEquals(0, clock.msLeft());
    assertFalse(clock.pastLimit());
    assertFalse(phase.stop().fired(clock.now(1_000_000)));
    flag.set(true);
    assertTrue(phase.stop().fired(clock.now(0)));
    assertTrue(clock.signalFlag().getAsBoolean());
    assertEquals("interrupted by a signal", clock.signalled().orElseThrow());
  }

  @Test
  void withATimeLimitAPhaseGetsItsShareOfWhatIsLeft() {
    StageClock clock = new StageClock(3_600_000, StopCriterion.never());
    StageClock.Phase phase = clock.phase(0.5);
    assertTrue(phase.deadlineNanos() > System.nanoTime());
    assertFalse(phase.stop().fired(clock.now(0)));
    // the phase's own limit lies at about half the hour, checked against a made-up progress point
    assertTrue(phase.stop().fired(Progress.at(0, 1_810_000)));
    assertFalse(phase.stop().fired(Progress.at(0, 1_790_000)));
  }
}
