package dev.mixwright.cli;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogGenerator;
import dev.mixwright.colgen.ChoiceEntry;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.RunStats;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.master.FullLp;
import dev.mixwright.master.Natives;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.pricing.CpSatPricer;
import dev.mixwright.pricing.HeuristicPricer;
import dev.mixwright.pricing.PricedVariant;
import dev.mixwright.pricing.Pricer;
import dev.mixwright.pricing.PricingOutcome;
import dev.mixwright.pricing.PricingQuery;
import dev.mixwright.pricing.ReducedCosts;
import dev.mixwright.runfolder.AtomicFiles;
import dev.mixwright.space.SpaceCount;
import dev.mixwright.space.SpaceCounter;
import dev.mixwright.space.VariantEnumerator;
import dev.mixwright.space.VariantKey;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.math.BigInteger;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * The benchmark of docs/performance.md: on the same generated catalogs, the full LP (every column
 * listed, one GLOP solve) against column generation, the exact pricers against each other on the
 * same duals, and each acceleration of the loop switched on and off. Every ratio comes from one run
 * in one JVM; memory is measured per phase after {@code System.gc()}. Then the generator's families
 * ({@link FamilyBench}): check and solve as a user runs them, against the code before issue 11 and
 * against HiGHS on the full LP of smaller catalogs.
 */
@Command(
    name = "bench",
    description = {
      "Measures column generation against solving the whole LP with every column listed.",
      "Runs on generated catalogs and prints the tables of docs/performance.md (Markdown).",
      "Takes minutes; --quick runs the small sizes only and gives each family's solve 5 s.",
      "Ends with the generator's families (--families): check, time to round 1, column generation and the count.",
      "With --integer, then the integer stage on the demos, 10^6 and 10^12 variants, each run with -Xmx512m."
    })
final class BenchCommand extends SubCommand {
  @Option(names = "--full-columns", split = ",", paramLabel = "E",
      description = "sizes for the full-LP comparison, as powers of ten of the column count (default 4,5,6)")
  List<Integer> fullColumns;

  @Option(names = "--space-sizes", split = ",", paramLabel = "E",
      description = "sizes for column generation alone, as powers of ten of buildable variants (default 9,15,25)")
  List<Integer> spaceSizes;

  @Option(names = "--quick", description = "small sizes only (columns 10^4 and 10^5, variants 10^9) and a short ablation")
  boolean quick;

  @Option(names = "--skip-ablation", description = "leave out the runs with each acceleration on and off")
  boolean skipAblation;

  @Option(names = "--families", split = ",", paramLabel = "NAME",
      description = "families of the generator for the section on check, round 1 and the count (default: all seven;"
          + " 'none' leaves the section out)")
  List<String> families;

  @Option(names = "--only-families", description = "run only the section on the generator's families")
  boolean onlyFamilies;

  @Option(names = "--integer", description = "end with the integer stage: the demos of ./catalogs, a generated catalog"
      + " of about 10^6 variants and the families (--families) at about 10^12, each solved with -Xmx512m and the"
      + " default limits (about a minute and a half each)")
  boolean integer;

  @Option(names = "--only-integer", description = "run only the section on the integer stage")
  boolean onlyInteger;

  @Option(names = "--seed", paramLabel = "X", defaultValue = "1", description = "seed of the generated catalogs (default ${DEFAULT-VALUE})")
  long seed;

  @Option(names = "--pricer-repeats", paramLabel = "N", defaultValue = "3", converter = Converters.PositiveCount.class,
      description = "timed repetitions of each pricer's exact round; the median is shown (default ${DEFAULT-VALUE})")
  int repeats;

  @Option(names = "--out", paramLabel = "FILE", description = "also write the tables to this Markdown file")
  Path outFile;

  @Option(names = "--replace", description = "overwrite --out FILE if it exists")
  boolean replace;

  private PrintWriter out;
  private final StringBuilder report = new StringBuilder();

  /** One generated instance, with the spec that made it. */
  record Instance(String label, CatalogGenerator.Spec spec, VariantSpace space, SpaceCount variants,
      BigInteger columns) {}

