package dev.mixwright.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

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

  /** A double for JSON: non-finite values become null rather than invalid JSON. */
  public static Double num(double v) {
    return Double.isFinite(v) ? v : null;
  }
}
