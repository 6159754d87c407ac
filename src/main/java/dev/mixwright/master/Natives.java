package dev.mixwright.master;

import com.google.ortools.Loader;
import com.sun.jna.Platform;
import java.io.IOException;
import java.io.InputStream;
import java.net.JarURLConnection;
import java.net.URL;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Enumeration;
import java.util.List;
import java.util.jar.JarEntry;
import java.util.jar.JarFile;
import java.util.stream.Stream;

/**
 * Loads the OR-Tools native libraries once per JVM — every use of OR-Tools goes through
 * {@link #load()}.
 *
 * <p>OR-Tools' own loader unpacks about 65 MB of libraries into a fresh temp folder at every JVM
 * start (measured 360–410 ms on this kind of machine, and a SIGKILL leaves the folder behind). For
 * people running one command after another that is most of a small solve, so the libraries are
 * unpacked once into a cache folder keyed by the jar's native entries (names and sizes) and loaded
 * from there (measured 24–31 ms). The folder is {@code $MIXWRIGHT_NATIVE_CACHE}, else
 * {@code $XDG_CACHE_HOME/mixwright}, else {@code ~/.cache/mixwright}. Any problem with the cache
 * falls back to OR-Tools' own loader.
 */
public final class Natives {
  private static final String RESOURCE = "ortools-" + Platform.RESOURCE_PREFIX + "/";
  private static final String JNI = System.mapLibraryName("jniortools");
  private static volatile boolean loaded;

  private Natives() {}

  public static void load() {
    if (!loaded) {
      synchronized (Natives.class) {
        if (!loaded) {
          if (!loadFromCache()) {
            Loader.loadNativeLibraries();
          }
          loaded = true;
        }
      }
    }
  }

  /**
   * Starts {@link #load} on a daemon thread, so that a solve reads its catalog while the libraries
   * load (hundreds of milliseconds when the disk is busy) instead of waiting for them before round 1.
   * A failure here is left for the caller's own {@link #load}, which tries again and reports it.
   */
  public static void loadInBackground() {
    if (loaded) {
      return;
    }
    Thread t = new Thread(() -> {
      try {
        load();
      } catch (RuntimeException | LinkageError e) {
        // the next load() on the solving thread meets the same problem and reports it
      }
    }, "native-load");
    t.setDaemon(true);
    t.start();
  }

  private static boolean loadFromCache() {
    try {
      URL url = Natives.class.getClassLoader().getResource(RESOURCE);
      if (url == null || !"jar".equals(url.getProtocol()) || cacheRoot() == null) {
        return false;
      }
      JarURLConnection conn = (JarURLConnection) url.openConnection();
      conn.setUseCaches(false);
      try (JarFile jar = conn.getJarFile()) {
        List<JarEntry> entries = new ArrayList<>();
        long key = 17;
        for (Enumeration<JarEntry> e = jar.entries(); e.hasMoreElements(); ) {
          JarEntry je = e.nextElement();
          if (je.getName().startsWith(RESOURCE) && !je.isDirectory()) {
            entries.add(je);
            key = key * 31 + je.getName().hashCode();
            key = key * 31 + je.getSize();
          }
        }
        if (entries.stream().noneMatch(je -> je.getName().equals(RESOURCE + JNI))) {
          return false;
        }
        Path dir = cacheRoot().resolve("natives").resolve(Platform.RESOURCE_PREFIX + "-" + Long.toHexString(key));
        Path done = dir.resolve(".complete");
        if (!Files.exists(done)) {
          unpack(jar, entries, dir);
        }
        System.load(dir.resolve(JNI).toAbsolutePath().toString());
        return true;
      }
    } catch (IOException | RuntimeException | UnsatisfiedLinkError e) {
      return false;
    }
  }

  /** Unpacks into a fresh sibling folder, then renames it into place, so a reader never sees half. */
  private static void unpack(JarFile jar, List<JarEntry> entries, Path dir) throws IOException {
    Files.createDirectories(dir.getParent());
    Path tmp = Files.createTempDirectory(dir.getParent(), ".unpacking-");
    try {
      for (JarEntry je : entries) {
        Path target = tmp.resolve(je.getName().substring(RESOURCE.length()));
        Files.createDirectories(target.getParent());
        try (InputStream in = jar.getInputStream(je)) {
          Files.copy(in, target, StandardCopyOption.REPLACE_EXISTING);
        }
      }
      Files.writeString(tmp.resolve(".complete"), "unpacked from " + entries.size() + " entries\n");
      try {
        Files.move(tmp, dir, StandardCopyOption.ATOMIC_MOVE);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(tmp, dir);
      } catch (IOException raced) {
        if (!Files.exists(dir.resolve(".complete"))) {
          throw raced;
        }
      }
    } finally {
      if (Files.exists(tmp)) {
        try (Stream<Path> walk = Files.walk(tmp)) {
          walk.sorted((a, b) -> b.getNameCount() - a.getNameCount()).forEach(p -> p.toFile().delete());
        }
      }
    }
  }

  private static Path cacheRoot() {
    String explicit = System.getenv("MIXWRIGHT_NATIVE_CACHE");
    if (explicit != null && !explicit.isBlank()) {
      return Paths.get(explicit);
    }
    String xdg = System.getenv("XDG_CACHE_HOME");
    if (xdg != null && !xdg.isBlank()) {
      return Paths.get(xdg, "mixwright");
    }
    String home = System.getProperty("user.home");
    return home == null || home.isBlank() ? null : Paths.get(home, ".cache", "mixwright");
  }
}