  @Override
  public Integer call() throws Exception {
    out = spec.commandLine().getOut();
    if (outFile != null && Files.exists(outFile) && !replace) {
      throw new UserError(outFile + " already exists; choose another --out file, or add --replace to overwrite it");
    }
    List<Integer> full = fullColumns != null ? fullColumns : quick ? List.of(4, 5) : List.of(4, 5, 6);
    List<Integer> spaces = spaceSizes != null ? spaceSizes : quick ? List.of(9) : List.of(9, 15, 25);
    List<CatalogGenerator.Family> chosen = families();
    if (onlyFamilies && onlyInteger) {
      throw new UserError("--only-families and --only-integer each run one section; give one of them, or --integer"
          + " with --only-families for both");
    }
    if (onlyFamilies && chosen.isEmpty()) {
      throw new UserError("--only-families with --families none leaves nothing to measure; name a family");
    }
    Natives.load();
    Runtime rt = Runtime.getRuntime();
    line("Machine: " + rt.availableProcessors() + " cores, JVM max heap " + mib(rt.maxMemory()) + " MiB, "
        + System.getProperty("java.vm.name") + " " + System.getProperty("java.version") + ", "
        + System.getProperty("os.name") + " " + System.getProperty("os.arch") + ".");
    line("Settings of column generation: " + describe(SolveSettings.defaults()) + ", pricer bnb.");
    line("");
    if (!onlyFamilies && !onlyInteger) {
      classicSections(full, spaces);
    }
    if (!chosen.isEmpty() && !onlyInteger) {
      new FamilyBench(this::line, this::note, seed, quick ? FamilyBench.Limits.QUICK : FamilyBench.Limits.FULL)
          .run(chosen);
    }
    if (integer || onlyInteger) {
      Path demos = Path.of("catalogs");
      if (!Files.isDirectory(demos)) {
        note("integer stage: no ./catalogs here, so the demos are left out (run bench from the project's folder)");
      }
      new IntegerBench(this::line, this::note, seed).run(chosen, demos);
    }
    if (outFile != null) {
      AtomicFiles.write(outFile, report.toString());
    }
    return ExitCodes.OK;
  }

  /** The families named by --families (all seven when not given, none for 'none'). */
  private List<CatalogGenerator.Family> families() {
    if (families == null) {
      return List.of(CatalogGenerator.Family.values());
    }
    if (families.size() == 1 && families.get(0).trim().equalsIgnoreCase("none")) {
      return List.of();
    }
    List<CatalogGenerator.Family> out = new ArrayList<>();
    for (String w : families) {
      try {
        out.add(CatalogGenerator.Family.of(w.trim()));
      } catch (IllegalArgumentException e) {
        throw new UserError("--families: " + e.getMessage() + ", or none");
      }
    }
    return out;
  }

