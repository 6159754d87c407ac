package dev.mixwright.export;

/** A run folder that cannot be exported as asked, said in words (bad input: exit code 2). */
public final class ExportError extends Exception {
  private static final long serialVersionUID = 1L;

  public ExportError(String message) {
    super(message);
  }
}
