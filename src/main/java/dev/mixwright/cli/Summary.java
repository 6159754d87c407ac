package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.report.MatrixView;
import dev.mixwright.report.VariantCodes;
import dev.mixwright.report.RunResult;
import dev.mixwright.report.StageWords;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** The few lines a person reads after a solve. */
final class Summary {
  private Summary() {}

  /** Rows of the matrix view shown unless every offer is asked for. */
  static final int SHOWN_VARIANTS = 8;

  static void print(PrintWriter out, VariantSpace space, SolveOutcome o, RunResult result, Path runDir) {
    print(out, space, o, result, runDir, false);
  }

  /** The summary; {@code allOffers} shows every variant of the plan instead of the first eight. */
  static void print(PrintWriter out, VariantSpace space, SolveOutcome o, RunResult result, Path runDir,
      boolean allOffers) {
    String cur = space.catalog().currency() == null ? "" : " " + space.catalog().currency();
    out.println(space.catalog().name() + ": " + o.status().word()
        + (o.stopReason().isEmpty() ? "" : " (" + o.stopReason() + ")"));
    out.println("  buildable variants  " + (result.buildableVariants() == null
        ? "at most " + result.buildableVariantsAtMost() : result.buildableVariants()));
    out.println("  LP objective        " + Figures.money(o.result().value()) + cur);
    out.println("  proven bound        " + Figures.money(o.result().bound()) + cur + "   gap " + Figures.percent(o.result().gap()));
    out.println(String.format(Locale.ROOT, "  rounds %d, columns %d (the starting ones included), LP stage %s",
        o.iterations(), o.columnsGenerated(), Durations.format(o.elapsedMs())));
    List<String> binding = new ArrayList<>();
    for (RunResult.ResourceRow r : result.resources()) {
      if (r.shadowPrice() != null && r.shadowPrice() > 1e-9) {
        binding.add(r.id() + " " + Figures.price(r.shadowPrice()));
      }
    }
    out.println("  shadow prices       " + (binding.isEmpty() ? "none (no resource limits the plan)" : String.join(", ", binding)));
    MatrixView matrix = MatrixView.of(result, space.catalog());
    VariantCodes codes = VariantCodes.of(result);
    long lpVariants = result.offers().stream().map(f -> VariantCodes.key(f.options())).distinct().count();
    out.println("  offers              " + result.offers().size() + " (variant, segment) pairs of " + lpVariants
        + " variants" + (matrix.rows().size() > lpVariants ? "; the table adds the portfolio's other variants ("
            + matrix.rows().size() + " rows)" : "") + ", units by segment:");
    matrix(out, matrix, allOffers ? Integer.MAX_VALUE : SHOWN_VARIANTS, "    ");
    if (!allOffers && matrix.rows().size() > SHOWN_VARIANTS) {
      out.println("    (every variant: solve with --all-offers, or mixwright export " + runDir + " --format text)");
    }
    printPortfolio(out, space, result, codes, allOffers);
    out.println("  written to          " + runDir);
    if (o.status() == RunStatus.STOPPED) {
      out.println("  continue with       mixwright resume " + runDir);
    }
    out.flush();
  }

  /** Characters a line of the summary may take: $COLUMNS when the shell exports it, else 120. */
  static int width() {
    try {
      int c = Integer.parseInt(System.getenv().getOrDefault("COLUMNS", "").trim());
      return c >= 60 ? c : DEFAULT_WIDTH;
    } catch (NumberFormatException e) {
      return DEFAULT_WIDTH;
    }
  }

  static final int DEFAULT_WIDTH = 120;

  /** The matrix view's lines, each indented, cut into blocks that fit {@link #width()}. */
  static void matrix(PrintWriter out, MatrixView m, int maxRows, String indent) {
    m.lines(Figures::units, maxRows, width() - indent.length()).forEach(line -> out.println(indent + line));
  }

