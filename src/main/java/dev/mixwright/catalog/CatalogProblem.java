package dev.mixwright.catalog;

/**
 * One thing wrong with a catalog: where it is ({@code groups[2].options[4].uses.weld}, or a file
 * position such as {@code range.yaml line 3 column 7}) and what is wrong with it, in words that
 * suggest the fix.
 */
public record CatalogProblem(String path, String message) {

  /** The form people read: {@code path: message}. */
  @Override
  public String toString() {
    return path + ": " + message;
  }
}
