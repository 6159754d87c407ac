package dev.mixwright.choice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.mixwright.cli.Main;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code check} describes the choice data; {@code solve} refuses it cleanly, for now. */
class ChoiceCommandsTest {
  @TempDir Path dir;

  private record Ran(int code, String out, String err) {}

  private static Ran run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true));
    return new Ran(code, out.toString(), err.toString());
  }

  private static String boats() throws Exception {
    return Path.of(ChoiceCommandsTest.class.getResource("rowing-boats.yaml").toURI()).toString();
  }

  @Test
  void checkPrintsTheChoiceDescription() throws Exception {
    Ran r = run("check", boats());
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("clubs            chooses (see below)"), r.out());
    assertTrue(r.out().contains("1 segment chooses by multinomial logit"), r.out());
    assertTrue(r.out().contains("buyers 900, stayOut 0.4, priceWeight -0.0009"), r.out());
    assertTrue(r.out().contains("price point as a distinct variant"), r.out());
  }

  @Test
  void checkJsonCarriesTheChoiceSection() throws Exception {
    Ran r = run("check", "--json", boats());
    assertEquals(0, r.code(), r.err());
    JsonNode n = new ObjectMapper().readTree(r.out());
    assertEquals(900, n.get("choice").get("segments").get(0).get("buyers").asDouble());
    assertEquals(1, n.get("choice").get("pricePointOptions").asInt());
  }

  @Test
  void solveRefusesWithWordsAndExitTwo() throws Exception {
    Ran r = run("solve", boats(), "--out", dir.resolve("run").toString(), "--no-portfolio");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("segments that choose are not solved by this version yet"), r.err());
    assertFalse(r.err().contains("Exception"), r.err());
  }
}
