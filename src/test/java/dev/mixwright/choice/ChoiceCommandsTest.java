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

/** {@code check} describes the choice data; {@code solve} plans it; {@code sweep} refuses it cleanly, for now. */
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

  /**
   * The solve writes the sales-based LP's plan: per choosing segment its buyers split into sold and
   * staying out (sold + stayOut = buyers, the buyers row), each offer's share is its quantity over
   * the buyers, no offer sells above w times what stays out (its own row), and the price shown is
   * the hull's chosen price point plus the other options' prices (the catalog's figures).
   */
  @Test
  void solveWritesTheChoiceFields() throws Exception {
    Path run = dir.resolve("run");
    Ran r = run("solve", boats(), "--out", run.toString());
    assertEquals(0, r.code(), r.err());
    JsonNode n = new ObjectMapper().readTree(run.resolve("result.json").toFile());
    assertEquals("optimal", n.get("status").asText());
    assertFalse(n.has("portfolio"));
    JsonNode clubs = n.get("segments").get(0);
    assertEquals("clubs", clubs.get("id").asText());
    double buyers = clubs.get("buyers").asDouble();
    assertEquals(900, buyers);
    assertEquals(buyers, clubs.get("sold").asDouble() + clubs.get("stayOut").asDouble(), 1e-6 * buyers);
    assertFalse(n.get("segments").get(1).has("buyers"));
    int clubOffers = 0;
    for (JsonNode o : n.get("offers")) {
      assertTrue(o.has("price"), o.toString());
      if (o.get("segment").asText().equals("clubs")) {
        clubOffers++;
        assertEquals(o.get("quantity").asDouble() / buyers, o.get("share").asDouble(), 1e-9);
        double cap = o.get("attraction").asDouble() * clubs.get("stayOut").asDouble();
        assertTrue(o.get("quantity").asDouble() <= cap * (1 + 1e-6) + 1e-6, o.toString());
        String hull = o.get("options").get("hull").asText();
        double price = hull.startsWith("shell@") ? Double.parseDouble(hull.substring(6)) : 2400;
        price += o.get("options").get("oars").asText().equals("carbon") ? 650 : 300;
        price += o.get("options").get("cover").asText().equals("canvas") ? 180 : 0;
        assertEquals(price, o.get("price").asDouble(), 1e-9, o.toString());
      } else {
        assertFalse(o.has("share"));
      }
    }
    assertTrue(clubOffers > 0);
  }

  /** With a portfolio section the integer stage runs over the choosing segment too. */
  @Test
  void portfolioIsChosen() throws Exception {
    Path from = Path.of(boats()).getParent();
    java.nio.file.Files.copy(from.resolve("clubs-utility.csv"), dir.resolve("clubs-utility.csv"));
    String text = java.nio.file.Files.readString(from.resolve("rowing-boats.yaml"))
        + "\nportfolio:\n  introductionCost: 1000\n  maxVariants: 3\n";
    Path catalog = dir.resolve("boats-portfolio.yaml");
    java.nio.file.Files.writeString(catalog, text);
    Path run = dir.resolve("run");
    Ran r = run("solve", catalog.toString(), "--out", run.toString());
    assertEquals(0, r.code(), r.err());
    JsonNode n = new ObjectMapper().readTree(run.resolve("result.json").toFile());
    assertFalse(n.has("portfolioPending"), n.toString());
    JsonNode p = n.get("portfolio");
    assertTrue(p.get("variants").size() <= 3, p.toString());
    assertTrue(p.get("bound").asDouble() >= p.get("value").asDouble() - 1e-6, p.toString());
  }

  @Test
  void sweepRunsOverSegmentsThatChoose() throws Exception {
    Path out = dir.resolve("sweep");
    Ran r = run("sweep", boats(), "--out", out.toString(), "--grid", "resources.layup.capacity=5000,6000");
    assertEquals(0, r.code(), r.out() + r.err());
    assertFalse(r.err().contains("Exception"), r.err());
    // a header and one row per grid point
    assertEquals(3, java.nio.file.Files.readAllLines(out.resolve("sweep.csv")).size());
  }
}
