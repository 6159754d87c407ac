package dev.mixwright.engine;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.io.ObjectStreamClass;
import java.io.Serializable;
import java.io.UncheckedIOException;

/**
 * Java serialisation of what a job's points share and return (records of settings, scenarios,
 * results), for the {@link PointWork} of each kind of job.
 */
public final class Bytes {
  private Bytes() {}

  public static byte[] of(Serializable o) {
    ByteArrayOutputStream b = new ByteArrayOutputStream();
    try (ObjectOutputStream out = new ObjectOutputStream(b)) {
      out.writeObject(o);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return b.toByteArray();
  }

  /** The object {@link #of} wrote; the caller knows its type. */
  public static Object read(byte[] bytes) {
    try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(bytes)) {
      @Override
      protected Class<?> resolveClass(ObjectStreamClass desc) throws IOException, ClassNotFoundException {
        // On a Spark executor the project's classes sit on the task's loader, not the system one.
        ClassLoader l = Thread.currentThread().getContextClassLoader();
        return l == null ? super.resolveClass(desc) : Class.forName(desc.getName(), false, l);
      }
    }) {
      return in.readObject();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (ClassNotFoundException e) {
      throw new IllegalStateException("a class of the job is not on this JVM's class path: " + e.getMessage(), e);
    }
  }
}
