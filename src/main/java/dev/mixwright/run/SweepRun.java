package dev.mixwright.run;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.TableReach;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.engine.Engine;
import dev.mixwright.engine.Engines;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.Tally;
import dev.mixwright.engine.Watch;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.report.SweepTable;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.runfolder.Checksums;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.RunFileDamaged;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunLock;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.Scenarios;
import dev.mixwright.scenario.SweepPlan;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * A sweep as the application runs it: the catalog read once, the plan built from a sweep file,
 * grid axes and scenario files, the rows of an earlier run of the same sweep kept, every other
 * point solved by an engine in chains ({@link SweepWork}), each going on to the integer stage when its
 * catalog has a portfolio section, and the table rewritten by this thread as each chain comes in.
 */
public final class SweepRun {
  private SweepRun() {}

  /**
   * What to sweep and how; {@code grid} and {@code sweepFile} exclude each other. {@code engine} names
   * the engine that solves the points ({@link Engines}); {@code chain}: points solved one after another
   * from each other's columns, the pieces an engine spreads (0: the whole sweep in one piece);
   * {@code portfolio}: whether each point goes on to the integer stage (when its catalog has a portfolio
   * section) and with which settings, the time limit counting per point; {@code tables} says where the
   * catalog's tables may be (the user's choice on the command line).
   */
  public record Request(Path catalogFile, Optional<Path> sweepFile, List<String> grid, List<Path> scenarioFiles,
      Path outDir, SolveSettings settings, PricerChoice pricer, boolean warmStart, boolean replace, String engine,
      int chain, PortfolioPlan portfolio, TableReach tables) {}

  /** What the caller wants to hear while the sweep goes on. */
  public interface Watcher {
    /** A point's row, as the table holds it, and the counts so far. */
    default void solved(ObjectNode row, Tally tally) {}

    /** An attempt at a chain of {@code points} points failed; the engine may try it again. */
    default void failed(int points, String why, Tally tally) {}

    /** The engine is done with the job (finished, stopped or failed). */
    default void finished(String engine, Tally tally) {}

    default void note(String text) {}
  }

  /** The table as written, how many rows were solved now and kept from before, and whether every point is done. */
  public record Outcome(SweepTable table, SweepPlan plan, Catalog catalog, int solvedNow, int kept, boolean complete) {}

  public static Outcome run(Request r, AtomicBoolean stop, Watcher watcher) throws IOException, CatalogException {
    if (r.sweepFile().isPresent() && !r.grid().isEmpty()) {
      throw new InputError("give the grid either with --grid or in the --sweep file, not both");
    }
    try (Engine engine = engine(r.engine())) {
      return run(r, engine, stop, watcher);
    }
  }

