package dev.mixwright.catalog;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.function.Consumer;

/**
 * Reading the files a catalog is made of: ordinary files only (never a device, a pipe or a socket,
 * which could block or never end, nor a link to one), and never more than a size limit, checked
 * before reading and again while reading (for files whose size is not known beforehand).
 */
final class InputFiles {
  private InputFiles() {}

  /**
   * The bytes of {@code file}, or null after handing {@code problem} a message (without the file's
   * name, which the caller puts in front) saying in words why it cannot be read.
   */
  static byte[] read(Path file, long limit, String kind, Consumer<String> problem) {
    BasicFileAttributes a;
    try {
      a = Files.readAttributes(file, BasicFileAttributes.class);
    } catch (NoSuchFileException e) {
      problem.accept("no such file (looked for " + file.toAbsolutePath() + ")");
      return null;
    } catch (IOException | SecurityException e) {
      problem.accept("cannot read the file: " + why(e));
      return null;
    }
    if (a.isDirectory()) {
      problem.accept("is a folder, not a file — give the " + kind + " file itself");
      return null;
    }
    if (!a.isRegularFile()) {
      problem.accept(
          "is not an ordinary file (a device, a pipe or a socket, or a link to one) — "
              + kind
              + " files must be ordinary files");
      return null;
    }
    if (a.size() > limit) {
      problem.accept(tooLarge(a.size(), limit, kind));
      return null;
    }
    try (InputStream in = Files.newInputStream(file)) {
      byte[] bytes = in.readNBytes((int) limit + 1);
      if (bytes.length > limit) {
        problem.accept(tooLarge(-1, limit, kind));
        return null;
      }
      return bytes;
    } catch (IOException | SecurityException e) {
      problem.accept("cannot read the file: " + why(e));
      return null;
    }
  }

  private static String tooLarge(long size, long limit, String kind) {
    return (size < 0 ? "is larger than " + Limits.bytes(limit) : "is " + size + " bytes")
        + "; "
        + kind
        + " files are read up to "
        + Limits.bytes(limit)
        + ", far more than a real one needs — check that this is the right file";
  }

  private static String why(Exception e) {
    if (e instanceof AccessDeniedException || e instanceof SecurityException) {
      return "permission denied";
    }
    return e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
  }
}
