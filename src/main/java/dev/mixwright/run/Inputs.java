package dev.mixwright.run;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.catalog.CatalogProblem;
import dev.mixwright.catalog.TableReach;
import dev.mixwright.scenario.Scenarios;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** Reading what the user names on the command line, with errors for people. */
public final class Inputs {
  private Inputs() {}

  public static Catalog catalog(Path file) throws CatalogException {
    return hashedCatalog(file).catalog();
  }

  /** The catalog, its tables allowed where {@code reach} says (the user's choice, never the file's). */
  public static Catalog catalog(Path file, TableReach reach) throws CatalogException {
    return hashedCatalog(file, reach).catalog();
  }

  /** The catalog and the SHA-256 of the bytes it was parsed from (the file is read once). */
  public static CatalogLoader.Hashed hashedCatalog(Path file) throws CatalogException {
    return hashedCatalog(file, TableReach.CATALOG_FOLDER);
  }

  /** As {@link #hashedCatalog(Path)}; a path that is there but no ordinary file is refused by the loader. */
  public static CatalogLoader.Hashed hashedCatalog(Path file, TableReach reach) throws CatalogException {
    if (!Files.exists(file)) {
      throw new InputError("no catalog file at " + file + " — give the path of a .yaml, .yml or .json catalog");
    }
    return CatalogLoader.loadHashed(file, reach);
  }

  /**
   * A scenario file applied to {@code base}; its problems come as one bad-input error listing each
   * with its path (the catalog's own problems keep their own wording).
   */
  public static Catalog withScenario(Catalog base, Path scenarioFile) {
    if (!Files.isRegularFile(scenarioFile)) {
      throw new InputError("no scenario file at " + scenarioFile + " — give the path of a .yaml or .json scenario");
    }
    try {
      return Scenarios.load(scenarioFile, base).applyTo(base);
    } catch (CatalogException e) {
      throw problems("the scenario file " + scenarioFile, e);
    }
  }

  /** A CatalogException from a file other than the catalog, as a bad-input error naming that file. */
  public static InputError problems(String what, CatalogException e) {
    StringBuilder sb = new StringBuilder(what + " has " + e.problems().size()
        + (e.problems().size() == 1 ? " problem:" : " problems:"));
    for (CatalogProblem p : e.problems()) {
      sb.append("\n  ").append(p.path()).append(": ").append(p.message());
    }
    return new InputError(sb.toString());
  }

  public static String sha256(Path file) {
    try (InputStream in = Files.newInputStream(file)) {
      MessageDigest md = MessageDigest.getInstance("SHA-256");
      byte[] buf = new byte[1 << 16];
      for (int n; (n = in.read(buf)) > 0; ) {
        md.update(buf, 0, n);
      }
      return HexFormat.of().formatHex(md.digest());
    } catch (IOException e) {
      throw new InputError("cannot read " + file + ": " + e.getMessage());
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }

  /**
   * A minimum lot above all the demand one variant could meet (every segment's demand times its
   * maxShare, added up) leaves no variant to offer: the integer stage would "prove" an empty range.
   * Refused in words before anything is solved.
   */
  public static void refuseUnreachableMinLot(Catalog catalog) {
    catalog.portfolio().ifPresent(p -> {
      double most = 0;
      for (dev.mixwright.catalog.Segment s : catalog.segments()) {
        most += s.demand() * s.maxShare();
      }
      if (p.minLot() > most * (1 + 1e-9)) {
        throw new InputError(String.format(java.util.Locale.ROOT, "portfolio.minLot: %,.0f units, but one variant can"
            + " sell at most %,.0f (each segment's demand times its maxShare, added up), so no variant could be"
            + " offered and the range would be empty — lower minLot to %,.0f or less", p.minLot(), most,
            Math.floor(most)));
      }
    });
  }
}
