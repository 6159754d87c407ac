package dev.mixwright.cli;

import dev.mixwright.portfolio.ScenarioStage;
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

  @Option(names = "--scenario-set", paramLabel = "FILE",
      description = "choose one range for every scenario of this set (a list with weights, or seeded draws):"
          + " introductions shared, a production plan per scenario; needs a portfolio section")
  Path scenarioSet;

  @Option(names = "--worst-case",
      description = "with --scenario-set: maximise the worst scenario's margin instead of the weighted mean")
  boolean worstCase;

  @Option(names = "--hold-out", paramLabel = "FILE",
      description = "with --scenario-set: evaluate the chosen range on the scenarios of this second set (e.g. many"
          + " draws) and report its mean and 5 %% / 95 %% quantiles")
  Path holdOut;

  @Option(names = "--all-offers", description = "list every variant of the plan in the summary, not the first eight")
  boolean allOffers;

  @Mixin SolveOptions solve;

  @Mixin PortfolioOptions portfolio;

  @Mixin ProgressOption progress;

  @Mixin TableReachOption tables;

  @Override
  public Integer call() throws Exception {
    RunSession.SolveRequest request = new RunSession.SolveRequest(catalogFile, Optional.ofNullable(scenarioFile),
        runDir, replace, solve.settings(), solve.loop.pricer, portfolio.plan(), tables.reach());
    if (scenarioSet == null && (worstCase || holdOut != null)) {
      throw new UserError((worstCase ? "--worst-case" : "--hold-out") + " applies to a range across scenarios; add"
          + " --scenario-set FILE");
    }
    ScenarioSetPlan set = scenarioSet == null ? null : new ScenarioSetPlan(scenarioSet,
        worstCase ? ScenarioStage.Aim.WORST : ScenarioStage.Aim.MEAN, Optional.ofNullable(holdOut));
    return RunView.run(spec.commandLine(), progress.asked, allOffers, session -> session.solve(request, set));
  }
}
