package dev.mixwright.runfolder;

import java.io.IOException;
import java.nio.file.Path;
import java.util.function.Predicate;

/**
 * A seam for tests of a full disk: while a predicate is installed, every run-file write whose target
 * it accepts fails half-way as {@code write(2)} does on a full disk (ENOSPC). Mounting a small tmpfs
 * needs privileges a test does not have; this reaches the same code paths (the atomic replace and the
 * column log's append). Nothing installs one outside tests.
 */
public final class WriteFaults {
  private static volatile Predicate<Path> failing = p -> false;

  private WriteFaults() {}

  /** Makes writes to the files {@code which} accepts fail until the returned handle is closed. */
  public static AutoCloseable install(Predicate<Path> which) {
    failing = which;
    return () -> failing = p -> false;
  }

  /** Throws as a full disk would when a fault is installed for {@code target}. */
  static void check(Path target) throws IOException {
    if (failing.test(target)) {
      throw new IOException("No space left on device");
    }
  }
}