  private static Outcome run(Request r, Engine engine, AtomicBoolean stop, Watcher watcher) throws IOException,
      CatalogException {
    CatalogLoader.Hashed read = Inputs.hashedCatalog(r.catalogFile(), r.tables());
    Catalog catalog = read.catalog();
    SweepPlan plan;
    try {
      plan = plan(r, catalog);
    } catch (CatalogException e) {
      throw Inputs.problems(r.sweepFile().map(f -> "the sweep file " + f).orElse("the --grid axes"), e);
    }
    if (plan.points().isEmpty()) {
      throw new InputError("nothing to sweep: give --grid PATH=VALUES, a --sweep file, or --scenario files");
    }
    refusePortfolioAxes(plan, r.portfolio());
    ObjectNode header = Json.pretty().createObjectNode();
    header.put("format", 1);
    header.put("kind", RunFolder.Kind.SWEEP.word());
    header.put("sweep", plan.name());
    ObjectNode cat = header.putObject("catalog");
    cat.put("name", catalog.name());
    cat.put("file", r.catalogFile().toString());
    cat.put("sha256", read.sha256());
    header.put("pricer", r.pricer().word());
    header.put("gap", r.settings().gapTolerance());
    header.put("warmStart", r.warmStart());
    boolean integerStage = r.portfolio().run() && catalog.portfolio().isPresent();
    Optional<PortfolioSettings> stage = integerStage ? Optional.of(r.portfolio().settings()) : Optional.empty();
    header.put("portfolio", integerStage);
    header.put("definitionSha256", definition(plan, read.sha256(), r.settings(), stage));
    SweepTable table = new SweepTable(plan, catalog, header);

    if (r.replace()) {
      RunStart.refuseUnlessReplaceable(new RunFolder(r.outDir()));
    }
    Files.createDirectories(r.outDir());
    try {
      new RunFolder(r.outDir()).claim(RunFolder.Kind.SWEEP);
    } catch (RunFileDamaged e) {
      throw new InputError(e.getMessage());
    }
    try (RunLock lock = RunStart.lock(new RunFolder(r.outDir()))) {
      Set<Integer> done = keepEarlierRows(r, table, header, watcher);
      AtomicFiles.write(r.outDir().resolve(RunFolder.CATALOG_COPY), CatalogWriter.toJson(catalog));
      table.write(r.outDir());
      Job job = SweepWork.job(catalog, plan, r.settings(), r.pricer(), r.warmStart(),
          stage.orElse(null), r.chain(), done);
      Tally tally = new Tally(plan.points().size() - done.size());
      int solvedNow = 0;
      try {
        solvedNow = runJob(engine, job, stop, table, r.outDir(), tally, watcher);
      } finally {
        watcher.finished(engine.name(), tally);
      }
      boolean complete = table.rows().size() == plan.points().size()
          && table.rows().values().stream().noneMatch(SweepTable::stopped);
      table.bestRow().ifPresent(b -> watcher.note(String.format(java.util.Locale.ROOT,
          "best price of the sweep: %s (objective %,.2f); a segment that chooses buys less as the price"
              + " rises, so the objective is a curve over the price", b.path("name").asText(),
          b.path("objective").asDouble())));
      return new Outcome(table, plan, catalog, solvedNow, done.size(), complete);
    }
  }

  /** The engine a person asked for; one that is not on the class path is bad input. */
  static Engine engine(String name) {
    return Engines.find(name).orElseThrow(() -> unknownEngine(name));
  }

  /** Refuses, before anything is solved, an engine that is not on the class path; makes none. */
  static void requireEngine(String name) {
    if (!Engines.exists(name)) {
      throw unknownEngine(name);
    }
  }

  private static InputError unknownEngine(String name) {
    return new InputError("no engine named '" + name + "' in this program"
        + " (it has " + String.join(", ", Engines.names()) + ")"
        + (name.equalsIgnoreCase("spark") ? "; the Spark engine runs in the jar of the spark module through"
            + " spark-submit (README, 'Sweeps on Spark')" : "") + "; leave out --engine to use this machine's threads");
  }

  /**
   * Runs the job, adding each row to the table and rewriting it (atomically, by this thread alone) as
   * each chain comes in, so a sweep cut off keeps what it finished. Returns the points solved.
   */
  private static int runJob(Engine engine, Job job, AtomicBoolean stop, SweepTable table, Path outDir, Tally tally,
      Watcher watcher) throws IOException {
    int[] solved = {0};
    try {
      engine.run(job, new Watch() {
        @Override
        public void done(int point, byte[] result, long millis) {
          List<ObjectNode> rows = SweepWork.rows(result);
          tally.done(rows.size(), millis);
          rows.forEach(table::keep);
          try {
            table.write(outDir);
          } catch (IOException e) {
            throw new UncheckedIOException(e);
          }
          solved[0] += rows.size();
          rows.forEach(n -> watcher.solved(n, tally));
        }

        @Override
        public void failed(int point, int attempt, String why) {
          int n = SweepWork.length(job.points().get(point));
          tally.failed(n);
          watcher.failed(n, why, tally);
        }
      }, stop::get);
    } catch (UncheckedIOException e) {
      throw e.getCause();
    } catch (Engine.JobFailed e) {
      throw new IllegalStateException("the sweep could not finish on the " + engine.name() + " engine: "
          + e.getMessage() + " (" + solved[0] + " points written to " + outDir + ")", e);
    }
    return solved[0];
  }

