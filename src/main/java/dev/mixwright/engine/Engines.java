package dev.mixwright.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.ServiceLoader;

/** The engines this JVM can run: the thread pool always, others when their jar is on the class path. */
public final class Engines {
  /** The name of the built-in engine, the default. */
  public static final String LOCAL = ThreadPoolEngine.NAME;

  private Engines() {}

  /** The engine of that name (case does not matter), if it is on the class path. */
  public static Optional<Engine> find(String name) {
    String n = name.toLowerCase(Locale.ROOT);
    if (n.equals(LOCAL)) {
      return Optional.of(new ThreadPoolEngine());
    }
    for (Engine e : ServiceLoader.load(Engine.class, Engines.class.getClassLoader())) {
      if (e.name().equals(n)) {
        return Optional.of(e);
      }
    }
    return Optional.empty();
  }

  /**
   * Whether an engine of that name (case does not matter) is on the class path, without making one:
   * the built-in one is known by name, others by the names their service providers give.
   */
  public static boolean exists(String name) {
    return names().contains(name.toLowerCase(Locale.ROOT));
  }

  /** The names of every engine on the class path, the built-in one first. */
  public static List<String> names() {
    List<String> out = new ArrayList<>(List.of(LOCAL));
    for (Engine e : ServiceLoader.load(Engine.class, Engines.class.getClassLoader())) {
      out.add(e.name());
    }
    return out;
  }
}
