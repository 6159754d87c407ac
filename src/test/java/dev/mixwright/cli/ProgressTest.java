package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.colgen.IterationRecord;
import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

class ProgressTest {
  private static IterationRecord rec(int it, double z, double b, int cols, long ms) {
    return new IterationRecord(it, z, b, (b - z) / z, cols, 5, true, ms);
  }

  @Test
  void onATerminalOneLineIsRewrittenInPlaceAndEndedOnce() {
    StringWriter w = new StringWriter();
    Progress p = new Progress(new PrintWriter(w), true, 200, "");
    p.iteration(rec(1, 1e6, 2e6, 10, 1000));
    p.iteration(rec(2, 1.5e6, 1.6e6, 20, 3000));
    String shown = w.toString();
    assertFalse(shown.contains("\n"), "no newline while it runs");
    assertEquals(2, shown.chars().filter(c -> c == '\r').count());
    String last = shown.substring(shown.lastIndexOf('\r') + 1);
    assertTrue(last.contains("round 2") && last.contains("obj 1,500,000") && last.contains("bound 1,600,000")
        && last.contains("gap 6.667%") && last.contains("cols 20") && last.contains("5.0 col/s"), last);
    assertTrue(last.startsWith("   3.0 s"), last);
    p.ended(null);
    assertTrue(w.toString().endsWith("\n"));
  }

  @Test
  void aShorterLineBlanksWhatWasLeftOfTheLongerOne() {
    StringWriter w = new StringWriter();
    Progress p = new Progress(new PrintWriter(w), true, 200, "");
    p.iteration(rec(1, 1e6, 2e6, 100000, 1000));
    int first = w.toString().length() - 1;
    p.iteration(rec(2, 1, 2, 100000, 2000));
    String second = w.toString().substring(first + 1);
    assertEquals(first, second.length() - 1, "padded to the length of the line before");
  }

  @Test
  void aNarrowTerminalCutsTheLineRatherThanWrapIt() {
    StringWriter w = new StringWriter();
    Progress p = new Progress(new PrintWriter(w), true, 40, "");
    p.iteration(rec(1, 1e6, 2e6, 10, 1000));
    assertEquals(39, w.toString().length() - 1);
  }

  @Test
  void elsewhereOneLabelledLinePerRound() {
    StringWriter w = new StringWriter();
    Progress p = new Progress(new PrintWriter(w));
    p.iteration(rec(1, 1e6, 2e6, 10, 1000));
    p.iteration(rec(2, 1.5e6, 1.6e6, 20, 3000));
    p.ended(null);
    String[] lines = w.toString().split("\n");
    assertEquals(2, lines.length);
    assertTrue(lines[1].startsWith("round    2  objective 1,500,000.00  bound 1,600,000.00"), lines[1]);
    assertFalse(w.toString().contains("\r"));
  }
}
