package dev.mixwright.cli;

import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.report.RunResult;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** The few lines a person reads after a solve. */
final class Summary {
  private Summary() {}

  static void print(PrintWriter out, VariantSpace space, SolveOutcome o, RunResult result, Path runDir) {
    String cur = space.catalog().currency() == null ? "" : " " + space.catalog().currency();
    out.println(space.catalog().name() + ": " + o.status().word()
        + (o.stopReason().isEmpty() ? "" : " (" + o.stopReason() + ")"));
    out.println("  buildable variants  " + (result.buildableVariants() == null
        ? "at most " + result.buildableVariantsAtMost() : result.buildableVariants()));
    out.println("  LP objective        " + Numbers.money(o.objective()) + cur);
    out.println("  proven bound        " + Numbers.money(o.bound()) + cur + "   gap " + Numbers.percent(o.gap()));
    out.println(String.format(Locale.ROOT, "  rounds %d, columns generated %d, LP stage %s",
        o.iterations(), o.columnsGenerated(), Durations.format(o.elapsedMs())));
    List<String> binding = new ArrayList<>();
    for (RunResult.ResourceRow r : result.resources()) {
      if (r.shadowPrice() != null && r.shadowPrice() > 1e-9) {
        binding.add(r.id() + " " + Numbers.money(r.shadowPrice()));
      }
    }
    out.println("  shadow prices       " + (binding.isEmpty() ? "none (no resource limits the plan)" : String.join(", ", binding)));
    List<RunResult.Offer> offers = result.offers();
    out.println("  offers              " + offers.size() + " (variant, segment) pairs");
    int shown = 0;
    for (RunResult.Offer off : offers) {
      if (shown++ == 8) {
        out.println("    ... " + (offers.size() - 8) + " more in result.json");
        break;
      }
      out.println(String.format(Locale.ROOT, "    %-14s %10s x %s", off.segment(),
          Numbers.qty(off.quantity()), chosen(off.options())));
    }
    printPortfolio(out, space, result);
    out.println("  written to          " + runDir);
    if (o.status() == RunStatus.STOPPED) {
      out.println("  continue with       mixwright resume " + runDir);
    }
    out.flush();
  }

  /** group=option for every group with an option chosen, comma-separated. */
  static String chosen(Map<String, String> options) {
    StringBuilder v = new StringBuilder();
    options.forEach((g, c) -> {
      if (!c.equals("none")) {
        v.append(v.length() == 0 ? "" : ",").append(g).append('=').append(c);
      }
    });
    return v.toString();
  }

  /** The summary lines of the integer stage, when the result has one. */
  private static void printPortfolio(PrintWriter out, VariantSpace space, RunResult result) {
    RunResult.Portfolio p = result.portfolio();
    if (p == null) {
      if (result.portfolioPending() != null) {
        out.println("  integer portfolio   not run: " + result.portfolioPending());
      }
      return;
    }
    String cur = space.catalog().currency() == null ? "" : " " + space.catalog().currency();
    out.println("  integer portfolio   " + p.status().word() + (p.reason().isEmpty() ? ""
        : " (" + p.reason() + ")"));
    out.println("    value             " + Numbers.money(p.value()) + cur
        + "   after introduction costs " + Numbers.money(p.introductionCosts()) + cur);
    out.println("    bound             " + Numbers.money(orNaN(p.bound())) + cur
        + "   gap " + Numbers.percent(orNaN(p.gap())));
    RunResult.Proof proof = p.proof();
    String change = p.kept() == null ? "" : String.format(Locale.ROOT, " (kept %d, dropped %d, added %d)",
        p.kept().size(), p.dropped().size(), p.added().size());
    out.println(String.format(Locale.ROOT, "    %d variants%s, MIP %s, pool %d, survivors added %d%s, time %s",
        p.variants().size(), change, p.solver().engine(), proof.poolVariants(), proof.survivorsAdded(),
        proof.survivorsComplete() ? " (all)" : "", Durations.format(p.elapsedMs())));
    if (p.kept() != null) {
      out.println("    today's range     " + (p.currentRangeValue() == null ? "does not fit as a fixed portfolio"
          : Numbers.money(p.currentRangeValue()) + cur + " as a fixed portfolio") + "; discontinue costs paid "
          + Numbers.money(p.discontinueCosts() == null ? 0 : p.discontinueCosts()) + cur);
    }
    int shown = 0;
    for (RunResult.PortfolioVariant v : p.variants()) {
      if (shown++ == 8) {
        out.println("      ... " + (p.variants().size() - 8) + " more in result.json");
        break;
      }
      StringBuilder sales = new StringBuilder();
      v.sales().forEach((s, q) -> sales.append(sales.length() == 0 ? "" : ", ").append(s).append(' ')
          .append(Numbers.qty(q)));
      out.println("      " + chosen(v.options()) + "  [" + sales + "]");
    }
  }

  private static double orNaN(Double v) {
    return v == null ? Double.NaN : v;
  }
}
