package dev.mixwright.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.colgen.ColGenListener;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.Sweep;
import dev.mixwright.report.SweepTable;
import dev.mixwright.run.Inputs;
import dev.mixwright.run.RunStart;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.runfolder.Checksums;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunLock;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.Scenarios;
import dev.mixwright.scenario.SweepPlan;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(
    name = "sweep",
    mixinStandardHelpOptions = true,
    description = {
      "Solves a grid or list of scenarios and writes one table of the results.",
      "Each scenario is solved to its proven LP optimum; the table holds the objective, bound, binding resources and shadow prices of each scenario per scenario (OUT/sweep.csv and OUT/sweep.json, rewritten after every scenario). Neighbouring scenarios start from each other's columns. Along a capacity or demand axis the table holds the value per extra unit between neighbouring points: the capacity value curve, found by re-running the search. Run it again with the same arguments to finish a sweep that was stopped or cut off.  Grid axes (--grid, repeatable, crossed with each other): resources.ID.capacity=10000..16000:1000   figures, FROM..TO:STEP options.GROUP.OPTION.cost=-10%%..+10%%:10%%  changes in percent options.GROUP.OPTION.price=+0,+50,+100    changes, listed segments.ID.demand=8000,9000              also segments.ID.maxShare rules.ID=on,off                           a rule switched portfolio.minLot=...                      also portfolio.introductionCost, portfolio.maxVariants "
    })
