package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.CatalogGenerator;
import dev.mixwright.catalog.CatalogWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class GenerateCommandTest {
  @TempDir Path dir;


  @Test
  void writesTheGeneratorsCatalogAndRefusesToOverwrite() throws Exception {
    Path file = dir.resolve("g.yaml");
    String[] args = {"generate", "--groups", "6", "--options", "4", "--resources", "3", "--segments", "2",
        "--rules", "8", "--seed", "5", "--out", file.toString()};
    CliRun first = CliRun.of(args);
    assertEquals(ExitCodes.OK, first.code(), first.err());
    assertTrue(first.out().contains("buildable variants"), first.out());
    String expected = CatalogWriter.toYaml(CatalogGenerator.generate(new CatalogGenerator.Spec(6, 4, 3, 2, 8, 0.2, 5)));
    assertEquals(expected, Files.readString(file));

    CliRun again = CliRun.of(args);
    assertEquals(ExitCodes.BAD_INPUT, again.code());
    assertTrue(again.err().contains("--replace"), again.err());

    String[] replace = java.util.Arrays.copyOf(args, args.length + 1);
    replace[args.length] = "--replace";
    assertEquals(ExitCodes.OK, CliRun.of(replace).code());
    assertEquals(expected, Files.readString(file), "same seed, same bytes");

    CliRun check = CliRun.of("check", file.toString());
    assertEquals(ExitCodes.OK, check.code(), check.err());
  }

  @Test
  void badSizesAreNamed() {
    CliRun r = CliRun.of("generate", "--groups", "1", "--options", "4", "--out", dir.resolve("x.yaml").toString());
    assertEquals(ExitCodes.BAD_INPUT, r.code());
    assertTrue(r.err().contains("groups must be at least 2"), r.err());
    r = CliRun.of("generate", "--groups", "3", "--options", "4", "--out", dir.resolve("x.txt").toString());
    assertEquals(ExitCodes.BAD_INPUT, r.code());
    assertTrue(r.err().contains(".yaml"), r.err());
  }
}
