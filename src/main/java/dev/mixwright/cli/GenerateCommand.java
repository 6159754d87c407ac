package dev.mixwright.cli;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogGenerator;
import dev.mixwright.catalog.CatalogWriter;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.space.BudgetedCount;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(
    name = "generate",
    mixinStandardHelpOptions = true,
    description = {
      "Writes a synthetic catalog (invented data) of the given size, for trials and benchmarks.",
      "The same options and seed always give the same file."
    })
final class GenerateCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--groups", paramLabel = "N", required = true, description = "option groups")
  int groups;

  @Option(names = "--options", paramLabel = "K", required = true, description = "options per group")
  int options;

  @Option(names = "--resources", paramLabel = "R", defaultValue = "5", description = "shared resources (default ${DEFAULT-VALUE})")
  int resources;

  @Option(names = "--segments", paramLabel = "S", defaultValue = "3", description = "market segments (default ${DEFAULT-VALUE})")
  int segments;

  @Option(names = "--rules", paramLabel = "M", defaultValue = "0", description = "compatibility rules (default ${DEFAULT-VALUE})")
  int rules;

  @Option(names = "--optional-share", paramLabel = "P", defaultValue = "0.2",
      description = "share of groups that are optional (default ${DEFAULT-VALUE})")
  double optionalShare;

  @Option(names = "--seed", paramLabel = "X", defaultValue = "1", description = "random seed (default ${DEFAULT-VALUE})")
  long seed;

  @Option(names = "--family", paramLabel = "NAME", defaultValue = "classic",
      description = "structure of rules and capacities: classic (default; pairwise rules between neighbours),"
          + " dense (large forbidden blocks between neighbours), distant (pairwise rules between any two groups),"
          + " wide (forbid over 3 to 5 groups), multi (when/require with several groups on each side),"
          + " tight or loose (classic rules, capacities far below or above demand)")
  String family;

  @Option(names = "--out", paramLabel = "FILE", required = true, description = "catalog file to write (.yaml, .yml or .json)")
  Path outFile;

  @Option(names = "--replace", description = "overwrite FILE if it exists")
  boolean replace;

  @Option(names = "--choice-spread", paramLabel = "U", defaultValue = "0",
      description = "give every segment a choice section (multinomial logit) with part-worths of this spread in utils;"
          + " 0 (default) keeps fixed demand")
  double choiceSpread;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    CatalogGenerator.Spec s;
    try {
      s = new CatalogGenerator.Spec(groups, options, resources, segments, rules, optionalShare, seed,
          CatalogGenerator.Family.of(family));
    } catch (IllegalArgumentException e) {
      throw new UserError(e.getMessage());
    }
    String name = outFile.getFileName() == null ? "" : outFile.getFileName().toString().toLowerCase(Locale.ROOT);
    boolean json = name.endsWith(".json");
    if (!json && !name.endsWith(".yaml") && !name.endsWith(".yml")) {
      throw new UserError("--out: " + outFile + " must end in .yaml, .yml or .json");
    }
    if (Files.exists(outFile) && !replace) {
      throw new UserError(outFile + " already exists; choose another --out file, or add --replace to overwrite it");
    }
    if (Files.isDirectory(outFile)) {
      throw new UserError("--out: " + outFile + " is a folder; give a file name");
    }
    if (!(choiceSpread >= 0) || Double.isInfinite(choiceSpread)) {
      throw new UserError("--choice-spread must be 0 (fixed demand) or a positive number of utils, got " + choiceSpread);
    }
    Catalog c = CatalogGenerator.generate(s);
    if (choiceSpread > 0) {
      c = CatalogGenerator.choosing(c, seed, choiceSpread);
    }
    AtomicFiles.write(outFile, json ? CatalogWriter.toJson(c) : CatalogWriter.toYaml(c));
    VariantSpace space = new VariantSpace(c);
    out.printf(Locale.ROOT, "wrote %s: %d groups, %d rules, %d resources, %d segments, buildable variants %s%n",
        outFile, c.groups().size(), c.rules().size(), c.resources().size(), c.segments().size(),
        new BudgetedCount(space).count(BudgetedCount.wholeSpace(space), 2000).text());
    return ExitCodes.OK;
  }
}
