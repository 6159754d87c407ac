package dev.mixwright.runfolder;

import java.nio.file.Files;
import java.nio.file.Path;

/** The files of one run and where they live. */
public record RunFolder(Path dir) {
  public static final String RESULT = "result.json";
  public static final String CATALOG_COPY = "catalog.json";
  public static final String MANIFEST = "run.json";
  public static final String SNAPSHOT = "state.json";
  public static final String LOCK = ".lock";

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
}
