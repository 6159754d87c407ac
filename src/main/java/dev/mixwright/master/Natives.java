package dev.mixwright.master;

import com.google.ortools.Loader;

/** Loads the OR-Tools native libraries once per JVM. */
public final class Natives {
  private static volatile boolean loaded;

  private Natives() {}

  public static void load() {
    if (!loaded) {
      synchronized (Natives.class) {
        if (!loaded) {
          Loader.loadNativeLibraries();
          loaded = true;
        }
      }
    }
  }
}