  /** The sections that came before the families: full LP, pricers, choosing segments, ablation. */
  private void classicSections(List<Integer> full, List<Integer> spaces) {
    List<Instance> instances = new ArrayList<>();
    for (int e : full) {
      instances.add(byColumns(e));
    }
    List<Instance> large = new ArrayList<>();
    for (int e : spaces) {
      large.add(byVariants(e));
    }

    // Warm-up, untimed: the first calls of each path pay for class loading and the JIT.
    Instance warm = instance("warm-up", CatalogGenerator.Spec.of(4, 5, 20, 6, 8, seed + 1));
    fullLp(warm);
    colgen(warm, SolveSettings.defaults());
    pricerRound(warm, colgen(warm, SolveSettings.defaults()).outcome, Double.NEGATIVE_INFINITY, "", false);

    line("## Full LP against column generation");
    line("");
    line("| instance | buildable variants | columns | (a) full LP build + solve | (b) column generation | ratio a/b "
        + "| objective (a) | objective (b) | rel. diff | iterations (b) | columns generated (b) | peak heap (a) | peak heap (b) "
        + "| simplex iterations (a) |");
    line("|---|---|---|---|---|---|---|---|---|---|---|---|---|---|");
    List<SolveOutcome> outcomes = new ArrayList<>();
    List<Instance> all = new ArrayList<>(instances);
    all.addAll(large);
    for (Instance in : all) {
      note("full LP against column generation: " + in.label);
      boolean withFull = instances.contains(in);
      FullRun a = withFull ? fullLp(in) : null;
      CgRun b = colgen(in, SolveSettings.defaults());
      outcomes.add(b.outcome);
      double rel = a == null ? Double.NaN : Math.abs(a.objective - b.outcome.result().value()) / Math.max(1, Math.abs(a.objective));
      line(String.format(Locale.ROOT, "| %s | %s | %s | %s | %s | %s | %s | %s | %s | %d | %d | %s | %s | %s |",
          in.label, sci(in.variants.value()), sci(in.columns),
          a == null ? "–" : secs(a.buildNanos + a.solveNanos) + " (" + secs(a.buildNanos) + " + " + secs(a.solveNanos) + ")",
          secs(b.nanos) + " (" + b.outcome.status().word() + ", gap " + sci(b.outcome.result().gap()) + ")",
          a == null ? "–" : String.format(Locale.ROOT, "%.1f", (double) (a.buildNanos + a.solveNanos) / b.nanos),
          a == null ? "–" : money(a.objective), money(b.outcome.result().value()),
          a == null ? "–" : sci(rel),
          b.outcome.iterations(), b.outcome.columnsGenerated(),
          a == null ? "–" : mib(a.peakHeap) + " MiB", mib(b.peakHeap) + " MiB",
          a == null ? "–" : Long.toString(a.simplexIterations)));
      out.flush();
    }
    line("");
    line("Instances: " + specs(all) + ".");
    line("");
    choicePairs(large);

    line("## Exact pricers on the same duals");
    line("");
    line("One exact round, every segment priced for the " + SolveSettings.DEFAULT_PER_ROUND
        + " best columns outside the master, by both pricers on the same query. Mid-run: the master's"
        + " duals after half the rounds of the default run, columns of reduced cost above 0 wanted."
        + " Final: the final duals, the best columns whatever their sign (so there is a best reduced"
        + " cost to compare). Median of " + repeats + " timed rounds after one untimed warm-up round.");
    line("");
    line("| instance | round | bnb per round | cpsat per round | ratio cpsat/bnb | same k best reduced costs | best reduced cost |");
    line("|---|---|---|---|---|---|---|");
    for (int i = 0; i < all.size(); i++) {
      Instance in = all.get(i);
      note("pricers: " + in.label);
      int half = Math.max(1, outcomes.get(i).iterations() / 2);
      SolveOutcome mid = colgen(in, SolveSettings.defaults().withLimits(0, half)).outcome;
      pricerRound(in, mid, 0.0, "mid-run (after " + half + " rounds)", true);
      pricerRound(in, outcomes.get(i), Double.NEGATIVE_INFINITY, "final", true);
      out.flush();
    }
    line("");

    if (!skipAblation) {
      List<Instance> subjects = new ArrayList<>();
      if (!instances.isEmpty()) {
        subjects.add(instances.get(instances.size() - 1));
      }
      subjects.addAll(large);
      ablation(subjects);
    }
  }

  /** Wall time allowed to each run of a choosing catalog: the entry rules measured may not finish. */
  private static final long CHOICE_LIMIT_MS = 120_000;

  /**
   * The same generated catalog with fixed demand and with every segment choosing (part-worths of
   * spread 3 utils, {@code generate --choice-spread 3}): the time to prove each LP optimum and the
   * ratio, measured in this run (docs/choice.md), on a 28,547-variant catalog and on the first large
   * instance (10^9 variants by default). On the small pair the choosing catalog also runs with the
   * entry rule used before {@link ChoiceEntry#GROWING}; every choosing run stops at {@link
   * #CHOICE_LIMIT_MS}.
   */
  private void choicePairs(List<Instance> large) {
    note("segments that choose against fixed demand");
    line("## Segments that choose against fixed demand");
    line("");
    line("Each choosing run is limited to " + CHOICE_LIMIT_MS / 1000 + " s; the ratio is that of the times to"
        + " prove each LP optimum, measured in this run.");
    line("");
    line("| catalog | buildable variants | entry of choosing columns | time | rounds | columns | sold (variant, segment) pairs | objective | ratio to fixed |");
    line("|---|---|---|---|---|---|---|---|---|");
    List<Instance> fixedOnes = new ArrayList<>();
    fixedOnes.add(instance("28,547 variants", CatalogGenerator.Spec.of(6, 6, 8, 4, 10, seed)));
    if (!large.isEmpty()) {
      fixedOnes.add(large.get(0));
    }
    for (Instance fixed : fixedOnes) {
      Catalog c = CatalogGenerator.choosing(CatalogGenerator.generate(fixed.spec()), seed, 3.0);
      Instance choosing = new Instance(fixed.label(), fixed.spec(), new VariantSpace(c), fixed.variants(), fixed.columns());
      CgRun f = colgen(fixed, SolveSettings.defaults());
      pairLine(fixed, "fixed demand", f, f.nanos);
      // the earlier entry rule only on the small pair: on the large one it runs into the limit
      List<ChoiceEntry> entries = fixed == fixedOnes.get(0) ? List.of(ChoiceEntry.RATE_SEARCH, ChoiceEntry.DEFAULT)
          : List.of(ChoiceEntry.DEFAULT);
      for (ChoiceEntry entry : entries) {
        note("segments that choose: " + fixed.label() + ", " + entry);
        CgRun r = colgen(choosing, SolveSettings.defaults().withLimits(CHOICE_LIMIT_MS, 0), entry);
        pairLine(choosing, "segments that choose, " + entry.name().toLowerCase(Locale.ROOT).replace('_', ' ')
            + (entry == ChoiceEntry.DEFAULT ? " (default)" : ""), r, f.nanos);
      }
      line("");
      line(String.format(Locale.ROOT, "%s: `generate --groups %d --options %d --resources %d --segments %d --rules %d"
          + " --seed %d`, with and without `--choice-spread 3`.", fixed.label(), fixed.spec().groups(),
          fixed.spec().options(), fixed.spec().resources(), fixed.spec().segments(), fixed.spec().rules(),
          fixed.spec().seed()));
      line("");
      out.flush();
    }
  }

