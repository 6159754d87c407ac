package dev.mixwright.export;

import dev.mixwright.runfolder.AtomicFiles;
import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.colgen.Column;
import dev.mixwright.master.ModelFiles;
import dev.mixwright.portfolio.PoolVariant;
import dev.mixwright.portfolio.PortfolioTerms;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.ColumnLogReader;
import dev.mixwright.runfolder.ColumnPool;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A run's models as free MPS files, rebuilt from the run folder (catalog.json and columns.jsonl):
 *
 * <ul>
 *   <li>{@code master.mps}: the restricted master over every column of the column log, margins, use
 *       and bounds computed from the catalog as solved. The log holds every column the run put in
 *       its master, so this is the final master with any retired column back in; its optimum lies
 *       between the final master's and the LP optimum over the whole space, which an optimal run
 *       proved equal within its gap — so it solves to the run's objective. (For a stopped run it can
 *       be above it.)
 *   <li>{@code portfolio.mps}, when the run has a portfolio: the portfolio MIP, formulated as the
 *       integer stage's, over the variants of the column log and of the portfolio in result.json,
 *       each in every segment that accepts it. The integer stage's own pool also held survivors of
 *       its proof that the run folder does not keep; the file's pool holds the chosen portfolio, so
 *       its optimum is at least the portfolio's value, and at most the proven bound.
 * </ul>
 */
public final class ModelExport {
  public static final String MASTER = "master.mps";
  public static final String PORTFOLIO = "portfolio.mps";

  private ModelExport() {}

  /** The run's catalog, with what keeps it from being rebuilt said in words. */
  private static Catalog catalog(RunData run) throws ExportError {
    if (run.catalog() == null) {
      throw new ExportError("no " + run.folder().catalogCopy().getFileName() + " in " + run.folder().dir()
          + ": the models are rebuilt from the catalog as solved, which a run folder made by 'mixwright solve' holds");
    }
    if (run.catalog().hasChoosingSegments()) {
      throw new ExportError("the run's catalog has segments that choose; this version writes the models of"
          + " fixed-demand segments only");
    }
    return run.catalog();
  }

  /** The columns of the column log, rebuilt for the catalog, in the log's order. */
  static List<Column> columns(RunData run, VariantSpace space) throws IOException, ExportError {
    Path log = run.folder().columnLog();
    if (!Files.isRegularFile(log)) {
      throw new ExportError("no " + log.getFileName() + " in " + run.folder().dir() + " — the master is rebuilt from it");
    }
    List<JsonNode> lines = ColumnLogReader.read(log).lines();
    return ColumnPool.rebuild(space, lines).columns();
  }

  /** Writes master.mps, and portfolio.mps when the run has a portfolio; returns the files. */
  public static List<Path> write(RunData run, Path outDir) throws IOException, ExportError {
    Catalog catalog = catalog(run);
    VariantSpace space = new VariantSpace(catalog);
    List<Column> columns = columns(run, space);
    List<Path> files = new ArrayList<>();
    Path master = outDir.resolve(MASTER);
    AtomicFiles.write(master, masterMps(run, space, columns).getBytes(StandardCharsets.UTF_8), true);
    files.add(master);
    if (run.result().portfolio() != null && catalog.portfolio().isPresent()) {
      Path p = outDir.resolve(PORTFOLIO);
      AtomicFiles.write(p, portfolioMps(run, space, columns).getBytes(StandardCharsets.UTF_8), true);
      files.add(p);
    }
    return files;
  }

  static String masterMps(RunData run, VariantSpace space, List<Column> columns) {
    Catalog c = space.catalog();
    List<ModelFiles.SalesColumn> cols = new ArrayList<>();
    List<String> notes = new ArrayList<>();
    notes.add("restricted master of run " + run.folder().dir().getFileName() + " (" + c.name() + "), "
        + columns.size() + " columns from its column log; objective of the run " + run.result().objective());
    for (int j = 0; j < columns.size(); j++) {
      Column col = columns.get(j);
      String seg = c.segments().get(col.segment()).id();
      String name = "x" + j + "_" + mpsName(seg);
      cols.add(new ModelFiles.SalesColumn(name, col.segment(), col.margin(), col.use(), col.upper()));
      notes.add("column " + name + ": " + variantText(space, col.choices()) + " in " + seg);
    }
    return ModelFiles.masterMps(String.join("\n", notes), resourceIds(c), capacity(c), segmentIds(c), demand(c), cols);
  }

  static String portfolioMps(RunData run, VariantSpace space, List<Column> columns) {
    Catalog c = space.catalog();
    PortfolioTerms terms = PortfolioTerms.of(space);
    Map<VariantKey, int[]> variants = new LinkedHashMap<>();
    for (Column col : columns) {
      variants.putIfAbsent(space.key(col.choices()), col.choices());
    }
    int fromLog = variants.size();
    for (RunResult.PortfolioVariant pv : run.result().portfolio().variants()) {
      int[] v = space.parse(pv.options());
      variants.putIfAbsent(space.key(v), v);
    }
    List<String> notes = new ArrayList<>();
    notes.add("portfolio MIP of run " + run.folder().dir().getFileName() + " (" + c.name() + ") over " + variants.size()
        + " variants: " + fromLog + " from the column log, " + (variants.size() - fromLog)
        + " more from the portfolio in result.json; its value in the run " + run.result().portfolio().value());
    List<ModelFiles.PoolEntry> pool = new ArrayList<>();
    int i = 0;
    for (int[] v : variants.values()) {
      PoolVariant pv = PoolVariant.of(space, terms, v);
      if (!pv.sellable()) {
        continue;
      }
      String code = run.codes().code(space.describe(v));
      String name = (code == null ? "p" + i : code);
      notes.add("variant y_" + name + ": " + variantText(space, v));
      pool.add(new ModelFiles.PoolEntry(name, pv.segments(), pv.margin(), pv.upper(), pv.use(), pv.tools()));
      i++;
    }
    List<String> toolNames = new ArrayList<>();
    for (int f = 0; f < space.totalChoices(); f++) {
      int g = space.groupOf(f);
      toolNames.add(mpsName(c.groups().get(g).id() + "." + space.choiceId(g, f - space.offset(g))));
    }
    return ModelFiles.portfolioMps(String.join("\n", notes), resourceIds(c), capacity(c), segmentIds(c), demand(c),
        terms.variantCap(), terms.introductionCost(), terms.minLot(), terms.choiceCost(), toolNames, pool);
  }

  private static String variantText(VariantSpace space, int[] v) {
    StringBuilder b = new StringBuilder();
    space.describe(v).forEach((g, ch) -> b.append(b.length() == 0 ? "" : ",").append(g).append('=').append(ch));
    return b.toString();
  }

  /** An MPS name: no blanks (free MPS splits fields at blanks), nothing but letters, digits and _ . -. */
  static String mpsName(String id) {
    String s = id.replaceAll("[^A-Za-z0-9_.\\-]", "_");
    return s.isEmpty() ? "_" : s;
  }

  private static List<String> resourceIds(Catalog c) {
    return c.resources().stream().map(r -> r.id()).toList();
  }

  private static List<String> segmentIds(Catalog c) {
    return c.segments().stream().map(s -> s.id()).toList();
  }

  private static double[] capacity(Catalog c) {
    return c.resources().stream().mapToDouble(r -> r.capacity()).toArray();
  }

  private static double[] demand(Catalog c) {
    return c.segments().stream().mapToDouble(s -> s.demand()).toArray();
  }
}
