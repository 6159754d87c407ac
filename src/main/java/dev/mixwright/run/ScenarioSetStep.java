package dev.mixwright.run;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.engine.Engine;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.Tally;
import dev.mixwright.engine.Watch;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.portfolio.PortfolioTerms;
import dev.mixwright.portfolio.ScenarioStage;
import dev.mixwright.report.PortfolioSection;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.Json;
import dev.mixwright.scenario.ScenarioSet;
import dev.mixwright.scenario.ScenarioSets;
import dev.mixwright.space.VariantSpace;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * The integer stage of a solve with a scenario set: every scenario solved on its own (its LP stage
 * and its own best range, as {@link ScenarioWork} on the engine the user chose), one range chosen
 * across the set ({@link ScenarioStage}, on this machine), each scenario's regret against its own
 * best range, and the optional hold-out check (again on the engine); the result is the
 * {@code portfolio} section of result.json, which the caller alone writes.
 */
final class ScenarioSetStep {
  private ScenarioSetStep() {}

  /**
   * A set read and checked against the catalog, ready to run: {@code base} the catalog the scenarios
   * change, {@code catalogs} the set's scenarios applied to it.
   */
  record Loaded(ScenarioSetPlan plan, Catalog base, ScenarioSet set, List<Catalog> catalogs,
      Optional<ScenarioSet> holdOut) {}

  /** Reads the set (and the hold-out set), refusing in words what a range across scenarios cannot take. */
  static Loaded load(ScenarioSetPlan plan, Catalog catalog) {
    if (catalog.portfolio().isEmpty()) {
      throw new InputError("--scenario-set chooses one range across the scenarios, so the catalog needs a portfolio"
          + " section (introductionCost, maxVariants, minLot); add one");
    }
    SweepRun.requireEngine(plan.engine()); // an engine not on the class path is refused before anything is solved
    ScenarioSet set = read(plan.file(), catalog, "--scenario-set");
    List<Catalog> cats = catalogs(set, catalog, plan.file());
    Optional<ScenarioSet> hold = plan.holdOut().map(f -> read(f, catalog, "--hold-out"));
    // Applied here only to refuse a change the catalog cannot take, by its path, before anything is
    // solved; each worker applies its own scenarios again.
    hold.ifPresent(h -> catalogs(h, catalog, plan.holdOut().get()));
    return new Loaded(plan, catalog, set, cats, hold);
  }

  private static ScenarioSet read(Path f, Catalog catalog, String option) {
    if (!Files.isRegularFile(f)) {
      throw new InputError("no scenario-set file at " + f + " (" + option + ") — give the path of a .yaml or .json"
          + " scenario set");
    }
    try {
      return ScenarioSets.load(f, catalog);
    } catch (CatalogException e) {
      throw Inputs.problems("the scenario set " + f, e);
    }
  }

  private static List<Catalog> catalogs(ScenarioSet set, Catalog catalog, Path f) {
    try {
      return set.catalogs(catalog);
    } catch (CatalogException e) {
      throw Inputs.problems("the scenario set " + f, e);
    }
  }

  /**
   * Runs the step and returns {@code result} with the set's portfolio section; {@code result} as it
   * was when a stop came before every scenario had its own range.
   */
  static RunResult attach(Loaded set, PricerChoice pricer, SolveSettings loop, PortfolioSettings settings,
      RunResult result, long startNanos, BooleanSupplier stop, RunSession.Watcher watcher) {
    Catalog base = set.base();
    try (Engine engine = SweepRun.engine(set.plan().engine())) {
      Optional<List<ScenarioWork.Alone>> solved = onEngine(engine, ScenarioWork.alone(base, set.set(), pricer, loop,
          settings), "scenarios solved on their own", stop, watcher).map(ScenarioSetStep::alone);
      if (solved.isEmpty()) {
        return result; // stopped before every scenario had its own range: no range across them
      }
      List<ScenarioWork.Alone> alone = solved.get();
      watcher.note(String.format(Locale.ROOT, "solved the %d scenarios of %s each on its own; choosing one range",
          alone.size(), set.plan().file()));
      List<VariantSpace> spaces = set.catalogs().stream().map(VariantSpace::new).toList();
      double[] w = set.set().weights();
      ScenarioStage stage = new ScenarioStage(spaces, w, set.plan().aim(), settings)
          .stopWhen(StopCriterion.signal(stop));
      ScenarioStage.Outcome o;
      try {
        o = stage.choose(alone.stream().map(ScenarioWork.Alone::lp).toList(),
            alone.stream().map(ScenarioWork.Alone::range).toList(),
            alone.stream().mapToDouble(ScenarioWork.Alone::bound).toArray());
      } catch (IllegalArgumentException e) {
        throw new InputError("current: " + e.getMessage() + " — give those variants keep: false, or leave out the"
            + " scenarios that starve them");
      }
      List<RunResult.ScenarioRow> rows = new ArrayList<>();
      for (int k = 0; k < alone.size(); k++) {
        ScenarioWork.Alone b = alone.get(k);
        double v = o.scenarioValue()[k];
        // The chosen range is itself a range for this scenario alone, so the best one alone is worth at
        // least v; a scenario's own solve stopped at its time limit below that must not show a negative regret.
        double best = Math.max(b.value(), v);
        rows.add(new RunResult.ScenarioRow(set.set().members().get(k).id(), w[k], v, best, best - v, b.status()));
      }
      RunResult.HoldOut check = set.holdOut().isEmpty() ? null
          : holdOut(engine, base, set.holdOut().get(), o.range(), set.plan().holdOut().get(), stop, watcher);
      VariantSpace first = spaces.get(0);
      RunResult.Portfolio p = PortfolioSection.ofScenarios(first, PortfolioTerms.of(first), o,
          settings.engine().word()).withScenarios(set.plan().aim().isWorst() ? "worst" : "mean", rows, check);
      return result.withPortfolio(p, (System.nanoTime() - startNanos) / 1_000_000);
    }
  }

