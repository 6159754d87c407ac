package dev.mixwright.report;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.colgen.RunStatus;
import java.util.Map;

/** Reads a finished run's result.json back, keyed by the catalog's entities. */
public final class RunReader {
  private RunReader() {}

  /** Shadow prices and offers of one run, aligned with the catalog it was solved with. */
  public record RunView(RunResult result, double[] resourcePrices, double[] segmentPrices) {
    /** Quantity sold of the variant (group id to choice id) in segment s, 0 when not offered. */
    public double quantity(String segmentId, Map<String, String> options) {
      for (RunResult.Offer o : result.offers()) {
        if (o.segment().equals(segmentId) && o.options().equals(options)) {
          return o.quantity();
        }
      }
      return 0.0;
    }

    public RunStatus status() {
      return result.status();
    }
  }

  public static RunView view(Catalog catalog, RunResult result) {
    double[] pi = new double[catalog.resources().size()];
    for (RunResult.ResourceRow r : result.resources()) {
      int i = catalog.resourceIndex(r.id());
      if (i >= 0) {
        pi[i] = r.shadowPrice() == null ? 0.0 : r.shadowPrice();
      }
    }
    double[] mu = new double[catalog.segments().size()];
    for (RunResult.SegmentRow s : result.segments()) {
      int i = catalog.segmentIndex(s.id());
      if (i >= 0) {
        mu[i] = s.shadowPrice() == null ? 0.0 : s.shadowPrice();
      }
    }
    return new RunView(result, pi, mu);
  }
}
