package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.colgen.RunStatus;
import org.junit.jupiter.api.Test;

/** result.json read into the record tree and written back gives the same text, nulls and absences kept. */
class RunResultTest {
  static final String STOPPED = """
      {
        "status" : "stopped",
        "stopReason" : "limit of 1 rounds reached",
        "objective" : 120.5,
        "bound" : null,
        "gap" : null,
        "iterations" : 1,
        "columnsGenerated" : 4,
        "columnsInMaster" : 6,
        "buildableVariants" : null,
        "buildableVariantsAtMost" : "1200",
        "elapsedMs" : 40,
        "catalog" : {
          "name" : "starter",
          "file" : "catalogs/heatpump-starter.yaml",
          "sha256" : "ab",
          "currency" : "EUR",
          "period" : "year"
        },
        "pricer" : "bnb",
        "offers" : [ {
          "segment" : "quiet",
          "options" : {
            "tank" : "t300",
            "backup" : "none"
          },
          "quantity" : 12.0,
          "unitMargin" : 10.0,
          "reducedCost" : 0.0,
          "atLimit" : false,
          "contribution" : 120.0
        } ],
        "resources" : [ {
          "id" : "testbench",
          "capacity" : 100.0,
          "used" : 100.0,
          "shadowPrice" : 2.5,
          "binding" : true
        } ],
        "segments" : [ {
          "id" : "quiet",
          "demand" : 50.0,
          "sold" : 12.0,
          "shadowPrice" : 0.0
        } ],
        "rounds" : [ {
          "iteration" : 1,
          "objective" : 120.5,
          "bound" : null,
          "gap" : null,
          "columns" : 6,
          "added" : 4,
          "exactPricing" : false,
          "elapsedMs" : 40
        } ],
        "sessions" : 2,
        "portfolioPending" : "the LP stage stopped before its optimum"
      }
      """;

  @Test
  void aStoppedResultReadsAndWritesBackUnchanged() throws Exception {
    RunResult r = RunResult.parse(STOPPED, "result.json");
    assertEquals(RunStatus.STOPPED, r.status());
    assertNull(r.bound());
    assertEquals(Double.POSITIVE_INFINITY, r.gapOrInfinity());
    assertEquals(java.util.List.of("tank", "backup"), java.util.List.copyOf(r.offers().get(0).options().keySet()));
    assertEquals(STOPPED, r.toJson());
  }

  @Test
  void absentOptionalFieldsStayAbsent() throws Exception {
    RunResult r = RunResult.parse(STOPPED, "result.json");
    RunResult plain = new RunResult(RunStatus.OPTIMAL, "", 1, 1.0, 0.0, 1, 1, 1, "3", null, null, null, 1, r.catalog(), "bnb",
        r.offers(), r.resources(), r.segments(), r.rounds(), null, null, null);
    String json = plain.toJson();
    assertTrue(json.contains("\"status\" : \"optimal\""), json);
    for (String absent : new String[] {"stopReason", "buildableVariantsAtMost", "sessions", "portfolioPending",
        "\"portfolio\""}) {
      assertTrue(!json.contains(absent), absent + " in " + json);
    }
  }

  /** The file write() streams is the text toJson() gives, sealed: the form every reader of a run folder checks. */
  @Test
  void theStreamedFileIsTheSealedText(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir) throws Exception {
    RunResult r = RunResult.parse(STOPPED, "result.json");
    r.write(dir);
    String file = java.nio.file.Files.readString(dir.resolve(ResultWriter.FILE));
    assertEquals(dev.mixwright.runfolder.SealedJson.seal(r.toJson()), file);
    assertEquals(STOPPED, RunResult.read(dir).toJson());
  }
}
