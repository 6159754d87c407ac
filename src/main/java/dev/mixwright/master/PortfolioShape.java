package dev.mixwright.master;

/**
 * The rows both portfolio models (the LP relaxation and the MIP) take before any variant is added:
 * which segment rows choose by the multinomial logit, and whether the objective is the worst of a
 * scenario set's margins. One shape, so that a caller sets it up once for either model.
 */
public interface PortfolioShape {
  /** Segment row s becomes its buyers row with a stay-out. */
  void chooseIn(int s);

  /** The objective becomes the worst of {@code scenarios} margins less the fixed costs. */
  void worstCase(int scenarios);
}
