package dev.mixwright.report;

import java.nio.file.Files;
import java.nio.file.Path;

/** The files of one run and where they live. */
public record RunFolder(Path dir) {
  public static final String CATALOG_COPY = "catalog.json";

  public Path result() {
    return dir.resolve(ResultWriter.FILE);
  }

  public Path columnLog() {
    return dir.resolve(ColumnLog.FILE);
  }

  /** The catalog exactly as solved, so that a run can be explained after its source file changed. */
  public Path catalogCopy() {
    return dir.resolve(CATALOG_COPY);
  }

  /** True when the folder already holds the files of a run. */
  public boolean holdsRun() {
    return Files.exists(result()) || Files.exists(columnLog()) || Files.exists(catalogCopy());
  }
}
