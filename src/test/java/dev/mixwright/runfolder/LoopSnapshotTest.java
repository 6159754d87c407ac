package dev.mixwright.runfolder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class LoopSnapshotTest {
  @TempDir Path dir;

  @Test
  void roundTripsIncludingAnInfiniteBound() throws Exception {
    RunFolder f = new RunFolder(dir);
    new LoopSnapshot("run-1", 2, "running", 7, 123.5, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, 40, 9000)
        .write(f);
    LoopSnapshot s = LoopSnapshot.read(f).snapshot().orElseThrow();
    assertEquals(7, s.iteration());
    assertEquals(Double.POSITIVE_INFINITY, s.bound());
    assertEquals(9000, s.elapsedMs());
    assertEquals("run-1", s.runId());
  }

  @Test
  void aSnapshotCutAtAnyLengthIsSetAsideWithAReason() throws Exception {
    RunFolder f = new RunFolder(dir);
    new LoopSnapshot("run-1", 1, "running", 7, 123.5, 130.25, 0.05, 40, 9000).write(f);
    byte[] whole = Files.readAllBytes(f.snapshot());
    String text = new String(whole, StandardCharsets.UTF_8);
    int closing = text.lastIndexOf('}');
    for (int cut = 0; cut <= closing; cut++) {
      Files.write(f.snapshot(), java.util.Arrays.copyOf(whole, cut));
      LoopSnapshot.Loaded l = LoopSnapshot.read(f);
      assertTrue(l.snapshot().isEmpty(), "cut at " + cut);
      assertTrue(!l.problem().isEmpty());
    }
  }

  @Test
  void theColumnLogGivesTheStateWhenTheSnapshotIsGone() throws Exception {
    List<JsonNode> lines = List.of(
        Json.compact().readTree("{\"session\":1,\"iteration\":0,\"objectiveAfter\":10,\"boundAfter\":null,\"elapsedMs\":5}"),
        Json.compact().readTree("{\"session\":1,\"iteration\":3,\"objectiveAfter\":20,\"boundAfter\":40,\"elapsedMs\":50}"),
        Json.compact().readTree("{\"session\":2,\"iteration\":4,\"objectiveAfter\":25,\"boundAfter\":30,\"elapsedMs\":70}"));
    LoopSnapshot s = LoopSnapshot.fromLog("r", new ColumnLogReader.Entries(lines, 0, 0));
    assertEquals(4, s.iteration());
    assertEquals(30, s.bound());
    assertEquals(70, s.elapsedMs());
    assertEquals(2, s.session());
  }
}
