package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import dev.mixwright.colgen.ColGenListener;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.IterationRecord;
import dev.mixwright.colgen.SolveOutcome;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;

/**
 * Progress for a person, always on stderr so that stdout stays clean for {@code --json}. On a
 * terminal, one live line rewritten in place with a carriage return (elapsed, round, objective,
 * bound, gap, columns, columns per second), its clock ticking between rounds; elsewhere (a log
 * file, a pipe) one plain labelled line per round.
 */
final class Progress implements ColGenListener {
  private final PrintWriter err;
  private final boolean live;
  private final int width;
  private final String prefix;
  private ScheduledExecutorService ticker;
  private IterationRecord last;
  private long lastAtNanos;
  private int firstColumns = -1;
  private long firstElapsed;
  private int shownLength;

  /** Plain lines, one per round. */
  Progress(PrintWriter err) {
    this(err, false, 0, "");
  }

  /**
   * @param live rewrite one line in place (a terminal) rather than print one per round
   * @param width characters a live line may take (the terminal's width); 0 for the default 80
   * @param prefix written before every line, e.g. the scenario of a sweep
   */
  Progress(PrintWriter err, boolean live, int width, String prefix) {
    this.err = err;
    this.live = live;
    this.width = width > 0 ? width : 80;
    this.prefix = prefix;
  }

  /**
   * Adds the display a command's {@code --progress}/{@code --no-progress} asks for: off when
   * refused, live on a terminal, plain lines when asked for and stderr is not a terminal.
   */
  static void attach(ColumnGeneration cg, PrintWriter err, Boolean asked, String prefix) {
    Progress p = choose(err, asked, prefix);
    if (p != null) {
      cg.addListener(p);
    }
  }

  static Progress choose(PrintWriter err, Boolean asked, String prefix) {
    return wanted(asked) ? new Progress(err, stderrIsTerminal(), terminalWidth(), prefix) : null;
  }

  /** Whether progress is shown: as --progress / --no-progress says, else when stderr is a terminal. */
  static boolean wanted(Boolean asked) {
    return asked != null ? asked : stderrIsTerminal();
  }

  /** Whether file descriptor 2 is a terminal: Linux names it under /proc; elsewhere the console decides. */
  static boolean stderrIsTerminal() {
    if ("dumb".equals(System.getenv("TERM"))) {
      return false;
    }
    try {
      String target = Files.readSymbolicLink(Path.of("/proc/self/fd/2")).toString();
      return target.startsWith("/dev/pts/") || target.startsWith("/dev/tty");
    } catch (IOException | UnsupportedOperationException | SecurityException e) {
      return System.console() != null;
    }
  }

  private static int terminalWidth() {
    try {
      return Integer.parseInt(System.getenv().getOrDefault("COLUMNS", "0").trim());
    } catch (NumberFormatException e) {
      return 0;
    }
  }

  @Override
  public synchronized void started(int seedColumns) {
    if (live && ticker == null) {
      ticker = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "mixwright-progress");
        t.setDaemon(true);
        return t;
      });
      ticker.scheduleAtFixedRate(this::tick, 1, 1, TimeUnit.SECONDS);
    }
  }

  @Override
  public synchronized void iteration(IterationRecord r) {
    if (firstColumns < 0) {
      firstColumns = r.columns();
      firstElapsed = r.elapsedMs();
    }
    last = r;
    lastAtNanos = System.nanoTime();
    if (live) {
      show(liveLine(r, r.elapsedMs()));
    } else {
      err.println(prefix + line(r));
      err.flush();
    }
  }

  @Override
  public synchronized void ended(SolveOutcome o) {
    if (ticker != null) {
      ticker.shutdownNow();
      ticker = null;
    }
    if (live && shownLength > 0) {
      err.print('\n');
      err.flush();
      shownLength = 0;
    }
  }

  private synchronized void tick() {
    if (last != null) {
      show(liveLine(last, last.elapsedMs() + (System.nanoTime() - lastAtNanos) / 1_000_000));
    }
  }

  private void show(String text) {
    String t = text.length() >= width ? text.substring(0, width - 1) : text;
    StringBuilder sb = new StringBuilder("\r").append(t);
    for (int i = t.length(); i < shownLength; i++) {
      sb.append(' ');
    }
    shownLength = t.length();
    err.print(sb);
    err.flush();
  }

  /** The live line at {@code elapsedMs}: compact, widest fields last so a narrow terminal cuts the rate first. */
  String liveLine(IterationRecord r, long elapsedMs) {
    double secs = (r.elapsedMs() - firstElapsed) / 1000.0;
    int added = r.columns() - firstColumns;
    String rate = secs > 0 && added > 0 ? String.format(Locale.ROOT, "%.1f col/s", added / secs) : "";
    return String.format(Locale.ROOT, "%s%8s  round %d  obj %s  bound %s  gap %s  cols %d  %s",
        prefix, Durations.format(elapsedMs), r.iteration(), compact(r.objective()), compact(r.bound()),
        Figures.percent(r.gap()), r.columns(), rate).stripTrailing();
  }

  private static String compact(double v) {
    if (!Double.isFinite(v)) {
      return "—";
    }
    return Math.abs(v) >= 1e5 ? Figures.wholeMoney(v) : Figures.money(v);
  }

  static String line(IterationRecord r) {
    return String.format(Locale.ROOT, "round %4d  objective %s  bound %s  gap %s  columns %d (+%d)  %s%s",
        r.iteration(), Figures.money(r.objective()), Figures.money(r.bound()), Figures.percent(r.gap()),
        r.columns(), r.added(), Durations.format(r.elapsedMs()), r.exactPricing() ? "" : "  (quick search: bound not updated)");
  }
}
