package dev.mixwright.space;

import java.util.Arrays;

/**
 * A variant packed into as few longs as its choice counts need, for hashing and sets. Immutable.
 */
public final class VariantKey {
  private final long[] words;
  private final int hash;

  VariantKey(long[] words) {
    this.words = words;
    this.hash = Arrays.hashCode(words);
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof VariantKey k && k.hash == hash && Arrays.equals(k.words, words);
  }

  @Override
  public int hashCode() {
    return hash;
  }
}
