package dev.mixwright.cli;

import dev.mixwright.run.RunSession;
import java.nio.file.Path;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(
    name = "resume",
    mixinStandardHelpOptions = true,
    description = {
      "Continues a stopped or cut-off run to the optimum of an uninterrupted run.",
      "A run stopped by a limit, Ctrl-C or SIGTERM, or cut off by a crash, kill -9 or power loss: resume rebuilds the master from the run's column log, keeps the bound it had proven and goes on to the optimum, appending to the same column log. The final objective is the one an uninterrupted run reaches. Refuses (exit 2) when the catalog file changed since the run began, unless --reprice is given."
    })
final class ResumeCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Parameters(index = "0", paramLabel = "RUN_DIR", description = "a folder written by 'mixwright solve --out'")
  Path runDir;

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

  @Override
  public Integer call() throws Exception {
    RunSession.ResumeRequest request = new RunSession.ResumeRequest(runDir, reprice,
        gap == null ? OptionalDouble.empty() : OptionalDouble.of(gap), limits.timeLimitMs, limits.maxIterations,
        portfolio.plan());
    return RunView.run(spec.commandLine(), progress.asked, session -> session.resume(request));
  }
}
