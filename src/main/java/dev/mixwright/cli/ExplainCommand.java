package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.explain.CapacityRanges;
import dev.mixwright.explain.Explainer;
import dev.mixwright.explain.Explanation;
import dev.mixwright.explain.PriceRange;
import dev.mixwright.report.MatrixView;
import dev.mixwright.report.PortfolioPending;
import dev.mixwright.explain.Substitution;
import dev.mixwright.report.RunReader;
import dev.mixwright.report.RunResult;
import dev.mixwright.report.VariantNames;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

@Command(
    name = "explain",
    description = {
      "Shows why a variant pays or not in a segment at the run's shadow prices: its margin, what each resource and the segment's demand charge it, its reduced cost, and the price change at which it would enter the plan. In a segment that chooses, also what the variant sells by the multinomial logit and whose buyers it takes.",
      "Name the variant by its code in the run (V03, as the summary, report and export print them) or by its options (--variant G=O,...). Without --segment, the variant is explained in each segment that buys it, or in every segment when none does."
    })
final class ExplainCommand extends RunDirCommand {
  @Parameters(index = "1", arity = "0..1", paramLabel = "VARIANT",
      description = "the variant: its code in the run (V03) or one option per group (G=O,...)")
  String variantArg;

  @Option(names = "--segment", paramLabel = "S", description = "segment id (default: each segment that buys the variant)")
  String segmentId;

  @Option(names = "--variant", paramLabel = "V03|G=O,...",
      description = "the variant, as VARIANT: a code of the run, or one option per group, e.g."
          + " capacity=c9,compressor=scroll,tank=t200 (optional groups left out mean none)")
  String variantText;

  @Option(names = "--json", description = "print the explanation as JSON")
  boolean json;

  @Option(names = "--leave-price",
      description = "for a variant the plan sells: find, by re-solving over the whole space, how far its"
          + " price may fall before the plan stops selling it (about 15 re-solves)")
  boolean leavePrice;

  @Option(names = "--capacity-ranges",
      description = "for each resource, the capacity range over which its shadow price holds, found by"
          + " re-solving over the whole space at other capacities (several solves per resource)")
  boolean capacityRanges;

