package dev.mixwright.cli;

import dev.mixwright.catalog.CatalogGenerator;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.AtomicFiles;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import java.util.function.Consumer;
import java.util.stream.Stream;

/**
 * The benchmark's section on the integer stage (issue 11's targets for it): the shipped demos, a
 * generated catalog of about 10^6 variants and each generator family at about 10^12 variants, each
 * with a {@code portfolio} section, solved as a user solves them — {@code solve} in a JVM of its own
 * with {@code -Xmx512m} and the default time limits — one after the other, so that no run shares the
 * two cores with another of the benchmark. Peak memory is the child's VmHWM from /proc, read while it
 * runs (Linux; "–" elsewhere).
 */
final class IntegerBench {
  /** The targets: the gap on the families, and the heap every run must fit. */
  static final double FAMILY_GAP_TARGET = 1e-4;
  static final String HEAP = "-Xmx512m";
  /** The portfolio section appended to every generated catalog (that of docs/portfolio.md's tables). */
  static final String PORTFOLIO = "portfolio:\n  introductionCost: 25000\n  maxVariants: 12\n  minLot: 300\n";
  /** A run is killed this long after its own limits (LP stage and 60 s integer stage) should have ended it. */
  static final long CHILD_LIMIT_MS = 600_000;

  private final Consumer<String> line;
  private final Consumer<String> note;
  private final long seed;
  private final Path work;

  IntegerBench(Consumer<String> line, Consumer<String> note, long seed) throws IOException {
    this.line = line;
    this.note = note;
    this.seed = seed;
    this.work = Files.createTempDirectory("mixwright-bench-int-");
  }

  /** One catalog of the section: what it is, its file, and what it must reach. */
  record Case(String label, String how, Path file, Goal goal) {}

  enum Goal {
    /** A shipped demo: proven within the default time limit. */
    PROVEN("proven"),
    /** A generated catalog of up to 10^6 variants: proven too. */
    PROVEN_SMALL("proven"),
    /** A family at about 10^12 variants: a gap of at most 0.01 %. */
    GAP("gap ≤ 0.01 %");

    final String words;

    Goal(String words) {
      this.words = words;
    }
  }

  record Measured(Case c, int exit, long wallMs, Long peakKib, RunResult result) {}

  void run(List<CatalogGenerator.Family> families, Path demos) throws IOException, InterruptedException {
    try {
      List<Case> cases = cases(families, demos);
      List<Measured> all = new ArrayList<>();
      for (Case c : cases) {
        note.accept("integer stage: " + c.label + " (solve -Xmx512m in its own JVM, default limits)");
        all.add(measure(c));
      }
      print(all);
    } finally {
      FamilyBench.deleteTree(work);
    }
  }

  private List<Case> cases(List<CatalogGenerator.Family> families, Path demos) throws IOException {
    List<Case> out = new ArrayList<>();
    if (demos != null && Files.isDirectory(demos)) {
      try (Stream<Path> s = Files.list(demos)) {
        for (Path p : s.filter(p -> p.toString().endsWith(".yaml")).sorted().toList()) {
          if (Files.readString(p).contains("\nportfolio:")) {
            out.add(new Case(p.getFileName().toString(), "shipped demo", p, Goal.PROVEN));
          }
        }
      }
    }
    CatalogGenerator.Spec small = new CatalogGenerator.Spec(7, 8, 6, 5, 30, 0.2, 5);
    out.add(new Case("generated, 7 groups", "`generate --groups 7 --options 8 --resources 6 --segments 5 --rules 30"
        + " --seed 5`", write("small", small), Goal.PROVEN_SMALL));
    for (CatalogGenerator.Family f : families) {
      CatalogGenerator.Spec spec = new CatalogGenerator.Spec(15, 7, 8, 5, 40, 0.2, seed, f);
      out.add(new Case(f.word(), "`generate --family " + f.word() + " --groups 15 --options 7 --resources 8"
          + " --segments 5 --rules 40 --seed " + seed + "`", write(f.word(), spec), Goal.GAP));
    }
    return out;
  }

  private Path write(String name, CatalogGenerator.Spec spec) throws IOException {
    Path file = work.resolve(name + ".yaml");
    AtomicFiles.write(file, CatalogWriter.toYaml(CatalogGenerator.generate(spec)) + PORTFOLIO);
    return file;
  }

