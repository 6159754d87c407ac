package dev.mixwright.cli;

import dev.mixwright.space.SpaceCount;
import dev.mixwright.space.SpaceCounter;
import dev.mixwright.space.VariantSpace;
import java.math.BigInteger;
import java.util.List;

/** The size of a catalog's space, in total and per segment, and why it is empty when it is. */
record SpaceFacts(SpaceCount total, List<SpaceCount> perSegment, String emptyReason) {

  static SpaceFacts of(VariantSpace space) {
    SpaceCounter counter = new SpaceCounter(space);
    SpaceCount total = counter.count();
    List<SpaceCount> per = counter.perSegment();
    String reason = "";
    if (total.isEmpty()) {
      reason = "no variant is buildable under the rules";
    } else if (per.stream().allMatch(SpaceCount::isEmpty)) {
      reason = "no segment accepts any buildable variant";
    }
    return new SpaceFacts(total, per, reason);
  }

  BigInteger buildable() {
    return total.value();
  }

  boolean exact() {
    return total.exact();
  }

  /** True when nothing at all can be sold. */
  boolean nothingSellable() {
    return !emptyReason.isEmpty();
  }
}
