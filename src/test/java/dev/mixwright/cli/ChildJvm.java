package dev.mixwright.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/** {@code mixwright} in a child JVM on the test class path, for tests that signal or kill it. */
final class ChildJvm {
  final Process process;
  final Path out;
  final Path err;

  private ChildJvm(Process process, Path out, Path err) {
    this.process = process;
    this.out = out;
    this.err = err;
  }

  static ChildJvm start(Path logDir, String name, String... args) throws IOException {
    Files.createDirectories(logDir);
    List<String> cmd = new ArrayList<>();
    cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    cmd.add("-cp");
    cmd.add(System.getProperty("java.class.path"));
    cmd.add("dev.mixwright.cli.Main");
    cmd.addAll(List.of(args));
    Path out = logDir.resolve(name + ".out");
    Path err = logDir.resolve(name + ".err");
    Process p = new ProcessBuilder(cmd).redirectOutput(out.toFile()).redirectError(err.toFile()).start();
    return new ChildJvm(p, out, err);
  }

  /** Waits until {@code file} exists (or the process ended); false if it ended first. */
  boolean awaitFile(Path file, long maxMillis) throws InterruptedException {
    long until = System.nanoTime() + maxMillis * 1_000_000;
    while (!Files.exists(file)) {
      if (!process.isAlive() || System.nanoTime() > until) {
        return Files.exists(file);
      }
      Thread.sleep(20);
    }
    return true;
  }

  /** Waits until the child's stderr holds one of {@code texts} (or it ended); false if it ended first. */
  boolean awaitText(List<String> texts, long maxMillis) throws InterruptedException, IOException {
    long until = System.nanoTime() + maxMillis * 1_000_000;
    while (true) {
      String e = Files.exists(err) ? Files.readString(err) : "";
      if (texts.stream().anyMatch(e::contains)) {
        return true;
      }
      if (!process.isAlive() || System.nanoTime() > until) {
        return false;
      }
      Thread.sleep(20);
    }
  }

  int waitFor(long maxSeconds) throws InterruptedException {
    if (!process.waitFor(maxSeconds, TimeUnit.SECONDS)) {
      process.destroyForcibly().waitFor();
      throw new AssertionError("the child JVM did not end within " + maxSeconds + " s");
    }
    return process.exitValue();
  }

  /** What the child printed, for assertion messages. */
  String transcript() {
    try {
      return "--- stdout\n" + Files.readString(out) + "--- stderr\n" + Files.readString(err);
    } catch (IOException e) {
      return "(no transcript: " + e + ")";
    }
  }
}
