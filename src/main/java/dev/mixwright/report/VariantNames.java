package dev.mixwright.report;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * What a person calls the variants of one run: the {@link VariantCodes code} of a variant the run
 * holds (the same code the summary, report and export print, since all read it from
 * {@link VariantCodes#of}), and for any other variant its nearest coded variant and the options in
 * which it differs ({@code V04 but 12 kW, Zone controller}), so that a log of many columns reads on
 * a narrow terminal. Labels come from the catalog where it gives them; an option without one is
 * named in the catalog's id form, group and option ({@code V04 but g03=o8}).
 */
public final class VariantNames {
  /** Differences named one by one in a short name; more are counted. */
  private static final int DIFFERENCES_SHOWN = 3;

  private final VariantCodes codes;
  private final Catalog catalog;
  /** Built at the first variant the run does not hold: most uses name only coded variants. */
  private NearestVariant nearest;

  private VariantNames(VariantCodes codes, Catalog catalog) {
    this.codes = codes;
    this.catalog = catalog;
  }

  /** The names of {@code result}'s variants; {@code catalog} (the run's catalog.json) gives labels and may be null. */
  public static VariantNames of(RunResult result, Catalog catalog) {
    return new VariantNames(VariantCodes.of(result), catalog);
  }

  public VariantCodes codes() {
    return codes;
  }

  /** The code of a variant the run holds, or null. */
  public String code(Map<String, String> options) {
    return codes.code(options);
  }

  /** The variant of a code (case does not matter), or null when the run has no such code. */
  public Map<String, String> variant(String code) {
    for (int i = 0; i < codes.size(); i++) {
      if (codes.codeAt(i).equalsIgnoreCase(code.strip())) {
        return codes.variants().get(i);
      }
    }
    return null;
  }

  /** Whether {@code text} is written as a variant code (V and digits), whether or not the run holds it. */
  public static boolean looksLikeCode(String text) {
    return text.strip().matches("[Vv][0-9]+");
  }

  /** The run's codes for a message: all of them up to twelve, else the first and the last. */
  public String codeList() {
    if (codes.size() == 0) {
      return "none (the run sells nothing)";
    }
    if (codes.size() <= 12) {
      List<String> all = new ArrayList<>();
      for (int i = 0; i < codes.size(); i++) {
        all.add(codes.codeAt(i));
      }
      return String.join(", ", all);
    }
    return codes.codeAt(0) + ", " + codes.codeAt(1) + ", " + codes.codeAt(2) + " ... " + codes.codeAt(codes.size() - 1);
  }

  /** Every choice of the variant in the catalog's words, optional groups at none left out. */
  public String labels(Map<String, String> options) {
    return MatrixView.describe(catalog, options);
  }

  /**
   * A short name: the code when the run holds the variant, else {@code V04 but X, Y} with the
   * nearest coded variant (fewest groups that differ; the lower code on a tie, found by
   * {@link NearestVariant}) and the choices that differ (label, else {@code group=option}); the
   * labels of every choice when the run has no coded variant.
   */
  public String shortName(Map<String, String> options) {
    String own = codes.code(options);
    if (own != null) {
      return own;
    }
    if (nearest == null) {
      nearest = new NearestVariant(codes.variants());
    }
    int best = nearest.nearest(options);
    if (best < 0) {
      return labels(options);
    }
    List<String> bestDiff = differences(options, codes.variants().get(best));
    List<String> shown = bestDiff.subList(0, Math.min(DIFFERENCES_SHOWN, bestDiff.size()));
    int more = bestDiff.size() - shown.size();
    return codes.codeAt(best) + " but " + String.join(", ", shown) + (more > 0 ? " and " + more + " more" : "");
  }

  /** The texts of {@code options}' choices in the groups where {@code than} has another choice. */
  private List<String> differences(Map<String, String> options, Map<String, String> than) {
    Set<String> groups = new LinkedHashSet<>(options.keySet());
    groups.addAll(than.keySet());
    List<String> out = new ArrayList<>();
    for (String g : groups) {
      String mine = options.getOrDefault(g, Group.NONE);
      if (!mine.equals(than.getOrDefault(g, Group.NONE))) {
        String label = MatrixView.choiceLabel(catalog, g, mine);
        // an option id alone ("o8") does not say its group when every group numbers its options alike
        out.add(mine.equals(Group.NONE) ? "no " + MatrixView.groupHead(catalog, g)
            : label != null ? label : VariantCodes.key(Map.of(g, mine)));
      }
    }
    return out;
  }

  /** A JSON object's fields as a variant map, in the object's order. */
  public static Map<String, String> options(com.fasterxml.jackson.databind.JsonNode node) {
    Map<String, String> m = new LinkedHashMap<>();
    node.fields().forEachRemaining(e -> m.put(e.getKey(), e.getValue().asText()));
    return m;
  }
}
