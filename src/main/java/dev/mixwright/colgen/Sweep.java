package dev.mixwright.colgen;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.scenario.SweepPlan;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.function.BooleanSupplier;
import java.util.function.Function;

/**
 * Solves the scenarios of a {@link SweepPlan} one after another, each to its own proven optimum, in
 * the plan's solve order (neighbouring grid points in turn). Each solve starts from the columns the
 * one before ended with, re-priced in the new scenario's figures ({@link WarmStart}): neighbouring
 * scenarios share most of their good variants, so the warm start saves most of the pricing rounds,
 * while the pricing still searches the whole space and finds variants that only pay in the new
 * scenario. Cost: one column generation per scenario.
 */
public final class Sweep {
  private final Catalog base;
  private final SweepPlan plan;
  private final Function<VariantSpace, Pricer> pricer;
  private final SolveSettings settings;
  private final boolean warmStart;

  /** Per scenario: a fresh listener for its loop (progress), and word of each result. */
  public interface Listener {
    default ColGenListener loopListener(SweepPlan.Point p, int nth, int total) {
      return null;
    }

    default void solved(Row row) {}
  }

  /**
   * One scenario's result, figures aligned with the scenario catalog's resources and segments.
   * {@code outcome} is null when the scenario could not be built ({@code problem} says why).
   */
  public record Row(SweepPlan.Point point, Catalog catalog, SolveOutcome outcome, double[] used,
      int warmColumns, String problem) {

    /** Whether resource r is used to its capacity. */
    public boolean binding(int r) {
      double cap = catalog.resources().get(r).capacity();
      return used[r] >= cap * (1 - 1e-7) - 1e-9;
    }
  }

  /** @param pricer makes the exact pricer of each scenario's space */
  public Sweep(Catalog base, SweepPlan plan, Function<VariantSpace, Pricer> pricer, SolveSettings settings,
      boolean warmStart) {
    this.base = base;
    this.plan = plan;
    this.pricer = pricer;
    this.settings = settings;
    this.warmStart = warmStart;
  }

  /**
   * Solves every point not in {@code skip}; stops early (remaining points unsolved) once {@code stop}
   * says so, the scenario in progress ending stopped.
   */
  public List<Row> run(Set<Integer> skip, BooleanSupplier stop, Listener listener) {
    List<SweepPlan.Point> points = plan.points();
    List<Row> rows = new ArrayList<>();
    VariantSpace prevSpace = null;
    List<Column> prevColumns = List.of();
    int total = (int) plan.solveOrder().stream().filter(i -> !skip.contains(i)).count();
    int nth = 0;
    for (int index : plan.solveOrder()) {
      if (skip.contains(index)) {
        continue;
      }
      if (stop.getAsBoolean()) {
        break;
      }
      SweepPlan.Point p = points.get(index);
      nth++;
      Catalog c;
      try {
        c = p.scenario().applyTo(base);
      } catch (CatalogException e) {
        Row row = new Row(p, base, null, new double[0], 0, e.getMessage());
        rows.add(row);
        listener.solved(row);
        continue;
      }
      VariantSpace space = new VariantSpace(c);
      List<Column> warm = warmStart && prevSpace != null
          ? WarmStart.reprice(prevSpace, prevColumns, space).columns() : List.of();
      ColumnGeneration cg = new ColumnGeneration(space, pricer.apply(space), null, settings,
          r -> stop.getAsBoolean() ? Optional.of("interrupted by a signal") : Optional.empty(),
          System.nanoTime());
      ColGenListener l = listener.loopListener(p, nth, total);
      if (l != null) {
        cg.addListener(l);
      }
      SolveOutcome out = cg.run(warm);
      Row row = new Row(p, c, out, used(space, out), warm.size(), "");
      rows.add(row);
      listener.solved(row);
      prevSpace = space;
      prevColumns = out.master().columns();
    }
    return rows;
  }

  /** Resource use of the outcome's plan. */
  public static double[] used(VariantSpace space, SolveOutcome out) {
    double[] used = new double[space.resourceCount()];
    for (int j = 0; j < out.master().x().length; j++) {
      Column col = out.master().columns().get(j);
      for (int r = 0; r < used.length; r++) {
        used[r] += col.use()[r] * out.master().x()[j];
      }
    }
    return used;
  }
}
