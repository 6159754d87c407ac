package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.portfolio.PortfolioEvent;
import java.util.List;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The integer stage's steps in plain words: every note the stage writes today (copied from
 * IntegerStage and BranchAndPrice) comes out without a solver word.
 */
class StageWordsTest {
  private static void assertPlain(String text) {
    for (String word : StageWords.JARGON) {
      assertFalse(Pattern.compile("(?i)\\b" + word).matcher(text).find(), "'" + word + "' in: " + text);
    }
  }

  @Test
  void everyStepOfTheLogReadsPlainly() {
    List<String[]> steps = List.of(
        new String[] {"relaxation", "round 3"},
        new String[] {"incumbent", "rounding of the relaxation"},
        new String[] {"incumbent", "incumbent of the earlier session"},
        new String[] {"incumbent", "MIP over the pool"},
        new String[] {"incumbent", "MIP over the pool with survivors"},
        new String[] {"mip", "scip optimal in 4287 ms, 97 nodes (bound over the pool only)"},
        new String[] {"mip", "cpsat feasible in 60000 ms, 0 nodes (bound over the pool only)"},
        new String[] {"survivors", "every variant that could be part of a better portfolio is listed"},
        new String[] {"survivors", "too many variants could be part of a better portfolio to prove it over the pool"},
        new String[] {"tree", "branch-and-price closed the tree: no portfolio is better than the incumbent"},
        new String[] {"tree", "time limit of 30.0 s reached with 11 nodes of the branch-and-price tree open"},
        new String[] {"end", "proven"},
        new String[] {"end", "heuristic: the MIP over the pool with every variant that could be part of a better"
            + " portfolio was not solved to optimality in the time limit"},
        new String[] {"end", "nothing can be sold: the empty portfolio is optimal"});
    for (String[] s : steps) {
      assertPlain(StageWords.step(s[0]));
      String what = StageWords.what(s[0], 1209, 5, s[1]);
      assertPlain(what);
      assertFalse(what.isBlank(), s[1]);
    }
    // the portfolio package's kinds are the ones named here
    for (PortfolioEvent.Kind k : PortfolioEvent.Kind.values()) {
      assertTrue(!StageWords.step(k.word()).equals(k.word()) || k == PortfolioEvent.Kind.END, k.word());
    }
    assertEquals("among 1,209 candidates, 4.3 s; limit for these only",
        StageWords.what("mip", 1209, 60, "scip optimal in 4287 ms, 97 nodes (bound over the pool only)"));
  }

  @Test
  void plainLeavesWordsInsideOtherWordsAlone() {
    assertEquals("spool of wire", StageWords.plain("spool of wire"));
    assertEquals("the best range found of 3 variants", StageWords.plain("the incumbent of 3 variants"));
  }
}
