package dev.mixwright.runfolder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** No run file is written through a link; --replace touches only run files; one kind of run per folder. */
class RunFolderSafetyTest {
  @TempDir Path tmp;

  private Path precious() throws Exception {
    Path p = tmp.resolve("elsewhere/precious.txt");
    Files.createDirectories(p.getParent());
    Files.writeString(p, "keep me");
    return p;
  }

  @Test
  void aLockThatIsALinkIsRefusedAndItsTargetKept() throws Exception {
    Path target = precious();
    Path dir = Files.createDirectories(tmp.resolve("run"));
    Files.createSymbolicLink(dir.resolve(RunFolder.LOCK), target);
    RunFileDamaged e = assertThrows(RunFileDamaged.class, () -> RunLock.acquire(new RunFolder(dir)));
    assertTrue(e.getMessage().contains("symbolic link"), e.getMessage());
    assertEquals("keep me", Files.readString(target));
  }

  @Test
  void aPortfolioLogThatIsALinkIsRefusedAndItsTargetKept() throws Exception {
    Path target = precious();
    Path dir = Files.createDirectories(tmp.resolve("run"));
    Files.createSymbolicLink(dir.resolve(PortfolioLog.FILE), target);
    assertThrows(RunFileDamaged.class, () -> new PortfolioLog(dir).close());
    assertThrows(RunFileDamaged.class, () -> new RunFolder(dir).refuseLinks());
    assertEquals("keep me", Files.readString(target));
  }

  @Test
  void atomicFilesNeverReplaceALink() throws Exception {
    Path target = precious();
    Path dir = Files.createDirectories(tmp.resolve("run"));
    Path link = Files.createSymbolicLink(dir.resolve(RunFolder.RESULT), target);
    assertThrows(RunFileDamaged.class, () -> AtomicFiles.write(link, "{}"));
    assertTrue(Files.isSymbolicLink(link));
    assertEquals("keep me", Files.readString(target));
    try (var left = Files.list(dir)) {
      assertEquals(1, left.count(), "no temp file left behind");
    }
  }

  @Test
  void replaceRemovesOnlyTheFilesARunWrites() throws Exception {
    Path dir = Files.createDirectories(tmp.resolve("run"));
    for (String f : RunFolder.RUN_FILES) {
      Files.writeString(dir.resolve(f), "x");
    }
    Files.writeString(dir.resolve("notes.txt"), "mine");
    Files.createDirectories(dir.resolve("drafts"));
    new RunFolder(dir).clearForReplace();
    assertEquals("mine", Files.readString(dir.resolve("notes.txt")));
    assertTrue(Files.isDirectory(dir.resolve("drafts")));
    for (String f : RunFolder.RUN_FILES) {
      assertEquals(f.equals(RunFolder.LOCK), Files.exists(dir.resolve(f)), f);
    }
  }

  @Test
  void replaceRefusesAFolderThatDoesNotLookLikeARun() throws Exception {
    Path dir = Files.createDirectories(tmp.resolve("home"));
    Files.writeString(dir.resolve("thesis.tex"), "years of work");
    Files.writeString(dir.resolve(RunFolder.PAGE), "a page of mine");
    RunFileDamaged e = assertThrows(RunFileDamaged.class, () -> new RunFolder(dir).clearForReplace());
    assertTrue(e.getMessage().contains("does not look like a run folder"), e.getMessage());
    assertTrue(Files.exists(dir.resolve(RunFolder.PAGE)));
    assertTrue(Files.exists(dir.resolve("thesis.tex")));
  }

  @Test
  void aFolderHoldsOneKindOfRun() throws Exception {
    Path solve = Files.createDirectories(tmp.resolve("solve"));
    Files.writeString(solve.resolve(RunFolder.MANIFEST), SealedJson.seal("{\"format\":2,\"kind\":\"solve\"}"));
    assertEquals(RunFolder.Kind.SOLVE, new RunFolder(solve).heldKind());
    new RunFolder(solve).claim(RunFolder.Kind.SOLVE);
    assertThrows(RunFileDamaged.class, () -> new RunFolder(solve).claim(RunFolder.Kind.SWEEP));
    Path sweep = Files.createDirectories(tmp.resolve("sweep"));
    Files.writeString(sweep.resolve(RunFolder.SWEEP_JSON), "{}");
    assertThrows(RunFileDamaged.class, () -> new RunFolder(sweep).claim(RunFolder.Kind.SOLVE));
    assertFalse(new RunFolder(tmp.resolve("new")).heldKind() != null);
  }

  @Test
  void aSealedFileIsCheckedAndALegacyOneReadAsBefore() throws Exception {
    String sealed = SealedJson.seal("{\n  \"a\" : 1\n}\n");
    SealedJson.check(sealed, "x.json", "here", false);
    assertEquals(1, Json.compact().readTree(sealed).path("a").asInt(), "still plain JSON");
    String flipped = sealed.replace("\"a\" : 1", "\"a\" : 7");
    assertThrows(RunFileDamaged.class, () -> SealedJson.check(flipped, "x.json", "here", false));
    assertThrows(RunFileDamaged.class, () -> SealedJson.check("{\"a\":1}", "x.json", "here", false));
    SealedJson.check("{\"a\":1}", "x.json", "here", true);
  }
}