  private Measured measure(Case c) throws IOException, InterruptedException {
    Path runDir = work.resolve(c.file.getFileName() + "-run");
    long t0 = System.nanoTime();
    Process p = FamilyBench.startChild(List.of(HEAP),
        List.of("solve", c.file.toString(), "--out", runDir.toString(), "--replace", "--no-progress"));
    Long peak = null;
    long deadline = t0 + CHILD_LIMIT_MS * 1_000_000L;
    while (!p.waitFor(200, TimeUnit.MILLISECONDS)) {
      Long hwm = peakKib(p.pid());
      if (hwm != null) {
        peak = peak == null ? hwm : Math.max(peak, hwm);
      }
      if (System.nanoTime() > deadline) {
        p.destroyForcibly().waitFor();
        return new Measured(c, -1, FamilyBench.msSince(t0), peak, null);
      }
    }
    long wall = FamilyBench.msSince(t0);
    RunResult r = null;
    try {
      r = RunResult.read(runDir);
    } catch (IOException | RuntimeException e) {
      note.accept("integer stage: " + c.label + " left no readable result.json (" + e.getMessage() + ")");
    }
    return new Measured(c, p.exitValue(), wall, peak, r);
  }

  /** A count as written in result.json, in scientific form when it is large. */
  private static String count(String digits) {
    try {
      java.math.BigInteger n = new java.math.BigInteger(digits);
      return n.bitLength() < 24 ? String.format(Locale.ROOT, "%,d", n) : BenchCommand.sci(n);
    } catch (NumberFormatException e) {
      return digits;
    }
  }

  /** The high-water mark of a process's resident memory, in KiB, or null where /proc does not tell. */
  static Long peakKib(long pid) {
    try {
      for (String l : Files.readAllLines(Path.of("/proc", Long.toString(pid), "status"))) {
        if (l.startsWith("VmHWM:")) {
          return Long.parseLong(l.replaceAll("[^0-9]", ""));
        }
      }
    } catch (IOException | RuntimeException e) {
      // not Linux, or the process just ended: the last reading stands
    }
    return null;
  }

  private void print(List<Measured> all) {
    line.accept("## The integer stage: demos, 10^6 and the families at about 10^12");
    line.accept("");
    line.accept("Each catalog solved as a user solves it: `java " + HEAP + " -jar mixwright.jar solve FILE --out DIR`"
        + " in a JVM of its own, with the default limits (integer stage 60 s), one run at a time. Generated catalogs"
        + " have `" + PORTFOLIO.replace("\n  ", " ").replace(":\n", ":").trim() + "` appended. Stage time is"
        + " the integer stage's `elapsedMs`; wall time includes the JVM, the LP stage and writing the run folder."
        + " Peak RSS is the child's VmHWM.");
    line.accept("");
    line.accept("| catalog | how | buildable variants | status | value | gap | stage | wall | peak RSS | tree nodes"
        + " (open) | target |");
    line.accept("|---|---|---|---|---|---|---|---|---|---|---|");
    for (Measured m : all) {
      RunResult.Portfolio pf = m.result == null ? null : m.result.portfolio();
      String variants = m.result == null ? "–" : m.result.buildableVariants() != null
          ? count(m.result.buildableVariants()) : "≤ " + count(m.result.buildableVariantsAtMost());
      String tree = pf == null || pf.proof().tree() == null ? "–"
          : String.format(Locale.ROOT, "%,d (%,d)", pf.proof().tree().nodesSolved(), pf.proof().tree().nodesOpen());
      line.accept(String.format(Locale.ROOT, "| %s | %s | %s | %s | %s | %s | %s | %s | %s | %s | %s |", m.c.label,
          m.c.how, variants, pf == null ? "exit " + m.exit : pf.status().word(),
          pf == null ? "–" : String.format(Locale.ROOT, "%,.2f", pf.value()),
          pf == null || pf.gap() == null ? "–" : String.format(Locale.ROOT, "%.4f %%", 100 * pf.gap()),
          pf == null ? "–" : FamilyBench.secs(pf.elapsedMs()), FamilyBench.secs(m.wallMs),
          m.peakKib == null ? "–" : String.format(Locale.ROOT, "%d MiB", m.peakKib / 1024), tree, m.c.goal.words));
    }
    line.accept("");
    line.accept("Targets of issue 11 for the integer stage and memory, from the runs above:");
    line.accept("");
    line.accept("| catalog | goal | integer stage | `solve " + HEAP + "` |");
    line.accept("|---|---|---|---|");
    for (Measured m : all) {
      RunResult.Portfolio pf = m.result == null ? null : m.result.portfolio();
      boolean reached = pf != null && switch (m.c.goal) {
        case PROVEN, PROVEN_SMALL -> pf.status().isProven();
        case GAP -> pf.status().isProven() || pf.gap() != null && pf.gap() <= FAMILY_GAP_TARGET;
      };
      String measured = pf == null ? "no result" : pf.status().word()
          + (pf.gap() == null ? "" : String.format(Locale.ROOT, ", gap %.4f %%", 100 * pf.gap()));
      line.accept(String.format(Locale.ROOT, "| %s | %s | %s (%s) | %s |", m.c.label, m.c.goal.words,
          reached ? "met" : "**not met**", measured,
          m.exit == ExitCodes.OK ? "met (exit 0)" : "**not met** (exit " + m.exit + ")"));
    }
    line.accept("");
  }
}
