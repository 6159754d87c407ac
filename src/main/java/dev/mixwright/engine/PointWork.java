package dev.mixwright.engine;

/**
 * The computation of one point of a job, run wherever the engine puts it (a thread of this JVM, a
 * Spark executor in another). An engine makes it by its class name through the public no-argument
 * constructor, so an implementation must be a public top-level class on every worker's class path.
 * It must be deterministic: a point computed twice (a retried task) gives the same result, which is
 * what lets an engine retry a failed point without changing the output.
 */
public interface PointWork {
  /**
   * The result of one point from the bytes every point shares (catalog, settings) and the point's
   * own. An exception means the point failed on this attempt; the engine may try it again.
   */
  byte[] compute(byte[] shared, byte[] point) throws Exception;

  /** A fresh instance of the named work, made through its public no-argument constructor. */
  static PointWork named(String className) {
    try {
      ClassLoader loader = Thread.currentThread().getContextClassLoader();
      Class<?> c = Class.forName(className, true, loader == null ? PointWork.class.getClassLoader() : loader);
      return (PointWork) c.getConstructor().newInstance();
    } catch (ReflectiveOperationException | ClassCastException e) {
      throw new IllegalStateException("cannot make the point work " + className + ": " + e, e);
    }
  }
}
