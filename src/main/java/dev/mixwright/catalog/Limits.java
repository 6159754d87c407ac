package dev.mixwright.catalog;

/**
 * The sizes and ranges a catalog must stay within. Each is far beyond what a real catalog reaches
 * (the demo range has 17 groups of at most 9 options, 6 resources, 18 rules, 4 segments, figures
 * below 10^6) and low enough that reading, checking and solving what is below them fits in a
 * 512 MB heap and takes seconds. Beyond a limit the catalog is refused in words, naming the limit;
 * the README lists them all under "Limits".
 */
public final class Limits {
  /** Largest catalog file (YAML or JSON), and largest scenario or sweep file, in bytes. */
  public static final long MAX_FILE_BYTES = 8L << 20;

  /** Largest option or utility table (CSV) a catalog names, in bytes. */
  public static final long MAX_TABLE_BYTES = 8L << 20;

  public static final int MAX_RESOURCES = 1_000;
  public static final int MAX_GROUPS = 10_000;
  public static final int MAX_OPTIONS_PER_GROUP = 5_000;

  /** Options of all groups together (each price point counts). */
  public static final int MAX_OPTIONS = 50_000;

  public static final int MAX_PRICE_POINTS = 100;
  public static final int MAX_RULES = 20_000;
  public static final int MAX_SEGMENTS = 1_000;

  /** Rows of one utility table, and entries of one inline {@code utility} or {@code value}. */
  public static final int MAX_UTILITY_ROWS = 100_000;

  /**
   * Longest line of a YAML file, in characters. SnakeYAML copies its look-ahead window each time it
   * reads on inside one token or comment, so a token of n characters costs O(n^2): a 3 MB id took
   * 10-30 s to parse (measured). 10,000 is ten times the longest label and parses in milliseconds.
   */
  public static final int MAX_YAML_LINE = 10_000;

  public static final int MAX_ID_LENGTH = 100;
  public static final int MAX_TEXT_LENGTH = 1_000;

  /** Largest |figure| of money: prices, costs, tooling, values, introduction cost. */
  public static final double MAX_MONEY = 1e9;

  /** Largest capacity, demand, number of buyers or lot. */
  public static final double MAX_QUANTITY = 1e9;

  /** Uses per unit are 0 or between these. */
  public static final double MIN_USE = 1e-6;

  public static final double MAX_USE = 1e6;

  /** Largest |part-worth|, |stayOut| and |priceWeight|. */
  public static final double MAX_UTILITY = 1e3;

  private Limits() {}

  /**
   * Null when {@code x} is a sum of money a catalog may hold (|x| at most {@link #MAX_MONEY}), else the
   * problem in words; for figures made outside a catalog file (a scenario's changes).
   */
  public static String moneyProblem(double x) {
    return Checks.figureProblem(x, Checks.Figure.SIGNED_MONEY, "give a number");
  }

  /** As {@link #moneyProblem}, for quantities (capacities, demand, lots), at most {@link #MAX_QUANTITY}. */
  public static String quantityProblem(double x) {
    return Checks.figureProblem(x, Checks.Figure.SIGNED_QUANTITY, "give a number");
  }

  /** A byte count as people read it: 8 MB. */
  static String bytes(long n) {
    return n % (1L << 20) == 0 ? (n >> 20) + " MB" : n + " bytes";
  }
}
