package dev.mixwright.cli;

import dev.mixwright.engine.Engines;
import dev.mixwright.portfolio.ScenarioStage;
import dev.mixwright.run.ScenarioSetPlan;
import java.nio.file.Path;
import java.util.Optional;
import picocli.CommandLine.Option;

/** One range across a set of scenarios (solve), as a mixin; {@link #plan} checks that they go together. */
final class ScenarioSetOptions {
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

  @Option(names = "--engine", paramLabel = "NAME", defaultValue = Engines.LOCAL,
      description = "with --scenario-set: what solves each scenario on its own and evaluates the hold-out"
          + " scenarios: local (this machine's threads, the default) or spark (a Spark cluster, when run through"
          + " spark-submit with the spark module's jar)")
  String engine;

  /** The set to solve across, or null for a single catalog; the two options that need a set refused without one. */
  ScenarioSetPlan plan() {
    boolean otherEngine = !engine.equals(Engines.LOCAL);
    if (scenarioSet == null && (worstCase || holdOut != null || otherEngine)) {
      throw new UserError((worstCase ? "--worst-case" : holdOut != null ? "--hold-out" : "--engine")
          + " applies to a range across scenarios; add --scenario-set FILE");
    }
    return scenarioSet == null ? null : new ScenarioSetPlan(scenarioSet,
        worstCase ? ScenarioStage.Aim.WORST : ScenarioStage.Aim.MEAN, Optional.ofNullable(holdOut), engine);
  }
}
