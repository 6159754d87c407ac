package dev.mixwright.report;

import dev.mixwright.colgen.Durations;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The integer stage's steps in a planner's words. The stage logs its steps ({@code portfolio.jsonl})
 * and its reasons in the solver's terms (relaxation, incumbent, pool, survivors, the MIP solver's
 * name); the files keep them, and every line a person reads goes through here: {@link #step} names a
 * step, {@link #what} says what it did, {@link #plain} rewrites a free reason. "Range" is what the
 * stage chooses (the portfolio of variants to offer); "candidates" the variants the exact search
 * chooses among; "upper limit" the proven bound on any range's value.
 */
public final class StageWords {
  private StageWords() {}

  /** A short name of a step kind (the log's {@code kind}: relaxation, incumbent, mip, survivors, tree, end). */
  public static String step(String kind) {
    return switch (kind) {
      case "relaxation" -> "estimate";
      case "incumbent" -> "better range";
      case "mip" -> "exact search";
      case "survivors" -> "widen";
      case "tree" -> "branching";
      case "end" -> "end";
      default -> plain(kind);
    };
  }

  private static final Pattern ROUND = Pattern.compile("round (\\d+)");
  private static final Pattern MIP = Pattern.compile("^\\S+ (\\w+) in (\\d+) ms, (\\d+) nodes");

  /**
   * What a step did: {@code candidates} variants the exact search chooses among, {@code count} the
   * variants the step concerns, {@code note} the log's words for it.
   */
  public static String what(String kind, int candidates, int count, String note) {
    String n = note == null ? "" : note;
    switch (kind) {
      case "relaxation": {
        Matcher m = ROUND.matcher(n);
        return "if variants could be introduced in part" + (m.find() ? " (round " + m.group(1) + ")" : "");
      }
      case "incumbent": {
        String how = n.startsWith("rounding") ? "by rounding the estimate"
            : n.contains("earlier session") ? "the best of the earlier session"
            : n.contains("survivors") ? "by the exact search, more candidates"
            : n.startsWith("MIP") ? "by the exact search"
            : plain(n);
        return how + " (" + count + " variant" + (count == 1 ? "" : "s") + ")";
      }
      case "mip": {
        Matcher m = MIP.matcher(n);
        String detail = "";
        if (m.find()) {
          String status = m.group(1).toLowerCase(Locale.ROOT);
          detail = (status.equals("optimal") ? ", " : ", stopped (" + status + ") after ")
              + Durations.format(Long.parseLong(m.group(2)));
        }
        return "among " + String.format(Locale.ROOT, "%,d", candidates) + " candidates" + detail
            + "; limit for these only";
      }
      case "survivors":
        return n.startsWith("every") && count == 0 ? "no other variant could beat it"
            : n.startsWith("every")
            ? String.format(Locale.ROOT, "%,d candidates added: all that could beat it", count)
            : String.format(Locale.ROOT, "%,d or more could beat it: too many to check", count);
      case "tree":
        return n.startsWith("branch-and-price closed")
            ? String.format(Locale.ROOT, "branch-and-price, %,d nodes: none is better",
                count)
            : String.format(Locale.ROOT, "branch-and-price stopped at %,d nodes: %s", count, plain(n));
      case "end":
        if (n.equals("proven")) {
          return "no range is better (proven)";
        }
        if (n.startsWith("heuristic")) {
          String why = n.length() > "heuristic: ".length() ? n.substring("heuristic: ".length()) : "";
          return "not proven the best" + (why.isEmpty() ? "" : ": " + plain(why));
        }
        return plain(n);
      default:
        return plain(n);
    }
  }

  /** Solver terms in a free text and their plain words, longest first so that a phrase wins over its words. */
  private static final List<String[]> TERMS = List.of(
      new String[] {"the MIP over the pool with every variant that could be part of a better portfolio",
          "the exact search over every variant that could beat the range found"},
      new String[] {"MIP over the pool", "exact search over the candidate variants"},
      new String[] {"bound over the pool only", "upper limit for these candidates only"},
      new String[] {"nodes of the branch-and-price tree open", "branches of the search left open"},
      new String[] {"the branch-and-price tree", "the search by branch-and-price"},
      new String[] {"the quick proof", "the quick check"},
      new String[] {"survivor limit", "limit on variants checked"},
      new String[] {"survivors", "variants that could still beat the best range"},
      new String[] {"incumbent", "best range found"},
      new String[] {"relaxation", "estimate"},
      new String[] {"threshold", "cut-off"},
      new String[] {"pool", "candidate variants"},
      new String[] {"scip", "the exact solver"},
      new String[] {"solved to optimality", "finished"});

  /** A free text with the solver's terms replaced by plain words. */
  public static String plain(String text) {
    String s = text;
    for (String[] t : TERMS) {
      s = Pattern.compile("\\b" + Pattern.quote(t[0]) + "\\b", Pattern.CASE_INSENSITIVE).matcher(s)
          .replaceAll(Matcher.quoteReplacement(t[1]));
    }
    return s;
  }

  /** The words a planner should not meet without an explanation (the tests grep the views for them). */
  public static final List<String> JARGON = List.of("seed", "survivor", "pool", "relaxation", "master", "threshold",
      "incumbent", "scip");
}