  @Option(names = "--resource", paramLabel = "ID", description = "with --capacity-ranges: only this resource (repeatable)")
  List<String> resources = new ArrayList<>();

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    RunFolder folder = new RunFolder(runDir);
    if (!Files.isRegularFile(folder.catalogCopy()) || !Files.isRegularFile(folder.result())) {
      throw new UserError(runDir + " is not a finished run folder (needs catalog.json and result.json from 'mixwright solve --out')");
    }
    if (variantArg != null && variantText != null) {
      throw new UserError("the variant is given twice (" + variantArg + " and --variant " + variantText + "): give it once");
    }
    String text = variantArg != null ? variantArg : variantText;
    if (segmentId != null && text == null) {
      throw new UserError("--segment needs a variant: give its code (e.g. V01, from the summary) or --variant G=O,...");
    }
    if (text == null && !capacityRanges) {
      throw new UserError("give a variant to explain, by its code (e.g. 'mixwright explain " + runDir + " V01'; the"
          + " summary and report list the codes) or --variant G=O,...; or --capacity-ranges for the range of each"
          + " shadow price");
    }
    Catalog catalog = CatalogLoader.parse(folder.verifiedCatalogCopy(), folder.catalogCopy().toString(), null);
    List<CapacityRanges.Range> ranges = capacityRanges
        ? CapacityRangeReport.compute(folder, catalog, resources, spec.commandLine().getErr()) : null;
    if (text == null) {
      if (json) {
        ObjectNode n = Json.pretty().createObjectNode();
        n.set("capacityRanges", CapacityRangeReport.toJson(ranges));
        out.println(Json.pretty().writeValueAsString(n));
      } else {
        CapacityRangeReport.print(out, ranges, RunResult.read(runDir));
      }
      return ExitCodes.OK;
    }
    VariantSpace space = new VariantSpace(catalog);
    if (segmentId != null && catalog.segmentIndex(segmentId) < 0) {
      throw new UserError("--segment: no segment '" + segmentId + "'; segments are "
          + catalog.segments().stream().map(x -> x.id()).toList());
    }
    RunReader.RunView run = RunReader.view(catalog, RunResult.read(runDir));
    VariantNames names = VariantNames.of(run.result(), catalog);
    int[] v = variant(space, names, text);
    Map<String, String> options = space.describe(v);
    String code = names.code(options);
    List<Integer> segments = segmentId != null ? List.of(catalog.segmentIndex(segmentId))
        : segmentsOf(space, run.result(), options);
    var verdict = PortfolioExplainView.verdict(space, v, run.result());
    String pending = PortfolioPending.line(run.result());
    List<ObjectNode> explained = new ArrayList<>();
    if (!json) {
      if (pending != null) {
        out.println(pending);
      }
      out.println("variant " + (code == null ? "" : code + ": ") + names.labels(options)
          + (code == null ? "  (not in this run's plan, so it has no code)" : ""));
      if (segmentId == null) {
        out.println(segments.size() == catalog.segments().size() && segments.size() > 1
            ? "  no segment buys it in the plan; explained in every segment (--segment S for one)"
            : (segments.size() == 1 ? "  explained in the segment that buys it" : "  explained in the segments that buy it")
                + " (--segment S for another)");
      }
    }
    for (int s : segments) {
      ObjectNode n = explain(out, space, names, v, s, run, folder);
      if (n != null) {
        explained.add(n);
      }
    }
    if (json) {
      ObjectNode n;
      if (explained.size() == 1) {
        n = explained.get(0);
      } else {
        n = Json.pretty().createObjectNode();
        ObjectNode opts = n.putObject("options");
        options.forEach(opts::put);
        explained.forEach(n.putArray("segments")::add);
      }
      n.put("code", code);
      n.put("labels", names.labels(options));
      if (ranges != null) {
        n.set("capacityRanges", CapacityRangeReport.toJson(ranges));
      }
      PortfolioExplainView.put(n, space, verdict);
      if (pending != null) {
        n.put("portfolioPending", run.result().portfolioPending());
      }
      out.println(Json.pretty().writeValueAsString(n));
    } else {
      PortfolioExplainView.print(out, space, verdict);
      if (verdict != null) {
        // issue 10: a variant on sale today, kept or dropped
        new dev.mixwright.explain.PortfolioExplainer(space).currentRangeWords(v, verdict, Figures::money).forEach(w -> out.println("    " + w));
      }
      if (ranges != null) {
        CapacityRangeReport.print(out, ranges, run.result());
      }
    }
    return ExitCodes.OK;
  }

  /**
   * The variant a code or a G=O list names; a code the run does not hold is refused with the run's
   * codes, as a typo would otherwise explain nothing.
   */
  private int[] variant(VariantSpace space, VariantNames names, String text) {
    Map<String, String> options;
    if (VariantNames.looksLikeCode(text)) {
      options = names.variant(text);
      if (options == null) {
        throw new UserError("no variant " + text.strip() + " in " + runDir + "; its codes are " + names.codeList()
            + " (every code with its options: mixwright export " + runDir + " --format text)");
      }
    } else {
      options = parseVariant(text);
    }
    try {
      return space.parse(options);
    } catch (IllegalArgumentException e) {
      throw new UserError("--variant: " + e.getMessage());
    }
  }

  /** The segments that buy the variant in the LP plan or the integer portfolio; every segment when none does. */
  private static List<Integer> segmentsOf(VariantSpace space, RunResult result, Map<String, String> options) {
    java.util.TreeSet<Integer> buying = new java.util.TreeSet<>();
    Catalog cat = space.catalog();
    for (RunResult.Offer o : result.offers()) {
      if (o.quantity() > 0 && o.options().equals(options)) {
        buying.add(cat.segmentIndex(o.segment()));
      }
    }
    if (result.portfolio() != null) {
      for (RunResult.PortfolioVariant p : result.portfolio().variants()) {
        if (p.options().equals(options)) {
          p.sales().forEach((seg, q) -> {
            if (q > 0) {
              buying.add(cat.segmentIndex(seg));
            }
          });
        }
      }
    }
    buying.remove(-1);
    if (buying.isEmpty()) {
      for (int s = 0; s < cat.segments().size(); s++) {
        buying.add(s);
      }
    }
    return new ArrayList<>(buying);
  }

  /** Explains v in segment s: prints it, or returns its JSON object with --json. */
  private ObjectNode explain(PrintWriter out, VariantSpace space, VariantNames names, int[] v, int s,
      RunReader.RunView run, RunFolder folder) throws Exception {
    String seg = space.catalog().segments().get(s).id();
    Explanation e = new Explainer(space).explain(v, s, run.resourcePrices(), run.segmentPrices());
    double qty = run.quantity(seg, space.describe(v));
    boolean chooses = space.chooses(s);
    if (leavePrice && chooses && segmentId != null) {
      throw new UserError("--leave-price: segment '" + seg + "' chooses, so a price change there also"
          + " changes the variant's attraction and its sales; sweep its price instead, e.g. --grid"
          + " options.GROUP.OPTION.price=-200,-100,+0,+100");
    }
    Substitution sub = chooses && e.sellable()
        ? new Explainer(space).substitution(v, s, offered(space, run.result(), seg)) : null;
    PriceRange.Leave leave = null;
    if (leavePrice && !chooses && qty > 0 && e.sellable()) {
      leave = new PriceRange(space, CapacityRangeReport.runPricer(folder)::create, CapacityRangeReport.RESOLVE,
          CapacityRangeReport.runColumns(folder, space)).leave(v, s, 1e-6);
    }
    if (json) {
      ObjectNode n = toJson(space, e, qty, run);
      if (sub != null) {
        n.set("choice", toJson(space, sub, qty, space.price(v, s)));
      }
      if (leave != null) {
        n.put("priceCutToLeave", leave.cut());
        n.put("resolves", leave.solves());
      }
      return n;
    }
    print(out, space, e, qty, run);
    if (sub != null) {
      print(out, space, names, sub, qty, space.price(v, s));
    }
    if (leave != null) {
      out.println("  leaves the plan if its price falls by more than " + Figures.price(leave.cut()) + " per unit (margin "
          + Figures.price(leave.newMargin()) + "), found by " + leave.solves() + " re-solves over the whole space");
    } else if (leavePrice && chooses) {
      out.println("  (--leave-price: segment " + seg + " chooses, so its price also moves its sales; sweep the"
          + " price instead)");
    } else if (leavePrice && qty <= 0) {
      out.println("  (--leave-price: the plan does not sell this variant here, so there is nothing to leave)");
    }
    return null;
  }

  static Map<String, String> parseVariant(String text) {
    Map<String, String> m = new LinkedHashMap<>();
    for (String part : text.split(",")) {
      String p = part.trim();
      if (p.isEmpty()) {
        continue;
      }
      int eq = p.indexOf('=');
      if (eq <= 0 || eq == p.length() - 1) {
        throw new UserError("--variant: '" + p + "' is not group=option; write e.g. capacity=c9,compressor=scroll");
      }
      String g = p.substring(0, eq).trim();
      if (m.put(g, p.substring(eq + 1).trim()) != null) {
        throw new UserError("--variant: group '" + g + "' is given twice");
      }
    }
    return m;
  }

  private static ObjectNode toJson(VariantSpace space, Explanation e, double qty, RunReader.RunView run) {
    ObjectNode n = Json.pretty().createObjectNode();
    n.put("segment", space.catalog().segments().get(e.segment()).id());
    ObjectNode opts = n.putObject("options");
    space.describe(e.choices()).forEach(opts::put);
    n.put("sellable", e.sellable());
    if (!e.sellable()) {
      e.problems().forEach(n.putArray("problems")::add);
    }
    n.put("margin", e.margin());
    ObjectNode parts = n.putObject("marginParts");
    for (Explanation.MarginPart p : e.marginParts()) {
      ObjectNode o = parts.putObject(p.group());
      o.put("option", p.option());
      o.put("price", p.price());
      o.put("cost", p.cost());
      o.put("segmentValue", p.segmentValue());
    }
    ObjectNode charges = n.putObject("charges");
    ObjectNode uses = n.putObject("uses");
    for (Explanation.Charge c : e.charges()) {
      charges.put(c.resource(), c.amount());
      uses.put(c.resource(), c.use());
    }
    n.put("segmentCharge", e.segmentCharge());
    n.put("reducedCost", e.reducedCost());
    n.put("quantity", qty);
    n.put("inPlan", qty > 0);
    if (e.sellable()) {
      n.put("priceRiseToEnter", qty > 0 ? 0.0 : e.priceRiseToEnter());
    } else {
      n.putNull("priceRiseToEnter"); // no price makes a variant a rule or the segment forbids enter
    }
    n.put("runStatus", run.status().word());
    return n;
  }

  /**
   * The reduced-cost breakdown for people: the column is money per unit of the variant (as reduced
   * costs are written), the catalog's prices and costs beside it are money, options by their labels.
   */
  private static void print(PrintWriter out, VariantSpace space, Explanation e, double qty, RunReader.RunView run) {
    Catalog cat = space.catalog();
    String seg = cat.segments().get(e.segment()).id();
    out.println("in segment " + seg + ":");
    if (!e.sellable()) {
      out.println("  cannot be sold there:");
      e.problems().forEach(p -> out.println("    - " + p));
    }
    List<String> names = new ArrayList<>();
    for (Explanation.MarginPart p : e.marginParts()) {
      String t = MatrixView.choiceText(cat, p.group(), p.option());
      names.add(t.equals(p.option()) ? p.group() + "=" + p.option() : t);
    }
    for (Explanation.Charge c : e.charges()) {
      names.add(c.resource());
    }
    boolean chooses = space.chooses(e.segment());
    String segLine = (chooses ? "buyers of " : "demand of ") + seg;
    names.add(segLine);
    int w = Math.max(18, names.stream().mapToInt(String::length).max().orElse(0));
    out.println(line("  ", "margin", w + 2, e.margin(), ""));
    for (int k = 0; k < e.marginParts().size(); k++) {
      Explanation.MarginPart p = e.marginParts().get(k);
      out.println(line("    ", names.get(k), w, p.total(), "(price " + Figures.money(p.price()) + " - cost "
          + Figures.money(p.cost()) + (p.segmentValue() == 0 ? "" : " + segment value " + Figures.money(p.segmentValue()))
          + ")"));
    }
    for (Explanation.Charge c : e.charges()) {
      out.println(line("  - ", c.resource(), w, c.amount(), "(" + Figures.qty(c.use()) + " used x shadow price "
          + Figures.price(c.shadowPrice()) + ")"));
    }
    out.println(line("  - ", segLine, w, e.segmentCharge(),
        chooses ? "(shadow price of the segment's buyers)" : "(segment shadow price)"));
    out.println(line("  = ", "reduced cost", w, e.reducedCost(), ""));
    if (run.status() != RunStatus.INFEASIBLE) {
      if (qty > 0) {
        out.println("  in the plan: " + Figures.units(qty) + " units" + (e.reducedCost() <= ZERO ? ""
            : chooses ? " (held by its attraction: it pays more than its resources' worth, but sells only as"
                + " many as the logit lets it)"
            : " (at its share limit: it pays more than its resources' worth)"));
      } else if (!e.sellable()) {
        out.println("  not in the plan, and no price puts it there: a rule or the segment's accepts forbids it");
      } else if (e.reducedCost() < -ZERO) {
        out.println("  not in the plan: it would enter if its price rose by more than "
            + Figures.price(-e.reducedCost()) + " per unit");
      } else if (e.reducedCost() <= ZERO && run.status().isOptimal()) {
        out.println("  not in the plan, though it pays as much as its resources' worth: an alternative optimum");
      } else {
        out.println("  not in the plan, though it pays more than its resources' worth"
            + (run.status().isOptimal() ? "" : ": the run stopped before it could enter"));
      }
    }
    if (!run.status().isOptimal()) {
      out.println("  note: the run ended " + run.status().word() + "; these shadow prices are those of the last"
          + " plan it solved, not of the optimum");
    }
  }

  /** A reduced cost this close to 0 is 0: the LP's tolerance. */
  private static final double ZERO = 1e-7;

  /** One line of the breakdown: its name padded to {@code width}, the figure, then words. */
  private static String line(String lead, String name, int width, double v, String words) {
    return (lead + name + " ".repeat(Math.max(0, width - name.length())) + String.format(Locale.ROOT, "%14s",
        Figures.price(v)) + (words.isEmpty() ? "" : "  " + words)).stripTrailing();
  }

  /** The plan's offers in the segment as variants of this space. */
  private static List<int[]> offered(VariantSpace space, RunResult result, String segmentId) {
    List<int[]> out = new ArrayList<>();
    for (RunResult.Offer o : result.offers()) {
      if (o.segment().equals(segmentId)) {
        out.add(space.parse(o.options()));
      }
    }
    return out;
  }

  private static ObjectNode toJson(VariantSpace space, Substitution sub, double qty, double price) {
    ObjectNode c = Json.pretty().createObjectNode();
    c.put("price", price);
    c.put("buyers", sub.buyers());
    c.put("attraction", sub.attraction());
    c.put("offered", sub.offered());
    c.put("planShare", qty / sub.buyers());
    c.put("othersAttraction", sub.othersAttraction());
    c.put("logitSales", sub.sales());
    c.put("logitShare", sub.share());
    var takes = c.putArray("takes");
    for (Substitution.Taken t : sub.others()) {
      ObjectNode o = takes.addObject();
      ObjectNode opts = o.putObject("options");
      space.describe(t.choices()).forEach(opts::put);
      o.put("attraction", t.attraction());
      o.put("salesWithout", t.salesWithout());
      o.put("taken", t.taken());
    }
    c.put("stayingOutWithout", sub.stayingOutWithout());
    c.put("fromStayingOut", sub.fromStayingOut());
    return c;
  }

  private static void print(PrintWriter out, VariantSpace space, VariantNames names, Substitution sub, double qty,
      double price) {
    String seg = space.catalog().segments().get(sub.segment()).id();
    out.println(String.format(Locale.ROOT, "  segment %s chooses by multinomial logit: at the price it pays"
        + " here, %s, its attraction against staying out is w = %s", seg, Figures.money(price), w(sub.attraction())));
    if (sub.offered()) {
      out.println(String.format(Locale.ROOT, "  the plan sells it to %s of %s buyers (%s); with the plan's %d other"
              + " offers (W = %s) the logit gives it %s buyers (%s), taken as follows:",
          Figures.qty(qty), Figures.qty(sub.buyers()), Figures.share(qty / sub.buyers()), sub.others().size(),
          w(sub.othersAttraction()), Figures.qty(sub.sales()), Figures.share(sub.share())));
    } else {
      out.println(String.format(Locale.ROOT, "  added to the plan's %d offers here (W = %s), the logit gives it %s"
              + " buyers (%s of %s), taken as follows:", sub.others().size(), w(sub.othersAttraction()),
          Figures.qty(sub.sales()), Figures.share(sub.share()), Figures.qty(sub.buyers())));
    }
    List<Substitution.Taken> most = new ArrayList<>(sub.others());
    most.sort((a, b) -> Double.compare(b.taken(), a.taken()));
    for (Substitution.Taken t : most.subList(0, Math.min(SHOWN, most.size()))) {
      out.println(String.format(Locale.ROOT, "    %12s  from %s (w %s; %s -> %s)", Figures.qty(t.taken()),
          names.shortName(space.describe(t.choices())), w(t.attraction()),
          Figures.qty(t.salesWithout()), Figures.qty(t.salesWithout() - t.taken())));
    }
    if (most.size() > SHOWN) {
      double rest = most.subList(SHOWN, most.size()).stream().mapToDouble(Substitution.Taken::taken).sum();
      out.println(String.format(Locale.ROOT, "    %12s  from the %d other offers (see --json)", Figures.qty(rest),
          most.size() - SHOWN));
    }
    out.println(String.format(Locale.ROOT, "    %12s  from staying out (%s -> %s)", Figures.qty(sub.fromStayingOut()),
        Figures.qty(sub.stayingOutWithout()), Figures.qty(sub.stayingOutWithout() - sub.fromStayingOut())));
    out.println("  every alternative loses the same fraction of its buyers (the logit's proportional"
        + " substitution); these are the logit's figures, and where a resource binds the plan may sell less"
        + " than this");
  }

  /** Offers named one by one in the substitution list; the rest are summed. */
  private static final int SHOWN = 8;

  private static String w(double attraction) {
    return Figures.attraction(attraction);
  }
}
