package dev.mixwright.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.portfolio.IntegerStage;
import dev.mixwright.portfolio.PortfolioOutcome;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.report.PortfolioLog;
import dev.mixwright.report.PortfolioSection;
import dev.mixwright.report.ResultWriter;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.function.BooleanSupplier;

/** The integer stage inside {@code solve}: runs it, logs it, and adds its section to result.json. */
final class PortfolioRun {
  private PortfolioRun() {}

  /**
   * Runs the stage when the catalog has a portfolio section and the options do not skip it, writing
   * {@code portfolio.jsonl} and putting {@code portfolio} into {@code result}; {@code result}'s
   * elapsedMs then covers both stages. Progress lines go to {@code progress} unless it is null.
   * The LP stage's result.json is written first, so a signal during the stage loses nothing of it;
   * {@code stop} ends the stage early with the best portfolio so far.
   */
  static void attach(VariantSpace space, SolveOutcome lp, PortfolioOptions options, Path runDir, ObjectNode result,
      long startNanos, PrintWriter progress, BooleanSupplier stop) throws IOException {
    if (space.catalog().portfolio().isEmpty() || options.skip) {
      return;
    }
    if (!lp.status().isOptimal()) {
      // A stopped LP stage means a limit or a signal ended the run: the integer stage, which can
      // take minutes, waits until 'resume' has finished the LP.
      result.put("portfolioPending", lp.status() == RunStatus.STOPPED
          ? "the LP stage stopped before its optimum; 'mixwright resume' finishes it and then runs the integer stage"
          : "nothing can be sold, so there is no portfolio to choose");
      return;
    }
    ResultWriter.write(runDir, result);
    PortfolioSettings settings = options.settings();
    IntegerStage stage = new IntegerStage(space, settings).stopWhen(StopCriterion.signal(stop));
    try (PortfolioLog log = new PortfolioLog(runDir)) {
      stage.addListener(log);
      if (progress != null) {
        stage.addListener(e -> {
          progress.println(String.format(Locale.ROOT, "portfolio %-10s value %s  bound %s  pool %d  %s  %s",
              e.kind().word(), Numbers.money(e.value()), Numbers.money(e.bound()), e.pool(), e.note(),
              Durations.format(e.elapsedMs())));
          progress.flush();
        });
      }
      PortfolioOutcome o = stage.run(lp);
      PortfolioSection.put(result, space, stage.terms(), o);
      result.put("elapsedMs", (System.nanoTime() - startNanos) / 1_000_000);
    }
  }

  /** The summary lines of the integer stage, when result.json has one. */
  static void print(PrintWriter out, VariantSpace space, JsonNode result) {
    JsonNode p = result.get("portfolio");
    if (p == null) {
      if (result.has("portfolioPending")) {
        out.println("  integer portfolio   not run: " + result.get("portfolioPending").asText());
      }
      return;
    }
    String cur = space.catalog().currency() == null ? "" : " " + space.catalog().currency();
    out.println("  integer portfolio   " + p.get("status").asText()
        + (p.has("reason") ? " (" + p.get("reason").asText() + ")" : ""));
    out.println("    value             " + Numbers.money(p.get("value").asDouble()) + cur
        + "   after introduction costs " + Numbers.money(p.get("introductionCosts").asDouble()) + cur);
    out.println("    bound             " + Numbers.money(p.path("bound").asDouble(Double.NaN)) + cur
        + "   gap " + Numbers.percent(p.path("gap").asDouble(Double.NaN)));
    JsonNode proof = p.get("proof");
    out.println(String.format(Locale.ROOT, "    %d variants, MIP %s, pool %d, survivors added %d%s, time %s",
        p.get("variants").size(), p.get("solver").get("engine").asText(), proof.get("poolVariants").asInt(),
        proof.get("survivorsAdded").asInt(), proof.get("survivorsComplete").asBoolean() ? " (all)" : "",
        Durations.format(p.get("elapsedMs").asLong())));
    int shown = 0;
    for (JsonNode v : p.get("variants")) {
      if (shown++ == 8) {
        out.println("      ... " + (p.get("variants").size() - 8) + " more in result.json");
        break;
      }
      StringBuilder sales = new StringBuilder();
      v.get("sales").fields().forEachRemaining(e -> sales.append(sales.length() == 0 ? "" : ", ")
          .append(e.getKey()).append(' ').append(Numbers.qty(e.getValue().asDouble())));
      StringBuilder opts = new StringBuilder();
      v.get("options").fields().forEachRemaining(e -> {
        if (!e.getValue().asText().equals("none")) {
          opts.append(opts.length() == 0 ? "" : ",").append(e.getKey()).append('=').append(e.getValue().asText());
        }
      });
      out.println("      " + opts + "  [" + sales + "]");
    }
  }
}
