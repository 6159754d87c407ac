package dev.mixwright.runfolder;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.colgen.WarmStart;
import dev.mixwright.space.VariantSpace;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The columns of a run's column log, rebuilt for a catalog: the warm start of a resume. */
public final class ColumnPool {
  private ColumnPool() {}

  public static WarmStart.Carried rebuild(VariantSpace space, List<JsonNode> lines) {
    WarmStart.Builder b = new WarmStart.Builder(space);
    for (JsonNode n : lines) {
      Map<String, String> options = new LinkedHashMap<>();
      n.path("options").fields().forEachRemaining(e -> options.put(e.getKey(), e.getValue().asText()));
      b.add(n.path("segment").asText(), options, n.path("iteration").asInt(), n.path("reducedCost").asDouble());
    }
    return b.build();
  }
}
