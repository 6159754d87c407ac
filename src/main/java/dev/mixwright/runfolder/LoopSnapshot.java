package dev.mixwright.runfolder;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.time.Instant;
import java.util.Optional;

/**
 * {@code state.json}: the loop's state after a round — the round number, the master objective, the
 * best bound proven so far (+∞ for none), the gap, columns in the master, elapsed time over all
 * sessions and the settings — and its status ({@code running} until the session ends). Written by temp file, sync and
 * rename after every round, so it is whole or absent, its checksum the last field ({@link
 * SealedJson}); one found damaged anyway (copied half, a flipped byte, edited) is set aside with the
 * reason in words and the state is taken from the column log, the run's authority, instead.
 */
public record LoopSnapshot(
    String runId, int session, String status, int iteration, double objective, double bound,
    double gap, int columns, long elapsedMs) {

  public static final String RUNNING = "running";

  /** What was found in state.json: a snapshot, or why there is none. */
  public record Loaded(Optional<LoopSnapshot> snapshot, String problem) {}

  public void write(RunFolder folder) throws IOException {
    write(folder, null);
  }

  /** Writes state.json, with the run's settings beside the state when given. */
  public void write(RunFolder folder, RunManifest.Settings settings) throws IOException {
    ObjectNode n = Json.pretty().createObjectNode();
    n.put("format", 2);
    n.put("runId", runId);
    n.put("session", session);
    n.put("status", status);
    n.put("iteration", iteration);
    Json.putNum(n, "objective", objective);
    Json.putNum(n, "bound", bound);
    Json.putNum(n, "gap", gap);
    n.put("columns", columns);
    n.put("elapsedMs", elapsedMs);
    n.put("writtenAt", Instant.now().toString());
    if (settings != null) {
      settings.putInto(n.putObject("settings"));
    }
    AtomicFiles.write(folder.snapshot(), SealedJson.seal(Json.pretty().writeValueAsString(n)));
  }

  public static Loaded read(RunFolder folder) {
    String text;
    try {
      text = folder.readSealed(RunFolder.SNAPSHOT);
    } catch (RunFileDamaged e) {
      return new Loaded(Optional.empty(), RunFolder.SNAPSHOT + " is damaged (" + e.getMessage() + ")");
    } catch (NoSuchFileException e) {
      return new Loaded(Optional.empty(), "no " + RunFolder.SNAPSHOT + " (the run ended before its first round)");
    } catch (IOException e) {
      return new Loaded(Optional.empty(), RunFolder.SNAPSHOT + " cannot be read: " + e.getMessage());
    }
    JsonNode n;
    try {
      n = Json.compact().readTree(text);
    } catch (JsonProcessingException e) {
      return new Loaded(Optional.empty(), RunFolder.SNAPSHOT + " is damaged (" + text.length()
          + " characters, not whole JSON)");
    }
    if (n == null || !n.isObject() || !n.path("iteration").isInt() || !n.path("elapsedMs").isIntegralNumber()
        || !n.path("status").isTextual() || !n.has("bound")) {
      return new Loaded(Optional.empty(), RunFolder.SNAPSHOT + " lacks the fields of a loop snapshot");
    }
    JsonNode b = n.get("bound");
    return new Loaded(Optional.of(new LoopSnapshot(
        n.path("runId").asText(""), n.path("session").asInt(), n.get("status").asText(),
        n.get("iteration").asInt(), n.path("objective").asDouble(Double.NaN),
        b.isNumber() ? b.asDouble() : Double.POSITIVE_INFINITY, n.path("gap").asDouble(Double.NaN),
        n.path("columns").asInt(), n.get("elapsedMs").asLong())), "");
  }

  /**
   * The state as far as the column log shows it: the last round that added a column, the best bound
   * written beside a column, the latest elapsed time. Behind the snapshot by at most the rounds since
   * the last column, which only costs the resumed run their re-pricing.
   */
  public static LoopSnapshot fromLog(String runId, ColumnLogReader.Entries log) {
    int iteration = 0;
    double bound = Double.POSITIVE_INFINITY;
    double objective = Double.NaN;
    long elapsed = 0;
    int session = 0;
    for (JsonNode n : log.lines()) {
      iteration = Math.max(iteration, n.path("iteration").asInt());
      JsonNode b = n.path("boundAfter");
      if (b.isNumber()) {
        bound = Math.min(bound, b.asDouble());
      }
      if (n.path("objectiveAfter").isNumber()) {
        objective = n.path("objectiveAfter").asDouble();
      }
      elapsed = Math.max(elapsed, n.path("elapsedMs").asLong());
      session = Math.max(session, n.path("session").asInt(1));
    }
    return new LoopSnapshot(runId, session, RUNNING, iteration, objective, bound, Double.NaN,
        log.lines().size(), elapsed);
  }
}
