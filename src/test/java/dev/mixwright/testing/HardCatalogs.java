package dev.mixwright.testing;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Random;

/**
 * Catalogs whose pricing takes far longer than any test may wait, for tests that a limit or a signal
 * ends a search under way.
 */
public final class HardCatalogs {
  private HardCatalogs() {}

  /**
   * One group of {@code bigOptions} options (no rules on it), then {@code n} two-option groups
   * ({@code a} earns 1 more than {@code b}) with a rule forbidding {@code a} in both groups of each
   * edge of a random graph G(n, p). Every variant of b's is buildable, so a variant is found at
   * once, but the best one is a maximum independent set of the graph, which pricing must prove:
   * NP-hard (Garey &amp; Johnson, <i>Computers and Intractability</i>, GT20). With 200 groups at
   * p = 0.05 the exact pricer's first query had not ended after 165 CPU seconds (measured on a
   * loaded 2-core machine); the tests take 300. Returned as catalog JSON.
   */
  public static String independentSets(long seed, int n, double p, int bigOptions) {
    Random rnd = new Random(seed);
    ObjectMapper json = new ObjectMapper();
    ObjectNode cat = json.createObjectNode();
    cat.put("format", 1).put("name", "independent sets " + seed).put("currency", "EUR").put("period", "year");
    cat.putArray("resources").addObject().put("id", "hours").put("capacity", 1e6);
    ArrayNode groups = cat.putArray("groups");
    ArrayNode big = groups.addObject().put("id", "big").putArray("options");
    for (int i = 0; i < bigOptions; i++) {
      ObjectNode o = big.addObject().put("id", "b" + i).put("price", 100 + rnd.nextInt(1000) / 100.0).put("cost", 50);
      o.putObject("uses").put("hours", 1);
    }
    for (int g = 0; g < n; g++) {
      ArrayNode opts = groups.addObject().put("id", "g" + g).putArray("options");
      opts.addObject().put("id", "a").put("price", 3).put("cost", 1);
      opts.addObject().put("id", "b").put("price", 2).put("cost", 1);
    }
    ArrayNode rules = cat.putArray("rules");
    int k = 0;
    for (int i = 0; i < n; i++) {
      for (int j = i + 1; j < n; j++) {
        if (rnd.nextDouble() < p) {
          ObjectNode forbid = rules.addObject().put("id", "r" + k++).putObject("forbid");
          forbid.putArray("g" + i).add("a");
          forbid.putArray("g" + j).add("a");
        }
      }
    }
    cat.putArray("segments").addObject().put("id", "buyers").put("demand", 1000);
    return cat.toString();
  }
}
