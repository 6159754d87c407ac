package dev.mixwright.runfolder;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.List;

/** The files of one run and where they live. */
public record RunFolder(Path dir) {
  public static final String RESULT = "result.json";
  public static final String CATALOG_COPY = "catalog.json";
  public static final String MANIFEST = "run.json";
  public static final String SNAPSHOT = "state.json";
  public static final String LOCK = ".lock";
  /** The files of a sweep folder (written by the report layer's sweep table). */
  public static final String SWEEP_JSON = "sweep.json";
  public static final String SWEEP_CSV = "sweep.csv";
  public static final String PAGE = "report.html";
  /**
   * Every file a run or a sweep writes into its folder: the only files {@code --replace} removes,
   * and the names that may not be links.
   */
  public static final List<String> RUN_FILES = List.of(MANIFEST, CATALOG_COPY, SNAPSHOT, RESULT, ColumnLog.FILE,
      PortfolioLog.FILE, PortfolioCheckpoint.FILE, LOCK, SWEEP_JSON, SWEEP_CSV, PAGE);

  /** What a folder holds: one kind of run only, so that one never overwrites the other's files. */
  public enum Kind {
    SOLVE, SWEEP;

    /** The word run.json and sweep.json record: the name in lower case. */
    public String word() {
      return name().toLowerCase(java.util.Locale.ROOT);
    }
  }

  public Path result() {
    return dir.resolve(RESULT);
  }

  public Path columnLog() {
    return dir.resolve(ColumnLog.FILE);
  }

  /** The catalog exactly as solved, so that a run can be explained after its source file changed. */
  public Path catalogCopy() {
    return dir.resolve(CATALOG_COPY);
  }

  /** Written when the run begins: where the catalog came from, its hash, the settings, the sessions. */
  public Path manifest() {
    return dir.resolve(MANIFEST);
  }

  /** The loop's state after its last round (iteration, bound, elapsed time), replaced atomically. */
  public Path snapshot() {
    return dir.resolve(SNAPSHOT);
  }

  /** Held (an OS file lock) by the process working on the run, so that two never write one folder. */
  public Path lock() {
    return dir.resolve(LOCK);
  }

  /** True when the folder already holds the files of a run. */
  public boolean holdsRun() {
    return Files.exists(result()) || Files.exists(columnLog()) || Files.exists(catalogCopy())
        || Files.exists(manifest()) || Files.exists(snapshot());
  }

  /**
   * Refuses a folder that is itself a link or holds a link (or anything not a plain file) where a run
   * file goes: writing through it would overwrite the link's target, anywhere on the machine.
   */
  public void refuseLinks() throws RunFileDamaged {
    if (Files.isSymbolicLink(dir)) {
      throw new RunFileDamaged(dir + " is a symbolic link; give the real folder as the run folder, so that"
          + " no file is written through a link");
    }
    for (String name : RUN_FILES) {
      Path p = dir.resolve(name);
      if (Files.isSymbolicLink(p)) {
        throw new RunFileDamaged(p + " is a symbolic link where a run file goes; mixwright never writes"
            + " through a link (its target would be overwritten) — remove the link or choose another folder");
      }
      if (Files.exists(p, LinkOption.NOFOLLOW_LINKS) && !Files.isRegularFile(p, LinkOption.NOFOLLOW_LINKS)) {
        throw new RunFileDamaged(p + " is not a plain file where a run file goes — move it away or choose"
            + " another folder");
      }
    }
  }

  /**
   * The kind of run the folder holds, or null when it holds none: a sweep table marks a sweep; a
   * manifest, a result or a column log marks a solve (run.json of format 2 names its kind, older
   * ones are solves).
   */
  public Kind heldKind() {
    if (Files.exists(dir.resolve(SWEEP_JSON), LinkOption.NOFOLLOW_LINKS)) {
      return Kind.SWEEP;
    }
    if (Files.exists(manifest(), LinkOption.NOFOLLOW_LINKS)) {
      try {
        JsonNode n = Json.compact().readTree(Files.readString(manifest()));
        if (n != null && Kind.SWEEP.word().equals(n.path("kind").asText())) {
          return Kind.SWEEP;
        }
      } catch (IOException | RuntimeException e) {
        // a damaged manifest still marks a solve; reading it later says what is wrong
      }
      return Kind.SOLVE;
    }
    return Files.exists(result(), LinkOption.NOFOLLOW_LINKS) || Files.exists(columnLog(), LinkOption.NOFOLLOW_LINKS)
        ? Kind.SOLVE : null;
  }

