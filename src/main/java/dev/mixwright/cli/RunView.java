package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import dev.mixwright.report.StageWords;
import dev.mixwright.colgen.ColGenListener;
import dev.mixwright.colgen.Durations;
import dev.mixwright.portfolio.PortfolioEvent;
import dev.mixwright.portfolio.PortfolioListener;
import dev.mixwright.run.RunOutcome;
import dev.mixwright.run.RunSession;
import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import picocli.CommandLine;

/** Runs a {@link RunSession} for a command (signals caught, progress shown) and prints how it ended. */
final class RunView {
  private RunView() {}

  /** What a command asks of the session. */
  interface Job {
    RunOutcome run(RunSession session) throws Exception;
  }

  /** Runs the job and prints its outcome; returns the exit code. */
  static int run(CommandLine cl, Boolean progress, Job job) throws Exception {
    return run(cl, progress, false, job);
  }

  /** As {@link #run(CommandLine, Boolean, Job)}; {@code allOffers} lists every variant of the plan. */
  static int run(CommandLine cl, Boolean progress, boolean allOffers, Job job) throws Exception {
    PrintWriter out = cl.getOut();
    PrintWriter err = cl.getErr();
    try (StopSignals signals = StopSignals.install(err)) {
      RunOutcome o = job.run(new RunSession(signals.flag(), new Watcher(out, err, progress)));
      print(out, o, allOffers);
      // A signal stops the integer stage too, which then ends with its best portfolio so far: the run
      // was still stopped, whatever the LP stage proved.
      return signals.flag().get() ? ExitCodes.STOPPED : ExitCodes.of(o);
    }
  }

  static void print(PrintWriter out, RunOutcome o) {
    print(out, o, false);
  }

  static void print(PrintWriter out, RunOutcome o, boolean allOffers) {
    if (o instanceof RunOutcome.Solved s) {
      Summary.print(out, s.space(), s.lp(), s.result(), s.runDir(), allOffers);
    } else if (o instanceof RunOutcome.AlreadyOptimal a) {
      out.println(a.runDir() + ": the run is already optimal (objective " + Figures.money(a.objective())
          + "); nothing to resume");
    } else if (o instanceof RunOutcome.EndedInfeasible i) {
      out.println(i.runDir() + ": the run ended infeasible (" + i.reason()
          + "); a resume cannot change that — fix the catalog and solve again");
    }
    out.flush();
  }

  /** Progress and notes on stderr, the resume line on stdout. */
  private record Watcher(PrintWriter out, PrintWriter err, Boolean progress) implements RunSession.Watcher {
    @Override
    public List<ColGenListener> loop() {
      Progress p = Progress.choose(err, progress, "");
      return p == null ? List.of() : List.of(p);
    }

    @Override
    public List<PortfolioListener> portfolio() {
      if (Progress.choose(err, progress, "") == null) {
        return List.of();
      }
      return List.of(e -> {
        err.println(String.format(Locale.ROOT, "range %8s  %-12s  best %14s  upper limit %14s  %s",
            Durations.format(e.elapsedMs()), StageWords.step(e.kind().word()),
            e.kind().isPortfolio() || e.kind() == PortfolioEvent.Kind.MIP ? Figures.money(e.value()) : "—",
            Figures.money(e.bound()), StageWords.what(e.kind().word(), e.pool(), e.count(), e.note())));
        err.flush();
      });
    }

    @Override
    public void note(String text) {
      err.println("mixwright: note: " + text);
      err.flush();
    }

    @Override
    public void scenarioProgress(String line) {
      if (Progress.wanted(progress)) {
        err.println("mixwright: " + line.strip());
        err.flush();
      }
    }

    @Override
    public void resuming(RunSession.ResumePoint p) {
      out.println(String.format(Locale.ROOT, "resuming %s: session %d, %d columns from the earlier sessions%s, after round %d"
              + " (%s so far)%s", p.runDir(), p.session(), p.pooledColumns(),
          p.leftOut() > 0 ? " (" + p.leftOut() + " left out: no longer sellable or duplicated)" : "",
          p.afterRound(), Durations.format(p.elapsedMs()),
          Double.isFinite(p.bound()) ? ", bound " + Figures.money(p.bound()) : ""));
      out.flush();
    }
  }
}
