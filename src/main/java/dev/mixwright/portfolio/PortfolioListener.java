package dev.mixwright.portfolio;

/** Receives the integer stage's steps as they happen, on the solving thread. */
public interface PortfolioListener {
  void event(PortfolioEvent e);

  static PortfolioListener none() {
    return e -> {};
  }
}