  private void pairLine(Instance in, String kind, CgRun r, long fixedNanos) {
    long sold = java.util.Arrays.stream(r.outcome.master().x()).filter(x -> x > 1e-6).count();
    line(String.format(Locale.ROOT, "| %s | %s | %s | %s (%s, gap %s) | %d | %d | %d | %s | %.1f |", in.label(),
        sci(in.variants().value()), kind, secs(r.nanos), r.outcome.status().word(), sci(r.outcome.result().gap()),
        r.outcome.iterations(), r.outcome.master().columns().size(), sold, money(r.outcome.result().value()),
        (double) r.nanos / fixedNanos));
    out.flush();
  }

  // ---- instances -------------------------------------------------------------------------

  /**
   * Full-LP family: 20 resources, 6 segments, 3 rules per group, 4 to 8 options per group; groups
   * and options picked so that the column count is closest to 10^exponent.
   */
  private Instance byColumns(int exponent) {
    return pick("columns 1e" + exponent, exponent, true, 4, 8, (g, k) -> CatalogGenerator.Spec.of(g, k, 20, 6, 3 * g, seed));
  }

  /**
   * Large family: 20 resources, 6 segments, 4 rules per power of ten of the space (100 at 10^25),
   * 6 to 10 options per group; groups and options picked so that the buildable variants are
   * closest to 10^exponent.
   */
  private Instance byVariants(int exponent) {
    int rules = Math.max(1, Math.round(4f * exponent));
    return pick("variants 1e" + exponent, exponent, false, 6, 10, (g, k) -> CatalogGenerator.Spec.of(g, k, 20, 6, rules, seed));
  }

  /** The (groups, options) whose size (columns or variants) is closest to 10^exponent on a log scale. */
  private Instance pick(String label, int exponent, boolean byColumns, int minOptions, int maxOptions,
      java.util.function.BiFunction<Integer, Integer, CatalogGenerator.Spec> specOf) {
    Instance best = null;
    double bestDist = Double.POSITIVE_INFINITY;
    for (int k = minOptions; k <= maxOptions; k++) {
      // rules only remove variants, so k^g >= 10^exponent needs at least this many groups
      int start = Math.max(2, (int) Math.floor(exponent / Math.log10(k)) - (byColumns ? 1 : 0));
      for (int g = start; g < 10_000; g++) {
        Instance in = instance(label, specOf.apply(g, k));
        double size = log10(byColumns ? in.columns : in.variants.value());
        double dist = Math.abs(size - exponent);
        if (dist < bestDist) {
          best = in;
          bestDist = dist;
        }
        if (size > exponent) {
          break;
        }
      }
    }
    CatalogGenerator.Spec sp = best.spec;
    note(String.format(Locale.ROOT, "%s: %d groups x %d options, %d rules: %s variants, %s columns", label,
        sp.groups(), sp.options(), sp.rules(), sci(best.variants.value()), sci(best.columns)));
    return best;
  }

