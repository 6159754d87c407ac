package dev.mixwright.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.portfolio.PortfolioSettings;
import dev.mixwright.portfolio.PortfolioStatus;
import dev.mixwright.report.PortfolioPending;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.PortfolioCheckpoint;
import dev.mixwright.runfolder.RunFolder;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A run cut off during its integer stage, in this JVM: the folder is put in the state a kill leaves
 * (result.json of the LP stage marked pending, the stage's checkpoint beside it) and resumed.
 */
class PortfolioResumeTest {
  @TempDir Path dir;

  private final List<String> notes = new ArrayList<>();
  private final RunSession session = new RunSession(new AtomicBoolean(), new RunSession.Watcher() {
    @Override
    public void note(String text) {
      notes.add(text);
    }
  });

  private Path solved() throws Exception {
    Path cat = dir.resolve("hand.yaml");
    Files.writeString(cat, Catalogs.HAND_PORTFOLIO.formatted("100"));
    Path run = dir.resolve("run");
    RunOutcome.Solved s = assertInstanceOf(RunOutcome.Solved.class, session.solve(new RunSession.SolveRequest(cat,
        Optional.empty(), run, false, SolveSettings.defaults(), PricerChoice.BNB, PortfolioPlan.defaults())));
    assertNull(s.result().portfolioPending());
    assertEquals(1700, s.result().portfolio().value(), 1e-6); // worked by hand, see Catalogs.HAND_PORTFOLIO
    return run;
  }

  /** What a kill during the stage leaves in result.json: the LP stage's result, marked pending. */
  private static void cutOffInTheStage(Path run) throws Exception {
    RunResult r = RunResult.read(run);
    r.withPortfolio(null, r.elapsedMs()).withPortfolioPending(PortfolioPending.RUNNING).write(run);
  }

  private RunResult resume(Path run, PortfolioSettings settings) throws Exception {
    RunOutcome.Solved s = assertInstanceOf(RunOutcome.Solved.class, session.resume(new RunSession.ResumeRequest(run,
        false, OptionalDouble.empty(), 0, 0, new PortfolioPlan(true, settings))));
    assertEquals(s.result(), RunResult.read(run));
    return s.result();
  }

  @Test
  void aRunCutOffInItsIntegerStageResumesFromItsCheckpointToTheSameProvenPortfolio() throws Exception {
    Path run = solved();
    assertTrue(Files.isRegularFile(PortfolioCheckpoint.file(new RunFolder(run))));
    cutOffInTheStage(run);
    RunResult r = resume(run, PortfolioSettings.defaults());
    assertNull(r.portfolioPending());
    assertNotNull(r.portfolio());
    assertEquals(PortfolioStatus.PROVEN, r.portfolio().status());
    assertEquals(1700, r.portfolio().value(), 1e-6);
    assertTrue(notes.stream().anyMatch(n -> n.startsWith("continuing the integer stage from")), notes.toString());
    // finished now: a further resume has nothing to do
    assertInstanceOf(RunOutcome.AlreadyOptimal.class, session.resume(new RunSession.ResumeRequest(run, false,
        OptionalDouble.empty(), 0, 0, PortfolioPlan.defaults())));
  }

  @Test
  void aCheckpointOfAnotherCatalogOrOtherSettingsIsIgnoredInWords() throws Exception {
    Path run = solved();
    Path cp = PortfolioCheckpoint.file(new RunFolder(run));
    String text = Files.readString(cp);
    String sha = text.replaceAll("(?s).*\"catalogSha256\":\"([0-9a-f]+)\".*", "$1");
    Files.writeString(cp, text.replace(sha, "0".repeat(sha.length())));
    cutOffInTheStage(run);
    RunResult r = resume(run, PortfolioSettings.defaults());
    assertEquals(1700, r.portfolio().value(), 1e-6);
    assertTrue(notes.stream().anyMatch(n -> n.contains("another catalog") && n.contains("starts afresh")),
        notes.toString());

    notes.clear();
    cutOffInTheStage(run);
    r = resume(run, PortfolioSettings.defaults().withSurvivorLimit(5));
    assertEquals(1700, r.portfolio().value(), 1e-6);
    assertTrue(notes.stream().anyMatch(n -> n.contains("other integer-stage settings")), notes.toString());
  }

  @Test
  void aDamagedCheckpointIsIgnoredInWords() throws Exception {
    Path run = solved();
    Path cp = PortfolioCheckpoint.file(new RunFolder(run));
    Files.writeString(cp, Files.readString(cp).substring(0, 40));
    cutOffInTheStage(run);
    RunResult r = resume(run, PortfolioSettings.defaults());
    assertEquals(PortfolioStatus.PROVEN, r.portfolio().status());
    assertTrue(notes.stream().anyMatch(n -> n.contains("damaged")), notes.toString());
  }
}
