package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * result.json says how far the branch-and-price tree went, so a run read the next morning shows
 * whether more time could help: with the quick proof switched off ({@code --survivor-limit 0}) a
 * generated catalog of 7 groups goes to the tree (it closes in about 25 nodes), which must then report
 * its nodes, and none left open once proven; a run the quick proof settles writes no tree.
 */
class TreeFiguresInResultTest {
  @TempDir Path dir;

  @Test
  void theTreeWritesItsNodesAndNoneOpenWhenItProves() throws Exception {
    Path catalog = dir.resolve("seven-groups.yaml");
    CliRun gen = CliRun.of("generate", "--groups", "7", "--options", "6", "--resources", "4", "--segments", "4",
        "--rules", "10", "--seed", "3", "--out", catalog.toString());
    assertEquals(0, gen.code(), gen.toString());
    Files.writeString(catalog, Files.readString(catalog)
        + "portfolio:\n  introductionCost: 25000\n  maxVariants: 10\n  minLot: 300\n");
    JsonNode portfolio = solve(catalog, "tree", "--survivor-limit", "0").path("portfolio");
    JsonNode tree = portfolio.path("proof").path("tree");
    assertTrue(tree.isObject(), portfolio.path("proof").toString());
    assertTrue(tree.path("nodesSolved").asLong() >= 1, tree.toString());
    assertTrue(tree.path("workers").asInt() >= 1, tree.toString());
    if (portfolio.path("status").asText().equals("proven")) {
      assertEquals(0, tree.path("nodesOpen").asInt(), tree.toString());
    } else {
      assertTrue(tree.path("nodesOpen").asInt() > 0, portfolio.toString());
    }
  }

  @Test
  void aRunTheQuickProofSettlesWritesNoTree() throws Exception {
    JsonNode portfolio = solve(Path.of("catalogs", "ventilation-small.yaml"), "quick").path("portfolio");
    assertEquals("proven", portfolio.path("status").asText(), portfolio.toString());
    assertFalse(portfolio.path("proof").has("tree"), portfolio.path("proof").toString());
  }

  private JsonNode solve(Path catalog, String name, String... extra) throws Exception {
    Path out = dir.resolve(name);
    CliRun run = CliRun.solve(catalog, out, extra);
    assertEquals(0, run.code(), run.toString());
    return new ObjectMapper().readTree(Files.readString(out.resolve("result.json")));
  }
}
