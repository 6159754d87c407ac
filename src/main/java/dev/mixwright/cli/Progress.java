package dev.mixwright.cli;

import dev.mixwright.colgen.ColGenListener;
import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.IterationRecord;
import java.io.PrintWriter;
import java.util.Locale;

/** One labelled line per round on stderr, for a person watching a terminal. */
final class Progress implements ColGenListener {
  private final PrintWriter err;

  Progress(PrintWriter err) {
    this.err = err;
  }

  @Override
  public void iteration(IterationRecord r) {
    err.println(line(r));
    err.flush();
  }

  static String line(IterationRecord r) {
    return String.format(Locale.ROOT, "round %4d  objective %s  bound %s  gap %s  columns %d (+%d)  %s%s",
        r.iteration(), Numbers.money(r.objective()), Numbers.money(r.bound()), Numbers.percent(r.gap()),
        r.columns(), r.added(), Durations.format(r.elapsedMs()), r.exactPricing() ? "" : "  (heuristic)");
  }
}
