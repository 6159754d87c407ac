package dev.mixwright.runfolder;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.mixwright.colgen.SolveSettings;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RunManifestTest {
  @TempDir Path dir;

  @Test
  void everySettingIsWrittenAndReadBack() throws Exception {
    RunFolder folder = new RunFolder(dir);
    SolveSettings s = new SolveSettings(1e-4, 3, 5000, 7, true, 0.3, 4);
    RunManifest m = RunManifest.begin(new RunManifest.Source("/a/c.yaml", "ab"), null, "cd",
        RunManifest.Settings.of(s, "cpsat"));
    m.write(folder);
    RunManifest back = RunManifest.read(folder);
    assertEquals(m, back);
    assertEquals(s.withLimits(0, 0), back.settings().forSession(null));
    assertEquals(s.withLimits(0, 0).withSmoothing(0.3), back.settings().forSession(1e-4));
  }

  @Test
  void aManifestWrittenBeforeSmoothingWasRecordedReadsAsTheDefaults() throws Exception {
    Files.writeString(dir.resolve(RunFolder.MANIFEST), """
        {"format": 1, "runId": "r", "createdAt": "2026-01-01T00:00:00Z",
         "catalog": {"path": "/a/c.yaml", "sha256": "ab"}, "catalogCopySha256": "cd",
         "settings": {"pricer": "bnb", "gap": 1e-6, "perRound": 10, "heuristicFirst": false,
                      "timeLimitMs": 0, "maxIterations": 0},
         "sessions": [{"number": 1, "kind": "solve", "startedAt": "2026-01-01T00:00:00Z"}]}
        """);
    RunManifest.Settings s = RunManifest.read(new RunFolder(dir)).settings();
    assertEquals(SolveSettings.DEFAULT_SMOOTHING, s.smoothing());
    assertEquals(SolveSettings.DEFAULT_RETIRE_AFTER, s.retireAfter());
  }
}
