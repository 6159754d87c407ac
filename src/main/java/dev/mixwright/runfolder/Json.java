package dev.mixwright.runfolder;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;

/** The project's JSON settings in one place. */
public final class Json {
  private static final ObjectMapper MAPPER =
      new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
  private static final ObjectMapper COMPACT = new ObjectMapper();

  private Json() {}

  public static ObjectMapper pretty() {
    return MAPPER;
  }

  public static ObjectMapper compact() {
    return COMPACT;
  }

  /** Puts a double, or null when it is not finite (JSON has no infinity). */
  public static void putNum(ObjectNode n, String field, double v) {
    if (Double.isFinite(v)) {
      n.put(field, v);
    } else {
      n.putNull(field);
    }
  }

  /** A double for JSON: non-finite values become null rather than invalid JSON. */
  public static Double num(double v) {
    return Double.isFinite(v) ? v : null;
  }
}
