package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.dataformat.yaml.YAMLMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A catalog whose option table lies outside its folder ({@code ../shared/casings.csv}): every
 * command that reads the catalog file (check, solve, resume, sweep) refuses it in words naming the
 * field and the option, and reads it when the person running the command adds
 * {@code --allow-outside-tables}.
 */
class TableReachTest {
  private static final String FLAG = "--allow-outside-tables";

  @TempDir static Path tmp;
  static String catalog;

  /** The starter catalog with its casing options moved to a table in a sibling folder. */
  @BeforeAll
  static void catalogWithATableOutside() throws IOException {
    YAMLMapper yaml = new YAMLMapper();
    ObjectNode tree = (ObjectNode) yaml.readTree(Path.of("catalogs/heatpump-starter.yaml").toFile());
    List<String> rows = new ArrayList<>(List.of("id,price,cost,label,uses.assembly,uses.testbench"));
    for (JsonNode g : tree.get("groups")) {
      if (g.get("id").asText().equals("casing")) {
        for (JsonNode o : g.get("options")) {
          JsonNode uses = o.path("uses");
          rows.add(String.join(",", o.get("id").asText(), o.get("price").asText(), o.get("cost").asText(),
              o.get("label").asText(), uses.path("assembly").asText("0"), uses.path("testbench").asText("0")));
        }
        ((ObjectNode) g).remove("options");
        ((ObjectNode) g).put("optionsFile", "../shared/casings.csv");
      }
    }
    Files.createDirectories(tmp.resolve("shared"));
    Files.writeString(tmp.resolve("shared/casings.csv"), String.join("\n", rows) + "\n");
    Path dir = Files.createDirectories(tmp.resolve("catalog"));
    catalog = dir.resolve("starter.yaml").toString();
    Files.writeString(Path.of(catalog), yaml.writeValueAsString(tree));
  }

  private static void refusedInWords(CliRun r) {
    assertEquals(2, r.code(), r.toString());
    assertTrue(r.err().contains("groups[3].optionsFile") && r.err().contains(FLAG), r.toString());
  }

  @Test
  void checkReadsAnOutsideTableOnlyWhenAllowed() {
    refusedInWords(CliRun.of("check", catalog));
    CliRun ok = CliRun.of("check", catalog, FLAG);
    assertEquals(0, ok.code(), ok.toString());
    assertTrue(ok.out().contains("casing            5 options"), ok.out());
  }

  @Test
  void solveAndResumeReadAnOutsideTableOnlyWhenAllowed() throws IOException {
    Path run = tmp.resolve("run");
    refusedInWords(CliRun.of("solve", catalog, "--out", run.toString(), "--no-portfolio"));
    assertFalse(Files.exists(run.resolve("result.json")), "a refused solve wrote a result");

    CliRun stopped = CliRun.of("solve", catalog, "--out", run.toString(), "--no-portfolio", "--max-iterations", "1",
        FLAG);
    assertEquals(1, stopped.code(), stopped.toString());
    // resume reads the catalog file again (to see whether it changed): the same permission is needed
    refusedInWords(CliRun.of("resume", run.toString(), "--no-portfolio"));
    CliRun resumed = CliRun.of("resume", run.toString(), "--no-portfolio", FLAG);
    assertEquals(0, resumed.code(), resumed.toString());
    assertTrue(Files.readString(run.resolve("result.json")).contains("\"optimal\""), "resume did not reach the optimum");
  }

  @Test
  void sweepReadsAnOutsideTableOnlyWhenAllowed() throws IOException {
    Path out = tmp.resolve("sweep");
    String[] args = {"sweep", catalog, "--grid", "resources.testbench.capacity=8000..9000:1000", "--out",
        out.toString()};
    refusedInWords(CliRun.of(args));
    List<String> allowed = new ArrayList<>(List.of(args));
    allowed.add(FLAG);
    CliRun ok = CliRun.of(allowed.toArray(String[]::new));
    assertEquals(0, ok.code(), ok.toString());
    assertTrue(Files.isRegularFile(out.resolve("sweep.csv")), ok.toString());
  }
}
