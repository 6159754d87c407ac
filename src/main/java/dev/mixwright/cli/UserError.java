package dev.mixwright.cli;

/** Bad input from a person: the message says what is wrong and how to fix it; exit code 2, no trace. */
public final class UserError extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public UserError(String message) {
    super(message);
  }
}
