package dev.mixwright.run;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.portfolio.IntegerStage;
import dev.mixwright.portfolio.OfferedVariant;
import dev.mixwright.portfolio.PortfolioOutcome;
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
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.BooleanSupplier;
import java.util.function.Consumer;

/**
 * The integer stage of a solve with a scenario set: every scenario solved on its own (its LP stage
 * and its own best range, through {@link ScenarioWork}), one range chosen across the set
 * ({@link ScenarioStage}), each scenario's regret against its own best range, and the optional
 * hold-out check; the result is the {@code portfolio} section of result.json.
 */
final class ScenarioSetStep {
  private ScenarioSetStep() {}

  /** A set read and checked against the catalog, ready to run. */
  record Loaded(ScenarioSetPlan plan, ScenarioSet set, List<Catalog> catalogs, Optional<ScenarioSet> holdOut,
      List<Catalog> holdOutCatalogs) {}

  /** Reads the set (and the hold-out set), refusing in words what a range across scenarios cannot take. */
  static Loaded load(ScenarioSetPlan plan, Catalog catalog) {
    if (catalog.portfolio().isEmpty()) {
      throw new InputError("--scenario-set chooses one range across the scenarios, so the catalog needs a portfolio"
          + " section (introductionCost, maxVariants, minLot); add one");
    }
    if (!catalog.current().isEmpty()) {
      throw new InputError("--scenario-set does not take a current range yet; solve without current: or without"
          + " the set");
    }
    ScenarioSet set = read(plan.file(), catalog, "--scenario-set");
    List<Catalog> cats = catalogs(set, catalog, plan.file());
    Optional<ScenarioSet> hold = plan.holdOut().map(f -> read(f, catalog, "--hold-out"));
    List<Catalog> holdCats = hold.isPresent() ? catalogs(hold.get(), catalog, plan.holdOut().get()) : List.of();
    return new Loaded(plan, set, cats, hold, holdCats);
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

  /** One scenario solved on its own: its space, LP stage and best range. */
  private record Alone(VariantSpace space, SolveOutcome lp, PortfolioOutcome best) {}

  /** Runs the step and returns {@code result} with the set's portfolio section. */
  static RunResult attach(Loaded set, PricerChoice pricer, SolveSettings loop, PortfolioSettings settings,
      RunResult result, long startNanos, BooleanSupplier stop, Consumer<String> note) {
    List<Alone> alone = ScenarioWork.each(set.catalogs(), c -> solveAlone(c, pricer, loop, settings, stop));
    note.accept(String.format(Locale.ROOT, "solved the %d scenarios of %s each on its own; choosing one range",
        alone.size(), set.plan().file()));
    List<VariantSpace> spaces = alone.stream().map(Alone::space).toList();
    double[] w = set.set().weights();
    ScenarioStage stage = new ScenarioStage(spaces, w, set.plan().aim(), settings).stopWhen(StopCriterion.signal(stop));
    ScenarioStage.Outcome o = stage.run(alone.stream().map(Alone::lp).toList(),
        alone.stream().map(a -> a.best().offer().variants().stream().map(OfferedVariant::choices).toList()).toList(),
        alone.stream().mapToDouble(a -> a.best().result().bound()).toArray());
    List<RunResult.ScenarioRow> rows = new ArrayList<>();
    for (int k = 0; k < alone.size(); k++) {
      PortfolioOutcome b = alone.get(k).best();
      double v = o.scenarioValue()[k];
      rows.add(new RunResult.ScenarioRow(set.set().members().get(k).id(), w[k], v, b.result().value(), b.result().value() - v,
          b.status()));
    }
    RunResult.HoldOut check = set.holdOut().isEmpty() ? null
        : holdOut(set.holdOut().get(), set.holdOutCatalogs(), o.range(), set.plan().holdOut().get());
    VariantSpace base = spaces.get(0);
    RunResult.Portfolio p = PortfolioSection.ofScenarios(base, PortfolioTerms.of(base), o,
        w, settings.engine().word()).withScenarios(set.plan().aim().isWorst() ? "worst" : "mean", rows, check);
    return result.withPortfolio(p, (System.nanoTime() - startNanos) / 1_000_000);
  }

  private static Alone solveAlone(Catalog c, PricerChoice pricer, SolveSettings loop, PortfolioSettings settings,
      BooleanSupplier stop) {
    VariantSpace space = new VariantSpace(c);
    SolveOutcome lp = new ColumnGeneration(space, pricer.create(space), null, loop, StopCriterion.signal(stop),
        System.nanoTime()).run();
    PortfolioOutcome best = new IntegerStage(space, settings).stopWhen(StopCriterion.signal(stop)).run(lp);
    return new Alone(space, lp, best);
  }

  /**
   * The range's value in every hold-out scenario (a fixed-range LP each, on {@link ScenarioWork}),
   * as a weighted mean and 5 % / 95 % quantiles (the least value whose cumulative weight reaches
   * the level).
   */
  static RunResult.HoldOut holdOut(ScenarioSet set, List<Catalog> catalogs, List<int[]> range, Path file) {
    long t0 = System.nanoTime();
    List<Optional<Double>> values = ScenarioWork.each(catalogs,
        c -> ScenarioStage.valueOf(new VariantSpace(c), range));
    double[] w = set.weights();
    List<double[]> kept = new ArrayList<>();
    int missed = 0;
    for (int k = 0; k < values.size(); k++) {
      if (values.get(k).isPresent()) {
        kept.add(new double[] {values.get(k).get(), w[k]});
      } else {
        missed++;
      }
    }
    long ms = (System.nanoTime() - t0) / 1_000_000;
    if (kept.isEmpty()) {
      return new RunResult.HoldOut(file.toString(), values.size(), missed, null, null, null, ms);
    }
    double total = kept.stream().mapToDouble(x -> x[1]).sum();
    double mean = kept.stream().mapToDouble(x -> x[0] * x[1]).sum() / total;
    kept.sort((a, b) -> Double.compare(a[0], b[0]));
    return new RunResult.HoldOut(file.toString(), values.size(), missed, Json.num(mean),
        Json.num(quantile(kept, total, 0.05)), Json.num(quantile(kept, total, 0.95)), ms);
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
