package dev.mixwright.report;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.space.SpaceCount;

/**
 * A count of variants as the run files and {@code check --json} write it, decided in one place:
 * {@code exact} (a decimal string) when the count is exact; otherwise {@code atMost}, {@code atLeast}
 * when a lower bound above 0 is known, and the sampled {@code estimate} when there is one.
 */
public record CountFields(String exact, String atMost, String atLeast, RunResult.CountEstimate estimate) {

  public static CountFields of(SpaceCount count) {
    if (count.exact()) {
      return new CountFields(count.upper().toString(), null, null, null);
    }
    RunResult.CountEstimate estimate = count.estimate()
        .map(e -> new RunResult.CountEstimate(e.value().doubleValue(), e.standardError().doubleValue(), e.samples()))
        .orElse(null);
    String atLeast = count.lower().signum() == 0 ? null : count.lower().toString();
    return new CountFields(null, count.upper().toString(), atLeast, estimate);
  }

  /** Writes {@code field} (null when not exact), {@code fieldAtMost}, {@code fieldAtLeast}, {@code fieldEstimate}. */
  public void putInto(ObjectNode n, String field) {
    n.put(field, exact);
    if (atMost != null) {
      n.put(field + "AtMost", atMost);
    }
    if (atLeast != null) {
      n.put(field + "AtLeast", atLeast);
    }
    if (estimate != null) {
      ObjectNode o = n.putObject(field + "Estimate");
      o.put("value", estimate.value());
      o.put("standardError", estimate.standardError());
      o.put("samples", estimate.samples());
    }
  }
}
