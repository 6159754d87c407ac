package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.colgen.Column;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.explain.CapacityRanges;
import dev.mixwright.report.RunResult;
import dev.mixwright.run.PricerChoice;
import dev.mixwright.runfolder.ColumnLogReader;
import dev.mixwright.runfolder.ColumnPool;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunManifest;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** {@code explain --capacity-ranges}: each resource's shadow price and the capacities over which it holds. */
final class CapacityRangeReport {
  /** Re-solves aim this close, so that their error stays well under the tolerance that tells pieces apart. */
  static final SolveSettings RESOLVE = SolveSettings.defaults().withGapTolerance(1e-9);

  private CapacityRangeReport() {}

  /** The exact pricer the run used (bnb when its manifest is missing). */
  static PricerChoice runPricer(RunFolder folder) throws IOException {
    if (!Files.isRegularFile(folder.manifest())) {
      return PricerChoice.BNB;
    }
    String word = RunManifest.read(folder).settings().pricer();
    try {
      return PricerChoice.byWord(word);
    } catch (IllegalArgumentException e) {
      throw new UserError(RunFolder.MANIFEST + " settings.pricer: " + e.getMessage());
    }
  }

  /** Every column of the run's log, as warm start for re-solves. */
  static List<Column> runColumns(RunFolder folder, VariantSpace space) throws IOException {
    return Files.isRegularFile(folder.columnLog())
        ? ColumnPool.rebuild(space, ColumnLogReader.read(folder.columnLog()).lines()).columns()
        : List.of();
  }

  static List<CapacityRanges.Range> compute(RunFolder folder, Catalog catalog, List<String> only, PrintWriter err)
      throws IOException {
    VariantSpace space = new VariantSpace(catalog);
    PricerChoice pricer = runPricer(folder);
    List<Column> warm = runColumns(folder, space);
    for (String id : only) {
      if (catalog.resourceIndex(id) < 0) {
        throw new UserError("--resource: no resource '" + id + "'; resources are "
            + catalog.resources().stream().map(r -> r.id()).toList());
      }
    }
    CapacityRanges search = new CapacityRanges(1e-6, 1e-7);
    List<CapacityRanges.Range> out = new ArrayList<>();
    for (int r = 0; r < catalog.resources().size(); r++) {
      String id = catalog.resources().get(r).id();
      if (!only.isEmpty() && !only.contains(id)) {
        continue;
      }
      CapacityRanges.ColumnGenerationSolver solver =
          new CapacityRanges.ColumnGenerationSolver(catalog, r, pricer::create, RESOLVE, warm);
      // The run's own figures come from a solve to its own gap; solve once more here so every point
      // of the search has the same accuracy.
      CapacityRanges.Point p0 = solver.at(catalog.resources().get(r).capacity());
      out.add(search.find(id, p0, CapacityRanges.unusableCapacity(space, r), solver));
      err.flush();
    }
    return out;
  }

  static ArrayNode toJson(List<CapacityRanges.Range> ranges) {
    ArrayNode a = Json.pretty().createArrayNode();
    for (CapacityRanges.Range r : ranges) {
      ObjectNode n = a.addObject();
      n.put("resource", r.resource());
      n.put("capacity", r.capacity());
      n.put("shadowPrice", r.price());
      n.put("holdsFrom", r.low());
      Json.putNum(n, "holdsTo", r.high());
      Json.putNum(n, "priceBelow", r.priceBelow());
      Json.putNum(n, "priceAbove", r.priceAbove());
      n.put("exact", r.exact());
      n.put("solves", r.solves());
    }
    return a;
  }

  static void print(PrintWriter out, List<CapacityRanges.Range> ranges, RunResult result) {
    int solves = ranges.stream().mapToInt(CapacityRanges.Range::solves).sum() + ranges.size();
    out.println("capacity ranges of the shadow prices (found by re-solving over the whole space, "
        + solves + " solves):");
    out.println(String.format(Locale.ROOT, "  %-14s %14s %12s   %-34s %12s %12s", "resource", "capacity",
        "shadow price", "holds for capacity in", "below", "above"));
    for (CapacityRanges.Range r : ranges) {
      String range = "[" + Figures.money(r.low()) + ", "
          + (Double.isInfinite(r.high()) ? "no limit" : Figures.money(r.high())) + "]" + (r.exact() ? "" : " at least");
      out.println(String.format(Locale.ROOT, "  %-14s %14s %12s   %-34s %12s %12s", r.resource(),
          Figures.money(r.capacity()), Figures.money(r.price()), range, Figures.money(r.priceBelow()),
          Figures.money(r.priceAbove())));
    }
    if (!result.status().isOptimal()) {
      out.println("  note: the run ended " + result.status().word()
          + "; the ranges are those of the re-solved optimum, not of its last master");
    }
  }
}
