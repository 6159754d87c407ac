package dev.mixwright.run;

import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.portfolio.IntegerStage;
import dev.mixwright.portfolio.PortfolioListener;
import dev.mixwright.portfolio.PortfolioOutcome;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.report.PortfolioSection;
import dev.mixwright.report.ResultWriter;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.PortfolioLog;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.function.BooleanSupplier;

/** The integer stage after the LP stage: runs it, logs it, and adds its section to result.json. */
final class PortfolioStep {
  private PortfolioStep() {}

  /** The id of the first segment that chooses, if any. */
  private static java.util.Optional<String> choosingSegment(VariantSpace space) {
    for (int s = 0; s < space.segmentCount(); s++) {
      if (space.chooses(s)) {
        return java.util.Optional.of(space.catalog().segments().get(s).id());
      }
    }
    return java.util.Optional.empty();
  }

  /**
   * Runs the stage when the catalog has a portfolio section and the options do not skip it, writing
   * {@code portfolio.jsonl}; returns {@code result} with its {@code portfolio} section (or why there
   * is none), its elapsedMs then covering both stages. {@code watchers} hear the stage's events.
   * The LP stage's result.json is written first, so a signal during the stage loses nothing of it;
   * {@code stop} ends the stage early with the best portfolio so far.
   */
  static RunResult attach(VariantSpace space, SolveOutcome lp, PortfolioPlan plan, Path runDir, RunResult result,
      long startNanos, List<PortfolioListener> watchers, BooleanSupplier stop) throws IOException {
    if (space.catalog().portfolio().isEmpty() || !plan.run()) {
      return result;
    }
    if (choosingSegment(space).isPresent()) {
      // The one place the integer stage is kept from catalogs with segments that choose: it sells
      // each variant up to a fixed share of demand and has no stay-out, so its plan would be wrong.
      return result.withPortfolioPending("segment '" + choosingSegment(space).get() + "' chooses by multinomial"
          + " logit, and this version's integer stage handles fixed demand only; the LP plan above stands,"
          + " the portfolio is not chosen");
    }
    if (!lp.status().isOptimal()) {
      // A stopped LP stage means a limit or a signal ended the run: the integer stage, which can
      // take minutes, waits until 'resume' has finished the LP.
      return result.withPortfolioPending(lp.status() == RunStatus.STOPPED
          ? "the LP stage stopped before its optimum; 'mixwright resume' finishes it and then runs the integer stage"
          : "nothing can be sold, so there is no portfolio to choose");
    }
    ResultWriter.write(runDir, result);
    PortfolioSettings settings = plan.settings();
    IntegerStage stage = new IntegerStage(space, settings).stopWhen(StopCriterion.signal(stop));
    try (PortfolioLog log = new PortfolioLog(runDir)) {
      stage.addListener(log);
      watchers.forEach(stage::addListener);
      PortfolioOutcome o = stage.run(lp);
      return result.withPortfolio(PortfolioSection.of(space, stage.terms(), o),
          (System.nanoTime() - startNanos) / 1_000_000);
    }
  }
}