  /** The summary lines of the integer stage, when the result has one. */
  private static void printPortfolio(PrintWriter out, VariantSpace space, RunResult result, VariantCodes codes,
      boolean all) {
    RunResult.Portfolio p = result.portfolio();
    if (result.portfolioPending() != null) {
      out.println("  integer portfolio   " + (p == null ? "not run: " : "not final: ") + result.portfolioPending());
    }
    if (p == null) {
      return;
    }
    String cur = space.catalog().currency() == null ? "" : " " + space.catalog().currency();
    out.println("  integer portfolio   " + (p.status().isProven() ? "proven the best range"
        : "not proven the best" + (p.reason().isEmpty() ? "" : " (" + StageWords.plain(p.reason()) + ")")));
    out.println("    value             " + Figures.money(p.value()) + cur
        + "   after introduction costs " + Figures.money(p.introductionCosts()) + cur);
    out.println("    bound             " + Figures.money(orNaN(p.bound())) + cur
        + "   gap " + Figures.percent(orNaN(p.gap())));
    if (!p.status().isProven() && p.bound() != null) {
      // what the gap is worth and what to do about it, as the report says it
      out.println("    a better range would be worth at most " + Figures.money(p.bound() - p.value()) + cur
          + " more; if that matters, give the search more time (--portfolio-time-limit) and solve again");
    }
    RunResult.Proof proof = p.proof();
    String change = p.kept() == null ? "," : String.format(Locale.ROOT,
        "; against today's range: kept %d, dropped %d, added %d;", p.kept().size(), p.dropped().size(),
        p.added().size());
    // a pinned variant of today's range that no segment buys stays on sale, outside the selling variants
    long idle = p.kept() == null ? 0 : p.kept().stream().filter(k -> k.sales() == null || k.sales().isEmpty()).count();
    String onSale = idle == 0 ? p.variants().size() + " variants" : (p.variants().size() + idle) + " variants on sale ("
        + idle + " kept from today's range, selling nothing)";
    out.println("    " + onSale + (change.equals(",") ? "" : change.substring(0, change.length() - 1)));
    out.println(String.format(Locale.ROOT, "    chosen by the exact search among %,d candidate variants"
            + " (%,d of them added to check that none does better%s), time %s",
        proof.poolVariants(), proof.survivorsAdded(),
        proof.survivorsComplete() ? ", every one that could" : "", Durations.format(p.elapsedMs())));
    if (p.kept() != null) {
      out.println("    today's range     " + (p.currentRangeValue() == null ? "does not fit as a fixed portfolio"
          : Figures.money(p.currentRangeValue()) + cur + " as a fixed portfolio") + "; discontinue costs paid "
          + Figures.money(p.discontinueCosts() == null ? 0 : p.discontinueCosts()) + cur);
    }
    int shown = 0;
    for (RunResult.PortfolioVariant v : p.variants()) {
      if (!all && shown++ == SHOWN_VARIANTS) {
        out.println("      ... " + (p.variants().size() - SHOWN_VARIANTS) + " more in result.json");
        break;
      }
      StringBuilder sales = new StringBuilder();
      v.sales().forEach((s, q) -> sales.append(sales.length() == 0 ? "" : ", ").append(s).append(' ')
          .append(Figures.units(q)));
      out.println("      " + codes.code(v.options()) + "  " + sales);
    }
    printScenarios(out, p, cur);
  }

  /** The range's scenarios (weight, value, best alone, regret) and the hold-out check, when the range is across a set. */
  private static void printScenarios(PrintWriter out, RunResult.Portfolio p, String cur) {
    if (p.scenarios() == null) {
      return;
    }
    out.println("    across " + p.scenarios().size() + " scenarios, value = " + ("worst".equals(p.aim())
        ? "the worst scenario's" : "the weighted mean") + ":");
    int width = Math.max(8, p.scenarios().stream().mapToInt(r -> r.id().length()).max().orElse(8));
    out.println(String.format(Locale.ROOT, "      %-" + width + "s %7s %14s %14s %14s", "scenario", "weight", "value",
        "best alone", "regret"));
    int shown = 0;
    for (RunResult.ScenarioRow r : p.scenarios()) {
      if (shown++ == 12) {
        out.println("      ... " + (p.scenarios().size() - 12) + " more in result.json");
        break;
      }
      out.println(String.format(Locale.ROOT, "      %-" + width + "s %7s %14s %14s %14s%s", r.id(), Figures.weight(r.weight()),
          Figures.money(r.value()), Figures.money(r.bestAlone()), Figures.money(r.regret()),
          r.bestAloneStatus().isProven() ? "" : "  (best alone heuristic)"));
    }
    RunResult.HoldOut h = p.holdOut();
    if (h != null) {
      out.println(String.format(Locale.ROOT, "    hold-out check    %d scenarios of %s%s: mean %s, 5%% %s, 95%% %s%s",
          h.scenarios(), h.source(), h.lotsMissed() > 0 ? " (" + h.lotsMissed() + " miss a minimum lot)" : "",
          Figures.money(orNaN(h.mean())), Figures.money(orNaN(h.p5())), Figures.money(orNaN(h.p95())), cur));
    }
  }

  private static double orNaN(Double v) {
    return v == null ? Double.NaN : v;
  }
}
