package dev.mixwright.run;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.TableReach;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.colgen.ColGenListener;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.Durations;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.WarmStart;
import dev.mixwright.master.Natives;
import dev.mixwright.portfolio.PortfolioListener;
import dev.mixwright.report.PortfolioPending;
import dev.mixwright.report.ResultWriter;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.runfolder.Checksums;
import dev.mixwright.runfolder.ColumnLog;
import dev.mixwright.runfolder.ColumnLogReader;
import dev.mixwright.runfolder.ColumnPool;
import dev.mixwright.runfolder.LoopSnapshot;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunLock;
import dev.mixwright.runfolder.RunManifest;
import dev.mixwright.runfolder.SnapshotWriter;
import dev.mixwright.space.CountJob;
import dev.mixwright.space.SpaceSurvey;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * One run of the application, the same for {@code solve} and {@code resume}: the catalog read once
 * (bytes hashed and parsed together), the variant space, the pricer and the loop built, the LP
 * stage run to its optimum or a limit, then the integer stage, and the run folder written through
 * the report layer (manifest first, then the column log and snapshots, result.json last). Returns
 * a {@link RunOutcome}; bad input is an {@link InputError}.
 */
public final class RunSession {

  /** What the caller wants to hear while a run goes on. */
  public interface Watcher {
    /** Listeners for the LP loop (progress). */
    default List<ColGenListener> loop() {
      return List.of();
    }

    /** Listeners for the integer stage. */
    default List<PortfolioListener> portfolio() {
      return List.of();
    }

    /** Something a person should know that is not an error (a torn line dropped, a file gone). */
    default void note(String text) {}

    /**
     * A line of progress of a scenario set's per-scenario work on its engine: scenarios done, failed
     * and left with the time a scenario, after each point and at the end.
     */
    default void scenarioProgress(String line) {}

    /** A resume is about to run its loop from this point. */
    default void resuming(ResumePoint p) {}
  }

  /** Where a resumed loop starts: pooled columns, rounds and time so far, the bound it keeps. */
  public record ResumePoint(Path runDir, int session, int pooledColumns, int leftOut, int afterRound,
      long elapsedMs, double bound) {}

  /**
   * A new run of the catalog (with a scenario applied when given) into {@code runDir}; {@code tables}
   * says where the catalog's tables may be (the user's choice on the command line).
   */
  public record SolveRequest(Path catalogFile, Optional<Path> scenarioFile, Path runDir, boolean replace,
      SolveSettings settings, PricerChoice pricer, PortfolioPlan portfolio, TableReach tables) {
    /** Tables in the catalog's folder only. */
    public SolveRequest(Path catalogFile, Optional<Path> scenarioFile, Path runDir, boolean replace,
        SolveSettings settings, PricerChoice pricer, PortfolioPlan portfolio) {
      this(catalogFile, scenarioFile, runDir, replace, settings, pricer, portfolio, TableReach.CATALOG_FOLDER);
    }
  }

  /**
   * Continuing the run in {@code runDir}: {@code gap} overrides the run's own target; the limits
   * count from this session's start (0 for none).
   */
  public record ResumeRequest(Path runDir, boolean reprice, OptionalDouble gap, long sessionTimeMs,
      int sessionIterations, PortfolioPlan portfolio, TableReach tables) {
    /** Tables in the catalog's folder only. */
    public ResumeRequest(Path runDir, boolean reprice, OptionalDouble gap, long sessionTimeMs,
        int sessionIterations, PortfolioPlan portfolio) {
      this(runDir, reprice, gap, sessionTimeMs, sessionIterations, portfolio, TableReach.CATALOG_FOLDER);
    }
  }

  private final AtomicBoolean stop;
  private final Watcher watcher;

  /** @param stop set (by a signal handler) to end the run after the current round */
  public RunSession(AtomicBoolean stop, Watcher watcher) {
    this.stop = stop;
    this.watcher = watcher;
  }

  public RunOutcome solve(SolveRequest r) throws IOException, CatalogException {
    return solve(r, null);
  }

