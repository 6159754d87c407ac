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
import dev.mixwright.report.PortfolioPending;
import dev.mixwright.explain.Substitution;
import dev.mixwright.report.RunComparison;
import dev.mixwright.report.RunReader;
import dev.mixwright.report.RunResult;
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

@Command(
    name = "explain",
    description = {
      "Shows why a variant pays or not in a segment at the run's shadow prices: its margin, what each resource and the segment's demand charge it, its reduced cost, and the price change at which it would enter the plan. In a segment that chooses, also what the variant sells by the multinomial logit and whose buyers it takes."
    })
final class ExplainCommand extends RunDirCommand {
  @Option(names = "--segment", paramLabel = "S", description = "segment id")
  String segmentId;

  @Option(names = "--variant", paramLabel = "G=O,...",
      description = "one option per group, e.g. capacity=c9,compressor=scroll,tank=t200 (optional groups left out mean none)")
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
    if ((segmentId == null) != (variantText == null)) {
      throw new UserError("--segment and --variant go together: give both to explain a variant");
    }
    if (segmentId == null && !capacityRanges) {
      throw new UserError("give --segment S --variant G=O,... to explain a variant, or --capacity-ranges for"
          + " the range of each shadow price");
    }
    Catalog catalog = CatalogLoader.parse(folder.verifiedCatalogCopy(), folder.catalogCopy().toString(), null);
    List<CapacityRanges.Range> ranges = capacityRanges
        ? CapacityRangeReport.compute(folder, catalog, resources, spec.commandLine().getErr()) : null;
    if (segmentId == null) {
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
    int s = catalog.segmentIndex(segmentId);
    if (s < 0) {
      throw new UserError("--segment: no segment '" + segmentId + "'; segments are "
          + catalog.segments().stream().map(x -> x.id()).toList());
    }
    int[] v;
    try {
      v = space.parse(parseVariant(variantText));
    } catch (IllegalArgumentException e) {
      throw new UserError("--variant: " + e.getMessage());
    }
    RunReader.RunView run = RunReader.view(catalog, RunResult.read(runDir));
    Explanation e = new Explainer(space).explain(v, s, run.resourcePrices(), run.segmentPrices());
    double qty = run.quantity(segmentId, space.describe(v));
    var verdict = PortfolioExplainView.verdict(space, v, run.result());
    String pending = PortfolioPending.line(run.result());
    boolean chooses = space.chooses(s);
    if (leavePrice && chooses) {
      throw new UserError("--leave-price: segment '" + segmentId + "' chooses, so a price change there also"
          + " changes the variant's attraction and its sales; sweep its price instead, e.g. --grid"
          + " options.GROUP.OPTION.price=-200,-100,+0,+100");
    }
    Substitution sub = chooses && e.sellable()
        ? new Explainer(space).substitution(v, s, offered(space, run.result(), segmentId)) : null;
    PriceRange.Leave leave = null;
    if (leavePrice && qty > 0 && e.sellable()) {
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
      if (ranges != null) {
        n.set("capacityRanges", CapacityRangeReport.toJson(ranges));
      }
      PortfolioExplainView.put(n, space, verdict);
      if (pending != null) {
        n.put("portfolioPending", run.result().portfolioPending());
      }
      out.println(Json.pretty().writeValueAsString(n));
    } else {
      if (pending != null) {
        out.println(pending);
      }
      print(out, space, e, qty, run);
      if (sub != null) {
        print(out, space, sub, qty, space.price(v, s));
      }
      if (leave != null) {
        out.println(String.format(Locale.ROOT,
            "  leaves the plan if its price falls by more than %.4f per unit (margin %.4f), found by %d"
                + " re-solves over the whole space", leave.cut(), leave.newMargin(), leave.solves()));
      } else if (leavePrice && qty <= 0) {
        out.println("  (--leave-price: the plan does not sell this variant here, so there is nothing to leave)");
      }
      PortfolioExplainView.print(out, space, verdict);
      if (verdict != null) {
        // issue 10: a variant on sale today, kept or dropped
        new dev.mixwright.explain.PortfolioExplainer(space).currentRangeWords(v, verdict).forEach(w -> out.println("    " + w));
      }
      if (ranges != null) {
        CapacityRangeReport.print(out, ranges, run.result());
      }
    }
    return ExitCodes.OK;
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

  private static void print(PrintWriter out, VariantSpace space, Explanation e, double qty, RunReader.RunView run) {
    String seg = space.catalog().segments().get(e.segment()).id();
    out.println("variant " + space.label(e.choices()) + " in segment " + seg);
    if (!e.sellable()) {
      out.println("  cannot be sold there:");
      e.problems().forEach(p -> out.println("    - " + p));
    }
    out.println("  margin                 " + fmt(e.margin()));
    for (Explanation.MarginPart p : e.marginParts()) {
      String val = p.segmentValue() == 0 ? "" : String.format(Locale.ROOT, " + segment value %s", fmt(p.segmentValue()));
      out.println(String.format(Locale.ROOT, "    %-18s %s  (price %s - cost %s%s)", p.group() + "=" + p.option(),
          fmt(p.total()), fmt(p.price()), fmt(p.cost()), val));
    }
    for (Explanation.Charge c : e.charges()) {
      out.println(String.format(Locale.ROOT, "  - %-20s %s  (%s used x shadow price %s)", c.resource(),
          fmt(c.amount()), fmt(c.use()), fmt(c.shadowPrice())));
    }
    boolean chooses = space.chooses(e.segment());
    out.println(String.format(Locale.ROOT, "  - %-20s %s  (%s)", (chooses ? "buyers of " : "demand of ") + seg,
        fmt(e.segmentCharge()), chooses ? "shadow price of the segment's buyers" : "segment shadow price"));
    out.println("  = reduced cost         " + fmt(e.reducedCost()));
    if (run.status() != RunStatus.INFEASIBLE) {
      if (qty > 0) {
        out.println("  in the plan: " + Figures.qty(qty) + " units" + (e.reducedCost() <= 1e-7 ? ""
            : chooses ? " (held by its attraction: it pays more than its resources' worth, but sells only as"
                + " many as the logit lets it)"
            : " (at its share limit: it pays more than its resources' worth)"));
      } else if (!e.sellable()) {
        out.println("  not in the plan, and no price puts it there: a rule or the segment's accepts forbids it");
      } else if (e.reducedCost() < -1e-9) {
        out.println(String.format(Locale.ROOT,
            "  not in the plan: it would enter if its price rose by more than %.4f per unit", -e.reducedCost()));
      } else {
        out.println("  not in the plan, though it pays as much as its resources' worth: an alternative optimum");
      }
    }
    if (!run.status().isOptimal()) {
      out.println("  note: the run ended " + run.status().word() + "; shadow prices are those of its last master");
    }
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

  private static void print(PrintWriter out, VariantSpace space, Substitution sub, double qty, double price) {
    String seg = space.catalog().segments().get(sub.segment()).id();
    out.println(String.format(Locale.ROOT, "  segment %s chooses by multinomial logit: at the price it pays"
        + " here, %s, its attraction against staying out is w = %s", seg, Figures.money(price), w(sub.attraction())));
    if (sub.offered()) {
      out.println(String.format(Locale.ROOT, "  the plan sells it to %s of %s buyers (%s); with the plan's %d other"
              + " offers (W = %s) the logit gives it %s buyers (%s), taken as follows:",
          Figures.qty(qty), Figures.qty(sub.buyers()), pct(qty / sub.buyers()), sub.others().size(),
          w(sub.othersAttraction()), Figures.qty(sub.sales()), pct(sub.share())));
    } else {
      out.println(String.format(Locale.ROOT, "  added to the plan's %d offers here (W = %s), the logit gives it %s"
              + " buyers (%s of %s), taken as follows:", sub.others().size(), w(sub.othersAttraction()),
          Figures.qty(sub.sales()), pct(sub.share()), Figures.qty(sub.buyers())));
    }
    List<Substitution.Taken> most = new ArrayList<>(sub.others());
    most.sort((a, b) -> Double.compare(b.taken(), a.taken()));
    for (Substitution.Taken t : most.subList(0, Math.min(SHOWN, most.size()))) {
      out.println(String.format(Locale.ROOT, "    %12s  from %s (w %s; %s -> %s)", Figures.qty(t.taken()),
          RunComparison.variant(space.describe(t.choices())), w(t.attraction()),
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
    return String.format(Locale.ROOT, "%.4g", attraction);
  }

  private static String pct(double share) {
    return String.format(Locale.ROOT, "%.1f%%", 100 * share);
  }

  private static String fmt(double v) {
    return String.format(Locale.ROOT, "%12.4f", v);
  }

}
