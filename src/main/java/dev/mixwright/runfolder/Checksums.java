package dev.mixwright.runfolder;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.zip.CRC32C;

/**
 * The two checksums a run folder uses: SHA-256 to tell whether a catalog changed, and CRC-32C per
 * column-log line to tell a whole line from one cut or garbled by a crash.
 */
public final class Checksums {
  private Checksums() {}

  public static String sha256(Path file) throws IOException {
    try (InputStream in = Files.newInputStream(file)) {
      MessageDigest md = digest();
      byte[] buf = new byte[1 << 16];
      for (int n; (n = in.read(buf)) > 0; ) {
        md.update(buf, 0, n);
      }
      return HexFormat.of().formatHex(md.digest());
    }
  }

  public static String sha256(String text) {
    return HexFormat.of().formatHex(digest().digest(text.getBytes(StandardCharsets.UTF_8)));
  }

  /** CRC-32C of the text's UTF-8 bytes as 8 lower-case hex digits. */
  public static String crc(String text) {
    CRC32C c = new CRC32C();
    c.update(text.getBytes(StandardCharsets.UTF_8));
    return hex(c);
  }

  /** A CRC-32C's value as written in a run folder: 8 lower-case hex digits. */
  static String hex(CRC32C c) {
    return String.format("%08x", c.getValue());
  }

  private static MessageDigest digest() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java runtime has SHA-256", e);
    }
  }
}
