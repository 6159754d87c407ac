package dev.mixwright.report;

import com.fasterxml.jackson.annotation.JsonInclude.Include;
import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.annotation.JsonValue;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectReader;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.json.JsonMapper;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.portfolio.PortfolioStatus;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.runfolder.RunFileDamaged;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.runfolder.SealedJson;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * {@code result.json} as a record tree, the one model that both writes the file and reads it back
 * (Jackson data binding on records, properties in component order). Field names and shape are
 * PRODUCT.md's: a figure that is not finite (a bound before the first exact round) is written as
 * null; fields marked non-null are left out when absent. Unknown fields are ignored on reading,
 * so a newer file still reads.
 */
public record RunResult(
    RunStatus status,
    @JsonInclude(Include.NON_EMPTY) String stopReason,
    double objective,
    Double bound,
    Double gap,
    int iterations,
    int columnsGenerated,
    int columnsInMaster,
    String buildableVariants,
    @JsonInclude(Include.NON_NULL) String buildableVariantsAtMost,
    @JsonInclude(Include.NON_NULL) String buildableVariantsAtLeast,
    @JsonInclude(Include.NON_NULL) CountEstimate buildableVariantsEstimate,
    long elapsedMs,
    CatalogRef catalog,
    String pricer,
    List<Offer> offers,
    List<ResourceRow> resources,
    List<SegmentRow> segments,
    List<Round> rounds,
    @JsonInclude(Include.NON_NULL) Integer sessions,
    @JsonInclude(Include.NON_NULL) String portfolioPending,
    @JsonInclude(Include.NON_NULL) Portfolio portfolio) {

  /** An absent stopReason reads as empty, as the writer leaves an empty one out. */
  public RunResult {
    stopReason = stopReason == null ? "" : stopReason;
    offers = offers == null ? List.of() : offers;
    resources = resources == null ? List.of() : resources;
    segments = segments == null ? List.of() : segments;
    rounds = rounds == null ? List.of() : rounds;
  }

  /** A sampled estimate of the number of buildable variants, when no exact count was reached. */
  public record CountEstimate(double value, double standardError, long samples) {}

  public record CatalogRef(String name, String file, String sha256, String currency, String period) {}

  /**
   * {@code price}: what the segment pays per unit (the chosen price points plus its value of the
   * options; absent in files of earlier versions). For a segment that chooses, {@code share} is the offer's share of the segment's
   * buyers and {@code attraction} its w = exp(u − stayOut); both are absent for a fixed segment.
   */
  public record Offer(String segment, Map<String, String> options, double quantity, double unitMargin,
      double reducedCost, boolean atLimit, double contribution, @JsonInclude(Include.NON_NULL) Double price,
      @JsonInclude(Include.NON_NULL) Double share, @JsonInclude(Include.NON_NULL) Double attraction) {

    public Offer {
      options = options == null ? Map.of() : options;
      unitMargin = Figures.catalogSum(unitMargin);
    }

    /** An offer of a fixed segment, without its price. */
    public Offer(String segment, Map<String, String> options, double quantity, double unitMargin,
        double reducedCost, boolean atLimit, double contribution) {
      this(segment, options, quantity, unitMargin, reducedCost, atLimit, contribution, null, null, null);
    }
  }

  public record ResourceRow(String id, double capacity, double used, Double shadowPrice, boolean binding) {}

  /**
   * For a segment that chooses, {@code buyers} (equal to {@code demand}) and {@code stayOut}, the
   * buyers who buy none of the offers, are present and {@code shadowPrice} is the dual of its buyers
   * row (free in sign); both are absent for a fixed segment.
   */
  public record SegmentRow(String id, double demand, double sold, Double shadowPrice,
      @JsonInclude(Include.NON_NULL) Double buyers, @JsonInclude(Include.NON_NULL) Double stayOut) {

    /** A segment with a fixed demand. */
    public SegmentRow(String id, double demand, double sold, Double shadowPrice) {
      this(id, demand, sold, shadowPrice, null, null);
    }

    /** True for a segment that chooses by multinomial logit. */
    public boolean chooses() {
      return buyers != null;
    }
  }

  public record Round(int iteration, double objective, Double bound, Double gap, int columns, int added,
      boolean exactPricing, long elapsedMs) {}

  /** The integer stage's section. */
  public record Portfolio(
      PortfolioStatus status,
      @JsonInclude(Include.NON_EMPTY) String reason,
      double value,
      Double bound,
      Double gap,
      List<PortfolioVariant> variants,
      double introductionCosts,
      double toolingCosts,
      @JsonInclude(Include.NON_NULL) Map<String, Double> toolingPaid,
      Terms terms,
      Double lpBound,
      @JsonInclude(Include.NON_NULL) Relaxation relaxation,
      Proof proof,
      Solver solver,
      long elapsedMs,
      @JsonInclude(Include.NON_NULL) List<RangeVariant> kept,
      @JsonInclude(Include.NON_NULL) List<RangeVariant> dropped,
      @JsonInclude(Include.NON_NULL) List<RangeVariant> added,
      @JsonInclude(Include.NON_NULL) Double discontinueCosts,
      @JsonInclude(Include.NON_NULL) Double currentRangeValue,
      @JsonInclude(Include.NON_NULL) String aim,
      @JsonInclude(Include.NON_NULL) List<ScenarioRow> scenarios,
      @JsonInclude(Include.NON_NULL) HoldOut holdOut) {

    public Portfolio {
      reason = reason == null ? "" : reason;
      variants = variants == null ? List.of() : variants;
    }

    /** A portfolio of a catalog without a current range. */
    public Portfolio(PortfolioStatus status, String reason, double value, Double bound, Double gap,
        List<PortfolioVariant> variants, double introductionCosts, double toolingCosts, Map<String, Double> toolingPaid,
        Terms terms, Double lpBound, Relaxation relaxation, Proof proof, Solver solver, long elapsedMs) {
      this(status, reason, value, bound, gap, variants, introductionCosts, toolingCosts, toolingPaid, terms, lpBound,
          relaxation, proof, solver, elapsedMs, null, null, null, null, null, null, null, null);
    }

    /** This section with the range's scenarios: {@code aim} (mean or worst), one row per scenario, the hold-out check. */
    public Portfolio withScenarios(String aim, List<ScenarioRow> rows, HoldOut check) {
      return new Portfolio(status, reason, value, bound, gap, variants, introductionCosts, toolingCosts, toolingPaid,
          terms, lpBound, relaxation, proof, solver, elapsedMs, kept, dropped, added, discontinueCosts,
          currentRangeValue, aim, rows, check);
    }
  }

  /**
   * One scenario of a range chosen across a set: its normalised weight, what the range earns in it
   * ({@code value}), the best range for it alone ({@code bestAlone}, with {@code bestAloneStatus}
   * proven or heuristic) and {@code regret} = bestAlone − value.
   */
  public record ScenarioRow(String id, double weight, double value, double bestAlone, double regret,
      PortfolioStatus bestAloneStatus) {}

  /**
   * The chosen range evaluated on scenarios it was not chosen on ({@code source}: the file): how many,
   * how many cannot meet the lots ({@code lotsMissed}, left out of the figures), and the weighted mean
   * and 5 % / 95 % quantiles of its value.
   */
  public record HoldOut(String source, int scenarios, int lotsMissed, Double mean, Double p5, Double p95,
      long elapsedMs) {}

  /** A variant of the current range's comparison: its options, and its sales where it is offered. */
  public record RangeVariant(Map<String, String> options, @JsonInclude(Include.NON_NULL) Map<String, Double> sales) {}

  public record PortfolioVariant(Map<String, String> options, Map<String, Double> sales, double units,
      double margin, double introductionCost) {

    public PortfolioVariant {
      options = options == null ? Map.of() : options;
      sales = sales == null ? Map.of() : sales;
    }
  }

  /** {@code maxVariants} and {@code variantCap} are null when unlimited. */
  public record Terms(double introductionCost, Integer maxVariants, double minLot, Integer variantCap) {}

  public record Relaxation(double objective, Double bound, boolean converged, int rounds, Double boundAtLpPrices,
      Prices prices, Double variantLimitPrice, Double boundAtVariantLimitPrice, long elapsedMs) {}

  public record Prices(Map<String, Double> resources, Map<String, Double> segments) {}

  /** {@code tree} is null when the branch-and-price tree did not run (and in result.json files written before it). */
  public record Proof(Double survivorThreshold, int survivorsAdded, boolean survivorsComplete, int poolVariants,
      @JsonInclude(Include.NON_NULL) Tree tree) {}

  /** The branch-and-price tree: nodes solved, nodes left open when it stopped (0 once it closed), workers. */
  public record Tree(long nodesSolved, int nodesOpen, int workers) {}

  public record Solver(String engine, int mipSolves, boolean lastMipOptimal) {}

  public RunResult withSessions(int n) {
    return new RunResult(status, stopReason, objective, bound, gap, iterations, columnsGenerated, columnsInMaster,
        buildableVariants, buildableVariantsAtMost, buildableVariantsAtLeast, buildableVariantsEstimate, elapsedMs, catalog, pricer, offers, resources, segments, rounds,
        n, portfolioPending, portfolio);
  }

  public RunResult withPortfolioPending(String why) {
    return new RunResult(status, stopReason, objective, bound, gap, iterations, columnsGenerated, columnsInMaster,
        buildableVariants, buildableVariantsAtMost, buildableVariantsAtLeast, buildableVariantsEstimate, elapsedMs, catalog, pricer, offers, resources, segments, rounds,
        sessions, why, portfolio);
  }

  /** This result with the integer stage's section; {@code elapsedMs} then covers both stages. */
  public RunResult withPortfolio(Portfolio p, long totalElapsedMs) {
    return new RunResult(status, stopReason, objective, bound, gap, iterations, columnsGenerated, columnsInMaster,
        buildableVariants, buildableVariantsAtMost, buildableVariantsAtLeast, buildableVariantsEstimate, totalElapsedMs, catalog, pricer, offers, resources, segments,
        rounds, sessions, portfolioPending, p);
  }

  /** The proven bound, +∞ when none is proven yet. */
  public double boundOrInfinity() {
    return bound == null ? Double.POSITIVE_INFINITY : bound;
  }

  /** The gap, +∞ when no bound is proven yet. */
  public double gapOrInfinity() {
    return gap == null ? Double.POSITIVE_INFINITY : gap;
  }

  /** The result.json words of {@link RunStatus} and {@link PortfolioStatus}, both ways. */
  abstract static class StatusWords {
    @JsonValue
    public abstract String word();
  }

  private static final ObjectMapper MAPPER = JsonMapper.builder()
      .addMixIn(RunStatus.class, StatusWords.class)
      .addMixIn(PortfolioStatus.class, StatusWords.class)
      .enable(SerializationFeature.INDENT_OUTPUT)
      .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
      .build();
  private static final ObjectReader READER = MAPPER.readerFor(RunResult.class);
  /** The mapper's writer that leaves the stream it writes to open (the checksum follows). */
  private static final com.fasterxml.jackson.databind.ObjectWriter STREAM_WRITER = MAPPER.writer()
      .without(com.fasterxml.jackson.core.JsonGenerator.Feature.AUTO_CLOSE_TARGET);

  public String toJson() {
    try {
      return MAPPER.writeValueAsString(this) + "\n";
    } catch (IOException e) {
      throw new IllegalStateException("a result always serializes", e);
    }
  }

  /** The text of result.json; the exception's message says in words what is wrong. */
  public static RunResult parse(String text, String where) throws IOException {
    RunResult r;
    try {
      r = READER.readValue(text);
    } catch (JsonProcessingException e) {
      throw new RunFileDamaged(where + " is not a result this version reads (" + e.getOriginalMessage() + ")");
    }
    if (r == null || r.status() == null || r.catalog() == null) {
      throw new RunFileDamaged(where + " lacks the status or catalog of a result");
    }
    return r;
  }

  /**
   * Reads result.json after checking its checksum ({@link SealedJson}; a folder written before
   * checksums is read unchecked). A damaged file is a {@link RunFileDamaged} that says so.
   */
  public static RunResult read(Path runDir) throws IOException {
    Path f = runDir.resolve(ResultWriter.FILE);
    if (!Files.exists(f, LinkOption.NOFOLLOW_LINKS)) {
      throw new RunFileDamaged("no " + ResultWriter.FILE + " in " + runDir
          + " — is this a run folder made by 'mixwright solve --out'?");
    }
    return parse(new RunFolder(runDir).readSealed(ResultWriter.FILE), f.toString());
  }

  /**
   * Writes result.json atomically, its checksum as the last field: the bytes of {@link #toJson()}
   * sealed, streamed to the file rather than built as one string.
   */
  public void write(Path runDir) throws IOException {
    AtomicFiles.write(runDir.resolve(ResultWriter.FILE),
        out -> SealedJson.write(out, body -> STREAM_WRITER.writeValue(body, this)));
  }
}
