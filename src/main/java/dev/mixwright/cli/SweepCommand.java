package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.engine.Engines;
import dev.mixwright.engine.Tally;
import dev.mixwright.report.MatrixView;
import dev.mixwright.report.SweepTable;
import dev.mixwright.run.SweepRun;
import dev.mixwright.run.SweepWork;
import dev.mixwright.runfolder.Json;
import dev.mixwright.scenario.SweepPlan;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

@Command(
    name = "sweep",
    description = {
      "Solves a grid or list of scenarios and writes one table of the results.",
      "Each scenario is solved to its proven LP optimum; the table holds the objective, bound, binding resources and shadow prices of each scenario (OUT/sweep.csv and OUT/sweep.json, rewritten after every scenario). When the catalog has a portfolio section, each scenario also runs the integer stage (--portfolio-time-limit counts per scenario) and the table holds its value and the chosen variants by code, one code list for the whole sweep. Neighbouring scenarios start from each other's columns. Along a capacity or demand axis the table holds the value per extra unit between neighbouring points: the capacity value curve, found by re-running the search. Run it again with the same arguments to finish a sweep that was stopped or cut off.",
      "",
      "Grid axes (--grid, repeatable, crossed with each other):",
      "  resources.ID.capacity=10000..16000:1000    figures, FROM..TO:STEP",
      "  options.GROUP.OPTION.cost=-10%%..+10%%:10%%   changes in percent",
      "  options.GROUP.OPTION.price=+0,+50,+100     changes, listed",
      "  segments.ID.demand=8000,9000               also segments.ID.maxShare",
      "  rules.ID=on,off                            a rule switched",
      "  portfolio.minLot=...                       also portfolio.introductionCost,",
      "                                             portfolio.maxVariants",
      ""
    })
final class SweepCommand extends CatalogCommand {
  @Option(names = "--grid", paramLabel = "PATH=VALUES", description = "one axis of the grid (see above)")
  List<String> grid = new ArrayList<>();

  @Option(names = "--sweep", paramLabel = "FILE", description = "a sweep file: base, grid and/or listed scenarios")
  Path sweepFile;

  @Option(names = "--scenario", paramLabel = "FILE",
      description = "a scenario file applied under every point of the sweep (repeatable: listed scenarios"
          + " when there is no grid)")
  List<Path> scenarioFiles = new ArrayList<>();

  @Option(names = "--out", required = true, paramLabel = "DIR", description = "folder for sweep.csv and sweep.json")
  Path outDir;

  @Mixin LoopOptions loop;

  @Option(names = "--cold", description = "solve every scenario from scratch (no warm start; for checking)")
  boolean cold;

  @Option(names = "--replace", description = "start afresh although OUT holds a different sweep")
  boolean replace;

  @Option(names = "--json", description = "print sweep.json on stdout instead of the table")
  boolean json;

  @Mixin PortfolioOptions portfolio;

  @Mixin ProgressOption progressOption;

  @Mixin TableReachOption tables;

  @Option(names = "--engine", paramLabel = "NAME", defaultValue = Engines.LOCAL,
      description = "what solves the points: local (this machine's threads, the default) or spark (a Spark"
          + " cluster, when run through spark-submit with the spark module's jar)")
  String engine;

  @Option(names = "--chain", paramLabel = "N", defaultValue = "" + SweepWork.DEFAULT_CHAIN,
      converter = Converters.PositiveCount.class,
      description = "points solved one after another from each other's columns; the chains run side by side"
          + " (default ${DEFAULT-VALUE}; the same on every engine, so the table is too)")
  int chain;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    Boolean progress = progressOption.asked;
    SweepRun.Request request = new SweepRun.Request(catalogFile, Optional.ofNullable(sweepFile), grid, scenarioFiles,
        outDir, loop.settings(), loop.pricer, !cold, replace, engine, chain, portfolio.plan(), tables.reach());
    SweepRun.Outcome o;
    try (StopSignals signals = StopSignals.install(err)) {
      o = SweepRun.run(request, signals.flag(), new SweepRun.Watcher() {
        @Override
        public void solved(ObjectNode row, Tally tally) {
          if (Progress.wanted(progress)) {
            err.println("  " + row.path("name").asText() + ": " + (row.path("objective").isNumber()
                ? row.path("status").asText() + ", objective " + Figures.money(row.path("objective").asDouble())
                : row.path("status").asText()) + "   [" + tally.line("point") + "]");
            err.flush();
          }
        }

        @Override
        public void failed(int points, String why, Tally tally) {
          err.println("mixwright: a chain of " + points + " points failed (" + why + "); the engine tries it again"
              + " if it can   [" + tally.line("point") + "]");
          err.flush();
        }

        @Override
        public void finished(String engineName, Tally tally) {
          if (Progress.wanted(progress)) {
            err.println("mixwright: engine " + engineName + ": " + tally.summary("point"));
            err.flush();
          }
        }

        @Override
        public void note(String text) {
          err.println("mixwright: " + text);
          err.flush();
        }
      });
    }
    if (json) {
      out.println(Json.pretty().writeValueAsString(o.table().toJson()));
    } else {
      print(out, o.table(), o.plan(), o.catalog(), o.solvedNow(), o.kept());
    }
    out.flush();
    return o.complete() ? ExitCodes.OK : ExitCodes.STOPPED;
  }

  private static void print(PrintWriter out, SweepTable table, SweepPlan plan, Catalog catalog, int solved,
      int kept) {
    out.println(String.format(Locale.ROOT, "%s: %d scenarios (%d solved now, %d kept from before)",
        plan.name(), table.rows().size(), solved, kept));
    for (ObjectNode n : table.rows().values()) {
      StringBuilder prices = new StringBuilder();
      n.path("resources").fields().forEachRemaining(e -> {
        double p = e.getValue().path("shadowPrice").asDouble();
        if (p > 1e-9) {
          prices.append(prices.length() == 0 ? "" : ", ").append(e.getKey()).append(' ').append(Figures.price(p));
        }
      });
      StringBuilder slope = new StringBuilder();
      n.path("valuePerUnit").fields().forEachRemaining(e -> {
        if (e.getValue().isNumber()) {
          slope.append("  +1 unit: ").append(Figures.price(e.getValue().asDouble()));
        }
      });
      out.println(String.format(Locale.ROOT, "  %-48s %-10s %18s  %s%s", n.path("name").asText(),
          n.path("status").asText(), n.path("objective").isNumber() ? Figures.money(n.path("objective").asDouble()) : "",
          prices.length() == 0 ? (n.has("problem") ? n.path("problem").asText() : "no binding resource") : prices,
          slope));
      JsonNode pf = n.path("portfolio");
      if (pf.isObject()) {
        List<String> codes = new ArrayList<>();
        pf.path("codes").forEach(c -> codes.add(c.asText()));
        out.println(String.format(Locale.ROOT, "  %-48s %-10s %18s  %s", "", pf.path("status").asText(),
            Figures.money(pf.path("value").asDouble()), "range: " + String.join(" ", codes)));
      }
    }
    JsonNode legend = table.toJson().path("portfolioVariants");
    if (legend.isObject()) {
      out.println("variants of the ranges (the same code on every row):");
      legend.fields().forEachRemaining(e -> {
        Map<String, String> o = new LinkedHashMap<>();
        e.getValue().fields().forEachRemaining(x -> o.put(x.getKey(), x.getValue().asText()));
        out.println("  " + e.getKey() + "  " + MatrixView.describe(catalog, o));
      });
    }
  }
}
