package dev.mixwright.run;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.catalog.TableReach;
import dev.mixwright.runfolder.Checksums;
import dev.mixwright.runfolder.RunManifest;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Whether the files a run was made from still say what they said when it began. The catalog file's
 * SHA-256 is compared first; when it matches, the catalog it loads is still compared with
 * catalog.json, because option tables (CSV files the catalog names) are not in that hash.
 */
final class CatalogSource {
  private CatalogSource() {}

  /**
   * @param missing the catalog file is gone (nothing to compare with)
   * @param changed it, its option tables or the scenario file say something else now
   * @param why the change in words, naming the file
   * @param current the catalog as it loads now (null when missing or when it no longer loads)
   * @param nowSource its path and hash now
   */
  record Check(boolean missing, boolean changed, String why, Catalog current, RunManifest.Source nowSource) {}

  static Check check(RunManifest m, String copyText, TableReach tables) throws CatalogException, IOException {
    Path src = Path.of(m.catalog().path());
    if (!Files.isRegularFile(src)) {
      return new Check(true, false, "the catalog file " + src + " is no longer there", null, null);
    }
    Path scn = m.scenario() == null ? null : Path.of(m.scenario().path());
    if (scn != null && !Files.isRegularFile(scn)) {
      return new Check(true, false, "the scenario file " + scn + " is no longer there", null, null);
    }
    if (scn != null && !Checksums.sha256(scn).equals(m.scenario().sha256())) {
      return new Check(false, true, "the scenario file " + scn + " changed since the run began",
          loadOrNull(src, scn, tables), new RunManifest.Source(m.catalog().path(), Checksums.sha256(src)));
    }
    String nowSha = Checksums.sha256(src);
    RunManifest.Source now = new RunManifest.Source(m.catalog().path(), nowSha);
    if (!nowSha.equals(m.catalog().sha256())) {
      String why = "the catalog file " + src + " changed since the run began (SHA-256 was "
          + m.catalog().sha256().substring(0, 12) + "…, is now " + nowSha.substring(0, 12) + "…)";
      return new Check(false, true, why, loadOrNull(src, scn, tables), now);
    }
    Catalog current = load(src, scn, tables);
    if (!CatalogWriter.toJson(current).equals(copyText)) {
      return new Check(false, true, "an option table (CSV file) named by the catalog file " + src
          + " changed since the run began", current, now);
    }
    return new Check(false, false, "", current, now);
  }

  /** The catalog as it loads now, the scenario applied; one that no longer loads is reported when needed. */
  private static Catalog loadOrNull(Path src, Path scn, TableReach tables) {
    try {
      return load(src, scn, tables);
    } catch (CatalogException | InputError e) {
      return null;
    }
  }

  static Catalog load(Path src, Path scn, TableReach tables) throws CatalogException {
    Catalog c = CatalogLoader.load(src, tables);
    return scn == null ? c : Inputs.withScenario(c, scn);
  }
}
