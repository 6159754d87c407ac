package dev.mixwright.report;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.catalog.Catalog;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;

/** Reads a finished run's result.json back, keyed by the catalog's entities. */
public final class RunReader {
  private RunReader() {}

  /** Shadow prices and offers of one run, aligned with the catalog it was solved with. */
  public record RunView(JsonNode result, double[] resourcePrices, double[] segmentPrices) {
    /** Quantity sold of the variant (group id to choice id) in segment s, 0 when not offered. */
    public double quantity(String segmentId, Map<String, String> options) {
      for (JsonNode o : result.get("offers")) {
        if (o.get("segment").asText().equals(segmentId) && asMap(o.get("options")).equals(options)) {
          return o.get("quantity").asDouble();
        }
      }
      return 0.0;
    }

    public String status() {
      return result.get("status").asText();
    }
  }

  public static JsonNode readResult(Path runDir) throws IOException {
    Path f = runDir.resolve(ResultWriter.FILE);
    if (!Files.isRegularFile(f)) {
      throw new IOException("no " + ResultWriter.FILE + " in " + runDir + " — is this a run folder made by 'mixwright solve --out'?");
    }
    return Json.pretty().readTree(f.toFile());
  }

  public static RunView view(Catalog catalog, JsonNode result) {
    double[] pi = new double[catalog.resources().size()];
    for (JsonNode r : result.get("resources")) {
      int i = catalog.resourceIndex(r.get("id").asText());
      if (i >= 0) {
        pi[i] = r.get("shadowPrice").asDouble();
      }
    }
    double[] mu = new double[catalog.segments().size()];
    for (JsonNode s : result.get("segments")) {
      int i = catalog.segmentIndex(s.get("id").asText());
      if (i >= 0) {
        mu[i] = s.get("shadowPrice").asDouble();
      }
    }
    return new RunView(result, pi, mu);
  }

  static Map<String, String> asMap(JsonNode obj) {
    Map<String, String> m = new LinkedHashMap<>();
    obj.fields().forEachRemaining(e -> m.put(e.getKey(), e.getValue().asText()));
    return m;
  }
}
