package dev.mixwright.run;

import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.portfolio.IntegerStage;
import dev.mixwright.portfolio.PortfolioListener;
import dev.mixwright.portfolio.PortfolioOutcome;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.report.Figures;
import dev.mixwright.report.PortfolioPending;
import dev.mixwright.report.PortfolioSection;
import dev.mixwright.report.ResultWriter;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.PortfolioCheckpoint;
import dev.mixwright.runfolder.PortfolioLog;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.function.BooleanSupplier;
import java.util.function.Consumer;

/**
 * The integer stage after the LP stage: runs it, logs it, checkpoints it and adds its section to
 * result.json. result.json says the portfolio is pending from before the stage starts until its
 * section is written, so a run cut off during the stage is never taken for a finished one.
 */
final class PortfolioStep {
  private PortfolioStep() {}

  /**
   * Where the stage's checkpoint goes and whose it is; {@code resume}: warm-start from a checkpoint
   * left by an earlier session; {@code note} hears what a person should know about it.
   */
  record Checkpoints(RunFolder folder, String runId, String catalogSha256, boolean resume, Consumer<String> note) {}

  /**
   * Runs the stage when the catalog has a portfolio section and the options do not skip it, writing
   * {@code portfolio.jsonl} and {@code portfolio-state.json}; returns {@code result} with its
   * {@code portfolio} section (or why there is none), its elapsedMs then covering both stages.
   * {@code watchers} hear the stage's events. The LP stage's result.json is written first, marked
   * pending, so a signal or a kill during the stage loses nothing of it; {@code stop} ends the stage
   * early with the best portfolio so far, still marked pending.
   */
  static RunResult attach(VariantSpace space, SolveOutcome lp, PortfolioPlan plan, Checkpoints cp, RunResult result,
      long startNanos, List<PortfolioListener> watchers, BooleanSupplier stop) throws IOException {
    if (space.catalog().portfolio().isEmpty() || !plan.run()) {
      return result;
    }
    if (!lp.status().isOptimal()) {
      // A stopped LP stage means a limit or a signal ended the run: the integer stage, which can
      // take minutes, waits until 'resume' has finished the LP.
      return result.withPortfolioPending(lp.status() == RunStatus.STOPPED
          ? PortfolioPending.LP_STOPPED
          : "nothing can be sold, so there is no portfolio to choose");
    }
    Path runDir = cp.folder().dir();
    ResultWriter.write(runDir, result.withPortfolioPending(PortfolioPending.RUNNING));
    PortfolioSettings settings = plan.settings();
    PortfolioCheckpoint.Stamp stamp = new PortfolioCheckpoint.Stamp(cp.runId(), cp.catalogSha256(), words(settings));
    IntegerStage stage = new IntegerStage(space, settings).stopWhen(StopCriterion.signal(stop));
    if (cp.resume()) {
      warmStart(space, stage, cp, stamp);
    }
    stage.checkpointTo(c -> {
      try {
        PortfolioCheckpoint.write(cp.folder(), stamp, c);
      } catch (IOException e) {
        throw new UncheckedIOException("cannot write " + PortfolioCheckpoint.file(cp.folder()) + ": "
            + e.getMessage(), e);
      }
    });
    try (PortfolioLog log = new PortfolioLog(runDir)) {
      stage.addListener(log);
      watchers.forEach(stage::addListener);
      PortfolioOutcome o = stage.run(lp);
      // A signal cut the stage short: its portfolio is written, but the run still owes the stage's end.
      String pending = stop.getAsBoolean() ? PortfolioPending.INTERRUPTED : null;
      return result.withPortfolioPending(pending).withPortfolio(PortfolioSection.of(space, stage.terms(), o),
          (System.nanoTime() - startNanos) / 1_000_000);
    }
  }

  /** The settings that decide what the stage's pool and incumbent mean (not its time limit). */
  static String words(PortfolioSettings s) {
    return String.format(Locale.ROOT, "mip solver %s, survivor limit %d, relaxation rounds %d, per round %d, gap %s",
        s.engine().word(), s.survivorLimit(), s.relaxationRounds(), s.perRound(), Double.toString(s.gap()));
  }

  /** Feeds an earlier session's checkpoint to the stage when it is this problem's; says why not otherwise. */
  private static void warmStart(VariantSpace space, IntegerStage stage, Checkpoints cp, PortfolioCheckpoint.Stamp stamp) {
    if (!Files.exists(PortfolioCheckpoint.file(cp.folder()))) {
      cp.note().accept("the integer stage had left no checkpoint; it starts afresh from the LP stage's columns");
      return;
    }
    PortfolioCheckpoint.Loaded loaded = PortfolioCheckpoint.read(cp.folder(), stamp);
    if (loaded.checkpoint().isEmpty()) {
      cp.note().accept(loaded.problem() + "; ignoring it, the integer stage starts afresh");
      return;
    }
    IntegerStage.Checkpoint c = loaded.checkpoint().get();
    for (List<int[]> vs : List.of(c.pool(), c.incumbent())) {
      for (int[] v : vs) {
        if (!fits(space, v)) {
          cp.note().accept(PortfolioCheckpoint.FILE + " holds a variant this catalog cannot build; ignoring it,"
              + " the integer stage starts afresh");
          return;
        }
      }
    }
    stage.warmStart(c);
    cp.note().accept(String.format(Locale.ROOT, "continuing the integer stage from %s: %d candidate variants%s",
        PortfolioCheckpoint.FILE, c.pool().size(), c.incumbent().isEmpty() ? ", no range found yet"
            : ", a best range of " + c.incumbent().size() + " variants worth " + Figures.money(c.value())));
  }

  private static boolean fits(VariantSpace space, int[] v) {
    if (v.length != space.groupCount()) {
      return false;
    }
    for (int g = 0; g < v.length; g++) {
      if (v[g] < 0 || v[g] >= space.choiceCount(g)) {
        return false;
      }
    }
    return space.isBuildable(v);
  }
}
