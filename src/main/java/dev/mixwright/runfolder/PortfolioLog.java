package dev.mixwright.runfolder;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.portfolio.PortfolioEvent;
import dev.mixwright.portfolio.PortfolioListener;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;

/**
 * Appends one JSON object per step of the integer stage to {@code portfolio.jsonl}, flushed at once.
 * Fields: kind ({@code relaxation}, {@code incumbent}, {@code mip}, {@code survivors}, {@code end}),
 * elapsedMs (since the stage began), value, bound, pool, count, note — see {@link PortfolioEvent}.
 */
public final class PortfolioLog implements PortfolioListener, AutoCloseable {
  public static final String FILE = "portfolio.jsonl";

  private final BufferedWriter out;

  public PortfolioLog(Path runDir) throws IOException {
    Files.createDirectories(runDir);
    Path file = runDir.resolve(FILE);
    if (Files.isSymbolicLink(file)) {
      throw new RunFileDamaged(file + " is a symbolic link; mixwright never writes through a link (its target"
          + " would be truncated) — remove it");
    }
    out = Files.newBufferedWriter(file, StandardCharsets.UTF_8, StandardOpenOption.CREATE,
        StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING, LinkOption.NOFOLLOW_LINKS);
  }

  @Override
  public void event(PortfolioEvent e) {
    ObjectNode n = Json.compact().createObjectNode();
    n.put("kind", e.kind().word());
    n.put("elapsedMs", e.elapsedMs());
    Json.putNum(n, "value", e.value());
    Json.putNum(n, "bound", e.bound());
    n.put("pool", e.pool());
    n.put("count", e.count());
    n.put("note", e.note());
    try {
      out.write(Json.compact().writeValueAsString(n));
      out.write('\n');
      out.flush();
    } catch (IOException x) {
      throw new UncheckedIOException(x);
    }
  }

  @Override
  public void close() throws IOException {
    out.close();
  }
}
