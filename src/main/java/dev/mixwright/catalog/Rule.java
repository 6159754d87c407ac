package dev.mixwright.catalog;

import java.util.List;
import java.util.Map;

/**
 * A compatibility rule, in one of two forms. {@code when}/{@code require}: if every group named in
 * {@code when} holds one of its listed options, every group named in {@code require} must hold one of
 * its listed options. {@code forbid}: no variant holds all the listed choices at once. Maps keep the
 * order of the file; absent parts are empty maps. {@code id} is optional (null when not given).
 */
public record Rule(
    String id,
    Map<String, List<String>> when,
    Map<String, List<String>> require,
    Map<String, List<String>> forbid) {

  public Rule {
    when = Catalog.orderedCopy(when);
    require = Catalog.orderedCopy(require);
    forbid = Catalog.orderedCopy(forbid);
  }

  public boolean isForbid() {
    return !forbid.isEmpty();
  }
}