  private static List<ScenarioWork.Alone> alone(List<byte[]> results) {
    List<ScenarioWork.Alone> out = new ArrayList<>();
    results.forEach(r -> out.addAll(ScenarioWork.alone(r)));
    return out;
  }

  /**
   * The range's value in every hold-out scenario (a fixed-range LP each, on the engine), as a
   * weighted mean and 5 % / 95 % quantiles (the least value whose cumulative weight reaches the
   * level); null when a stop came before every scenario was evaluated.
   */
  static RunResult.HoldOut holdOut(Engine engine, Catalog base, ScenarioSet set, List<int[]> range, Path file,
      BooleanSupplier stop, RunSession.Watcher watcher) {
    long t0 = System.nanoTime();
    Optional<List<byte[]>> results = onEngine(engine, ScenarioWork.evaluations(base, set, range), "hold-out",
        stop, watcher);
    if (results.isEmpty()) {
      watcher.note("stopped before every hold-out scenario was evaluated: no hold-out check");
      return null;
    }
    double[] values = results.get().stream().map(ScenarioWork::values).flatMapToDouble(Arrays::stream).toArray();
    return holdOut(values, set.weights(), file, (System.nanoTime() - t0) / 1_000_000);
  }

  /** The figures of a hold-out check from each scenario's value (NaN: it cannot meet the lots). */
  static RunResult.HoldOut holdOut(double[] values, double[] w, Path file, long ms) {
    List<double[]> kept = new ArrayList<>();
    int missed = 0;
    for (int k = 0; k < values.length; k++) {
      if (!Double.isNaN(values[k])) {
        kept.add(new double[] {values[k], w[k]});
      } else {
        missed++;
      }
    }
    if (kept.isEmpty()) {
      return new RunResult.HoldOut(file.toString(), values.length, missed, null, null, null, ms);
    }
    double total = kept.stream().mapToDouble(x -> x[1]).sum();
    double mean = kept.stream().mapToDouble(x -> x[0] * x[1]).sum() / total;
    kept.sort((a, b) -> Double.compare(a[0], b[0]));
    return new RunResult.HoldOut(file.toString(), values.length, missed, Json.num(mean),
        Json.num(quantile(kept, total, 0.05)), Json.num(quantile(kept, total, 0.95)), ms);
  }

  /**
   * Runs a job of per-scenario work and returns each point's result in the order of the points, or
   * empty when a stop came before every point was done. The watcher hears the counts after each
   * point (scenarios done, failed and left, time a scenario) and the engine's summary at the end.
   */
  static Optional<List<byte[]>> onEngine(Engine engine, Job job, String work, BooleanSupplier stop,
      RunSession.Watcher watcher) {
    int total = job.points().stream().mapToInt(ScenarioWork::scenarios).sum();
    Tally tally = new Tally(total);
    byte[][] results = new byte[job.size()][];
    try {
      engine.run(job, new Watch() {
        @Override
        public void done(int point, byte[] result, long millis) {
          results[point] = result;
          tally.done(ScenarioWork.scenarios(job.points().get(point)), millis);
          watcher.scenarioProgress("  " + work + ": " + tally.line("scenario"));
        }

        @Override
        public void failed(int point, int attempt, String why) {
          int n = ScenarioWork.scenarios(job.points().get(point));
          tally.failed(n);
          watcher.note(String.format(Locale.ROOT, "%s: a point of %d scenarios failed (%s); the engine tries it"
              + " again if it can   [%s]", work, n, why, tally.line("scenario")));
        }
      }, stop);
    } catch (Engine.JobFailed e) {
      throw new IllegalStateException("the " + work + " could not finish on the " + engine.name() + " engine: "
          + e.getMessage(), e);
    } finally {
      watcher.scenarioProgress("engine " + engine.name() + ", " + work + ": " + tally.summary("scenario"));
    }
    return tally.left() == 0 ? Optional.of(Arrays.asList(results)) : Optional.empty();
  }

  /** The least value whose cumulative weight reaches {@code level} of the total; {@code sorted} by value. */
  static double quantile(List<double[]> sorted, double total, double level) {
    double cum = 0;
    for (double[] x : sorted) {
      cum += x[1];
      if (cum >= level * total * (1 - 1e-12)) {
        return x[0];
      }
    }
    return sorted.get(sorted.size() - 1)[0];
  }
}
