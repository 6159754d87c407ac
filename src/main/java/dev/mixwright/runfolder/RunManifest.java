package dev.mixwright.runfolder;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.colgen.SolveSettings;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;

/**
 * {@code run.json}: what a run is, written atomically before its first round and again at the start
 * of every resume. It names the catalog file the run was started from and its SHA-256 (so a resume
 * can tell that the file changed), the scenario file applied to it if any, the SHA-256 of {@code
 * catalog.json} (the catalog as solved), the settings, and one entry per session.
 */
public record RunManifest(
    int format,
    String runId,
    String createdAt,
    Source catalog,
    Source scenario,
    String catalogCopySha256,
    Settings settings,
    List<Session> sessions) {

  /**
   * 2: the manifest names its kind and every JSON file of the folder carries a checksum ({@link
   * SealedJson}). 1: written before; still read (without checksums) and kept at 1 when resumed, so
   * the older unchecked files beside it stay readable.
   */
  public static final int FORMAT = 2;
  static final int LEGACY_FORMAT = 1;

  /** A file the run was made from: its path as given (made absolute) and its SHA-256. */
  public record Source(String path, String sha256) {}

  /**
   * How the loop runs, every switch of {@link SolveSettings} and the pricer; limits of 0 mean none.
   * A resume rebuilds the loop from these, so a setting missing here is silently lost on resume.
   */
  public record Settings(
      String pricer, double gap, int perRound, boolean heuristicFirst, long timeLimitMs, int maxIterations,
      double smoothing, int retireAfter) {

    public static Settings of(SolveSettings s, String pricer) {
      return new Settings(pricer, s.gapTolerance(), s.perRound(), s.heuristicFirst(), s.timeLimitMs(),
          s.maxIterations(), s.smoothing(), s.retireAfter());
    }

    /**
     * The loop's settings for a later session: the run's own, with {@code gap} when given and no
     * limits (a session's limits count from its own start and are applied apart).
     */
    /** Every field, as run.json and state.json write them. */
    public void putInto(ObjectNode s) {
      s.put("pricer", pricer);
      s.put("gap", gap);
      s.put("perRound", perRound);
      s.put("heuristicFirst", heuristicFirst);
      s.put("timeLimitMs", timeLimitMs);
      s.put("maxIterations", maxIterations);
      s.put("smoothing", smoothing);
      s.put("retireAfter", retireAfter);
    }

    public SolveSettings forSession(Double gapOverride) {
      return new SolveSettings(gapOverride != null ? gapOverride : gap, perRound, 0, 0, heuristicFirst,
          smoothing, retireAfter);
    }
  }

  /** One process working on the run: 1 is the solve, each resume adds one. */
  /** One solve or resume of the run; {@code note} is left out of run.json when empty. */
  public record Session(int number, String kind, String startedAt,
      @JsonInclude(JsonInclude.Include.NON_EMPTY) String note) {}

  public RunManifest {
    sessions = List.copyOf(sessions);
  }

  /** The manifest of a new run, with its first session. */
  public static RunManifest begin(Source catalog, Source scenario, String catalogCopySha256, Settings settings) {
    String now = Instant.now().toString();
    return new RunManifest(FORMAT, UUID.randomUUID().toString(), now, catalog, scenario,
        catalogCopySha256, settings, List.of(new Session(1, "solve", now, "")));
  }

  /** The number the next session gets. */
  public int nextSession() {
    return sessions.isEmpty() ? 1 : sessions.get(sessions.size() - 1).number() + 1;
  }

  /** This manifest with one more session; when the catalog was re-priced, its new source and copy hash. */
  public RunManifest withSession(String kind, String note, Source newCatalog, String newCopySha256) {
    List<Session> s = new ArrayList<>(sessions);
    s.add(new Session(nextSession(), kind, Instant.now().toString(), note == null ? "" : note));
    return new RunManifest(format, runId, createdAt, newCatalog, scenario, newCopySha256, settings, s);
  }

  public void write(RunFolder folder) throws IOException {
    String text = Json.pretty().writeValueAsString(toJson()) + "\n";
    AtomicFiles.write(folder.manifest(), format >= FORMAT ? SealedJson.seal(text) : text);
  }

  public ObjectNode toJson() {
    ObjectNode n = Json.pretty().createObjectNode();
    n.put("format", format);
    if (format >= FORMAT) {
      n.put("kind", RunFolder.Kind.SOLVE.word());
    }
    n.put("runId", runId);
    n.put("createdAt", createdAt);
    putSource(n, "catalog", catalog);
    if (scenario != null) {
      putSource(n, "scenario", scenario);
    }
    n.put("catalogCopySha256", catalogCopySha256);
    settings.putInto(n.putObject("settings"));
    ArrayNode a = n.putArray("sessions");
    sessions.forEach(x -> a.add(Json.pretty().<JsonNode>valueToTree(x)));
    return n;
  }

  private static void putSource(ObjectNode n, String field, Source s) {
    ObjectNode o = n.putObject(field);
    o.put("path", s.path());
    o.put("sha256", s.sha256());
  }

  /** Reads run.json; the message of the exception says what is wrong in words. */
  public static RunManifest read(RunFolder folder) throws IOException {
    String name = RunFolder.MANIFEST;
    JsonNode n;
    try {
      n = Json.pretty().readTree(folder.readSealed(name));
    } catch (NoSuchFileException e) {
      throw new RunFileDamaged("no " + name + " in " + folder.dir() + " — it is not a run folder, or the"
          + " run was cut off before it began (solve it again)");
    } catch (JsonProcessingException e) {
      throw new RunFileDamaged(name + " in " + folder.dir() + " is damaged (not JSON: "
          + e.getOriginalMessage() + "); it is written atomically, so something else changed it");
    }
    if (n == null || !n.isObject()) {
      throw new RunFileDamaged(name + " in " + folder.dir() + " is not a JSON object");
    }
    int format = need(n, "format", name).asInt();
    if (format != FORMAT && format != LEGACY_FORMAT) {
      throw new RunFileDamaged(name + " in " + folder.dir() + ": format " + format + " is not one this version"
          + " reads (" + LEGACY_FORMAT + " or " + FORMAT + "); use the mixwright version that wrote it");
    }
    if (format >= FORMAT && !RunFolder.Kind.SOLVE.word().equals(n.path("kind").asText())) {
      throw new RunFileDamaged(folder.dir() + " holds a " + n.path("kind").asText("(unnamed)") + " run, not a"
          + " solve; only a solve run can be resumed or explained");
    }
    JsonNode s = need(n, "settings", name);
    Settings settings = new Settings(
        need(s, "pricer", name + " settings").asText(),
        need(s, "gap", name + " settings").asDouble(),
        need(s, "perRound", name + " settings").asInt(),
        s.path("heuristicFirst").asBoolean(false),
        s.path("timeLimitMs").asLong(0),
        s.path("maxIterations").asInt(0),
        // Run folders written before these were recorded ran with the defaults.
        s.path("smoothing").asDouble(SolveSettings.DEFAULT_SMOOTHING),
        s.path("retireAfter").asInt(SolveSettings.DEFAULT_RETIRE_AFTER));
    List<Session> sessions = new ArrayList<>();
    for (JsonNode x : n.path("sessions")) {
      sessions.add(new Session(x.path("number").asInt(), x.path("kind").asText(),
          x.path("startedAt").asText(), x.path("note").asText("")));
    }
    if (Files.exists(folder.catalogCopy())) {
      // Its SHA-256 is checked by whoever reads it (a changed copy may be re-priced); bytes that are
      // not text at all are damage no reader can handle, refused here before anyone reads them.
      folder.readText(RunFolder.CATALOG_COPY);
    }
    return new RunManifest(format, need(n, "runId", name).asText(), n.path("createdAt").asText(),
        source(need(n, "catalog", name), name + " catalog"),
        n.has("scenario") ? source(n.get("scenario"), name + " scenario") : null,
        need(n, "catalogCopySha256", name).asText(), settings, sessions);
  }

  private static Source source(JsonNode n, String where) throws IOException {
    return new Source(need(n, "path", where).asText(), need(n, "sha256", where).asText());
  }

  private static JsonNode need(JsonNode n, String field, String where) throws IOException {
    JsonNode v = n.get(field);
    if (v == null || v.isNull()) {
      throw new RunFileDamaged(where + ": field '" + field + "' is missing");
    }
    return v;
  }
}
