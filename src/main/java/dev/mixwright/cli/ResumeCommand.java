package dev.mixwright.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.WarmStart;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.pricing.Pricers;
import dev.mixwright.report.AtomicFiles;
import dev.mixwright.report.Checksums;
import dev.mixwright.report.ColumnLog;
import dev.mixwright.report.ColumnLogReader;
import dev.mixwright.report.ColumnPool;
import dev.mixwright.report.LoopSnapshot;
import dev.mixwright.report.ResultWriter;
import dev.mixwright.report.RunFolder;
import dev.mixwright.report.RunLock;
import dev.mixwright.report.RunManifest;
import dev.mixwright.report.RunReader;
import dev.mixwright.report.SnapshotWriter;
import dev.mixwright.space.CountJob;
import dev.mixwright.space.SpaceSurvey;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(
    name = "resume",
    mixinStandardHelpOptions = true,
    description = {
      "Continues a stopped or cut-off run to the optimum of an uninterrupted run.",
      "A run stopped by a limit, Ctrl-C or SIGTERM, or cut off by a crash, kill -9 or power loss: resume rebuilds the master from the run's column log, keeps the bound it had proven and goes on to the optimum, appending to the same column log. The final objective is the one an uninterrupted run reaches. Refuses (exit 2) when the catalog file changed since the run began, unless --reprice is given."
    })
