package dev.mixwright.colgen;

/** What one run of the loop spent its effort on, counted as it goes; {@link #snapshot} freezes it. */
final class LoopCounters {
  private int masterSolves;
  private long masterNanos;
  private int exactCalls;
  private long exactNanos;
  private int heuristicCalls;
  private long heuristicNanos;
  private int exactRounds;
  private int mispricings;
  private int retired;
  private int revived;

  void masterSolved(long nanos) {
    masterSolves++;
    masterNanos += nanos;
  }

  void exactPriced(long nanos) {
    exactCalls++;
    exactNanos += nanos;
  }

  void heuristicPriced(long nanos) {
    heuristicCalls++;
    heuristicNanos += nanos;
  }

  void exactRound() {
    exactRounds++;
  }

  void mispriced() {
    mispricings++;
  }

  void retired() {
    retired++;
  }

  void revived() {
    revived++;
  }

  RunStats snapshot() {
    return new RunStats(masterSolves, masterNanos, exactCalls, exactNanos, heuristicCalls, heuristicNanos,
        exactRounds, mispricings, retired, revived);
  }
}
