package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * A terminal escape code in a command-line argument (a path, a value picocli refuses) is shown as
 * {@code \u001B} in the message, never written raw to the terminal.
 */
class ControlCharactersInArgumentsTest {
  private static final String ESC = "\u001b[31m";

  private static void assertNoControlCharacters(CliRun r) {
    for (char c : (r.out() + r.err()).toCharArray()) {
      assertFalse(c < 0x20 && c != '\n' && c != '\r' && c != '\t', "raw U+" + Integer.toHexString(c) + " in\n" + r);
    }
  }

  @Test
  void aPathWithAnEscapeCodeIsShownEscaped() {
    CliRun r = CliRun.of("solve", ESC + "nothing-here.yaml", "--out", "unused", "--no-progress");
    assertEquals(ExitCodes.BAD_INPUT, r.code(), r.toString());
    assertTrue(r.err().contains("\\u001B[31mnothing-here.yaml"), r.toString());
    assertNoControlCharacters(r);
  }

  @Test
  void anArgumentPicocliRefusesIsShownEscaped() {
    // log takes the run folder alone: picocli refuses the second argument and shows it
    CliRun r = CliRun.of("log", "some-run", "capacity=" + ESC + "c14");
    assertEquals(ExitCodes.BAD_INPUT, r.code(), r.toString());
    assertTrue(r.err().contains("\\u001B[31mc14"), r.toString());
    assertNoControlCharacters(r);
  }
}
