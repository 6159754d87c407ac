package dev.mixwright.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.report.RunResult;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The session solve and resume share, without the command line: typed outcomes, the run folder written. */
class RunSessionTest {
  static final Path STARTER = Path.of("catalogs/heatpump-starter.yaml");

  @TempDir Path dir;

  private static RunSession.SolveRequest solve(Path catalog, Path out, SolveSettings s) {
    return new RunSession.SolveRequest(catalog, Optional.empty(), out, false, s, PricerChoice.BNB,
        new PortfolioPlan(false, PortfolioPlan.defaults().settings()));
  }

  private static RunSession.ResumeRequest resume(Path out) {
    return new RunSession.ResumeRequest(out, false, OptionalDouble.empty(), 0, 0,
        new PortfolioPlan(false, PortfolioPlan.defaults().settings()));
  }

  @Test
  void aStoppedRunResumesToTheUninterruptedOptimumAndThenHasNothingToDo() throws Exception {
    RunSession session = new RunSession(new AtomicBoolean(), new RunSession.Watcher() {});
    RunOutcome full = session.solve(solve(STARTER, dir.resolve("full"), SolveSettings.defaults()));
    RunOutcome.Solved f = assertInstanceOf(RunOutcome.Solved.class, full);
    assertEquals(RunStatus.OPTIMAL, f.lp().status());
    // what the session returns is what it wrote
    assertEquals(f.result(), RunResult.read(dir.resolve("full")));

    Path run = dir.resolve("run");
    RunOutcome.Solved stopped = assertInstanceOf(RunOutcome.Solved.class,
        session.solve(solve(STARTER, run, SolveSettings.defaults().withLimits(0, 1))));
    assertEquals(RunStatus.STOPPED, stopped.lp().status());

    List<RunSession.ResumePoint> points = new ArrayList<>();
    RunSession watched = new RunSession(new AtomicBoolean(), new RunSession.Watcher() {
      @Override
      public void resuming(RunSession.ResumePoint p) {
        points.add(p);
      }
    });
    RunOutcome.Solved resumed = assertInstanceOf(RunOutcome.Solved.class, watched.resume(resume(run)));
    assertEquals(RunStatus.OPTIMAL, resumed.lp().status());
    assertEquals(f.lp().result().value(), resumed.lp().result().value(), 1e-6 * Math.abs(f.lp().result().value()));
    assertEquals(2, resumed.result().sessions());
    assertEquals(1, points.size());
    assertEquals(2, points.get(0).session());
    assertTrue(points.get(0).pooledColumns() > 0);

    RunOutcome again = watched.resume(resume(run));
    RunOutcome.AlreadyOptimal done = assertInstanceOf(RunOutcome.AlreadyOptimal.class, again);
    assertEquals(resumed.lp().result().value(), done.objective(), 1e-9);
  }

  @Test
  void nothingSellableIsAnInfeasibleResultAndAResumeSaysSo() throws Exception {
    Path f = dir.resolve("clash.yaml");
    Files.writeString(f, Catalogs.NOTHING_BUILDABLE);
    RunSession session = new RunSession(new AtomicBoolean(), new RunSession.Watcher() {});
    Path run = dir.resolve("r");
    RunOutcome.Solved s = assertInstanceOf(RunOutcome.Solved.class,
        session.solve(solve(f, run, SolveSettings.defaults())));
    assertEquals(RunStatus.INFEASIBLE, s.result().status());
    RunOutcome.EndedInfeasible e = assertInstanceOf(RunOutcome.EndedInfeasible.class, session.resume(resume(run)));
    assertTrue(e.reason().contains("rules[0]"), e.reason());
  }

  @Test
  void aFolderHoldingARunIsRefusedWithoutReplace() throws Exception {
    RunSession session = new RunSession(new AtomicBoolean(), new RunSession.Watcher() {});
    Path run = dir.resolve("r");
    session.solve(solve(STARTER, run, SolveSettings.defaults().withLimits(0, 1)));
    InputError e = assertThrows(InputError.class,
        () -> session.solve(solve(STARTER, run, SolveSettings.defaults())));
    assertTrue(e.getMessage().contains("mixwright resume"), e.getMessage());
  }

  @Test
  void pricerNamesAreTypedAndTheHeuristicCannotProveABound() {
    assertEquals(PricerChoice.CPSAT, PricerChoice.byWord(" CPSAT "));
    assertTrue(!PricerChoice.byWord("heuristic").exact());
    assertEquals("bnb, cpsat or brute", PricerChoice.exactWords());
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> PricerChoice.byWord("magic"));
    assertTrue(e.getMessage().contains("unknown pricer 'magic'"), e.getMessage());
  }
}
