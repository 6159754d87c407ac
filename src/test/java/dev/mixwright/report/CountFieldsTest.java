package dev.mixwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.space.SpaceCount;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** The one encoding of a count that result.json and check --json share. */
class CountFieldsTest {

  @Test
  void anExactCountIsOneDecimalString() {
    ObjectNode n = JsonNodeFactory.instance.objectNode();
    CountFields.of(new SpaceCount.Exact(new BigInteger("123456789012345678901234567890"))).putInto(n, "v");
    assertEquals("123456789012345678901234567890", n.get("v").asText());
    assertFalse(n.has("vAtMost") || n.has("vAtLeast") || n.has("vEstimate"), n.toString());
  }

  @Test
  void boundsLeaveOutALowerBoundOfZeroAndCarryTheEstimate() {
    var estimate = new SpaceCount.Estimate(new BigDecimal("5e20"), new BigDecimal("1e19"), 4096);
    ObjectNode n = JsonNodeFactory.instance.objectNode();
    CountFields.of(new SpaceCount.Bounded(BigInteger.ZERO, BigInteger.TEN.pow(21), Optional.of(estimate)))
        .putInto(n, "v");
    assertTrue(n.get("v").isNull(), n.toString());
    assertEquals("1000000000000000000000", n.get("vAtMost").asText());
    assertFalse(n.has("vAtLeast"), "a lower bound of 0 says nothing: " + n);
    assertEquals(5e20, n.get("vEstimate").get("value").asDouble());
    assertEquals(4096, n.get("vEstimate").get("samples").asLong());

    CountFields known = CountFields.of(new SpaceCount.Bounded(BigInteger.valueOf(7), BigInteger.valueOf(90),
        Optional.empty()));
    assertEquals("7", known.atLeast());
    assertEquals(null, known.estimate());
  }
}
