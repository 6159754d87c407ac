package dev.mixwright.run;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.runfolder.Checksums;
import dev.mixwright.runfolder.PortfolioCheckpoint;
import dev.mixwright.runfolder.RunFileDamaged;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.RunLock;
import dev.mixwright.runfolder.RunManifest;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

/** The start of a durable run, shared by the commands that write run folders. */
public final class RunStart {
  private RunStart() {}

  /** Locks the folder for this process, or says in words who holds it (exit 2). */
  public static RunLock lock(RunFolder folder) {
    try {
      return RunLock.acquire(folder);
    } catch (IOException e) {
      throw new InputError(e.getMessage());
    }
  }

  /**
   * Why a folder without run.json cannot be resumed: run.json is written last when a run begins, so
   * its absence means the run never started (cut off while starting, or never given this folder).
   */
  static String neverStarted(RunFolder folder) {
    Path dir = folder.dir();
    return "the run in " + dir + " never started: there is no " + RunFolder.MANIFEST + ", which a run writes"
        + " once it has begun (it was cut off while starting, or this folder was never given to 'mixwright solve')."
        + " There is nothing to resume; start it again with 'mixwright solve CATALOG --out " + dir
        + (folder.holdsRun() ? " --replace" : "") + "'";
  }

  static RunManifest.Source source(Path file, String sha256) {
    return new RunManifest.Source(file.toAbsolutePath().normalize().toString(), sha256);
  }

  /**
   * Begins a run in {@code folder}: the files of an earlier run there go first (a result.json or
   * column log left from it would otherwise be taken for this run's after a crash), then
   * catalog.json and, last, run.json — the mark that the run began and can be resumed.
   */
  /** {@link RunFolder#refuseUnlessReplaceable}, refused in words as bad input. */
  static void refuseUnlessReplaceable(RunFolder folder) throws IOException {
    try {
      folder.refuseUnlessReplaceable();
    } catch (RunFileDamaged e) {
      throw new InputError(e.getMessage());
    }
  }

  static RunManifest begin(RunFolder folder, Catalog catalog, RunManifest.Source catalogSource,
      RunManifest.Source scenarioSource, RunManifest.Settings settings) throws IOException {
    Files.createDirectories(folder.dir());
    try {
      folder.claim(RunFolder.Kind.SOLVE);
      if (folder.holdsRun()) {
        folder.clearForReplace();
      }
    } catch (RunFileDamaged e) {
      throw new InputError(e.getMessage());
    }
    PortfolioCheckpoint.delete(folder);
    String copy = CatalogWriter.toJson(catalog);
    AtomicFiles.write(folder.catalogCopy(), copy);
    RunManifest m = RunManifest.begin(catalogSource, scenarioSource, Checksums.sha256(copy), settings);
    m.write(folder);
    return m;
  }
}
