package dev.mixwright.report;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.DoubleFunction;

/**
 * A run's variants as a matrix: one row per variant (by its {@link VariantCodes code}), one column per
 * option group in which the variants differ, then the units each segment buys in the LP plan, their
 * total, and the units of the integer portfolio. The choices every variant shares are factored out
 * above the table, so a range of twelve variants that differ in two groups reads as a 12 × 2 table.
 * Group and option labels of the catalog are used where it gives them, ids otherwise.
 */
public record MatrixView(List<Shared> shared, List<GroupColumn> groups, List<String> segments,
    boolean hasPortfolio, List<Row> rows) {

  public MatrixView {
    shared = List.copyOf(shared);
    groups = List.copyOf(groups);
    segments = List.copyOf(segments);
    rows = List.copyOf(rows);
  }

  /** A choice every variant holds: group id and heading, choice id and its text. */
  public record Shared(String group, String groupHead, String choice, String choiceText) {}

  /** A group in which the variants differ: id and heading. */
  public record GroupColumn(String id, String head) {}

  /**
   * A variant: code, its choices (group id to choice id), the text of its choice per {@link #groups},
   * LP units per segment (aligned with {@link #segments}), their total, and its units in the integer
   * portfolio (NaN when the run has no portfolio; 0 when the portfolio leaves it out).
   */
  public record Row(String code, Map<String, String> options, List<String> cells, double[] units, double total,
      double portfolioUnits) {
    public Row {
      cells = List.copyOf(cells);
      units = units.clone();
    }

    @Override
    public double[] units() {
      return units.clone();
    }
  }

  /** The matrix of a run; {@code catalog} (the run's catalog.json) gives labels and may be null. */
  public static MatrixView of(RunResult result, Catalog catalog) {
    VariantCodes codes = VariantCodes.of(result);
    List<String> segments = new ArrayList<>();
    result.segments().forEach(s -> segments.add(s.id()));
    result.offers().forEach(o -> {
      if (!segments.contains(o.segment())) {
        segments.add(o.segment());
      }
    });
    List<String> groupIds = new ArrayList<>();
    if (catalog != null) {
      catalog.groups().forEach(g -> groupIds.add(g.id()));
    }
    codes.variants().forEach(v -> v.keySet().forEach(g -> {
      if (!groupIds.contains(g)) {
        groupIds.add(g);
      }
    }));
    List<Shared> shared = new ArrayList<>();
    List<GroupColumn> varying = new ArrayList<>();
    for (String g : groupIds) {
      String first = codes.size() == 0 ? null : codes.variants().get(0).get(g);
      boolean same = codes.size() > 1 && codes.variants().stream().allMatch(v -> eq(v.get(g), first));
      if (same && first != null) {
        shared.add(new Shared(g, groupHead(catalog, g), first, choiceText(catalog, g, first)));
      } else {
        varying.add(new GroupColumn(g, groupHead(catalog, g)));
      }
    }
    Map<String, double[]> units = new LinkedHashMap<>();
    for (RunResult.Offer o : result.offers()) {
      units.computeIfAbsent(codes.code(o.options()), k -> new double[segments.size()])[segments.indexOf(o.segment())]
          += o.quantity();
    }
    Map<String, Double> inPortfolio = new LinkedHashMap<>();
    if (result.portfolio() != null) {
      result.portfolio().variants().forEach(v -> inPortfolio.merge(codes.code(v.options()), v.units(), Double::sum));
    }
    List<Row> rows = new ArrayList<>();
    for (int i = 0; i < codes.size(); i++) {
      Map<String, String> v = codes.variants().get(i);
      String code = codes.codeAt(i);
      List<String> cells = new ArrayList<>();
      for (GroupColumn g : varying) {
        String c = v.get(g.id());
        cells.add(c == null ? "" : choiceText(catalog, g.id(), c));
      }
      double[] u = units.getOrDefault(code, new double[segments.size()]);
      rows.add(new Row(code, v, cells, u, Arrays.stream(u).sum(),
          result.portfolio() == null ? Double.NaN : inPortfolio.getOrDefault(code, 0.0)));
    }
    return new MatrixView(shared, varying, segments, result.portfolio() != null, rows);
  }

  /**
   * A variant's short description: the texts of its choices in the groups where the run's variants
   * differ, joined by " · " (what the code alone does not say); empty for a code the view lacks.
   */
  public String describe(String code) {
    for (Row r : rows) {
      if (r.code().equals(code)) {
        return String.join(" · ", r.cells().stream().filter(c -> !c.isEmpty()).toList());
      }
    }
    return "";
  }

  /**
   * A variant on its own: the texts of its choices in every group, optional groups at none left out,
   * joined by " · " ({@code catalog} may be null: ids then).
   */
  public static String describe(Catalog catalog, Map<String, String> options) {
    List<String> parts = new ArrayList<>();
    options.forEach((g, c) -> {
      if (!c.equals(Group.NONE)) {
        parts.add(choiceText(catalog, g, c));
      }
    });
    return String.join(" · ", parts);
  }

  /** The table's heading: the code, the varying groups, the segments, total and portfolio. */
  public List<String> header() {
    List<String> h = new ArrayList<>();
    h.add("variant");
    groups.forEach(g -> h.add(g.head()));
    h.addAll(segments);
    h.add("LP total");
    if (hasPortfolio) {
      h.add("portfolio");
    }
    return h;
  }

  /** The view as text lines of any width: {@link #lines(DoubleFunction, int, int)} without a limit. */
  public List<String> lines(DoubleFunction<String> units, int maxRows) {
    return lines(units, maxRows, Integer.MAX_VALUE);
  }

  /**
   * The view as text lines: the shared choices, then the table with at most {@code maxRows} rows
   * (a line says how many more there are); {@code units} formats a number of units. A table wider
   * than {@code width} characters is cut into blocks of group columns, each led by the variant's
   * code: the first holds the units and the groups that fit beside them, the next ones the other
   * groups, so that a catalog of thirty groups still reads on a terminal; the shared choices wrap.
   */
  public List<String> lines(DoubleFunction<String> units, int maxRows, int width) {
    List<String> out = new ArrayList<>();
    if (!shared.isEmpty()) {
      List<String> parts = new ArrayList<>();
      for (Shared s : shared) {
        parts.add(s.groupHead() + ": " + s.choiceText());
      }
      out.addAll(wrap("all variants: ", parts, width, ";"));
    }
    List<String> head = header();
    List<List<String>> cells = new ArrayList<>();
    int shown = Math.min(rows.size(), maxRows);
    for (int i = 0; i < shown; i++) {
      Row r = rows.get(i);
      List<String> line = new ArrayList<>();
      line.add(r.code());
      line.addAll(r.cells());
      for (double u : r.units) {
        line.add(u == 0 ? "-" : units.apply(u));
      }
      line.add(r.total() == 0 ? "-" : units.apply(r.total()));
      if (hasPortfolio) {
        line.add(r.portfolioUnits() == 0 ? "-" : units.apply(r.portfolioUnits()));
      }
      cells.add(line);
    }
    int[] w = new int[head.size()];
    for (int c = 0; c < w.length; c++) {
      w[c] = head.get(c).length();
      for (List<String> line : cells) {
        w[c] = Math.max(w[c], line.get(c).length());
      }
    }
    int textColumns = 1 + groups.size();
    List<List<Integer>> blocks = blocks(w, textColumns, width);
    for (int b = 0; b < blocks.size(); b++) {
      List<Integer> cols = blocks.get(b);
      if (b > 0) {
        out.add("");
      }
      out.add(row(pick(head, cols), pick(w, cols, width), textColumns(cols, textColumns)));
      for (List<String> line : cells) {
        out.add(row(pick(line, cols), pick(w, cols, width), textColumns(cols, textColumns)));
      }
    }
    if (rows.size() > shown) {
      out.add("... " + (rows.size() - shown) + " more variants");
    }
    return out;
  }

  /**
   * The columns of each block: all in one when the table fits {@code width}; else the code, the
   * groups that fit and the number columns, then the code and the next groups that fit, and so on
   * (a block holds at least one group, so a group wider than the line still shows, its cells cut).
   */
  private static List<List<Integer>> blocks(int[] w, int textColumns, int width) {
    int total = -2;
    for (int x : w) {
      total += x + 2;
    }
    List<List<Integer>> blocks = new ArrayList<>();
    List<Integer> all = new ArrayList<>();
    for (int c = 0; c < w.length; c++) {
      all.add(c);
    }
    if (total <= width || textColumns == 1) {
      blocks.add(all);
      return blocks;
    }
    int numbers = 0;
    for (int c = textColumns; c < w.length; c++) {
      numbers += w[c] + 2;
    }
    int g = 1;
    boolean first = true;
    while (g < textColumns) {
      List<Integer> block = new ArrayList<>();
      block.add(0);
      int used = w[0] + (first ? numbers : 0);
      do {
        block.add(g);
        used += w[g] + 2;
        g++;
      } while (g < textColumns && used + w[g] + 2 <= width);
      if (first) {
        for (int c = textColumns; c < w.length; c++) {
          block.add(c);
        }
        first = false;
      }
      blocks.add(block);
    }
    return blocks;
  }

  /** How many of a block's columns are text (the code and its groups): they come first. */
  private static int textColumns(List<Integer> cols, int textColumns) {
    int n = 0;
    for (int c : cols) {
      n += c < textColumns ? 1 : 0;
    }
    return n;
  }

  private static List<String> pick(List<String> line, List<Integer> cols) {
    List<String> out = new ArrayList<>();
    cols.forEach(c -> out.add(line.get(c)));
    return out;
  }

  /** The widths of a block's columns, a text column no wider than the line leaves it. */
  private static int[] pick(int[] w, List<Integer> cols, int width) {
    int[] out = new int[cols.size()];
    for (int i = 0; i < out.length; i++) {
      out[i] = w[cols.get(i)];
    }
    if (out.length > 1 && width < Integer.MAX_VALUE) {
      out[1] = Math.min(out[1], Math.max(8, width - out[0] - 2));
    }
    return out;
  }

  /** {@code lead} then the parts, {@code separator} after each but the last, wrapped at {@code width} with the next lines indented. */
  private static List<String> wrap(String lead, List<String> parts, int width, String separator) {
    List<String> out = new ArrayList<>();
    StringBuilder b = new StringBuilder(lead);
    for (int i = 0; i < parts.size(); i++) {
      String part = parts.get(i) + (i < parts.size() - 1 ? separator : "");
      boolean fresh = b.length() == lead.length() || b.toString().isBlank();
      if (!fresh && b.length() + 1 + part.length() > width) {
        out.add(b.toString());
        b = new StringBuilder("  ");
        fresh = true;
      }
      b.append(fresh ? "" : " ").append(part);
    }
    out.add(b.toString());
    return out;
  }

  /** Text columns left-aligned, number columns right-aligned, two spaces apart. */
  private static String row(List<String> cells, int[] width, int textColumns) {
    StringBuilder b = new StringBuilder();
    for (int c = 0; c < cells.size(); c++) {
      String s = cells.get(c);
      if (s.length() > width[c]) {
        s = s.substring(0, width[c] - 1) + "…";
      }
      String pad = " ".repeat(width[c] - s.length());
      b.append(c == 0 ? "" : "  ").append(c < textColumns ? s + pad : pad + s);
    }
    return b.toString().stripTrailing();
  }

  public static String groupHead(Catalog catalog, String groupId) {
    if (catalog != null) {
      int g = catalog.groupIndex(groupId);
      if (g >= 0 && hasText(catalog.groups().get(g).label())) {
        return catalog.groups().get(g).label();
      }
    }
    return groupId;
  }

  /** The option's label (with its price point, {@code 12 kW @5300}), or the choice id. */
  public static String choiceText(Catalog catalog, String groupId, String choice) {
    String label = choiceLabel(catalog, groupId, choice);
    return label == null ? choice : label;
  }

  /** The option's label with its price point ({@code 12 kW @5300}), or null when the catalog gives it none. */
  public static String choiceLabel(Catalog catalog, String groupId, String choice) {
    if (catalog == null) {
      return null;
    }
    int g = catalog.groupIndex(groupId);
    if (g < 0) {
      return null;
    }
    int at = choice.indexOf(Option.PRICE_MARK);
    String optionId = at < 0 ? choice : choice.substring(0, at);
    Group group = catalog.groups().get(g);
    for (Option o : group.options()) {
      if (o.id().equals(optionId) && hasText(o.label())) {
        return at < 0 ? o.label() : o.label() + " " + choice.substring(at);
      }
    }
    return null;
  }

  private static boolean hasText(String s) {
    return s != null && !s.isBlank();
  }

  private static boolean eq(String a, String b) {
    return a == null ? b == null : a.equals(b);
  }
}