  /** Progress for the person waiting, on stderr, so the tables on stdout stay clean. */
  private void note(String text) {
    PrintWriter err = spec.commandLine().getErr();
    err.println("bench: " + text);
    err.flush();
  }

  private static Instance instance(String label, CatalogGenerator.Spec spec) {
    Catalog c = CatalogGenerator.generate(spec);
    VariantSpace space = new VariantSpace(c);
    SpaceCounter counter = new SpaceCounter(space);
    BigInteger columns = BigInteger.ZERO;
    for (SpaceCount sc : counter.perSegment()) {
      columns = columns.add(sc.value());
    }
    return new Instance(label, spec, space, counter.count(), columns);
  }

  private static double log10(BigInteger x) {
    if (x.signum() <= 0) {
      return Double.NEGATIVE_INFINITY;
    }
    int shift = Math.max(0, x.bitLength() - 60);
    return Math.log10(x.shiftRight(shift).doubleValue()) + shift * Math.log10(2);
  }

  // ---- (a) full LP ------------------------------------------------------------------------

  record FullRun(long buildNanos, long solveNanos, double objective, long simplexIterations, long peakHeap) {}

  private FullRun fullLp(Instance in) {
    return fullLp(in.space, in.label, FullLp.Solver.GLOP_DUAL);
  }

  /** Every column of {@code space} listed and solved by {@code solver}, timed; {@code label} names it in a failure. */
  static FullRun fullLp(VariantSpace space, String label, FullLp.Solver solver) {
    quiet();
    long t0 = System.nanoTime();
    try (FullLp lp = new FullLp(capacities(space), demands(space), solver)) {
      listColumns(space, lp);
      long t1 = System.nanoTime();
      FullLp.Result r = lp.solve();
      long t2 = System.nanoTime();
      if (!r.status().isOptimal()) {
        throw new IllegalStateException("the full LP (" + solver.word() + ") of " + label + " ended " + r.status());
      }
      return new FullRun(t1 - t0, t2 - t1, r.objective(), r.simplexIterations(), peakHeap());
    }
  }

  /** Every (buildable variant, segment that accepts it) column of the space, added to {@code lp}. */
  static void listColumns(VariantSpace space, FullLp lp) {
    VariantEnumerator en = new VariantEnumerator(space);
    double[] use = new double[space.resourceCount()];
    for (int s = 0; s < space.segmentCount(); s++) {
      int seg = s;
      double upper = space.catalog().segments().get(s).columnBound();
      en.forEach(s, v -> {
        lp.addColumn(seg, space.margin(v, seg), space.use(v, use), upper);
        return true;
      });
    }
  }

  // ---- (b) column generation --------------------------------------------------------------

  record CgRun(long nanos, SolveOutcome outcome, RunStats stats, long peakHeap) {}

  private CgRun colgen(Instance in, SolveSettings settings) {
    return colgen(in, settings, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT);
  }

  /** @param tableLimit of the branch-and-bound pricer; 0 for its forward-checking bound alone */
  private CgRun colgen(Instance in, SolveSettings settings, ChoiceEntry entry) {
    return colgen(in, settings, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT, entry);
  }

  private CgRun colgen(Instance in, SolveSettings settings, long tableLimit) {
    return colgen(in, settings, tableLimit, ChoiceEntry.DEFAULT);
  }

  private CgRun colgen(Instance in, SolveSettings settings, long tableLimit, ChoiceEntry entry) {
    quiet();
    long t0 = System.nanoTime();
    ColumnGeneration cg = new ColumnGeneration(in.space, new BranchAndBoundPricer(in.space, Long.MAX_VALUE, tableLimit),
        new HeuristicPricer(in.space), settings, null, t0).withChoiceEntry(entry);
    SolveOutcome o = cg.run(List.of());
    long t1 = System.nanoTime();
    return new CgRun(t1 - t0, o, cg.stats(), peakHeap());
  }

  // ---- pricers ----------------------------------------------------------------------------

