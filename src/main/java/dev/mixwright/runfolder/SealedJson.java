package dev.mixwright.runfolder;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.zip.CRC32C;

/**
 * The checksum of the JSON files of a run folder ({@code run.json}, {@code state.json}, {@code
 * result.json}): the writer appends a last field {@code "crc32c" : "89abcdef"}, the CRC-32C of the
 * UTF-8 text before that field, so the file stays plain JSON that any reader parses. A reader checks
 * it before it trusts a figure: a file cut short, a flipped byte or a hand edit is refused in words.
 * Files written before checksums existed (run.json format 1 and the files beside it) carry none and
 * are read as before. {@code catalog.json} is checked against the SHA-256 that run.json records.
 */
public final class SealedJson {
  /** What comes between the body and the checksum digits; the writer's JSON is indented by two. */
  static final String MARK = ",\n  \"crc32c\" : \"";
  private static final String END = "\"\n}\n";

  private SealedJson() {}

  /** {@code json} (one pretty-printed object) with its checksum as its last field. */
  public static String seal(String json) {
    String t = json.stripTrailing();
    if (!t.endsWith("}")) {
      throw new IllegalArgumentException("not one JSON object");
    }
    String body = t.substring(0, t.length() - 1).stripTrailing();
    return body + MARK + Checksums.crc(body) + END;
  }

  /**
   * Streams what {@code json} writes (one pretty-printed object) to {@code out} with its checksum as
   * its last field: the same bytes as {@link #seal} of the whole text, without holding the text.
   * The object's closing brace and the blanks around it are held back until the end, so that the
   * checksum covers exactly the body that {@link #seal} keeps.
   */
  public static void write(OutputStream out, AtomicFiles.Content json) throws IOException {
    Body body = new Body(out);
    json.writeTo(body);
    body.seal();
  }

  /** The body of a sealed object on its way out: checksummed as it goes, its tail of blanks and braces held back. */
  private static final class Body extends OutputStream {
    private final OutputStream out;
    private final CRC32C crc = new CRC32C();
    private final ByteArrayOutputStream held = new ByteArrayOutputStream();

    Body(OutputStream out) {
      this.out = out;
    }

    @Override
    public void write(int b) throws IOException {
      if (isTail((byte) b)) {
        held.write(b);
        return;
      }
      if (held.size() > 0) {
        pass(held.toByteArray(), held.size());
        held.reset();
      }
      out.write(b);
      crc.update(b);
    }

    @Override
    public void write(byte[] b, int off, int len) throws IOException {
      // the tail is short (blanks and the closing braces of nested objects): bytes before the last
      // plain byte go through in one piece
      int last = off + len - 1;
      while (last >= off && isTail(b[last])) {
        last--;
      }
      if (last < off) {
        held.write(b, off, len);
        return;
      }
      if (held.size() > 0) {
        pass(held.toByteArray(), held.size());
        held.reset();
      }
      out.write(b, off, last + 1 - off);
      crc.update(b, off, last + 1 - off);
      held.write(b, last + 1, off + len - last - 1);
    }

    private static boolean isTail(byte b) {
      return b == '}' || b == ' ' || b == '\n' || b == '\r' || b == '\t';
    }

    private void pass(byte[] b, int len) throws IOException {
      out.write(b, 0, len);
      crc.update(b, 0, len);
    }

    @Override
    public void flush() throws IOException {
      out.flush(); // the held tail stays held: it may be the object's end
    }

    @Override
    public void close() {
      // the caller's stream stays open for the checksum
    }

    /** Writes the tail without the object's closing brace and the blanks around it, then the checksum field. */
    void seal() throws IOException {
      String tail = held.toString(StandardCharsets.UTF_8).stripTrailing();
      if (!tail.endsWith("}")) {
        throw new IllegalArgumentException("not one JSON object");
      }
      byte[] keep = tail.substring(0, tail.length() - 1).stripTrailing().getBytes(StandardCharsets.UTF_8);
      pass(keep, keep.length);
      out.write((MARK + Checksums.hex(crc) + END).getBytes(StandardCharsets.UTF_8));
    }
  }

  /** Whether the text carries a checksum field at its end (whole or not). */
  public static boolean sealed(String text) {
    return text.contains(MARK);
  }

  /**
   * Checks the text of {@code name} in {@code folderText}: with a checksum it must match; without
   * one it is refused unless {@code legacy} (written before checksums existed).
   */
  public static void check(String text, String name, String folder, boolean legacy) throws RunFileDamaged {
    int mark = text.lastIndexOf(MARK);
    if (mark < 0) {
      if (legacy) {
        return;
      }
      throw damaged(name, folder, "its checksum is missing, so it was cut short or changed");
    }
    int digits = mark + MARK.length();
    if (text.length() != digits + 8 + END.length() || !text.endsWith(END)
        || !text.substring(digits, digits + 8).equals(Checksums.crc(text.substring(0, mark)))) {
      throw damaged(name, folder, "its checksum does not match its content (" + text.getBytes(StandardCharsets.UTF_8).length
          + " bytes), so it was cut short or changed after it was written");
    }
  }

  static RunFileDamaged damaged(String name, String folder, String why) {
    return new RunFileDamaged(name + " in " + folder + " is damaged: " + why + ". Run files are written"
        + " whole or not at all, so something else changed it; restore it from a copy, or solve again into"
        + " a new --out folder");
  }
}
