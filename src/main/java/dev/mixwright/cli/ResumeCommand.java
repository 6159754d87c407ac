package dev.mixwright.cli;

import dev.mixwright.run.RunSession;
import java.util.OptionalDouble;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

@Command(
    name = "resume",
    description = {
      "Continues a stopped or cut-off run to the optimum of an uninterrupted run.",
      "A run stopped by a limit, Ctrl-C or SIGTERM, or cut off by a crash, kill -9 or power loss: resume rebuilds the master from the run's column log, keeps the bound it had proven and goes on to the optimum, appending to the same column log. The final objective is the one an uninterrupted run reaches. Refuses (exit 2) when the catalog file changed since the run began, unless --reprice is given."
    })
final class ResumeCommand extends RunDirCommand {
  @Option(names = "--reprice",
      description = "the catalog file changed: re-price the pooled columns against it as it is now and go"
          + " on (columns it no longer sells are left out; the old bound is dropped)")
  boolean reprice;

  @Mixin LimitOptions limits;

  @Option(names = "--gap", paramLabel = "REL", converter = Converters.Gap.class,
      description = "gap target; default: the run's own (from run.json)")
  Double gap;

  @Mixin PortfolioOptions portfolio;

  @Mixin ProgressOption progress;

  @Mixin TableReachOption tables;

  @Override
  public Integer call() throws Exception {
    RunSession.ResumeRequest request = new RunSession.ResumeRequest(runDir, reprice,
        gap == null ? OptionalDouble.empty() : OptionalDouble.of(gap), limits.timeLimitMs, limits.maxIterations,
        portfolio.plan(), tables.reach());
    return RunView.run(spec.commandLine(), progress.asked, session -> session.resume(request));
  }
}