  private void pricerRound(Instance in, SolveOutcome o, double threshold, String which, boolean print) {
    VariantSpace space = in.space;
    List<Set<VariantKey>> inMaster = new ArrayList<>();
    for (int s = 0; s < space.segmentCount(); s++) {
      inMaster.add(new HashSet<>());
    }
    o.master().columns().forEach(c -> inMaster.get(c.segment()).add(space.key(c.choices())));
    List<PricingQuery> round = new ArrayList<>();
    for (int s = 0; s < space.segmentCount(); s++) {
      round.add(ReducedCosts.query(space, s, o.duals().resource(), o.duals().segment()[s], SolveSettings.DEFAULT_PER_ROUND,
          threshold, inMaster.get(s)));
    }
    Pricer bnb = new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT);
    Pricer cpsat = new CpSatPricer(space, 0, 1);
    List<PricingOutcome> fromBnb = priceRound(bnb, round);
    List<PricingOutcome> fromCpsat = priceRound(cpsat, round);
    long tb = medianRound(bnb, round);
    long tc = medianRound(cpsat, round);
    boolean same = true;
    double best = Double.NEGATIVE_INFINITY;
    for (int s = 0; s < round.size(); s++) {
      List<PricedVariant> a = fromBnb.get(s).found();
      List<PricedVariant> b = fromCpsat.get(s).found();
      same &= fromBnb.get(s).exact() && fromCpsat.get(s).exact() && a.size() == b.size();
      for (int i = 0; same && i < a.size(); i++) {
        double x = a.get(i).reducedCost();
        same &= Math.abs(x - b.get(i).reducedCost()) <= 1e-6 * Math.max(1, Math.abs(x));
      }
      if (!a.isEmpty()) {
        best = Math.max(best, a.get(0).reducedCost());
      }
    }
    if (!same) {
      // The whole point of the cross-check: two exact pricers that disagree is a bug to report.
      line("| " + in.label + " | " + which + " | " + secs(tb) + " | " + secs(tc) + " | – | **NO: the pricers disagree** | – |");
      throw new IllegalStateException("bnb and cpsat disagree on the k best of " + in.label);
    }
    if (!print) {
      return;
    }
    line(String.format(Locale.ROOT, "| %s | %s | %s | %s | %.1f | yes | %s |", in.label, which, secs(tb), secs(tc),
        (double) tc / Math.max(1, tb), best == Double.NEGATIVE_INFINITY ? "none above 0" : money(best)));
  }

  private static List<PricingOutcome> priceRound(Pricer p, List<PricingQuery> round) {
    List<PricingOutcome> res = new ArrayList<>();
    for (PricingQuery q : round) {
      res.add(p.price(q));
    }
    return res;
  }

  private long medianRound(Pricer p, List<PricingQuery> round) {
    long[] t = new long[repeats];
    for (int i = 0; i < repeats; i++) {
      long t0 = System.nanoTime();
      priceRound(p, round);
      t[i] = System.nanoTime() - t0;
    }
    java.util.Arrays.sort(t);
    return t[repeats / 2];
  }

  // ---- ablation ---------------------------------------------------------------------------

  private void ablation(List<Instance> subjects) {
    SolveSettings base = SolveSettings.defaults();
    List<String> names = new ArrayList<>();
    List<SolveSettings> variants = new ArrayList<>();
    names.add("defaults");
    variants.add(base);
    for (int k : quick ? new int[] {1, 10} : new int[] {1, 2, 5, 10, 20}) {
      if (k != base.perRound()) {
        names.add("columns per round " + k);
        variants.add(base.withPerRound(k));
      }
    }
    names.add("heuristic first " + (base.heuristicFirst() ? "off" : "on"));
    variants.add(base.withHeuristicFirst(!base.heuristicFirst()));
    for (double a : quick ? new double[] {0.5} : new double[] {0.3, 0.5, 0.8}) {
      if (a != base.smoothing()) {
        names.add("smoothing " + a);
        variants.add(base.withSmoothing(a));
      }
    }
    if (base.smoothing() != 0) {
      names.add("smoothing off");
      variants.add(base.withSmoothing(0));
    }
    for (int r : quick ? new int[] {5} : new int[] {3, 10}) {
      if (r != base.retireAfter()) {
        names.add("retire after " + r + " idle rounds");
        variants.add(base.withRetireAfter(r));
      }
    }
    if (base.retireAfter() != 0) {
      names.add("retire never");
      variants.add(base.withRetireAfter(0));
    }
    // The pricer's exact tables switched off; a time limit, because without them the large
    // instances can take hours.
    int forwardOnly = variants.size();
    names.add("bnb without its exact tables (forward checking only; 120 s limit)");
    variants.add(base.withLimits(120_000, 0));
    line("## Each acceleration on and off");
    line("");
    line("Column generation with the defaults (" + describe(base) + ") and with one switch changed. "
        + "Seconds are wall time of the run; pricing and master columns split it; rounds are "
        + "iterations of the loop (a round repeated after mispricing counts once).");
    line("");
    line("| instance | settings | status | iterations | seconds | pricing s (exact / heuristic) | master s | "
        + "exact rounds | mispricings | retired | columns | objective |");
    line("|---|---|---|---|---|---|---|---|---|---|---|---|");
    for (Instance in : subjects) {
      for (int i = 0; i < variants.size(); i++) {
        note("ablation: " + in.label + ", " + names.get(i));
        CgRun r = colgen(in, variants.get(i), i == forwardOnly ? 0 : BranchAndBoundPricer.DEFAULT_TABLE_LIMIT);
        RunStats st = r.stats;
        line(String.format(Locale.ROOT, "| %s | %s | %s | %d | %s | %s / %s | %s | %d | %d | %d | %d | %s |",
            in.label, names.get(i), r.outcome.status().word(), r.outcome.iterations(), secs(r.nanos),
            secs(st.exactNanos()), secs(st.heuristicNanos()), secs(st.masterNanos()), st.exactRounds(),
            st.mispricings(), st.retired(), r.outcome.master().columns().size(), money(r.outcome.result().value())));
        out.flush();
      }
    }
    line("");
  }

  // ---- helpers ----------------------------------------------------------------------------

  private static String describe(SolveSettings s) {
    return String.format(Locale.ROOT, "gap %s, %d columns per segment per round, heuristic first %s, smoothing %s, "
        + "retire idle columns %s", sci(s.gapTolerance()), s.perRound(), s.heuristicFirst() ? "on" : "off",
        s.smoothing() == 0 ? "off" : Double.toString(s.smoothing()),
        s.retireAfter() == 0 ? "never" : "after " + s.retireAfter() + " rounds");
  }

  private static String specs(List<Instance> all) {
    List<String> parts = new ArrayList<>();
    for (Instance in : all) {
      CatalogGenerator.Spec s = in.spec;
      parts.add(String.format(Locale.ROOT, "%s = `generate --groups %d --options %d --resources %d --segments %d --rules %d --seed %d`",
          in.label, s.groups(), s.options(), s.resources(), s.segments(), s.rules(), s.seed()));
    }
    return String.join("; ", parts);
  }

  static double[] capacities(VariantSpace space) {
    double[] c = new double[space.resourceCount()];
    for (int r = 0; r < c.length; r++) {
      c[r] = space.catalog().resources().get(r).capacity();
    }
    return c;
  }

  static double[] demands(VariantSpace space) {
    double[] d = new double[space.segmentCount()];
    for (int s = 0; s < d.length; s++) {
      d[s] = space.catalog().segments().get(s).demand();
    }
    return d;
  }

  /** Collects garbage and restarts the peak counters, so the next phase's peak is its own. */
  private static void quiet() {
    System.gc();
    for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
      if (p.getType() == MemoryType.HEAP) {
        p.resetPeakUsage();
      }
    }
  }

  /** Sum of the heap pools' peaks since {@link #quiet} (an upper bound on the true joint peak). */
  private static long peakHeap() {
    long sum = 0;
    for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
      if (p.getType() == MemoryType.HEAP) {
        sum += p.getPeakUsage().getUsed();
      }
    }
    return sum;
  }

  private void line(String s) {
    out.println(s);
    report.append(s).append('\n');
  }

  private static String mib(long bytes) {
    return Long.toString(Math.round(bytes / 1048576.0));
  }

  private static String secs(long nanos) {
    double s = nanos / 1e9;
    return s < 0.01 ? String.format(Locale.ROOT, "%.2f ms", s * 1000)
        : String.format(Locale.ROOT, s < 10 ? "%.2f s" : "%.1f s", s);
  }

  private static String sci(double x) {
    if (Double.isNaN(x)) {
      return "–";
    }
    if (x == 0) {
      return "0";
    }
    return String.format(Locale.ROOT, "%.1e", x);
  }

  static String sci(BigInteger x) {
    if (x.bitLength() < 20) {
      return x.toString();
    }
    String d = x.toString();
    return d.charAt(0) + "." + d.substring(1, 3) + "e" + (d.length() - 1);
  }

  private static String money(double x) {
    return String.format(Locale.ROOT, "%,.2f", x);
  }
}
