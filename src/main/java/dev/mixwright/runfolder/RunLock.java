package dev.mixwright.runfolder;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.StandardOpenOption;

/**
 * An operating-system lock on a run folder's {@code .lock} file, held while a process writes the run,
 * so that a resume started while the run is still going refuses instead of writing the same column
 * log. The system drops the lock when the process dies, even by {@code kill -9}, so a crash never
 * leaves a stale lock behind.
 */
public final class RunLock implements AutoCloseable {
  private final FileChannel channel;
  private final FileLock lock;

  private RunLock(FileChannel channel, FileLock lock) {
    this.channel = channel;
    this.lock = lock;
  }

  /** Takes the lock, or throws an IOException saying that another process holds it. */
  public static RunLock acquire(RunFolder folder) throws IOException {
    Files.createDirectories(folder.dir());
    folder.refuseLinks();
    FileChannel ch = FileChannel.open(folder.lock(), StandardOpenOption.CREATE, StandardOpenOption.READ,
        StandardOpenOption.WRITE, LinkOption.NOFOLLOW_LINKS);
    FileLock lock;
    try {
      lock = ch.tryLock();
    } catch (OverlappingFileLockException e) {
      lock = null;
    }
    if (lock == null) {
      String holder = "";
      try {
        holder = new String(Files.readAllBytes(folder.lock()), StandardCharsets.UTF_8).strip();
      } catch (IOException ignored) {
        // the message goes without the process id
      }
      ch.close();
      throw new IOException("another mixwright process is working on " + folder.dir()
          + (holder.isEmpty() ? "" : " (process " + holder + ")")
          + "; wait for it to end, or stop it with Ctrl-C or kill, then try again");
    }
    ch.truncate(0);
    ch.write(ByteBuffer.wrap(Long.toString(ProcessHandle.current().pid()).getBytes(StandardCharsets.UTF_8)), 0);
    return new RunLock(ch, lock);
  }

  /**
   * Whether a process is working on the run now (it holds the lock): a page or a comparison made
   * meanwhile would show a run that is not finished. Takes and drops the lock to find out; never
   * creates the lock file.
   */
  public static boolean busy(RunFolder folder) {
    if (!Files.isRegularFile(folder.lock(), LinkOption.NOFOLLOW_LINKS)) {
      return false;
    }
    try (FileChannel ch = FileChannel.open(folder.lock(), StandardOpenOption.READ, StandardOpenOption.WRITE,
        LinkOption.NOFOLLOW_LINKS)) {
      FileLock l = ch.tryLock();
      if (l == null) {
        return true;
      }
      l.release();
      return false;
    } catch (OverlappingFileLockException e) {
      return true;
    } catch (IOException e) {
      return false;
    }
  }

  @Override
  public void close() throws IOException {
    try {
      lock.release();
    } finally {
      channel.close();
    }
  }
}
