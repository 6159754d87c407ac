package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.concurrent.Callable;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/**
 * Picocli hands a command's exceptions to the project's handler but lets errors through, so running out
 * of heap used to end in a JVM stack trace (`log` on a 209 MB column log did, before it streamed). A
 * command that runs out of heap now ends with one line that names the heap limit and how to raise it,
 * exit code {@link ExitCodes#FAULT}, and no stack trace.
 */
class OutOfMemoryTest {
  @CommandLine.Command(name = "greedy")
  static final class Greedy implements Callable<Integer> {
    @Override
    public Integer call() {
      throw new OutOfMemoryError("Java heap space");
    }
  }

  /** A pool thread ran out of heap, and the pool handed the error on as a cause (as ThreadPoolEngine does). */
  @CommandLine.Command(name = "pooled")
  static final class Pooled implements Callable<Integer> {
    @Override
    public Integer call() throws Exception {
      java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newSingleThreadExecutor();
      try {
        return pool.submit((Callable<Integer>) () -> {
          throw new OutOfMemoryError("Java heap space");
        }).get();
      } catch (java.util.concurrent.ExecutionException e) {
        throw new IllegalStateException("point 3 failed: " + e.getCause(), e);
      } finally {
        pool.shutdownNow();
      }
    }
  }

  @CommandLine.Command(name = "broken")
  static final class Broken implements Callable<Integer> {
    @Override
    public Integer call() {
      throw new IllegalStateException("broken");
    }
  }

  @Test
  void runningOutOfHeapIsSaidInWordsWithTheLimit() {
    assertSaidOutOfMemory(new Greedy());
  }

  /** The same from a worker thread, whose pool wraps the error in exceptions: said the same way. */
  @Test
  void runningOutOfHeapInAWorkerThreadIsSaidTheSameWay() {
    assertSaidOutOfMemory(new Pooled());
  }

  /** The command ends with exit code FAULT and one line on the heap limit: no stack trace, no internal fault. */
  private static void assertSaidOutOfMemory(Callable<Integer> command) {
    StringWriter err = new StringWriter();
    int code = execute(command, err);
    String said = err.toString();
    assertEquals(ExitCodes.FAULT, code);
    assertTrue(said.startsWith("mixwright: ran out of memory (Java heap space) with a heap limit of "), said);
    assertTrue(said.contains(Runtime.getRuntime().maxMemory() / (1024 * 1024) + " MiB"), said);
    assertTrue(said.contains("-Xmx"), said);
    assertFalse(said.contains("\tat "), "no stack trace: " + said);
    assertFalse(said.contains("internal fault"), said);
    assertEquals(1, said.strip().lines().count(), said);
  }

  /** Other failures keep their own handling: a plain exception is an internal fault, in words. */
  @Test
  void otherFailuresStillGoToTheHandler() {
    StringWriter err = new StringWriter();
    assertEquals(ExitCodes.FAULT, execute(new Broken(), err));
    assertTrue(err.toString().startsWith("mixwright: internal fault: java.lang.IllegalStateException: broken"),
        err.toString());
  }

  /** The command run as {@link Main} runs one, its error stream into {@code err}; the exit code. */
  private static int execute(Callable<Integer> command, StringWriter err) {
    CommandLine cl = new CommandLine(command);
    cl.setOut(new PrintWriter(new StringWriter(), true));
    cl.setErr(new PrintWriter(err, true));
    return Main.execute(cl, new String[0]);
  }
}
