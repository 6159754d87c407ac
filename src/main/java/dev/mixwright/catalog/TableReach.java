package dev.mixwright.catalog;

/**
 * Where the tables a catalog names ({@code optionsFile}, {@code utilityFile}) may be. A catalog
 * comes from anyone; left to itself it could name /etc/passwd or a link to a device, so by default
 * its tables must lie in its own folder or below it. Only the person running the command can widen
 * that (on the command line), never the catalog.
 */
public enum TableReach {
  /** Relative paths that stay inside the catalog's folder once links are followed. */
  CATALOG_FOLDER,

  /** Any path the user can read (still ordinary files only, within the size limit). */
  ANYWHERE;

  public boolean anywhere() {
    return this == ANYWHERE;
  }
}