  /**
   * A new run whose integer stage chooses one range across the scenario set of {@code set} (null:
   * the catalog's own integer stage). The LP stage and result.json's LP fields are the catalog's.
   */
  public RunOutcome solve(SolveRequest r, ScenarioSetPlan set) throws IOException, CatalogException {
    long start = System.nanoTime();
    Natives.loadInBackground();
    if (!r.pricer().exact()) {
      throw new InputError("--pricer " + r.pricer().word() + " proves no bound; choose "
          + PricerChoice.exactWords() + " (use --heuristic-first to add the heuristic in front of an exact pricer)");
    }
    CatalogLoader.Hashed read = Inputs.hashedCatalog(r.catalogFile(), r.tables());
    Catalog catalog = read.catalog();
    if (r.scenarioFile().isPresent()) {
      catalog = Inputs.withScenario(catalog, r.scenarioFile().get());
    }
    if (r.portfolio().run()) {
      Inputs.refuseUnreachableMinLot(catalog);
    }
    ScenarioSetStep.Loaded scenarios = set == null ? null : ScenarioSetStep.load(set, catalog);
    VariantSpace space = new VariantSpace(catalog);
    RunFolder folder = new RunFolder(r.runDir());
    if (!r.replace() && folder.holdsRun()) {
      throw new InputError(r.runDir() + " already holds a run; choose another --out folder, or add --replace to"
          + " overwrite it (or continue it with 'mixwright resume " + r.runDir() + "')");
    }
    if (r.replace()) {
      RunStart.refuseUnlessReplaceable(folder); // before the lock file is made there
    }
    try (RunLock lock = RunStart.lock(folder)) {
      RunManifest.Source scenario = r.scenarioFile()
          .map(f -> RunStart.source(f, Inputs.sha256(f))).orElse(null);
      RunManifest manifest = RunStart.begin(folder, catalog, RunStart.source(r.catalogFile(), read.sha256()),
          scenario, RunManifest.Settings.of(r.settings(), r.pricer().word()));
      ColumnGeneration cg = loop(space, r.pricer(), r.settings(), StopCriterion.signal(stop), start);
      try (ColumnLog log = ColumnLog.open(space, r.runDir(), 1, 0)) {
        cg.addListener(log);
        cg.addListener(new SnapshotWriter(folder, manifest, 1));
        Stage lp = new Stage(space, cg, List.of(), r.catalogFile().toString(), read.sha256(), r.pricer(), 0, start);
        PortfolioStep.Checkpoints cp = checkpoints(folder, manifest, false);
        return finish(lp, cp, false, 1, scenarios != null ? setStep(r, scenarios, folder)
            : catalogStep(r.portfolio(), cp));
      }
    }
  }

  public RunOutcome resume(ResumeRequest r) throws IOException, CatalogException {
    long start = System.nanoTime();
    Path runDir = r.runDir();
    RunFolder folder = new RunFolder(runDir);
    if (!Files.isDirectory(runDir)) {
      throw new InputError("no run folder at " + runDir + " — give a folder written by 'mixwright solve --out'"
          + " (if a solve into it was cut off before it made the folder, that run never started: run"
          + " 'mixwright solve CATALOG --out " + runDir + "' again)");
    }
    try (RunLock lock = RunStart.lock(folder)) {
      if (!Files.exists(folder.manifest())) {
        throw new InputError(RunStart.neverStarted(folder));
      }
      RunManifest m;
      try {
        m = RunManifest.read(folder);
      } catch (IOException e) {
        throw new InputError(e.getMessage());
      }
      Resumed from = prepare(folder, m, r);
      if (from.ended().isPresent()) {
        return from.ended().get();
      }
      return continueRun(folder, from, r, start);
    }
  }

  /** What a resumed session starts from, or how the run had already ended. */
  private record Resumed(Optional<RunOutcome> ended, RunManifest manifest, Catalog catalog, boolean repriced,
      ColumnLogReader.Entries log, LoopSnapshot state) {

    static Resumed ended(RunOutcome o) {
      return new Resumed(Optional.of(o), null, null, false, null, null);
    }
  }

