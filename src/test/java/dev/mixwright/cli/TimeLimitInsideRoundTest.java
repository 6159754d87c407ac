package dev.mixwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.mixwright.testing.HardCatalogs;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code --time-limit} ends a run whose very first pricing call would take hours: the limit reaches
 * inside the search, the survey of what is sellable and the count, not only the loop between rounds.
 */
class TimeLimitInsideRoundTest {
  @TempDir Path dir;

  @Test
  void aTimeLimitEndsARunWhoseFirstPricingCallWouldTakeHours() throws Exception {
    // One group of 5,000 options (the most a group may hold) beside a 300-node independent-set
    // problem: the exact pricer's first call alone runs for minutes to hours (see HardCatalogs).
    Path cat = dir.resolve("sets.json");
    Files.writeString(cat, HardCatalogs.independentSets(7, 300, 0.05, 5_000));
    Path run = dir.resolve("run");
    // A guard against a hang only: without the limit inside the search this never returns.
    CliRun r = assertTimeoutPreemptively(Duration.ofMinutes(1), () -> CliRun.of("solve", cat.toString(), "--out",
        run.toString(), "--time-limit", "2s", "--no-progress", "--no-portfolio"));
    assertEquals(ExitCodes.STOPPED, r.code(), r.toString());
    JsonNode res = ResumeTest.result(run);
    assertEquals("stopped", res.path("status").asText(), r.toString());
    assertTrue(res.path("stopReason").asText().contains("time limit of 2.0 s reached"), res.toString());
    // what it found is a buildable plan, so the run can be resumed from it
    assertTrue(res.path("objective").asDouble() > 0, res.toString());
  }
}
