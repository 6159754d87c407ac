package dev.mixwright.runfolder;

import java.nio.charset.StandardCharsets;

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
