package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.runfolder.Json;
import dev.mixwright.testing.Cases;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A sweep killed with SIGKILL at random moments (and its re-run sometimes killed too) is finished by
 * running the same command again, to the table an uninterrupted sweep writes: every point, each with
 * the uninterrupted objective. The sweep table is replaced atomically after each point, so a kill
 * leaves the points solved before it whole. Seeded; the seed is in every failure message.
 */
class SweepKillTest {
  private static final String STARTER = "src/test/resources/fixed-demand/heatpump-starter.yaml";
  private static final int KILLS = 3;
  private static final int MAX_ATTEMPTS = 10;

  @TempDir Path tmp;

  private static String[] args(Path out) {
    return new String[] {"sweep", STARTER, "--grid", "resources.testbench.capacity=8000..10000:1000",
        "--grid", "options.compressor.evi.cost=-10%,+10%", "--out", out.toString(), "--no-progress"};
  }

  private static JsonNode rows(Path out) throws Exception {
    return Json.pretty().readTree(out.resolve("sweep.json").toFile()).path("rows");
  }

  @Test
  void aKilledSweepRunAgainEndsWithTheUninterruptedTable() throws Exception {
    Path full = tmp.resolve("full");
    CliRun whole = CliRun.of(args(full));
    assertEquals(0, whole.code(), whole.toString());
    JsonNode expected = rows(full);
    assertEquals(6, expected.size());

    long seed = Cases.seed(13);
    Random rnd = new Random(seed);
    int landed = 0;
    List<String> log = new ArrayList<>();
    for (int attempt = 0; attempt < MAX_ATTEMPTS && landed < KILLS; attempt++) {
      Path out = tmp.resolve("killed" + attempt);
      String why = "seed " + seed + ", attempt " + attempt;
      boolean killedOne = false;
      // one kill, and a second of the re-run half the time
      for (int k = 0; k < (rnd.nextBoolean() ? 2 : 1); k++) {
        ChildJvm child = ChildJvm.start(tmp.resolve("logs"), "sweep" + attempt + "-" + k, args(out));
        // the table is written before the first point is solved, then after each point
        child.awaitFile(out.resolve("sweep.json"), 120_000);
        Thread.sleep(rnd.nextInt(1500));
        boolean alive = child.process.isAlive();
        child.process.destroyForcibly().waitFor(); // SIGKILL
        killedOne |= alive;
        log.add(why + ": kill " + k + (alive ? " landed" : " came after the end"));
      }
      CliRun again = CliRun.of(args(out));
      assertEquals(0, again.code(), why + "\n" + again + "\n" + String.join("\n", log));
      JsonNode got = rows(out);
      assertEquals(expected.size(), got.size(), why);
      for (int i = 0; i < expected.size(); i++) {
        double e = expected.get(i).path("objective").asDouble();
        assertEquals(e, got.get(i).path("objective").asDouble(), 1e-6 * Math.abs(e), why + ", point " + i);
      }
      landed += killedOne ? 1 : 0;
    }
    assertTrue(landed >= KILLS, "only " + landed + " kills landed while the sweep ran (seed " + seed + "):\n"
        + String.join("\n", log));
  }
}
