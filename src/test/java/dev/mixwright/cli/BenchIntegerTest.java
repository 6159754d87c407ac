package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.CatalogGenerator;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The bench's section on the integer stage: each catalog solved in a JVM of its own with -Xmx512m,
 * its row read back from that run's result.json, and the targets printed from those rows.
 */
class BenchIntegerTest {

  @Test
  void eachRunIsReadBackFromItsOwnResultAndJudgedAgainstItsTarget() throws Exception {
    List<String> lines = new ArrayList<>();
    // no demos folder: the generated 7-group catalog (823,432 variants, proven by the quick proof in
    // seconds) and the loose family, which is proven in about 2 s
    new IntegerBench(lines::add, n -> { }, 1).run(List.of(CatalogGenerator.Family.LOOSE), null);
    String all = String.join("\n", lines);
    String small = row(lines, "| generated, 7 groups |");
    assertTrue(small.contains("| 823,432 |") && small.contains("| proven |"), all);
    String loose = row(lines, "| loose |");
    assertTrue(loose.contains("1.58e12") || loose.contains("1.59e12"), all);
    String target = lines.stream().filter(l -> l.startsWith("| loose | gap ≤ 0.01 %")).findFirst().orElse(null);
    assertNotNull(target, all);
    assertTrue(target.endsWith("| met (exit 0) |"), target);
    assertEquals(2, lines.stream().filter(l -> l.endsWith("| met (exit 0) |")).count(), all);
  }

  @Test
  void bothOnlyOptionsAreRefused() {
    CliRun r = CliRun.of("bench", "--only-families", "--only-integer");
    assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
    assertTrue(r.err().contains("--only-integer"), r.err());
  }

  @Test
  void theChildsPeakMemoryIsReadFromProcWhereThereIsOne() {
    Long own = IntegerBench.peakKib(ProcessHandle.current().pid());
    if (java.nio.file.Files.isDirectory(java.nio.file.Path.of("/proc/self"))) {
      assertNotNull(own);
      assertTrue(own > 1024, "a JVM holds more than 1 MiB: " + own);
    }
    assertEquals(null, IntegerBench.peakKib(-5));
  }

  private static String row(List<String> lines, String start) {
    return lines.stream().filter(l -> l.startsWith(start)).findFirst().orElseThrow(() -> new AssertionError(
        "no row " + start + " in\n" + String.join("\n", lines)));
  }
}
