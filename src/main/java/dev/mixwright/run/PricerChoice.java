package dev.mixwright.run;

import dev.mixwright.pricing.Pricer;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.pricing.BruteForcePricer;
import dev.mixwright.pricing.CpSatPricer;
import dev.mixwright.pricing.HeuristicPricer;
import dev.mixwright.space.VariantSpace;
import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * The pricing algorithms a person can name, as a value rather than a string passed around: the one
 * place that maps a {@code --pricer} name (as run.json records it) to an implementation.
 */
public enum PricerChoice {
  BNB("bnb", true),
  CPSAT("cpsat", true),
  BRUTE("brute", true),
  HEURISTIC("heuristic", false);

  private final String word;
  private final boolean exact;

  PricerChoice(String word, boolean exact) {
    this.word = word;
    this.exact = exact;
  }

  /** The name written on the command line and into run.json. */
  public String word() {
    return word;
  }

  /** Whether it finds the column of largest reduced cost, so the loop can prove its bound. */
  public boolean exact() {
    return exact;
  }

  /** A fresh pricer of this kind for the space, with its default limits. */
  public Pricer create(VariantSpace space) {
    return switch (this) {
      case BNB -> BranchAndBoundPricer.withDefaultLimits(space);
      case CPSAT -> new CpSatPricer(space, 0, 1);
      case BRUTE -> new BruteForcePricer(space);
      case HEURISTIC -> new HeuristicPricer(space);
    };
  }

  /** The choice with this name; the message of the exception lists the exact ones. */
  public static PricerChoice byWord(String w) {
    for (PricerChoice p : values()) {
      if (p.word.equals(w.trim().toLowerCase(Locale.ROOT))) {
        return p;
      }
    }
    throw new IllegalArgumentException("unknown pricer '" + w + "'; choose " + exactWords());
  }

  /** The exact pricers' names, for messages: "bnb, cpsat or brute". */
  public static String exactWords() {
    String all = Arrays.stream(values()).filter(PricerChoice::exact).map(PricerChoice::word)
        .collect(Collectors.joining(", "));
    int last = all.lastIndexOf(", ");
    return last < 0 ? all : all.substring(0, last) + " or " + all.substring(last + 2);
  }
}