  /**
   * An axis over a portfolio term changes nothing the LP stage reads: without the integer stage every
   * point of it would come out the same, so it is refused, in words. (A catalog without a portfolio
   * section has its portfolio axes refused where the grid is read.)
   */
  private static void refusePortfolioAxes(SweepPlan plan, PortfolioPlan portfolio) {
    for (SweepPlan.Axis a : plan.axes()) {
      if (a.target().field().isPortfolioTerm() && !portfolio.run()) {
        throw new InputError("the axis " + a.target().path() + " changes a term of the integer stage, which"
            + " --no-portfolio skips — drop --no-portfolio or this axis");
      }
    }
  }

  private static SweepPlan plan(Request r, Catalog catalog) throws CatalogException {
    if (r.sweepFile().isPresent()) {
      Path sweepFile = r.sweepFile().get();
      if (!Files.isRegularFile(sweepFile)) {
        throw new InputError("no sweep file at " + sweepFile);
      }
      SweepPlan p = Scenarios.loadSweep(sweepFile, catalog);
      Scenario under = Scenario.none();
      for (Path f : r.scenarioFiles()) {
        under = under.then(scenario(f, catalog), "base");
      }
      return new SweepPlan(p.name(), under.then(p.base(), "base"), p.axes(), p.listed());
    }
    List<Scenario> loaded = new ArrayList<>();
    for (Path f : r.scenarioFiles()) {
      loaded.add(scenario(f, catalog));
    }
    if (r.grid().isEmpty()) {
      return new SweepPlan("scenarios", Scenario.none(), List.of(), loaded);
    }
    Scenario base = Scenario.none();
    for (Scenario s : loaded) {
      base = base.then(s, "base");
    }
    return Scenarios.grid(r.grid(), base, List.of(), catalog);
  }

  private static Scenario scenario(Path f, Catalog catalog) {
    if (!Files.isRegularFile(f)) {
      throw new InputError("no scenario file at " + f);
    }
    try {
      return Scenarios.load(f, catalog);
    } catch (CatalogException e) {
      throw Inputs.problems("the scenario file " + f, e);
    }
  }

  /** The hash that says whether an earlier sweep.json in OUT is of this very sweep. */
  private static String definition(SweepPlan plan, String catalogSha, SolveSettings s,
      Optional<PortfolioSettings> integerStage) {
    StringBuilder sb = new StringBuilder(catalogSha).append('\n').append(s.gapTolerance()).append('\n')
        .append(s.perRound()).append('\n');
    // A sweep of the LP alone keeps its old hash, so its earlier rows are still kept.
    integerStage.ifPresent(p -> sb.append("integer stage: ").append(PortfolioStep.words(p)).append('\n'));
    for (SweepPlan.Point p : plan.points()) {
      sb.append(p.index()).append(':').append(p.scenario().describe()).append('\n');
    }
    return Checksums.sha256(sb.toString());
  }

  /** Rows of an earlier run of the same sweep that are finished; a different sweep needs --replace. */
  private static Set<Integer> keepEarlierRows(Request r, SweepTable table, ObjectNode header, Watcher watcher) {
    Set<Integer> done = new HashSet<>();
    Path f = r.outDir().resolve(SweepTable.JSON_FILE);
    if (!Files.isRegularFile(f) || r.replace()) {
      return done;
    }
    JsonNode old;
    try {
      old = Json.pretty().readTree(f.toFile());
    } catch (IOException e) {
      throw new InputError(f + " is not a sweep table (" + e.getMessage() + "); add --replace to start afresh");
    }
    if (!old.path("definitionSha256").asText().equals(header.path("definitionSha256").asText())
        || !old.path("pricer").asText().equals(r.pricer().word())) {
      throw new InputError(r.outDir() + " holds another sweep (other catalog, scenarios or settings); choose"
          + " another --out folder, or add --replace to overwrite it");
    }
    for (JsonNode row : old.path("rows")) {
      if (SweepTable.finished(row)) {
        table.keep(row);
        done.add(row.path("index").asInt());
      }
    }
    if (!done.isEmpty()) {
      watcher.note(done.size() + " scenarios already solved in " + r.outDir() + "; solving the rest");
    }
    return done;
  }
}
