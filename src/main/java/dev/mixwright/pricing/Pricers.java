package dev.mixwright.pricing;

import dev.mixwright.space.VariantSpace;
import java.util.List;
import java.util.Locale;

/** Pricers by the short names options and logs use. */
public final class Pricers {
  /** The pricer used when none is named: exact and fastest on rule-structured catalogs. */
  public static final String DEFAULT = "bnb";

  private static final List<String> NAMES = List.of("bnb", "brute", "cpsat", "heuristic");

  private Pricers() {}

  /** Known names, default first. */
  public static List<String> names() {
    return NAMES;
  }

  /**
   * A pricer with default settings: {@code bnb} (branch-and-bound, exact), {@code brute} (enumeration,
   * exact, small spaces only), {@code cpsat} (OR-Tools CP-SAT, exact), {@code heuristic} (greedy and
   * 1-opt, no proof). A null or blank name gives {@link #DEFAULT}.
   */
  public static Pricer byName(String name, VariantSpace space) {
    String n = name == null || name.isBlank() ? DEFAULT : name.trim().toLowerCase(Locale.ROOT);
    return switch (n) {
      case "bnb" -> BranchAndBoundPricer.withDefaultLimits(space);
      case "brute" -> new BruteForcePricer(space);
      case "cpsat" -> new CpSatPricer(space, 0, 1);
      case "heuristic" -> new HeuristicPricer(space);
      default -> throw new IllegalArgumentException(
          "unknown pricer '" + name + "'; choose one of " + String.join(", ", NAMES));
    };
  }
}
