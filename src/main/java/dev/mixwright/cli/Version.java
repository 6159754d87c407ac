package dev.mixwright.cli;

import picocli.CommandLine;

/** Version from the jar manifest, or "development" when run from classes. */
final class Version implements CommandLine.IVersionProvider {
  @Override
  public String[] getVersion() {
    String v = Main.class.getPackage().getImplementationVersion();
    return new String[] {"mixwright " + (v == null ? "development" : v)};
  }
}
