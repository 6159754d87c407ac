package dev.mixwright.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Short codes for the distinct variants of a run ({@code V01}, {@code V02}, ...), a function of
 * result.json alone so that every view of one run (summary, export, compare) gives a variant the same
 * code. Order: the variants of the LP plan by units sold, all segments together, largest first; then
 * the variants only the integer portfolio holds, by their portfolio units; then the variants of the
 * range on sale today that neither sells (kept unsold, or dropped); ties by the variant's text
 * ({@code group=option,...} in the file's group order). Units are compared at 1e-6, so round-off in
 * the last digits of an LP value cannot swap two codes. Codes have at least two digits, more when a
 * run has 100 variants or more.
 */
public final class VariantCodes {
  private final Map<String, String> codeByKey;
  private final List<Map<String, String>> variants;

  private VariantCodes(Map<String, String> codeByKey, List<Map<String, String>> variants) {
    this.codeByKey = codeByKey;
    // copied once: callers index it in loops, and a copy per call made a table of n rows cost n²
    this.variants = List.copyOf(variants);
  }

  public static VariantCodes of(RunResult result) {
    Map<String, Map<String, String>> options = new LinkedHashMap<>();
    Map<String, Double> lpUnits = new LinkedHashMap<>();
    for (RunResult.Offer o : result.offers()) {
      String k = key(o.options());
      options.putIfAbsent(k, o.options());
      lpUnits.merge(k, o.quantity(), Double::sum);
    }
    Map<String, Double> portfolioUnits = new LinkedHashMap<>();
    if (result.portfolio() != null) {
      for (RunResult.PortfolioVariant v : result.portfolio().variants()) {
        String k = key(v.options());
        options.putIfAbsent(k, v.options());
        portfolioUnits.merge(k, v.units(), Double::sum);
      }
      for (List<RunResult.RangeVariant> today : java.util.Arrays.asList(result.portfolio().kept(),
          result.portfolio().dropped())) {
        if (today != null) {
          today.forEach(v -> options.putIfAbsent(key(v.options()), v.options()));
        }
      }
    }
    Comparator<String> order = Comparator
        .comparing((String k) -> lpUnits.containsKey(k) ? 0 : portfolioUnits.containsKey(k) ? 1 : 2)
        .thenComparing(k -> -rounded(lpUnits.containsKey(k) ? lpUnits.get(k) : portfolioUnits.getOrDefault(k, 0.0)))
        .thenComparing(Comparator.naturalOrder());
    List<String> keys = new ArrayList<>(options.keySet());
    keys.sort(order);
    Map<String, String> codes = new LinkedHashMap<>();
    List<Map<String, String>> variants = new ArrayList<>();
    for (int i = 0; i < keys.size(); i++) {
      codes.put(keys.get(i), code(i, keys.size()));
      variants.add(options.get(keys.get(i)));
    }
    return new VariantCodes(codes, variants);
  }

  /** The code of a variant of this run (group id to choice id), or null when the run does not hold it. */
  public String code(Map<String, String> options) {
    return codeByKey.get(key(options));
  }

  /** The variants in code order: the first is V01. */
  public List<Map<String, String>> variants() {
    return variants;
  }

  public String codeAt(int i) {
    return codeByKey.get(key(variants.get(i)));
  }

  public int size() {
    return variants.size();
  }

  /** The code of the i-th (from 0) of {@code count} variants: V01, V02, ...; more digits from 100 on. */
  static String code(int i, int count) {
    int digits = Math.max(2, String.valueOf(count).length());
    return "V" + String.format(java.util.Locale.ROOT, "%0" + digits + "d", i + 1);
  }

  /**
   * {@code group=option,...} in the map's order: the identity of a variant in a result. Use it rather
   * than the options map as a hash key: a map's hash sums its entries' hashes, which collide in bulk
   * on catalogs whose ids differ in a digit or two (a plan of 10^5 variants became quadratic).
   */
  public static String key(Map<String, String> options) {
    StringBuilder b = new StringBuilder();
    options.forEach((g, c) -> b.append(b.length() == 0 ? "" : ",").append(g).append('=').append(c));
    return b.toString();
  }

  private static double rounded(double v) {
    return Math.rint(v * 1e6) / 1e6;
  }
}
