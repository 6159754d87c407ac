package dev.mixwright.runfolder;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.testing.Cases;
import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** A sealed object streamed in pieces of any size is byte for byte the object sealed whole. */
class SealedJsonStreamTest {
  private static final ObjectMapper PRETTY = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

  /** Random fields, nested objects and arrays, strings with blanks, braces and non-ASCII letters at their ends. */
  private static ObjectNode object(Random rnd, int depth) {
    ObjectNode o = PRETTY.createObjectNode();
    for (int f = rnd.nextInt(5); f >= 0; f--) {
      switch (rnd.nextInt(depth > 2 ? 3 : 5)) {
        case 0 -> o.put("n" + f, rnd.nextDouble() * 1e6);
        case 1 -> o.put("s" + f, "ü } " + rnd.nextInt(100) + (rnd.nextBoolean() ? " }" : " "));
        case 2 -> o.putNull("z" + f);
        case 3 -> o.set("o" + f, object(rnd, depth + 1));
        default -> o.putArray("a" + f).add(object(rnd, depth + 1)).add(rnd.nextInt());
      }
    }
    return o;
  }

  @Test
  void streamedInPiecesIsTheWholeSealed() {
    Cases.each(300, (seed, rnd) -> {
      String text = PRETTY.writeValueAsString(object(rnd, 0)) + (rnd.nextBoolean() ? "\n" : "");
      byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
      ByteArrayOutputStream got = new ByteArrayOutputStream();
      SealedJson.write(got, out -> {
        int i = 0;
        while (i < bytes.length) {
          if (rnd.nextInt(4) == 0) {
            out.write(bytes[i++]);
          } else {
            int n = Math.min(bytes.length - i, rnd.nextInt(40));
            out.write(bytes, i, n);
            i += n;
          }
          if (rnd.nextInt(10) == 0) {
            out.flush();
          }
        }
      });
      String sealed = got.toString(StandardCharsets.UTF_8);
      assertEquals(SealedJson.seal(text), sealed, text);
      SealedJson.check(sealed, "x.json", "here", false); // its own reader accepts it
    });
  }
}
