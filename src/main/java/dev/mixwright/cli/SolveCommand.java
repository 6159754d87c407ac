package dev.mixwright.cli;

import dev.mixwright.run.RunSession;
import dev.mixwright.run.ScenarioSetPlan;
import java.nio.file.Path;
import java.util.Optional;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

@Command(
    name = "solve",
    description = {
      "Finds the best LP plan over the whole variant space by column generation and proves it.",
      "Writes RUN_DIR/result.json, RUN_DIR/columns.jsonl (one line per column added) and RUN_DIR/catalog.json (the catalog as solved), RUN_DIR/run.json (what the run is) and RUN_DIR/state.json (the loop's state after each round). Ctrl-C or SIGTERM stops after the current round with status stopped (exit 1); 'mixwright resume RUN_DIR' continues such a run, or one cut off by a crash."
    })
final class SolveCommand extends CatalogCommand {
  @Option(names = "--out", required = true, paramLabel = "RUN_DIR", description = "folder for the run's files")
  Path runDir;

  @Option(names = "--replace", description = "overwrite the files of an earlier run in RUN_DIR")
  boolean replace;

  @Option(names = "--scenario", paramLabel = "FILE",
      description = "solve the catalog changed by this scenario file (capacities, prices, costs, demand, rules)")
  Path scenarioFile;

  @Option(names = "--all-offers", description = "list every variant of the plan in the summary, not the first eight")
  boolean allOffers;

  @Mixin ScenarioSetOptions scenarioSet;

  @Mixin SolveOptions solve;

  @Mixin PortfolioOptions portfolio;

  @Mixin ProgressOption progress;

  @Mixin TableReachOption tables;

  @Override
  public Integer call() throws Exception {
    RunSession.SolveRequest request = new RunSession.SolveRequest(catalogFile, Optional.ofNullable(scenarioFile),
        runDir, replace, solve.settings(), solve.loop.pricer, portfolio.plan(), tables.reach());
    ScenarioSetPlan set = scenarioSet.plan();
    return RunView.run(spec.commandLine(), progress.asked, allOffers, session -> session.solve(request, set));
  }
}
