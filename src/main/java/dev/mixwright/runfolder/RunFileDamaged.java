package dev.mixwright.runfolder;

import java.io.IOException;

/**
 * A run file that is not what its writer wrote (cut short, a byte changed, edited by hand) or a run
 * folder that is unsafe to write (a link where a run file goes, another kind of run): bad input,
 * refused in words (exit 2), never misread.
 */
public class RunFileDamaged extends IOException {
  private static final long serialVersionUID = 1L;

  public RunFileDamaged(String message) {
    super(message);
  }
}
