package dev.mixwright.run;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.engine.Bytes;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.PointWork;
import dev.mixwright.portfolio.IntegerStage;
import dev.mixwright.portfolio.OfferedVariant;
import dev.mixwright.portfolio.PortfolioOutcome;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.portfolio.PortfolioStatus;
import dev.mixwright.portfolio.ScenarioStage;
import dev.mixwright.scenario.Scenario;
import dev.mixwright.scenario.ScenarioSet;
import dev.mixwright.space.VariantSpace;
import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.function.BooleanSupplier;

/**
 * The per-scenario work of a scenario set as an engine computes it: each scenario solved on its own
 * (its LP stage and its own best range, which the regret is measured against), or the chosen range
 * evaluated in each scenario of the hold-out set (a fixed-range LP a scenario). Everything a worker
 * needs travels as bytes: the catalog as its JSON copy, the range as its variants' choice indices,
 * each scenario as its changes; each scenario's answer is a small record. Points are cut from the
 * set by count alone, never by the engine, so every engine computes the same answers (an integer
 * stage cut off by its time limit is the one exception: where it stops depends on the machine).
 */
public final class ScenarioWork implements PointWork {
  /**
   * Hold-out scenarios a point: an evaluation takes a few milliseconds to a few tenths of a second,
   * so one a point would be mostly the engine's overhead; twenty still spread 200 draws over ten
   * tasks. A scenario solved on its own is heavy enough to be a point by itself.
   */
  static final int EVALUATIONS_PER_POINT = 20;

  /** What the points of one job share: the catalog and what to do with each scenario. */
  record Shared(String catalogJson, Task task) implements Serializable {
    private static final long serialVersionUID = 1L;
  }

  /** The work done for each scenario. */
  sealed interface Task extends Serializable permits SolveAlone, Evaluate {}

  /** Solve the scenario on its own: its LP stage, then its integer stage. */
  record SolveAlone(PricerChoice pricer, SolveSettings loop, PortfolioSettings settings) implements Task {
    private static final long serialVersionUID = 1L;
  }

  /** Evaluate this range (each variant's choice indices) in the scenario. */
  record Evaluate(List<int[]> range) implements Task {
    private static final long serialVersionUID = 1L;

    Evaluate {
      range = List.copyOf(range);
    }
  }

  /** A point: consecutive scenarios of the set. */
  record Batch(ArrayList<Scenario> scenarios) implements Serializable {
    private static final long serialVersionUID = 1L;
  }

  /**
   * A scenario solved on its own, as the stage across the set needs it: what its LP stage hands in,
   * its own best range, and that range's value, bound and status.
   */
  record Alone(ScenarioStage.Start lp, List<int[]> range, double value, double bound, PortfolioStatus status)
      implements Serializable {
    private static final long serialVersionUID = 1L;
  }

  /** The job that solves every scenario of {@code set} on its own, one scenario a point. */
  public static Job alone(Catalog catalog, ScenarioSet set, PricerChoice pricer, SolveSettings loop,
      PortfolioSettings settings) {
    return job(catalog, set, new SolveAlone(pricer, loop, settings), 1);
  }

  /** The job that evaluates {@code range} in every scenario of {@code set}. */
  public static Job evaluations(Catalog catalog, ScenarioSet set, List<int[]> range) {
    return job(catalog, set, new Evaluate(range), EVALUATIONS_PER_POINT);
  }

  private static Job job(Catalog catalog, ScenarioSet set, Task task, int perPoint) {
    List<byte[]> points = new ArrayList<>();
    List<ScenarioSet.Member> members = set.members();
    for (int from = 0; from < members.size(); from += perPoint) {
      ArrayList<Scenario> batch = new ArrayList<>();
      members.subList(from, Math.min(members.size(), from + perPoint)).forEach(m -> batch.add(m.scenario()));
      points.add(Bytes.of(new Batch(batch)));
    }
    return new Job(ScenarioWork.class.getName(), Bytes.of(new Shared(CatalogWriter.toJson(catalog), task)), points);
  }

  /** How many scenarios a point of such a job holds. */
  static int scenarios(byte[] point) {
    return ((Batch) Bytes.read(point)).scenarios().size();
  }

  /** The answers of a point of an {@link #alone} job, in the order of its scenarios. */
  @SuppressWarnings("unchecked")
  static List<Alone> alone(byte[] result) {
    return (List<Alone>) Bytes.read(result);
  }

  /**
   * The answers of a point of an {@link #evaluations} job, in the order of its scenarios: the range's
   * value, NaN where the scenario cannot meet the range's lots.
   */
  public static double[] values(byte[] result) {
    return (double[]) Bytes.read(result);
  }

  @Override
  public byte[] compute(byte[] sharedBytes, byte[] pointBytes) throws Exception {
    Shared s = (Shared) Bytes.read(sharedBytes);
    Catalog base = CatalogLoader.parse(s.catalogJson(), "catalog.json", null);
    List<Scenario> batch = ((Batch) Bytes.read(pointBytes)).scenarios();
    // A stop reaches a worker as its thread's interrupt (the thread pool's cancel, Spark's kill).
    BooleanSupplier stop = Thread.currentThread()::isInterrupted;
    if (s.task() instanceof Evaluate e) {
      double[] values = new double[batch.size()];
      for (int k = 0; k < batch.size(); k++) {
        VariantSpace space = new VariantSpace(batch.get(k).applyTo(base));
        values[k] = ScenarioStage.valueOf(space, e.range()).orElse(Double.NaN);
      }
      return Bytes.of(values);
    }
    SolveAlone a = (SolveAlone) s.task();
    ArrayList<Alone> out = new ArrayList<>();
    for (Scenario sc : batch) {
      out.add(solveAlone(new VariantSpace(sc.applyTo(base)), a, stop));
    }
    return Bytes.of(out);
  }

  private static Alone solveAlone(VariantSpace space, SolveAlone a, BooleanSupplier stop) {
    SolveOutcome lp = new ColumnGeneration(space, a.pricer().create(space), null, a.loop(),
        StopCriterion.signal(stop), System.nanoTime()).run();
    PortfolioOutcome best = new IntegerStage(space, a.settings()).stopWhen(StopCriterion.signal(stop)).run(lp);
    return new Alone(ScenarioStage.Start.of(lp), best.offer().variants().stream().map(OfferedVariant::choices)
        .toList(), best.result().value(), best.result().bound(), best.status());
  }
}
