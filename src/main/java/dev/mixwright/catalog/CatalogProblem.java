package dev.mixwright.catalog;

/**
 * One thing wrong with a catalog: where it is ({@code groups[2].options[4].uses.brazing}, or a file
 * position such as {@code range.yaml line 3 column 7}) and what is wrong with it, in words that
 * suggest the fix.
 */
public record CatalogProblem(String path, String message) {
  /** Longest path and message kept; longer ones quote a catalog's own text, which is cut short. */
  private static final int MAX_PATH = 300;

  private static final int MAX_MESSAGE = 1_000;

  /** Made printable here, the one place every problem passes, so no caller can forget it. */
  public CatalogProblem {
    path = Where.printable(path, MAX_PATH);
    message = Where.printable(message, MAX_MESSAGE);
  }

  /** The form people read: {@code path: message}. */
  @Override
  public String toString() {
    return path + ": " + message;
  }
}
