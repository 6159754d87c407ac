package dev.mixwright.cli;

import dev.mixwright.run.InputError;

/** Bad input found by a command itself (an option that does not fit); exit code 2, no trace. */
public final class UserError extends InputError {
  private static final long serialVersionUID = 1L;

  public UserError(String message) {
    super(message);
  }
}
