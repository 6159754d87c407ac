package dev.mixwright.runfolder;

import dev.mixwright.colgen.ColGenListener;
import dev.mixwright.colgen.IterationRecord;
import dev.mixwright.colgen.SolveOutcome;
import java.io.IOException;
import java.io.UncheckedIOException;

/** Writes {@code state.json} after every round of the loop and once more when it ends. */
public final class SnapshotWriter implements ColGenListener {
  private final RunFolder folder;
  private final String runId;
  private final RunManifest.Settings settings;
  private final int session;

  /** Snapshots of session {@code session} of the run {@code manifest} describes, its settings included. */
  public SnapshotWriter(RunFolder folder, RunManifest manifest, int session) {
    this.folder = folder;
    this.runId = manifest.runId();
    this.settings = manifest.settings();
    this.session = session;
  }

  @Override
  public void iteration(IterationRecord r) {
    write(new LoopSnapshot(runId, session, LoopSnapshot.RUNNING, r.iteration(), r.objective(), r.bound(),
        r.gap(), r.columns(), r.elapsedMs()));
  }

  @Override
  public void ended(SolveOutcome o) {
    write(new LoopSnapshot(runId, session, o.status().word(), o.iterations(), o.result().value(), o.result().bound(),
        o.result().gap(), o.master().columns().size(), o.elapsedMs()));
  }

  private void write(LoopSnapshot s) {
    try {
      s.write(folder, settings);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot write " + folder.snapshot() + ": " + e.getMessage(), e);
    }
  }
}
