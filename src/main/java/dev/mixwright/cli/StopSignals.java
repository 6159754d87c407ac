package dev.mixwright.cli;

import dev.mixwright.pricing.Cancellation;
import java.io.PrintWriter;
import java.lang.reflect.Constructor;
import java.lang.reflect.Method;
import java.lang.reflect.Proxy;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Turns Ctrl-C (SIGINT) and SIGTERM into a request to stop: the pricing searches under way are
 * abandoned ({@code pricing.Cancellation}), the loop ends its round, the run's
 * state and result.json are written with status {@code stopped}, and the command exits 1 — a run
 * that {@code mixwright resume} continues. A second signal quits at once (exit 1); the column log is
 * safe either way, since every line is on disk before the next is written.
 *
 * <p>A JVM shutdown hook cannot do this: once a signal starts the shutdown, {@code System.exit(1)}
 * blocks and the process ends with the signal's status (143 for SIGTERM). So the handlers replace
 * the JVM's own for the two signals while a command runs, through {@code sun.misc.Signal} (module
 * jdk.unsupported, reached by reflection so the build stays free of internal-API warnings). Where
 * that is missing, a shutdown hook is the fallback: the run still stops cleanly and is resumable,
 * only the exit status is the signal's. A signal the process was started ignoring (nohup, a
 * background job) stays ignored.
 */
final class StopSignals implements AutoCloseable {
  private static final String[] SIGNALS = {"INT", "TERM"};

  private final AtomicBoolean stop = new AtomicBoolean();
  private final AtomicInteger received = new AtomicInteger();
  private final PrintWriter err;
  private final List<Object[]> restore = new ArrayList<>(); // {signal, previous handler}
  private final CountDownLatch done = new CountDownLatch(1);
  private Thread hook;
  private Method handle;

  private StopSignals(PrintWriter err) {
    this.err = err;
  }

  /** Installs the handlers until {@link #close}. */
  static StopSignals install(PrintWriter err) {
    StopSignals s = new StopSignals(err);
    if (!s.installHandlers()) {
      s.installHook();
    }
    return s;
  }

  /** Set once a stop was asked for; give it to {@code StopCriterion.signal}. */
  AtomicBoolean flag() {
    return stop;
  }

  private boolean installHandlers() {
    try {
      Class<?> signal = Class.forName("sun.misc.Signal");
      Class<?> handler = Class.forName("sun.misc.SignalHandler");
      Constructor<?> make = signal.getConstructor(String.class);
      handle = signal.getMethod("handle", signal, handler);
      Object mine = Proxy.newProxyInstance(StopSignals.class.getClassLoader(), new Class<?>[] {handler},
          (proxy, m, args) -> switch (m.getName()) {
            case "handle" -> {
              onSignal();
              yield null;
            }
            case "hashCode" -> System.identityHashCode(proxy);
            case "equals" -> proxy == args[0];
            default -> "mixwright stop handler";
          });
      for (String name : SIGNALS) {
        try {
          Object sig = make.newInstance(name);
          restore.add(new Object[] {sig, handle.invoke(null, sig, mine)});
        } catch (ReflectiveOperationException e) {
          // no such signal on this platform, or the JVM keeps it (-Xrs): the other may still work
        }
      }
      return !restore.isEmpty();
    } catch (ReflectiveOperationException | RuntimeException | LinkageError e) {
      return false;
    }
  }

  private void installHook() {
    hook = new Thread(() -> {
      stop.set(true);
      Cancellation.request();
      try {
        // Let the loop finish its round and write result.json before the JVM goes.
        done.await(120, TimeUnit.SECONDS);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }, "mixwright-stop");
    Runtime.getRuntime().addShutdownHook(hook);
  }

  private void onSignal() {
    if (received.incrementAndGet() == 1) {
      stop.set(true);
      // Searches under way end within a few thousand nodes, not at the end of the round.
      Cancellation.request();
      err.println();
      err.println("mixwright: stopping after the current round; the run can be resumed"
          + " (signal again to quit at once)");
      err.flush();
    } else {
      err.println();
      err.println("mixwright: quitting now; the column log is safe and the run can be resumed");
      err.flush();
      Runtime.getRuntime().halt(ExitCodes.STOPPED);
    }
  }

  @Override
  public void close() {
    done.countDown();
    Cancellation.clear();
    for (Object[] r : restore) {
      try {
        handle.invoke(null, r[0], r[1]);
      } catch (ReflectiveOperationException | RuntimeException e) {
        // leave ours in place; it only sets a flag nobody reads any more
      }
    }
    if (hook != null && !stop.get()) {
      try {
        Runtime.getRuntime().removeShutdownHook(hook);
      } catch (IllegalStateException shuttingDown) {
        // the JVM is already exiting; the hook has been released above
      }
    }
  }
}
