package dev.mixwright.engine;

import java.math.BigInteger;

/** Test work: the point's bytes read as a number, squared, and plus the shared number; throws on 13. */
public final class Squares implements PointWork {
  @Override
  public byte[] compute(byte[] shared, byte[] point) {
    BigInteger x = new BigInteger(point);
    if (x.intValue() == 13) {
      throw new IllegalArgumentException("13 is refused on purpose");
    }
    return x.multiply(x).add(new BigInteger(shared)).toByteArray();
  }
}
