package dev.mixwright.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** The few lines a person reads after a solve. */
final class Summary {
  private Summary() {}

  static void print(PrintWriter out, VariantSpace space, SolveOutcome o, ObjectNode result, Path runDir) {
    String cur = space.catalog().currency() == null ? "" : " " + space.catalog().currency();
    out.println(space.catalog().name() + ": " + o.status().word()
        + (o.stopReason().isEmpty() ? "" : " (" + o.stopReason() + ")"));
    JsonNode bv = result.get("buildableVariants");
    out.println("  buildable variants  " + (bv.isNull()
        ? "at most " + result.get("buildableVariantsAtMost").asText() : bv.asText()));
    out.println("  LP objective        " + Numbers.money(o.objective()) + cur);
    out.println("  proven bound        " + Numbers.money(o.bound()) + cur + "   gap " + Numbers.percent(o.gap()));
    out.println(String.format(Locale.ROOT, "  rounds %d, columns generated %d, LP stage %s",
        o.iterations(), o.columnsGenerated(), Durations.format(o.elapsedMs())));
    List<String> binding = new ArrayList<>();
    for (JsonNode r : result.get("resources")) {
      if (r.get("shadowPrice").asDouble() > 1e-9) {
        binding.add(r.get("id").asText() + " " + Numbers.money(r.get("shadowPrice").asDouble()));
      }
    }
    out.println("  shadow prices       " + (binding.isEmpty() ? "none (no resource limits the plan)" : String.join(", ", binding)));
    JsonNode offers = result.get("offers");
    out.println("  offers              " + offers.size() + " (variant, segment) pairs");
    int shown = 0;
    for (JsonNode off : offers) {
      if (shown++ == 8) {
        out.println("    ... " + (offers.size() - 8) + " more in result.json");
        break;
      }
      StringBuilder v = new StringBuilder();
      off.get("options").fields().forEachRemaining(e -> {
        if (!e.getValue().asText().equals("none")) {
          v.append(v.length() == 0 ? "" : ",").append(e.getKey()).append('=').append(e.getValue().asText());
        }
      });
      out.println(String.format(Locale.ROOT, "    %-14s %10s x %s", off.get("segment").asText(),
          Numbers.qty(off.get("quantity").asDouble()), v));
    }
    printPortfolio(out, space, result);
    out.println("  written to          " + runDir);
    if (o.status() == RunStatus.STOPPED) {
      out.println("  continue with       mixwright resume " + runDir);
    }
    out.flush();
  }

  /** The summary lines of the integer stage, when result.json has one. */
  private static void printPortfolio(PrintWriter out, VariantSpace space, JsonNode result) {
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
