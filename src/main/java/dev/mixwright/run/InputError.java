package dev.mixwright.run;

/**
 * Bad input from a person (a file missing, a run folder that cannot be continued, a setting out of
 * range): the message says what is wrong and how to fix it. The command line maps it to exit code 2
 * and prints no stack trace.
 */
public class InputError extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public InputError(String message) {
    super(message);
  }
}
