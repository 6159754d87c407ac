package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.CatalogGenerator;
import dev.mixwright.catalog.CatalogWriter;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class GenerateCommandTest {
  @TempDir Path dir;

  private record Run(int code, String out, String err) {}

  private static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  @Test
  void writesTheGeneratorsCatalogAndRefusesToOverwrite() throws Exception {
    Path file = dir.resolve("g.yaml");
    String[] args = {"generate", "--groups", "6", "--options", "4", "--resources", "3", "--segments", "2",
        "--rules", "8", "--seed", "5", "--out", file.toString()};
    Run first = run(args);
    assertEquals(ExitCodes.OK, first.code(), first.err());
    assertTrue(first.out().contains("buildable variants"), first.out());
    String expected = CatalogWriter.toYaml(CatalogGenerator.generate(new CatalogGenerator.Spec(6, 4, 3, 2, 8, 0.2, 5)));
    assertEquals(expected, Files.readString(file));

    Run again = run(args);
    assertEquals(ExitCodes.BAD_INPUT, again.code());
    assertTrue(again.err().contains("--replace"), again.err());

    String[] replace = java.util.Arrays.copyOf(args, args.length + 1);
    replace[args.length] = "--replace";
    assertEquals(ExitCodes.OK, run(replace).code());
    assertEquals(expected, Files.readString(file), "same seed, same bytes");

    Run check = run("check", file.toString());
    assertEquals(ExitCodes.OK, check.code(), check.err());
  }

  @Test
  void badSizesAreNamed() {
    Run r = run("generate", "--groups", "1", "--options", "4", "--out", dir.resolve("x.yaml").toString());
    assertEquals(ExitCodes.BAD_INPUT, r.code());
    assertTrue(r.err().contains("groups must be at least 2"), r.err());
    r = run("generate", "--groups", "3", "--options", "4", "--out", dir.resolve("x.txt").toString());
    assertEquals(ExitCodes.BAD_INPUT, r.code());
    assertTrue(r.err().contains(".yaml"), r.err());
  }
}