  /**
   * Checks that a run of {@code kind} may be written here: no links where run files go, and no run of
   * another kind (a sweep would overwrite a solve's catalog.json, and the other way round), with or
   * without --replace.
   */
  public void claim(Kind kind) throws RunFileDamaged {
    refuseLinks();
    Kind held = heldKind();
    if (held != null && held != kind) {
      throw new RunFileDamaged(dir + " holds a " + held.word() + " run; a " + kind.word() + " would overwrite its"
          + " files — choose another --out folder");
    }
  }

  /**
   * What {@code --replace} may write into: a new or empty folder, or one that holds a run (besides
   * anything else). A folder that holds other things but no run is refused, so that a mistyped --out
   * (a home folder, /etc) never gets run files, nor loses any.
   */
  public void refuseUnlessReplaceable() throws IOException {
    refuseLinks();
    if (!Files.isDirectory(dir) || heldKind() != null) {
      return;
    }
    try (var entries = Files.list(dir)) {
      if (entries.anyMatch(p -> !RUN_FILES.contains(p.getFileName().toString()))) {
        throw new RunFileDamaged(dir + " does not look like a run folder (no " + MANIFEST + ", " + RESULT
            + " or " + ColumnLog.FILE + ") and is not empty; --replace only replaces runs — choose an"
            + " empty or new --out folder");
      }
    }
  }

  /**
   * Removes the files a run writes, and nothing else, for {@code --replace}; refuses a folder that
   * holds other things but no run, so that a mistyped --out never empties the wrong folder.
   */
  public void clearForReplace() throws IOException {
    refuseUnlessReplaceable();
    if (!Files.isDirectory(dir)) {
      return;
    }
    for (String name : RUN_FILES) {
      if (!name.equals(LOCK)) {
        Files.deleteIfExists(dir.resolve(name));
      }
    }
  }

  /**
   * The text of a run file, read without following a link, as strict UTF-8: bytes that are not
   * UTF-8 are damage, said in words.
   */
  public String readText(String name) throws IOException {
    Path p = dir.resolve(name);
    if (Files.isSymbolicLink(p)) {
      throw new RunFileDamaged(p + " is a symbolic link where a run file goes; mixwright reads run files only"
          + " as plain files — replace the link with the file");
    }
    byte[] bytes = Files.readAllBytes(p);
    try {
      return StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
    } catch (CharacterCodingException e) {
      throw SealedJson.damaged(name, dir.toString(), "it is not UTF-8 text");
    }
  }

  /** The checked text of a sealed run file ({@link SealedJson}). */
  public String readSealed(String name) throws IOException {
    String text = readText(name);
    SealedJson.check(text, name, dir.toString(), name.equals(MANIFEST) ? legacyManifest(text) : legacy());
    return text;
  }

  /**
   * The text of catalog.json after checking it against the SHA-256 that run.json records for it (a
   * folder without run.json, a sweep's, has nothing to check it against and is read as it is).
   */
  public String verifiedCatalogCopy() throws IOException {
    String text = readText(CATALOG_COPY);
    if (Files.exists(manifest(), LinkOption.NOFOLLOW_LINKS)) {
      RunManifest m = RunManifest.read(this);
      if (!Checksums.sha256(text).equals(m.catalogCopySha256())) {
        throw SealedJson.damaged(CATALOG_COPY, dir.toString(), "its SHA-256 no longer matches the one " + MANIFEST
            + " records for it");
      }
    }
    return text;
  }

  /**
   * The catalog the run solved: catalog.json checked as {@link #verifiedCatalogCopy} and parsed;
   * empty when the folder has none (ids then stand in for labels). A copy that does not parse is the
   * caller's to refuse or pass over.
   */
  public java.util.Optional<dev.mixwright.catalog.Catalog> solvedCatalog()
      throws IOException, dev.mixwright.catalog.CatalogException {
    if (!Files.isRegularFile(catalogCopy())) {
      return java.util.Optional.empty();
    }
    return java.util.Optional.of(
        dev.mixwright.catalog.CatalogLoader.parse(verifiedCatalogCopy(), catalogCopy().toString(), null));
  }

  /** Whether the folder was written before run files carried checksums (run.json format 1). */
  public boolean legacy() {
    try {
      return legacyManifest(readText(MANIFEST));
    } catch (IOException e) {
      return false;
    }
  }

  private static boolean legacyManifest(String text) {
    try {
      JsonNode n = Json.compact().readTree(text);
      return n != null && n.path("format").isInt() && n.path("format").asInt() == 1 && !SealedJson.sealed(text);
    } catch (IOException e) {
      return false;
    }
  }
}
