package dev.mixwright.runfolder;

import java.io.IOException;
import java.nio.file.Path;

/**
 * A run file that could not be written (a full disk, a quota, a folder made read-only): said in
 * words naming the file and what is left as it was (exit 2), never an internal fault. Every run
 * file is replaced atomically or appended line by line, so what was on disk before stays whole.
 */
public class RunFileWriteFailed extends IOException {
  private static final long serialVersionUID = 1L;

  public RunFileWriteFailed(Path file, IOException cause, String kept) {
    super("could not write " + file + " (" + reason(cause) + "); " + kept + " — free space on that disk or"
        + " choose another folder, then run the command again", cause);
  }

  private static String reason(IOException e) {
    String m = e instanceof java.nio.file.FileSystemException f && f.getReason() != null ? f.getReason()
        : e.getMessage();
    return m == null || m.isBlank() ? e.getClass().getSimpleName() : m;
  }
}
