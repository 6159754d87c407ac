package dev.mixwright.portfolio;

import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * The portfolio against the range on sale today: the current variants it keeps (with their sales),
 * those it drops (each paying its discontinue cost), the new ones it adds, and today's range valued
 * as a fixed portfolio (every current variant offered, nothing else; NaN when the catalog has no
 * current range or that range does not fit its capacities and lots).
 */
public record RangeChange(
    List<OfferedVariant> kept,
    List<int[]> dropped,
    List<OfferedVariant> added,
    double discontinueCosts,
    double currentRangeValue) {

  public RangeChange {
    kept = List.copyOf(kept);
    dropped = List.copyOf(dropped);
    added = List.copyOf(added);
  }

  /** True when the catalog lists a current range. */
  public boolean hasCurrentRange() {
    return !kept.isEmpty() || !dropped.isEmpty();
  }

  static RangeChange of(VariantSpace space, Pool pool, Plan plan, Plan today) {
    return of(space, pool.current(), IntegerStage.offered(space, pool, plan), today == null ? Double.NaN : today.value());
  }

  /** The change that offering {@code offered} makes to today's range {@code cr}. */
  static RangeChange of(VariantSpace space, CurrentRange cr, List<OfferedVariant> offered, double todayValue) {
    List<OfferedVariant> kept = new ArrayList<>();
    List<OfferedVariant> added = new ArrayList<>();
    Set<Integer> keptIndex = new HashSet<>();
    for (OfferedVariant o : offered) {
      int i = cr.indexOf(space.key(o.choices()));
      if (i >= 0) {
        kept.add(o);
        keptIndex.add(i);
      } else {
        added.add(o);
      }
    }
    List<int[]> dropped = new ArrayList<>();
    double paid = 0;
    for (int i = 0; i < cr.size(); i++) {
      if (keptIndex.contains(i)) {
        continue;
      }
      if (cr.pinned(i)) {
        // pinned but no segment takes it: kept on sale, selling nothing
        kept.add(new OfferedVariant(cr.variant(i).clone(), new double[space.segmentCount()], 0));
      } else {
        dropped.add(cr.variant(i).clone());
        paid += cr.discontinue(i);
      }
    }
    return new RangeChange(kept, dropped, added, paid, todayValue);
  }
}