final class ResumeCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Parameters(index = "0", paramLabel = "RUN_DIR", description = "a folder written by 'mixwright solve --out'")
  Path runDir;

  @Option(names = "--reprice",
      description = "the catalog file changed: re-price the pooled columns against it as it is now and go"
          + " on (columns it no longer sells are left out; the old bound is dropped)")
  boolean reprice;

  @Option(names = "--time-limit", paramLabel = "DURATION", description = "stop this session after this long, e.g. 90s, 10m, 8h")
  String timeLimit;

  @Option(names = "--max-iterations", paramLabel = "N", description = "stop after N more rounds")
  int maxIterations;

  @Option(names = "--gap", paramLabel = "REL",
      description = "gap target; default: the run's own (from run.json)")
  Double gap;

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
    if (maxIterations < 0) {
      throw new UserError("--max-iterations must be at least 1, got " + maxIterations);
    }
    if (gap != null && !(gap >= 0)) {
      throw new UserError("--gap must be >= 0, got " + gap);
    }
    long sessionTimeMs = 0;
    if (timeLimit != null) {
      try {
        sessionTimeMs = Durations.parse(timeLimit);
      } catch (IllegalArgumentException e) {
        throw new UserError("--time-limit: " + e.getMessage());
      }
    }
    RunFolder folder = new RunFolder(runDir);
    if (!Files.isDirectory(runDir)) {
      throw new UserError("no run folder at " + runDir + " — give a folder written by 'mixwright solve --out'");
    }
    try (RunLock lock = RunSessions.lock(folder);
        StopSignals signals = StopSignals.install(err)) {
      RunManifest manifest = readManifest(folder);
      Resumed r = prepare(folder, manifest, err);
      if (r == null) {
        return ExitCodes.OK;
      }
      if (r == INFEASIBLE) {
        return ExitCodes.STOPPED;
      }
      return run(folder, r, start, sessionTimeMs, signals, out, err);
    }
  }

  /** Marks a run that ended infeasible: nothing to resume, exit 1. */
  private static final Resumed INFEASIBLE = new Resumed(null, null, false, null, null);

  /** What the session starts from. */
  private record Resumed(RunManifest manifest, Catalog catalog, boolean repriced, ColumnLogReader.Entries log,
      LoopSnapshot state) {}

  private static RunManifest readManifest(RunFolder folder) {
    try {
      return RunManifest.read(folder);
    } catch (IOException e) {
      throw new UserError(e.getMessage());
    }
  }

  /** Checks the folder and the catalog; null when there is nothing to do (said on stdout). */
  private Resumed prepare(RunFolder folder, RunManifest m, PrintWriter err) throws IOException, CatalogException {
    if (!Files.isRegularFile(folder.catalogCopy())) {
      throw new UserError(runDir + " has run.json but no " + RunFolder.CATALOG_COPY
          + "; the run cannot be rebuilt — solve it again");
    }
    String copyText = Files.readString(folder.catalogCopy(), StandardCharsets.UTF_8);
    boolean copyIntact = Checksums.sha256(copyText).equals(m.catalogCopySha256());
    Catalog catalog = copyIntact ? CatalogLoader.load(folder.catalogCopy()) : null;

    CatalogSource.Check source = CatalogSource.check(m, copyText);
    if (source.missing()) {
      err.println("mixwright: note: " + source.why() + "; resuming with the catalog as solved ("
          + RunFolder.CATALOG_COPY + ")");
    }
    boolean repriced = false;
    if (source.changed() || !copyIntact) {
      String why = source.changed() ? source.why()
          : RunFolder.CATALOG_COPY + " in " + runDir + " was changed after the run began (its SHA-256 no"
              + " longer matches run.json)";
      if (!reprice) {
        throw new UserError(why + ". Resuming would mix columns priced under two catalogs. Add --reprice"
            + " to re-price the pooled columns against the catalog as it is now and go on, or solve the new"
            + " catalog afresh with 'mixwright solve'");
      }
      if (source.missing()) {
        throw new UserError(why + ", and the catalog file is gone, so there is nothing to re-price against");
      }
      catalog = source.current() != null ? source.current() : CatalogSource.load(Path.of(m.catalog().path()),
          m.scenario() == null ? null : Path.of(m.scenario().path()));
      String copy = CatalogWriter.toJson(catalog);
      AtomicFiles.write(folder.catalogCopy(), copy);
      m = m.withSession("resume", "re-priced: " + why, source.nowSource(), Checksums.sha256(copy));
      repriced = true;
    } else {
      m = m.withSession("resume", "", m.catalog(), m.catalogCopySha256());
    }

    if (!repriced && Files.isRegularFile(folder.result())) {
      JsonNode result = RunReader.readResult(runDir);
      String status = result.path("status").asText();
      double target = gap != null ? gap : m.settings().gap();
      if (status.equals("optimal") && result.path("gap").asDouble(Double.POSITIVE_INFINITY) <= target) {
        spec.commandLine().getOut().println(runDir + ": the run is already optimal (objective "
            + Numbers.money(result.path("objective").asDouble()) + "); nothing to resume");
        return null;
      }
      if (status.equals("infeasible")) {
        spec.commandLine().getOut().println(runDir + ": the run ended infeasible ("
            + result.path("stopReason").asText() + "); a resume cannot change that — fix the catalog and solve"
            + " again");
        return INFEASIBLE;
      }
    }

    ColumnLogReader.Entries log;
    try {
      log = Files.exists(folder.columnLog()) ? ColumnLogReader.read(folder.columnLog())
          : new ColumnLogReader.Entries(List.of(), 0, 0);
    } catch (IOException e) {
      throw new UserError(runDir + ": " + e.getMessage());
    }
    if (log.droppedTornLines() > 0) {
      err.println("mixwright: note: dropped the torn last line of " + ColumnLog.FILE
          + " (the run was cut off while writing it)");
    }
    String runId = m.runId();
    LoopSnapshot fromLog = LoopSnapshot.fromLog(runId, log);
    LoopSnapshot.Loaded loaded = LoopSnapshot.read(folder);
    Optional<LoopSnapshot> snap = loaded.snapshot().filter(s -> s.runId().equals(runId));
    if (loaded.snapshot().isPresent() && snap.isEmpty()) {
      err.println("mixwright: note: " + RunFolder.SNAPSHOT + " belongs to another run; taking the state from "
          + ColumnLog.FILE);
    } else if (snap.isEmpty() && log.lines().size() > 0) {
      err.println("mixwright: note: " + loaded.problem() + "; taking the state from " + ColumnLog.FILE);
    }
    LoopSnapshot state = snap.map(s -> merge(s, fromLog)).orElse(fromLog);
    m.write(folder);
    return new Resumed(m, catalog, repriced, log, state);
  }

  /** The later of the two views: the snapshot can be behind the log (written after the round) or ahead. */
  private static LoopSnapshot merge(LoopSnapshot a, LoopSnapshot b) {
    return new LoopSnapshot(a.runId(), Math.max(a.session(), b.session()), a.status(),
        Math.max(a.iteration(), b.iteration()), a.objective(), Math.min(a.bound(), b.bound()), a.gap(),
        a.columns(), Math.max(a.elapsedMs(), b.elapsedMs()));
  }

  private int run(RunFolder folder, Resumed r, long start, long sessionTimeMs, StopSignals signals,
      PrintWriter out, PrintWriter err) throws IOException {
    RunManifest m = r.manifest();
    int session = m.sessions().get(m.sessions().size() - 1).number();
    VariantSpace space = new VariantSpace(r.catalog());
    RunManifest.Settings s = m.settings();
    Pricer pricer;
    try {
      pricer = Pricers.byName(s.pricer(), space);
    } catch (IllegalArgumentException e) {
      throw new UserError(RunFolder.MANIFEST + " settings.pricer: " + e.getMessage());
    }
    SpaceSurvey facts = SpaceSurvey.of(space);
    CountJob count = CountJob.whole(space, CountJob.BACKGROUND_BUDGET_MS); // nothing waits for it
    WarmStart.Carried pool = ColumnPool.rebuild(space, r.log().lines());
    LoopSnapshot st = r.state();
    double priorBound = r.repriced() ? Double.POSITIVE_INFINITY : st.bound();
    out.println(String.format(Locale.ROOT, "resuming %s: session %d, %d columns from the pool%s, after round %d"
            + " (%s so far)%s", runDir, session, pool.columns().size(),
        pool.leftOut() > 0 ? " (" + pool.leftOut() + " left out: no longer sellable or duplicated)" : "",
        st.iteration(), Durations.format(st.elapsedMs()),
        Double.isFinite(priorBound) ? ", bound " + Numbers.money(priorBound) : ""));
    out.flush();

    SolveSettings settings = new SolveSettings(gap != null ? gap : s.gap(), s.perRound(), 0, 0, s.heuristicFirst(),
        SolveSettings.DEFAULT_SMOOTHING, SolveSettings.DEFAULT_RETIRE_AFTER);
    long priorElapsed = st.elapsedMs();
    int priorIterations = st.iteration();
    StopCriterion limits = sessionLimits(sessionTimeMs, maxIterations, priorElapsed, priorIterations);
    long shiftedStart = start - priorElapsed * 1_000_000L;
    try (ColumnLog log = ColumnLog.open(space, runDir, session, r.log().validBytes())) {
      ColumnGeneration cg = new ColumnGeneration(space, pricer,
          s.heuristicFirst() ? Pricers.byName("heuristic", space) : null, settings,
          StopCriterion.anyOf(StopCriterion.signal(signals.flag()), limits), shiftedStart)
          .continuing(priorIterations, priorBound);
      cg.addListener(log);
      cg.addListener(new SnapshotWriter(folder, m, session));
      Progress.attach(cg, err, progress, "");
      SolveOutcome outcome = facts.nothingSellable() ? null : cg.run(pool.columns());
      long elapsed = priorElapsed + (System.nanoTime() - start) / 1_000_000;
      ResultWriter.RunInfo info = new ResultWriter.RunInfo(m.catalog().path(), m.catalog().sha256(),
          pricer.name(), new ResultWriter.SpaceSize(count.finish()), elapsed);
      if (outcome == null) {
        outcome = SolveOutcomes.infeasible(space, facts.emptyReason(), elapsed);
      }
      ObjectNode result = ResultWriter.build(space, outcome, info);
      result.put("sessions", session);
      PortfolioRun.attach(space, outcome, portfolio, runDir, result, shiftedStart,
          Progress.choose(err, progress, "") != null ? err : null, signals.flag()::get);
      ResultWriter.write(runDir, result);
      Summary.print(out, space, outcome, result, runDir);
      return outcome.status().isOptimal() ? ExitCodes.OK : ExitCodes.STOPPED;
    }
  }

  /** Limits that count from this session's start, not the run's. */
  static StopCriterion sessionLimits(long timeMs, int iterations, long priorElapsed, int priorIterations) {
    StopCriterion t = timeMs <= 0 ? StopCriterion.never()
        : rec -> rec.elapsedMs() - priorElapsed >= timeMs
            ? Optional.of("time limit of " + Durations.format(timeMs) + " for this session reached")
            : Optional.empty();
    StopCriterion i = iterations <= 0 ? StopCriterion.never()
        : rec -> rec.iteration() - priorIterations >= iterations
            ? Optional.of("limit of " + iterations + " more rounds reached")
            : Optional.empty();
    return StopCriterion.anyOf(t, i);
  }
}
