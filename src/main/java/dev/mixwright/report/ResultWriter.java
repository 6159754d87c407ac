package dev.mixwright.report;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.choice.Logit;
import dev.mixwright.colgen.Column;
import dev.mixwright.colgen.IterationRecord;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.space.SpaceCount;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/** Builds {@code result.json} (fields of PRODUCT.md and more) and writes it atomically. */
public final class ResultWriter {
  public static final String FILE = RunFolder.RESULT;
  /** A quantity below this is reported as not sold. */
  static final double QUANTITY_EPS = 1e-7;

  private ResultWriter() {}

  /** What result.json says about the variant space's size. */
  public record SpaceSize(SpaceCount count) {}

  /** Facts about the run that the outcome does not hold. */
  public record RunInfo(String catalogFile, String catalogSha256, String pricer, SpaceSize size, long elapsedMs) {}

  public static RunResult build(VariantSpace space, SolveOutcome out, RunInfo info) {
    Catalog cat = space.catalog();
    List<Integer> sold = new ArrayList<>();
    for (int j = 0; j < out.master().x().length; j++) {
      if (out.master().x()[j] > QUANTITY_EPS) {
        sold.add(j);
      }
    }
    sold.sort(Comparator.comparingInt((Integer j) -> out.master().columns().get(j).segment())
        .thenComparing(j -> -out.master().x()[j] * out.master().columns().get(j).margin()));
    double[] used = new double[cat.resources().size()];
    double[] segSold = new double[cat.segments().size()];
    List<RunResult.Offer> offers = new ArrayList<>();
    for (int j : sold) {
      Column col = out.master().columns().get(j);
      double q = out.master().x()[j];
      int s = col.segment();
      boolean chooses = space.chooses(s);
      offers.add(new RunResult.Offer(cat.segments().get(s).id(), space.describe(col.choices()), q,
          col.margin(), out.master().reducedCost()[j], !chooses && q >= col.upper() * (1 - 1e-9), q * col.margin(),
          space.price(col.choices(), s),
          chooses ? q / space.buyers(s) : null,
          chooses ? Logit.attraction(space.utility(col.choices(), s), space.stayOut(s)) : null));
      for (int r = 0; r < used.length; r++) {
        used[r] += col.use()[r] * q;
      }
      segSold[col.segment()] += q;
    }
    List<RunResult.ResourceRow> res = new ArrayList<>();
    for (int r = 0; r < cat.resources().size(); r++) {
      Resource rr = cat.resources().get(r);
      res.add(new RunResult.ResourceRow(rr.id(), rr.capacity(), used[r],
          known(out.duals().resource(r)),
          used[r] >= rr.capacity() * (1 - 1e-7) - 1e-9));
    }
    List<RunResult.SegmentRow> segs = new ArrayList<>();
    for (int s = 0; s < cat.segments().size(); s++) {
      Segment ss = cat.segments().get(s);
      boolean chooses = space.chooses(s);
      segs.add(new RunResult.SegmentRow(ss.id(), ss.demand(), segSold[s],
          known(out.duals().segment(s)),
          chooses ? space.buyers(s) : null,
          chooses ? stayingOut(out, space, s, segSold[s]) : null));
    }
    List<RunResult.Round> rounds = new ArrayList<>();
    for (IterationRecord r : out.history()) {
      rounds.add(new RunResult.Round(r.iteration(), r.objective(), Json.num(r.bound()), Json.num(r.gap()),
          r.columns(), r.added(), r.exactPricing(), r.elapsedMs()));
    }
    CountFields count = CountFields.of(info.size().count());
    return new RunResult(out.status(), out.stopReason(), out.result().value(), Json.num(out.result().bound()),
        Json.num(out.result().gap()), out.iterations(), out.columnsGenerated(), out.master().columns().size(),
        count.exact(), count.atMost(), count.atLeast(), count.estimate(), info.elapsedMs(),
        new RunResult.CatalogRef(cat.name(), info.catalogFile(), info.catalogSha256(), cat.currency(), cat.period()),
        info.pricer(), offers, res, segs, rounds, null, null, null);
  }

  /**
   * The buyers of choosing segment s who buy none: the master's x_s0 when the run solved one, else
   * (nothing offered) every buyer who did not buy.
   */
  private static double stayingOut(SolveOutcome out, VariantSpace space, int s, double sold) {
    double x0 = out.master().stayingOut(s);
    return Double.isNaN(x0) ? space.buyers(s) - sold : x0;
  }

  public static void write(Path runDir, RunResult result) throws IOException {
    result.write(runDir);
  }

  /** A dual value as written: null when the run has none (nothing was solved), never a made-up 0. */
  private static Double known(java.util.OptionalDouble d) {
    return d.isPresent() ? d.getAsDouble() : null;
  }
}
