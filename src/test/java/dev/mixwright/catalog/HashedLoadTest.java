package dev.mixwright.catalog;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@link CatalogLoader#loadHashed}: one read gives both the catalog and the hash of its bytes. */
class HashedLoadTest {
  @TempDir Path dir;

  @Test
  void theHashIsOfTheBytesThatWereParsed() throws Exception {
    Path f = dir.resolve("c.yaml");
    byte[] bytes = Files.readAllBytes(Path.of("catalogs/heatpump-starter.yaml"));
    Files.write(f, bytes);
    CatalogLoader.Hashed h = CatalogLoader.loadHashed(f);
    assertEquals(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes)), h.sha256());
    assertEquals(CatalogLoader.parse(new String(bytes, StandardCharsets.UTF_8), "c.yaml", dir), h.catalog());
  }

  @Test
  void bytesThatAreNotUtf8AreOneProblemNamingTheFile() throws Exception {
    Path f = dir.resolve("latin.yaml");
    Files.write(f, "format: 1\nname: K\u00e4lte\n".getBytes(StandardCharsets.ISO_8859_1));
    CatalogException e = assertThrows(CatalogException.class, () -> CatalogLoader.loadHashed(f));
    assertTrue(e.getMessage().contains("not UTF-8"), e.getMessage());
  }
}
