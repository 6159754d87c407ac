package dev.mixwright.colgen;

import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Columns carried from one solve to another — from a run's pool into its resume, or from one
 * scenario of a sweep into the next. A column is a (variant, segment) pair; its margin, use and
 * bound are figures of the catalog, so they are computed afresh in the catalog it goes to, and a
 * column that catalog cannot sell (a rule now forbids it, the segment no longer accepts it, an id
 * is gone) is left out. Any set of sellable columns is a valid start: the loop proves the optimum
 * whatever it starts from, so a warm start changes the work, never the answer.
 */
public final class WarmStart {
  private WarmStart() {}

  /** What was carried: the columns, and how many were left out and why. */
  public record Carried(List<Column> columns, int unknownIds, int unsellable, int duplicates) {
    public Carried {
      columns = List.copyOf(columns);
    }

    public int leftOut() {
      return unknownIds + unsellable + duplicates;
    }
  }

  /** Column of variant {@code v} in segment {@code s} with the figures of {@code space}. */
  public static Column column(VariantSpace space, int s, int[] v, int iteration, double reducedCostAtEntry) {
    return new Column(s, v.clone(), space.margin(v, s), space.use(v),
        space.catalog().segments().get(s).columnBound(), iteration, reducedCostAtEntry);
  }

  /** Columns of {@code from} re-priced in {@code to}, matched by segment, group and option ids. */
  public static Carried reprice(VariantSpace from, List<Column> columns, VariantSpace to) {
    Builder b = new Builder(to);
    for (Column c : columns) {
      b.add(from.catalog().segments().get(c.segment()).id(), from.describe(c.choices()), c.iteration(),
          c.reducedCostAtEntry());
    }
    return b.build();
  }

  /** Collects columns named by ids (e.g. read from a column log) for one space. */
  public static final class Builder {
    private final VariantSpace space;
    private final List<Column> columns = new ArrayList<>();
    private final List<Set<VariantKey>> seen = new ArrayList<>();
    private int unknown;
    private int unsellable;
    private int duplicates;

    public Builder(VariantSpace space) {
      this.space = space;
      for (int s = 0; s < space.segmentCount(); s++) {
        seen.add(new HashSet<>());
      }
    }

    public Builder add(String segmentId, Map<String, String> options, int iteration, double reducedCostAtEntry) {
      int s = space.catalog().segmentIndex(segmentId);
      int[] v;
      try {
        v = s < 0 ? null : space.parse(options);
      } catch (IllegalArgumentException e) {
        v = null;
      }
      if (v == null) {
        unknown++;
      } else if (!space.isColumn(v, s)) {
        unsellable++;
      } else if (!seen.get(s).add(space.key(v))) {
        duplicates++;
      } else {
        columns.add(column(space, s, v, iteration, reducedCostAtEntry));
      }
      return this;
    }

    public Carried build() {
      return new Carried(columns, unknown, unsellable, duplicates);
    }
  }
}