  /** Checks the folder and the catalog, records the new session in run.json and finds the state. */
  private Resumed prepare(RunFolder folder, RunManifest m, ResumeRequest r) throws IOException, CatalogException {
    Path runDir = r.runDir();
    if (!Files.isRegularFile(folder.catalogCopy())) {
      throw new InputError(runDir + " has run.json but no " + RunFolder.CATALOG_COPY
          + "; the run cannot be rebuilt — solve it again");
    }
    String copyText = Files.readString(folder.catalogCopy(), StandardCharsets.UTF_8);
    boolean copyIntact = Checksums.sha256(copyText).equals(m.catalogCopySha256());
    Catalog catalog = copyIntact ? CatalogLoader.parse(copyText, folder.catalogCopy().toString(), null) : null;

    CatalogSource.Check source = CatalogSource.check(m, copyText, r.tables());
    if (source.missing()) {
      watcher.note(source.why() + "; resuming with the catalog as solved (" + RunFolder.CATALOG_COPY + ")");
    }
    boolean repriced = false;
    if (source.changed() || !copyIntact) {
      // A damaged copy is said first: the check of the option tables compares against the copy, so
      // with the copy damaged it would blame a table that never changed.
      String why = copyIntact ? source.why()
          : RunFolder.CATALOG_COPY + " in " + runDir + " was changed after the run began (its SHA-256 no"
              + " longer matches run.json)";
      if (!r.reprice()) {
        throw new InputError(why + ". Resuming would mix columns priced under two catalogs. Add --reprice"
            + " to re-price the pooled columns against the catalog as it is now and go on, or solve the new"
            + " catalog afresh with 'mixwright solve'");
      }
      if (source.missing()) {
        throw new InputError(why + ", and the catalog file is gone, so there is nothing to re-price against");
      }
      catalog = source.current() != null ? source.current() : CatalogSource.load(Path.of(m.catalog().path()),
          m.scenario() == null ? null : Path.of(m.scenario().path()), r.tables());
      String copy = CatalogWriter.toJson(catalog);
      AtomicFiles.write(folder.catalogCopy(), copy);
      m = m.withSession("resume", "re-priced: " + why, source.nowSource(), Checksums.sha256(copy));
      repriced = true;
    } else {
      m = m.withSession("resume", "", m.catalog(), m.catalogCopySha256());
    }

    if (!repriced && Files.isRegularFile(folder.result())) {
      RunResult result;
      try {
        result = RunResult.read(runDir);
      } catch (IOException e) {
        throw new InputError(e.getMessage() + " — it is written atomically, so something else changed it; move it"
            + " aside and resume again to continue from the column log");
      }
      double target = r.gap().orElse(m.settings().gap());
      if (result.status().isOptimal() && result.gapOrInfinity() <= target) {
        if (!portfolioOwed(catalog, result, r.portfolio())) {
          return Resumed.ended(new RunOutcome.AlreadyOptimal(runDir, result.objective()));
        }
        // The LP stage had ended but the integer stage had not: the LP is rebuilt from the column log
        // (one round proves it again) because the integer stage starts from its columns and prices.
        watcher.note("the LP stage had reached its optimum but the integer stage had not ended; rebuilding the LP"
            + " from " + ColumnLog.FILE + " and running the integer stage");
      }
      if (result.status() == RunStatus.INFEASIBLE) {
        return Resumed.ended(new RunOutcome.EndedInfeasible(runDir, result.stopReason()));
      }
    }

    ColumnLogReader.Entries log;
    try {
      log = Files.exists(folder.columnLog()) ? ColumnLogReader.read(folder.columnLog())
          : new ColumnLogReader.Entries(List.of(), 0, 0);
    } catch (IOException e) {
      throw new InputError(runDir + ": " + e.getMessage());
    }
    if (log.droppedTornLines() > 0) {
      watcher.note("dropped the torn last line of " + ColumnLog.FILE + " (the run was cut off while writing it)");
    }
    String runId = m.runId();
    LoopSnapshot fromLog = LoopSnapshot.fromLog(runId, log);
    LoopSnapshot.Loaded loaded = LoopSnapshot.read(folder);
    Optional<LoopSnapshot> snap = loaded.snapshot().filter(s -> s.runId().equals(runId));
    if (loaded.snapshot().isPresent() && snap.isEmpty()) {
      watcher.note(RunFolder.SNAPSHOT + " belongs to another run; taking the state from " + ColumnLog.FILE);
    } else if (snap.isEmpty() && log.lines().size() > 0) {
      watcher.note(loaded.problem() + "; taking the state from " + ColumnLog.FILE);
    }
    LoopSnapshot state = snap.map(s -> merge(s, fromLog)).orElse(fromLog);
    m.write(folder);
    return new Resumed(Optional.empty(), m, catalog, repriced, log, state);
  }

