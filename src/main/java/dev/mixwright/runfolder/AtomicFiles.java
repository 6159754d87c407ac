package dev.mixwright.runfolder;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Writes a file so that a reader sees either the old content or the whole new content, never half:
 * write a temp file beside it, force it to disk, then rename over the target.
 */
public final class AtomicFiles {
  private AtomicFiles() {}

  public static void write(Path target, String text) throws IOException {
    write(target, text.getBytes(StandardCharsets.UTF_8));
  }

  public static void write(Path target, byte[] bytes) throws IOException {
    write(target, bytes, false);
  }

  /**
   * As {@link #write(Path, byte[])}; {@code shared}: the file gets the process's default permissions
   * (0644 under umask 022) rather than {@code createTempFile}'s owner-only 0600, for files made to be
   * handed on (exports).
   */
  public static void write(Path target, byte[] bytes, boolean shared) throws IOException {
    write(target, shared, out -> {
      out.write(bytes, 0, bytes.length / 2);
      out.flush();
      WriteFaults.check(target); // a full disk fails here, half-way
      out.write(bytes, bytes.length / 2, bytes.length - bytes.length / 2);
    });
  }

  /** What a streamed file holds, written to the stream it is given (which it must not close). */
  @FunctionalInterface
  public interface Content {
    void writeTo(OutputStream out) throws IOException;
  }

  /**
   * As {@link #write(Path, byte[])}, the content streamed instead of held whole in memory: a result of
   * hundreds of thousands of offers is over 100 MB of text, more than a 512 MB heap holds beside the
   * run as a string.
   */
  public static void write(Path target, Content content) throws IOException {
    write(target, false, out -> {
      content.writeTo(out);
      out.flush();
      WriteFaults.check(target); // a full disk fails here, at the end
    });
  }

  private static void write(Path target, boolean shared, Content content) throws IOException {
    Path dir = target.toAbsolutePath().getParent();
    Files.createDirectories(dir);
    if (Files.isSymbolicLink(target)) {
      throw new RunFileDamaged(target + " is a symbolic link; mixwright never writes through a link (its target"
          + " would be overwritten) — remove the link or choose another folder");
    }
    // A fresh name created here (CREATE_NEW), opened without following links, then renamed over the
    // target: the rename replaces a directory entry and never writes into a link's target. A shared
    // file (an export) gets the default permissions; createTempFile would give 0600.
    Path tmp = null;
    try {
      tmp = shared
          ? Files.createFile(dir.resolve("." + target.getFileName() + "." + System.nanoTime() + ".tmp"))
          : Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
      try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING,
          LinkOption.NOFOLLOW_LINKS)) {
        OutputStream out = new BufferedOutputStream(Channels.newOutputStream(ch), 1 << 16);
        content.writeTo(out);
        out.flush();
        ch.force(true);
      }
      try {
        Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
      }
      syncDirectory(dir);
    } catch (IOException e) {
      throw new RunFileWriteFailed(target, e, Files.exists(target, LinkOption.NOFOLLOW_LINKS)
          ? "the previous " + target.getFileName() + " is unchanged" : "nothing was written in its place");
    } finally {
      deleteQuietly(tmp);
    }
  }

  /** Removes a temp file left by a failed write; on a failing disk that may fail too, and nothing reads it. */
  private static void deleteQuietly(Path tmp) {
    if (tmp == null) {
      return;
    }
    try {
      Files.deleteIfExists(tmp);
    } catch (IOException e) {
      // a hidden .tmp file stays behind; --replace and the readers ignore it
    }
  }

  /**
   * Forces a folder's entries (a rename, a new file) to disk, where the platform allows it: Linux and
   * macOS do; elsewhere opening a folder fails and the rename's own durability has to do.
   */
  public static void syncDirectory(Path dir) {
    try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
      ch.force(true);
    } catch (IOException | UnsupportedOperationException e) {
      // not supported here (e.g. Windows); nothing better is available from Java
    }
  }
}
