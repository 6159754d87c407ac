package dev.mixwright.cli;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.pricing.Pricers;
import dev.mixwright.report.ColumnLog;
import dev.mixwright.report.ResultWriter;
import dev.mixwright.report.RunFolder;
import dev.mixwright.report.RunLock;
import dev.mixwright.report.RunManifest;
import dev.mixwright.report.SnapshotWriter;
import dev.mixwright.space.CountJob;
import dev.mixwright.space.SpaceSurvey;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

@Command(
    name = "solve",
    mixinStandardHelpOptions = true,
    description = {
      "Finds the best LP plan over the whole variant space by column generation and proves it.",
      "Writes RUN_DIR/result.json, RUN_DIR/columns.jsonl (one line per column added) and RUN_DIR/catalog.json (the catalog as solved), RUN_DIR/run.json (what the run is) and RUN_DIR/state.json (the loop's state after each round). Ctrl-C or SIGTERM stops after the current round with status stopped (exit 1); 'mixwright resume RUN_DIR' continues such a run, or one cut off by a crash."
    })
final class SolveCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Parameters(index = "0", paramLabel = "CATALOG", description = "catalog file (.yaml, .yml or .json)")
  Path catalogFile;

  @Option(names = "--out", required = true, paramLabel = "RUN_DIR", description = "folder for the run's files")
  Path runDir;

  @Option(names = "--gap", paramLabel = "REL", defaultValue = "1e-6",
      description = "stop when (bound - objective) / max(1, |objective|) <= REL (default ${DEFAULT-VALUE})")
  double gap;

  @Option(names = "--time-limit", paramLabel = "DURATION", description = "stop after this long, e.g. 90s, 10m, 8h")
  String timeLimit;

  @Option(names = "--max-iterations", paramLabel = "N", description = "stop after N rounds")
  int maxIterations;

  @Option(names = "--pricer", paramLabel = "NAME", defaultValue = "bnb",
      description = "exact pricing algorithm: bnb (default), cpsat, brute")
  String pricerName;

  @Option(names = "--per-round", paramLabel = "K", defaultValue = "" + SolveSettings.DEFAULT_PER_ROUND,
      description = "columns sought per segment per round (default ${DEFAULT-VALUE})")
  int perRound;

  @Option(names = "--heuristic-first", negatable = true,
      description = "price with a fast heuristic first; exact rounds prove the bound (default: off)")
  boolean heuristicFirst = SolveSettings.defaults().heuristicFirst();

  @Option(names = "--smoothing", paramLabel = "ALPHA", defaultValue = "" + SolveSettings.DEFAULT_SMOOTHING,
      description = "weight of the best dual point so far when pricing, 0 (off) to below 1 (default ${DEFAULT-VALUE})")
  double smoothing;

  @Option(names = "--retire-after", paramLabel = "ROUNDS", defaultValue = "" + SolveSettings.DEFAULT_RETIRE_AFTER,
      description = "take a column out of the master after this many rounds unused, 0 for never (default ${DEFAULT-VALUE})")
  int retireAfter;

  @Option(names = "--scenario", paramLabel = "FILE",
      description = "solve the catalog changed by this scenario file (capacities, prices, costs, demand, rules)")
  Path scenarioFile;

  @Option(names = "--replace", description = "overwrite the files of an earlier run in RUN_DIR")
  boolean replace;

  @Option(names = "--progress", negatable = true,
      description = "progress on stderr: a live line on a terminal, else one line per round"
          + " (default: on when stderr is a terminal)")
  Boolean progress;

  @Mixin PortfolioOptions portfolio;

  @Override
  public Integer call() throws Exception {
    long start = System.nanoTime();
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    if (!(gap >= 0)) {
      throw new UserError("--gap must be >= 0, got " + gap);
    }
    if (perRound < 1) {
      throw new UserError("--per-round must be at least 1, got " + perRound);
    }
    if (maxIterations < 0) {
      throw new UserError("--max-iterations must be at least 1, got " + maxIterations);
    }
    if (!(smoothing >= 0 && smoothing < 1)) {
      throw new UserError("--smoothing must be at least 0 and below 1, got " + smoothing);
    }
    if (retireAfter < 0) {
      throw new UserError("--retire-after must be 0 (never) or more, got " + retireAfter);
    }
    long timeMs = 0;
    if (timeLimit != null) {
      try {
        timeMs = Durations.parse(timeLimit);
      } catch (IllegalArgumentException e) {
        throw new UserError("--time-limit: " + e.getMessage());
      }
    }
    Catalog catalog = Inputs.catalog(catalogFile);
    String sha = Inputs.sha256(catalogFile);
    if (scenarioFile != null) {
      catalog = Inputs.withScenario(catalog, scenarioFile);
    }
    VariantSpace space = new VariantSpace(catalog);
    Pricer pricer;
    try {
      pricer = Pricers.byName(pricerName, space);
    } catch (IllegalArgumentException e) {
      throw new UserError("--pricer: " + e.getMessage());
    }
    if (!pricerExact(pricerName)) {
      throw new UserError("--pricer " + pricerName + " proves no bound; choose bnb, cpsat or brute"
          + " (use --heuristic-first to add the heuristic in front of an exact pricer)");
    }
    RunFolder folder = new RunFolder(runDir);
    if (!replace && folder.holdsRun()) {
      throw new UserError(runDir + " already holds a run; choose another --out folder, or add --replace to overwrite it"
          + " (or continue it with 'mixwright resume " + runDir + "')");
    }
    SolveSettings settings = new SolveSettings(gap, perRound, timeMs, maxIterations, heuristicFirst, smoothing, retireAfter);
    try (RunLock lock = RunSessions.lock(folder);
        StopSignals signals = StopSignals.install(err)) {
      RunManifest manifest = RunSessions.begin(folder, catalog, RunSessions.source(catalogFile, sha),
          scenarioFile == null ? null : RunSessions.source(scenarioFile, Inputs.sha256(scenarioFile)),
          RunSessions.settings(settings, pricer.name()));
      SpaceSurvey facts = SpaceSurvey.of(space);
      CountJob count = CountJob.whole(space, CountJob.BACKGROUND_BUDGET_MS); // nothing waits for it
      try (ColumnLog log = ColumnLog.open(space, runDir, 1, 0)) {
        ColumnGeneration cg = new ColumnGeneration(space, pricer,
            heuristicFirst ? Pricers.byName("heuristic", space) : null, settings,
            StopCriterion.signal(signals.flag()), start);
        cg.addListener(log);
        cg.addListener(new SnapshotWriter(folder, manifest, 1));
        Progress.attach(cg, err, progress, "");
        SolveOutcome outcome = facts.nothingSellable() ? null : cg.run();
        long elapsed = (System.nanoTime() - start) / 1_000_000;
        ResultWriter.RunInfo info = new ResultWriter.RunInfo(catalogFile.toString(), sha, pricer.name(),
            new ResultWriter.SpaceSize(count.finish()), elapsed);
        if (outcome == null) {
          outcome = SolveOutcomes.infeasible(space, facts.emptyReason(), elapsed);
        }
        ObjectNode result = ResultWriter.build(space, outcome, info);
        PortfolioRun.attach(space, outcome, portfolio, runDir, result, start,
            Progress.choose(err, progress, "") != null ? err : null, signals.flag()::get);
        ResultWriter.write(runDir, result);
        Summary.print(out, space, outcome, result, runDir);
        return outcome.status().isOptimal() ? ExitCodes.OK : ExitCodes.STOPPED;
      }
    }
  }

  private static boolean pricerExact(String name) {
    return !name.equals("heuristic");
  }
}
