package dev.mixwright.export;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.concurrent.ThreadLocalRandom;

/**
 * Writes an export file whole or not at all: a temp file beside the target, forced to disk, then
 * renamed over it. The temp file is opened with the process's default permissions (0666 less the
 * umask, 0644 under the usual 022), not {@code Files.createTempFile}'s owner-only 0600, because an
 * export is made to be shared.
 */
final class OutputFiles {
  private OutputFiles() {}

  static void write(Path target, byte[] bytes) throws IOException {
    Path dir = target.toAbsolutePath().getParent();
    Files.createDirectories(dir);
    Path tmp = dir.resolve("." + target.getFileName() + "." + Long.toHexString(ThreadLocalRandom.current().nextLong())
        + ".tmp");
    try {
      try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)) {
        ByteBuffer buf = ByteBuffer.wrap(bytes);
        while (buf.hasRemaining()) {
          ch.write(buf);
        }
        ch.force(true);
      }
      try {
        Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
      }
    } finally {
      Files.deleteIfExists(tmp);
    }
  }
}
