package dev.mixwright.runfolder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.space.VariantSpace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The column log as the run's pool: whole lines read back, a crash's torn last line dropped, damage refused. */
class ColumnLogReaderTest {
  @TempDir Path dir;
  VariantSpace space;
  byte[] whole;
  int lines;
  double objective;

  @BeforeEach
  void writeLog() throws Exception {
    space = new VariantSpace(CatalogLoader.load(Path.of("catalogs/heatpump-starter.yaml")));
    try (ColumnLog log = ColumnLog.open(space, dir, 1, 0)) {
      objective = new ColumnGeneration(space, BranchAndBoundPricer.withDefaultLimits(space), null, SolveSettings.defaults(), StopCriterion.never(), System.nanoTime())
          .addListener(log).run().result().value();
    }
    whole = Files.readAllBytes(log());
    lines = ColumnLogReader.read(log()).lines().size();
    assertTrue(lines > 10, "the starter catalog needs more than a handful of columns");
  }

  private Path log() {
    return dir.resolve(ColumnLog.FILE);
  }

  private int lastLineStart(byte[] b) {
    int i = b.length - 2;
    while (i >= 0 && b[i] != '\n') {
      i--;
    }
    return i + 1;
  }

  @Test
  void everyLineCarriesItsChecksumAndRebuildsItsColumn() throws IOException {
    ColumnLogReader.Entries e = ColumnLogReader.read(log());
    assertEquals(0, e.droppedTornLines());
    assertEquals(whole.length, e.validBytes());
    for (JsonNode n : e.lines()) {
      assertTrue(n.path("crc").isTextual());
      assertEquals(1, n.path("session").asInt());
    }
    var pool = ColumnPool.rebuild(space, e.lines());
    assertEquals(lines, pool.columns().size());
    assertEquals(0, pool.leftOut());
    // The margin written beside each column is what the catalog gives it again.
    for (int i = 0; i < lines; i++) {
      assertEquals(e.lines().get(i).path("margin").asDouble(), pool.columns().get(i).margin(), 1e-9);
    }
  }

  @Test
  void aLastLineCutAtAnyByteIsDroppedAndNeverMisread() throws IOException {
    int start = lastLineStart(whole);
    for (int cut = start + 1; cut < whole.length; cut++) {
      Files.write(log(), Arrays.copyOf(whole, cut));
      ColumnLogReader.Entries e = ColumnLogReader.read(log());
      assertEquals(lines - 1, e.lines().size(), "cut at " + cut);
      assertEquals(1, e.droppedTornLines());
      assertEquals(start, e.validBytes());
    }
  }

  @Test
  void aLastLineWithItsNewlineButGarbledIsDropped() throws IOException {
    int start = lastLineStart(whole);
    // A digit changed inside the body: still JSON, but the checksum no longer matches.
    byte[] b = whole.clone();
    int at = new String(b, StandardCharsets.UTF_8).indexOf("\"elapsedMs\":", start) + 12;
    b[at] = (byte) (b[at] == '1' ? '2' : '1');
    Files.write(log(), b);
    ColumnLogReader.Entries e = ColumnLogReader.read(log());
    assertEquals(lines - 1, e.lines().size());
    assertEquals(start, e.validBytes());
  }

  @Test
  void zeroBytesLeftByACrashAfterTheLastLineAreDropped() throws IOException {
    byte[] b = Arrays.copyOf(whole, whole.length + 4096); // a block the file system extended, never written
    Files.write(log(), b);
    ColumnLogReader.Entries e = ColumnLogReader.read(log());
    assertEquals(lines, e.lines().size());
    assertEquals(whole.length, e.validBytes());
  }

  @Test
  void damageWithWholeLinesAfterItIsAnErrorNamingTheLine() throws IOException {
    byte[] b = whole.clone();
    String text = new String(b, StandardCharsets.UTF_8);
    int third = text.indexOf('\n', text.indexOf('\n') + 1) + 1; // start of line 3
    int at = text.indexOf("\"margin\":", third) + 9;
    b[at] = (byte) (b[at] == '9' ? '8' : '9');
    Files.write(log(), b);
    IOException ex = assertThrows(IOException.class, () -> ColumnLogReader.read(log()));
    assertTrue(ex.getMessage().contains("line 3"), ex.getMessage());
  }

  @Test
  void appendingAfterATornLineCutsItFirstSoTheLogStaysWhole() throws Exception {
    // Cut in the middle of a line half-way through: as if the run had died there.
    Files.write(log(), Arrays.copyOf(whole, whole.length / 2));
    ColumnLogReader.Entries e = ColumnLogReader.read(log());
    assertEquals(1, e.droppedTornLines());
    int kept = e.lines().size();
    var pool = ColumnPool.rebuild(space, e.lines());
    double resumed;
    try (ColumnLog log = ColumnLog.open(space, dir, 2, e.validBytes())) {
      resumed = new ColumnGeneration(space, BranchAndBoundPricer.withDefaultLimits(space), null, SolveSettings.defaults(), StopCriterion.never(), System.nanoTime())
          .continuing(3, Double.POSITIVE_INFINITY).addListener(log).run(pool.columns()).result().value();
    }
    assertEquals(objective, resumed, 1e-6 * Math.abs(objective));
    ColumnLogReader.Entries after = ColumnLogReader.read(log());
    assertEquals(0, after.droppedTornLines());
    assertTrue(after.lines().size() > kept, "the resumed loop adds columns after the kept ones");
    List<Integer> sessions = after.lines().stream().map(n -> n.path("session").asInt()).toList();
    assertEquals(1, sessions.get(0));
    assertEquals(2, sessions.get(sessions.size() - 1));
    for (int i = kept; i < after.lines().size(); i++) {
      assertTrue(after.lines().get(i).path("iteration").asInt() > 3, "rounds are numbered on after the resume");
    }
  }

  /**
   * {@link ColumnLogReader#scan} holds one line at a time (what `log` uses on an overnight run's log):
   * the same lines in the same order as {@link ColumnLogReader#read}, lines longer than its buffers
   * (4 KiB for a line, 64 KiB read at once) whole, and the same torn-line count and valid length.
   */
  @Test
  void aScanHandsOnTheSameLinesOneAtATime() throws IOException {
    StringBuilder text = new StringBuilder(new String(whole, StandardCharsets.UTF_8));
    String longNote = "x".repeat(150_000); // spans three reads of the file
    text.append("{\"iteration\":9,\"segment\":\"retrofit\",\"note\":\"").append(longNote).append("\"}\n");
    text.append("{\"iteration\":9,\"seg"); // a torn last line
    Files.writeString(log(), text);
    ColumnLogReader.Entries all = ColumnLogReader.read(log());
    List<JsonNode> seen = new java.util.ArrayList<>();
    ColumnLogReader.Summary s = ColumnLogReader.scan(log(), seen::add);
    assertEquals(lines + 1, seen.size());
    assertEquals(all.lines(), seen);
    assertEquals(longNote, seen.get(lines).path("note").asText());
    assertEquals(lines + 1, s.wholeLines());
    assertEquals(1, s.droppedTornLines());
    assertEquals(all.validBytes(), s.validBytes());
    assertEquals(text.toString().getBytes(StandardCharsets.UTF_8).length - "{\"iteration\":9,\"seg".length(),
        s.validBytes());
  }

  @Test
  void aLineWithoutChecksumFromAnOlderLogIsStillRead() throws IOException {
    Files.writeString(log(), "{\"iteration\":0,\"segment\":\"retrofit\",\"options\":{}}\n");
    assertEquals(1, ColumnLogReader.read(log()).lines().size());
  }
}