final class SweepCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Parameters(index = "0", paramLabel = "CATALOG", description = "catalog file (.yaml, .yml or .json)")
  Path catalogFile;

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

  @Mixin ProgressOption progressOption;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    Boolean progress = progressOption.asked;
    if (sweepFile != null && !grid.isEmpty()) {
      throw new UserError("give the grid either with --grid or in the --sweep file, not both");
    }
    CatalogLoader.Hashed read = Inputs.hashedCatalog(catalogFile);
    Catalog catalog = read.catalog();
    String sha = read.sha256();
    SweepPlan plan;
    try {
      plan = plan(catalog);
    } catch (CatalogException e) {
      throw Inputs.problems(sweepFile != null ? "the sweep file " + sweepFile : "the --grid axes", e);
    }
    List<SweepPlan.Point> points = plan.points();
    if (points.isEmpty()) {
      throw new UserError("nothing to sweep: give --grid PATH=VALUES, a --sweep file, or --scenario files");
    }
    SolveSettings settings = loop.settings();
    ObjectNode header = Json.pretty().createObjectNode();
    header.put("format", 1);
    header.put("sweep", plan.name());
    ObjectNode cat = header.putObject("catalog");
    cat.put("name", catalog.name());
    cat.put("file", catalogFile.toString());
    cat.put("sha256", sha);
    header.put("pricer", loop.pricer.word());
    header.put("gap", loop.gap);
    header.put("warmStart", !cold);
    header.put("definitionSha256", definition(plan, sha, settings));
    SweepTable table = new SweepTable(plan, catalog, header);

    Files.createDirectories(outDir);
    RunFolder folder = new RunFolder(outDir);
    try (RunLock lock = RunStart.lock(folder);
        StopSignals signals = StopSignals.install(err)) {
      Set<Integer> done = keepEarlierRows(table, header, err);
      AtomicFiles.write(outDir.resolve("catalog.json"), CatalogWriter.toJson(catalog));
      table.write(outDir);
      Sweep sweep = new Sweep(catalog, plan, loop.pricer::create, settings, !cold);
      List<Sweep.Row> rows = sweep.run(done, () -> signals.flag().get(), new Sweep.Listener() {
        @Override
        public ColGenListener loopListener(SweepPlan.Point p, int nth, int total) {
          Progress pr = Progress.choose(err, progress, String.format(Locale.ROOT, "[%d/%d] ", nth, total));
          return pr;
        }

        @Override
        public void solved(Sweep.Row row) {
          table.add(row);
          try {
            table.write(outDir);
          } catch (IOException e) {
            throw new UncheckedIOException(e);
          }
          if (progress != null && progress || Progress.stderrIsTerminal() && progress == null) {
            err.println("  " + row.point().name() + ": " + (row.outcome() == null ? "invalid"
                : row.outcome().status().word() + ", objective " + Numbers.money(row.outcome().objective())));
            err.flush();
          }
        }
      });
      boolean complete = table.rows().size() == points.size()
          && table.rows().values().stream().noneMatch(n -> n.path("status").asText().equals("stopped"));
      if (json) {
        out.println(Json.pretty().writeValueAsString(table.toJson()));
      } else {
        print(out, table, plan, catalog, rows.size(), done.size());
      }
      out.flush();
      return complete ? ExitCodes.OK : ExitCodes.STOPPED;
    }
  }

  private SweepPlan plan(Catalog catalog) throws CatalogException {
    if (sweepFile != null) {
      if (!Files.isRegularFile(sweepFile)) {
        throw new UserError("no sweep file at " + sweepFile);
      }
      SweepPlan p = Scenarios.loadSweep(sweepFile, catalog);
      Scenario under = Scenario.none();
      for (Path f : scenarioFiles) {
        under = under.then(scenario(f, catalog), "base");
      }
      return new SweepPlan(p.name(), under.then(p.base(), "base"), p.axes(), p.listed());
    }
    List<Scenario> loaded = new ArrayList<>();
    for (Path f : scenarioFiles) {
      loaded.add(scenario(f, catalog));
    }
    if (grid.isEmpty()) {
      return new SweepPlan("scenarios", Scenario.none(), List.of(), loaded);
    }
    Scenario base = Scenario.none();
    for (Scenario s : loaded) {
      base = base.then(s, "base");
    }
    return Scenarios.grid(grid, base, List.of(), catalog);
  }

  private static Scenario scenario(Path f, Catalog catalog) {
    if (!Files.isRegularFile(f)) {
      throw new UserError("no scenario file at " + f);
    }
    try {
      return Scenarios.load(f, catalog);
    } catch (CatalogException e) {
      throw Inputs.problems("the scenario file " + f, e);
    }
  }

  /** The hash that says whether an earlier sweep.json in OUT is of this very sweep. */
  private static String definition(SweepPlan plan, String catalogSha, SolveSettings s) {
    StringBuilder sb = new StringBuilder(catalogSha).append('\n').append(s.gapTolerance()).append('\n')
        .append(s.perRound()).append('\n');
    for (SweepPlan.Point p : plan.points()) {
      sb.append(p.index()).append(':').append(p.scenario().describe()).append('\n');
    }
    return Checksums.sha256(sb.toString());
  }

  /** Rows of an earlier run of the same sweep that are finished; a different sweep needs --replace. */
  private Set<Integer> keepEarlierRows(SweepTable table, ObjectNode header, PrintWriter err) {
    Set<Integer> done = new HashSet<>();
    Path f = outDir.resolve(SweepTable.JSON_FILE);
    if (!Files.isRegularFile(f) || replace) {
      return done;
    }
    JsonNode old;
    try {
      old = Json.pretty().readTree(f.toFile());
    } catch (IOException e) {
      throw new UserError(f + " is not a sweep table (" + e.getMessage() + "); add --replace to start afresh");
    }
    if (!old.path("definitionSha256").asText().equals(header.path("definitionSha256").asText())
        || !old.path("pricer").asText().equals(loop.pricer.word())) {
      throw new UserError(outDir + " holds another sweep (other catalog, scenarios or settings); choose another"
          + " --out folder, or add --replace to overwrite it");
    }
    for (JsonNode row : old.path("rows")) {
      String st = row.path("status").asText();
      if (st.equals("optimal") || st.equals("infeasible")) {
        table.keep(row);
        done.add(row.path("index").asInt());
      }
    }
    if (!done.isEmpty()) {
      err.println("mixwright: " + done.size() + " scenarios already solved in " + outDir + "; solving the rest");
      err.flush();
    }
    return done;
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
          prices.append(prices.length() == 0 ? "" : ", ").append(e.getKey()).append(' ').append(Numbers.money(p));
        }
      });
      StringBuilder slope = new StringBuilder();
      n.path("valuePerUnit").fields().forEachRemaining(e -> {
        if (e.getValue().isNumber()) {
          slope.append("  +1 unit: ").append(Numbers.money(e.getValue().asDouble()));
        }
      });
      out.println(String.format(Locale.ROOT, "  %-48s %-10s %18s  %s%s", n.path("name").asText(),
          n.path("status").asText(), n.path("objective").isNumber() ? Numbers.money(n.path("objective").asDouble()) : "",
          prices.length() == 0 ? (n.has("problem") ? n.path("problem").asText() : "no binding resource") : prices,
          slope));
    }
  }
}
