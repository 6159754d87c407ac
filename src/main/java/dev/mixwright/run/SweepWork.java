package dev.mixwright.run;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.Sweep;
import dev.mixwright.engine.Bytes;
import dev.mixwright.engine.Job;
import dev.mixwright.engine.PointWork;
import dev.mixwright.portfolio.IntegerStage;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.report.PortfolioSection;
import dev.mixwright.report.RunResult;
import dev.mixwright.report.SweepTable;
import dev.mixwright.runfolder.Json;
import dev.mixwright.scenario.SweepPlan;
import dev.mixwright.space.VariantSpace;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.Serializable;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * One piece of a sweep as an engine computes it: a chain of points, consecutive in the plan's solve
 * order, each warm-started from the one before ({@link Sweep}), and their rows of the sweep table as
 * JSON. Everything a worker needs travels as bytes: the catalog as its JSON copy, the plan and the
 * settings serialised, a chain as its point indices. Chains are cut from the whole solve order by
 * length alone, never by the engine, so every engine computes the same chains and so the same rows
 * (an integer stage cut off by its time limit is the one exception: where it stops depends on the
 * machine).
 */
public final class SweepWork implements PointWork {
  /** Points per chain unless the user says otherwise: short enough to spread, long enough to warm-start. */
  public static final int DEFAULT_CHAIN = 25;

  /** What every chain shares; {@code integerStage} null for a sweep of the LP stage alone. */
  record Shared(String catalogJson, SweepPlan plan, SolveSettings settings, PricerChoice pricer, boolean warmStart,
      PortfolioSettings integerStage) implements Serializable {
    private static final long serialVersionUID = 1L;
  }

  /**
   * The job of a sweep: the chains of at most {@code chain} points (0: one chain) not in {@code done};
   * {@code integerStage}: its settings when each point goes on to the integer stage (catalogs with a
   * portfolio section), else null.
   */
  public static Job job(Catalog catalog, SweepPlan plan, SolveSettings settings, PricerChoice pricer, boolean warmStart,
      PortfolioSettings integerStage, int chain, Set<Integer> done) {
    byte[] shared = Bytes.of(new Shared(CatalogWriter.toJson(catalog), plan, settings, pricer, warmStart,
        integerStage));
    List<byte[]> points = new ArrayList<>();
    for (int[] c : chains(plan.solveOrder(), chain, done)) {
      points.add(indices(c));
    }
    return new Job(SweepWork.class.getName(), shared, points);
  }

  /**
   * The solve order cut into pieces of {@code chain} points (0: one piece), then the points already
   * done left out; a piece left empty is dropped. Cutting before leaving out keeps the chains of a
   * resumed sweep those of the first run.
   */
  static List<int[]> chains(List<Integer> order, int chain, Set<Integer> done) {
    int len = chain <= 0 ? Math.max(1, order.size()) : chain;
    List<int[]> out = new ArrayList<>();
    for (int from = 0; from < order.size(); from += len) {
      int[] c = order.subList(from, Math.min(order.size(), from + len)).stream()
          .filter(i -> !done.contains(i)).mapToInt(Integer::intValue).toArray();
      if (c.length > 0) {
        out.add(c);
      }
    }
    return out;
  }

  /** The number of sweep points in a chain's bytes. */
  static int length(byte[] chain) {
    return readIndices(chain).length;
  }

  /** The rows a chain's result holds, as the table stores them. */
  public static List<ObjectNode> rows(byte[] result) {
    try {
      List<ObjectNode> out = new ArrayList<>();
      Json.compact().readTree(result).forEach(n -> out.add((ObjectNode) n));
      return out;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  @Override
  public byte[] compute(byte[] sharedBytes, byte[] chainBytes) throws Exception {
    Shared s = (Shared) Bytes.read(sharedBytes);
    Catalog catalog = CatalogLoader.parse(s.catalogJson(), "catalog.json", null);
    Set<Integer> chain = new HashSet<>();
    for (int i : readIndices(chainBytes)) {
      chain.add(i);
    }
    Set<Integer> skip = new HashSet<>();
    for (int i = 0; i < s.plan().points().size(); i++) {
      if (!chain.contains(i)) {
        skip.add(i);
      }
    }
    // The table turns a solved point into its row exactly as a sweep on one machine always did.
    SweepTable rowMaker = new SweepTable(s.plan(), catalog, Json.compact().createObjectNode());
    ArrayNode rows = Json.compact().createArrayNode();
    new Sweep(catalog, s.plan(), s.pricer()::create, s.settings(), s.warmStart())
        .run(skip, Thread.currentThread()::isInterrupted, new Sweep.Listener() {
          @Override
          public void solved(Sweep.Row row) {
            rows.add(rowMaker.add(row, portfolio(row, s.integerStage())));
          }
        });
    return Json.compact().writeValueAsBytes(rows);
  }

  /**
   * The point's integer stage, when the sweep asks for it, the point's catalog has a portfolio section
   * and its LP stage reached the optimum; null otherwise. The stage's time limit counts for this point.
   */
  private static RunResult.Portfolio portfolio(Sweep.Row row, PortfolioSettings settings) {
    if (settings == null || row.outcome() == null || row.catalog().portfolio().isEmpty()
        || !row.outcome().status().isOptimal()) {
      return null;
    }
    VariantSpace space = new VariantSpace(row.catalog());
    IntegerStage stage = new IntegerStage(space, settings)
        .stopWhen(StopCriterion.signal(Thread.currentThread()::isInterrupted));
    return PortfolioSection.of(space, stage.terms(), stage.run(row.outcome()));
  }

  private static byte[] indices(int[] c) {
    ByteArrayOutputStream b = new ByteArrayOutputStream();
    try (DataOutputStream out = new DataOutputStream(b)) {
      out.writeInt(c.length);
      for (int i : c) {
        out.writeInt(i);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return b.toByteArray();
  }

  private static int[] readIndices(byte[] bytes) {
    try (DataInputStream in = new DataInputStream(new ByteArrayInputStream(bytes))) {
      int[] c = new int[in.readInt()];
      for (int k = 0; k < c.length; k++) {
        c[k] = in.readInt();
      }
      return c;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
