package dev.mixwright.runfolder;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.portfolio.IntegerStage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * {@code portfolio-state.json}: the integer stage's progress (its pool of variants, the incumbent's
 * variants and value, the bound proven so far), stamped with the run, the SHA-256 of the catalog as
 * solved and the stage's settings, so that a resume warm-starts only the same problem. Replaced by
 * temp file, sync and rename, so it is whole or absent; one that is damaged or stamped for another
 * catalog or settings is ignored with the reason in words.
 */
public final class PortfolioCheckpoint {
  public static final String FILE = "portfolio-state.json";
  private static final int FORMAT = 1;

  private PortfolioCheckpoint() {}

  /** Whose progress a checkpoint is: the run, the catalog copy's SHA-256 and the stage's settings in words. */
  public record Stamp(String runId, String catalogSha256, String settings) {}

  /** What was found: the progress, or why there is none to use. */
  public record Loaded(Optional<IntegerStage.Checkpoint> checkpoint, String problem) {}

  public static Path file(RunFolder folder) {
    return folder.dir().resolve(FILE);
  }

  public static void write(RunFolder folder, Stamp stamp, IntegerStage.Checkpoint c) throws IOException {
    ObjectNode n = Json.compact().createObjectNode();
    n.put("format", FORMAT);
    n.put("runId", stamp.runId());
    n.put("catalogSha256", stamp.catalogSha256());
    n.put("settings", stamp.settings());
    Json.putNum(n, "value", c.value());
    Json.putNum(n, "bound", c.bound());
    n.put("writtenAt", Instant.now().toString());
    variants(n.putArray("incumbent"), c.incumbent());
    variants(n.putArray("pool"), c.pool());
    AtomicFiles.write(file(folder), Json.compact().writeValueAsString(n) + "\n");
  }

  private static void variants(ArrayNode a, List<int[]> vs) {
    for (int[] v : vs) {
      ArrayNode row = a.addArray();
      for (int k : v) {
        row.add(k);
      }
    }
  }

  public static void delete(RunFolder folder) throws IOException {
    Files.deleteIfExists(file(folder));
  }

  /** The checkpoint in {@code folder} if it is whole and carries {@code expected}; else why not. */
  public static Loaded read(RunFolder folder, Stamp expected) {
    String text;
    try {
      text = Files.readString(file(folder));
    } catch (NoSuchFileException e) {
      return none("no " + FILE + " (the integer stage had not yet reached its first checkpoint)");
    } catch (IOException e) {
      return none(FILE + " cannot be read (" + e.getMessage() + ")");
    }
    JsonNode n;
    try {
      n = Json.compact().readTree(text);
    } catch (JsonProcessingException e) {
      return none(FILE + " is damaged (not whole JSON)");
    }
    if (n == null || !n.isObject() || n.path("format").asInt() != FORMAT || !n.path("pool").isArray()
        || !n.path("incumbent").isArray()) {
      return none(FILE + " lacks the fields of a portfolio checkpoint");
    }
    if (!expected.runId().equals(n.path("runId").asText())) {
      return none(FILE + " belongs to another run");
    }
    if (!expected.catalogSha256().equals(n.path("catalogSha256").asText())) {
      return none(FILE + " was written for another catalog (its SHA-256 differs from the catalog as solved now)");
    }
    if (!expected.settings().equals(n.path("settings").asText())) {
      return none(FILE + " was written with other integer-stage settings (" + n.path("settings").asText()
          + ", now " + expected.settings() + ")");
    }
    List<int[]> pool = ints(n.get("pool"));
    List<int[]> incumbent = ints(n.get("incumbent"));
    if (pool == null || incumbent == null) {
      return none(FILE + " is damaged (a variant is not a list of choice numbers)");
    }
    JsonNode v = n.path("value");
    JsonNode b = n.path("bound");
    return new Loaded(Optional.of(new IntegerStage.Checkpoint(pool, incumbent,
        v.isNumber() ? v.asDouble() : Double.NEGATIVE_INFINITY, b.isNumber() ? b.asDouble() : Double.POSITIVE_INFINITY)),
        "");
  }

  private static List<int[]> ints(JsonNode a) {
    List<int[]> out = new ArrayList<>(a.size());
    for (JsonNode row : a) {
      if (!row.isArray()) {
        return null;
      }
      int[] v = new int[row.size()];
      for (int i = 0; i < v.length; i++) {
        if (!row.get(i).isInt()) {
          return null;
        }
        v[i] = row.get(i).asInt();
      }
      out.add(v);
    }
    return out;
  }

  private static Loaded none(String why) {
    return new Loaded(Optional.empty(), why);
  }
}