  /**
   * The run has a portfolio to write: the catalog has a portfolio section, the stage is not skipped,
   * and result.json has no final portfolio (none, or one marked pending).
   */
  private static boolean portfolioOwed(Catalog catalog, RunResult result, PortfolioPlan plan) {
    return plan.run() && catalog.portfolio().isPresent()
        && (result.portfolio() == null || result.portfolioPending() != null);
  }

  /** The later of the two views: the snapshot can be behind the log (written after the round) or ahead. */
  private static LoopSnapshot merge(LoopSnapshot a, LoopSnapshot b) {
    return new LoopSnapshot(a.runId(), Math.max(a.session(), b.session()), a.status(),
        Math.max(a.iteration(), b.iteration()), a.objective(), Math.min(a.bound(), b.bound()), a.gap(),
        a.columns(), Math.max(a.elapsedMs(), b.elapsedMs()));
  }

  private RunOutcome continueRun(RunFolder folder, Resumed from, ResumeRequest r, long start) throws IOException {
    RunManifest m = from.manifest();
    int session = m.sessions().get(m.sessions().size() - 1).number();
    VariantSpace space = new VariantSpace(from.catalog());
    RunManifest.Settings s = m.settings();
    PricerChoice pricer;
    try {
      pricer = PricerChoice.byWord(s.pricer());
    } catch (IllegalArgumentException e) {
      throw new InputError(RunFolder.MANIFEST + " settings.pricer: " + e.getMessage());
    }
    WarmStart.Carried pool = ColumnPool.rebuild(space, from.log().lines());
    LoopSnapshot st = from.state();
    double priorBound = from.repriced() ? Double.POSITIVE_INFINITY : st.bound();
    watcher.resuming(new ResumePoint(r.runDir(), session, pool.columns().size(), pool.leftOut(), st.iteration(),
        st.elapsedMs(), priorBound));

    SolveSettings settings = s.forSession(r.gap().isPresent() ? r.gap().getAsDouble() : null);
    long priorElapsed = st.elapsedMs();
    int priorIterations = st.iteration();
    StopCriterion limits = sessionLimits(r.sessionTimeMs(), r.sessionIterations(), priorElapsed, priorIterations);
    long shiftedStart = start - priorElapsed * 1_000_000L;
    try (ColumnLog log = ColumnLog.open(space, r.runDir(), session, from.log().validBytes())) {
      ColumnGeneration cg = loop(space, pricer, settings,
          StopCriterion.anyOf(StopCriterion.signal(stop), limits), shiftedStart)
          .continuing(priorIterations, priorBound);
      cg.addListener(log);
      cg.addListener(new SnapshotWriter(folder, m, session));
      Stage lp = new Stage(space, cg, pool.columns(), m.catalog().path(), m.catalog().sha256(), pricer,
          priorElapsed, start);
      PortfolioStep.Checkpoints cp = checkpoints(folder, m, true);
      return finish(lp, cp, true, session, catalogStep(r.portfolio(), cp));
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

  private static ColumnGeneration loop(VariantSpace space, PricerChoice pricer, SolveSettings settings,
      StopCriterion stopWhen, long startNanos) {
    return new ColumnGeneration(space, pricer.create(space),
        settings.heuristicFirst() ? PricerChoice.HEURISTIC.create(space) : null, settings, stopWhen, startNanos);
  }

  /**
   * The LP stage about to run: its loop and warm columns, what result.json says of the catalog, the
   * time earlier sessions spent and when this one started.
   */
  private record Stage(VariantSpace space, ColumnGeneration cg, List<dev.mixwright.colgen.Column> warm,
      String catalogFile, String catalogSha256, PricerChoice pricer, long priorElapsedMs, long startNanos) {}

  /**
   * Runs the LP stage (unless nothing is sellable), then the integer stage, and writes result.json.
   * {@code resumed}: result.json names the session count.
   */
  /** What follows the LP stage: the result with its portfolio section added (or why there is none). */
  private interface IntegerStep {
    RunResult after(VariantSpace space, SolveOutcome lp, RunResult lpResult, long startNanos) throws IOException;
  }

  /** The catalog's own integer stage. */
  private IntegerStep catalogStep(PortfolioPlan plan, PortfolioStep.Checkpoints cp) {
    return (space, outcome, lpResult, startNanos) -> PortfolioStep.attach(space, outcome, plan, cp, lpResult,
        startNanos, watcher.portfolio(), stop::get);
  }

  private RunOutcome finish(Stage lp, PortfolioStep.Checkpoints cp, boolean resumed, int session, IntegerStep step)
      throws IOException {
    Path runDir = cp.folder().dir();
    VariantSpace space = lp.space();
    SpaceSurvey facts = SpaceSurvey.of(space, lp.cg()::limitReached);
    // nothing waits for the count: it runs beside the loop and is taken as far as it got at the end
    CountJob count = CountJob.whole(space, CountJob.BACKGROUND_BUDGET_MS);
    watcher.loop().forEach(lp.cg()::addListener);
    SolveOutcome outcome = facts.nothingSellable()
        ? SolveOutcomes.infeasible(space, facts.emptyReason(), lp.priorElapsedMs() + sinceMs(lp.startNanos()))
        : lp.cg().run(lp.warm());
    long elapsed = lp.priorElapsedMs() + sinceMs(lp.startNanos());
    ResultWriter.RunInfo info = new ResultWriter.RunInfo(lp.catalogFile(), lp.catalogSha256(), lp.pricer().word(),
        new ResultWriter.SpaceSize(count.finish()), elapsed);
    RunResult lpResult = ResultWriter.build(space, outcome, info);
    if (resumed) {
      lpResult = lpResult.withSessions(session);
    }
    RunResult result = step.after(space, outcome, lpResult, lp.startNanos() - lp.priorElapsedMs() * 1_000_000L);
    ResultWriter.write(runDir, result);
    return new RunOutcome.Solved(runDir, space, outcome, result);
  }

  /** The integer stage of a range across a scenario set, in place of the catalog's own. */
  private IntegerStep setStep(SolveRequest r, ScenarioSetStep.Loaded set, RunFolder folder) {
    return (space, outcome, lpResult, startNanos) -> {
      if (!r.portfolio().run() || !outcome.status().isOptimal()) {
        return lpResult;
      }
      ResultWriter.write(folder.dir(), lpResult.withPortfolioPending(PortfolioPending.RUNNING));
      RunResult result = ScenarioSetStep.attach(set, r.pricer(), r.settings(), r.portfolio().settings(), lpResult,
          startNanos, stop::get, watcher);
      return stop.get() ? result.withPortfolioPending(PortfolioPending.INTERRUPTED) : result;
    };
  }

  private PortfolioStep.Checkpoints checkpoints(RunFolder folder, RunManifest m, boolean resume) {
    return new PortfolioStep.Checkpoints(folder, m.runId(), m.catalogCopySha256(), resume, watcher::note);
  }

  private static long sinceMs(long startNanos) {
    return (System.nanoTime() - startNanos) / 1_000_000;
  }
}
