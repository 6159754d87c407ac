package dev.mixwright.cli;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogLoader;
import dev.mixwright.colgen.RunStatus;
import dev.mixwright.explain.CapacityRanges;
import dev.mixwright.explain.Explainer;
import dev.mixwright.explain.Explanation;
import dev.mixwright.explain.PriceRange;
import dev.mixwright.report.RunReader;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.Json;
import dev.mixwright.runfolder.RunFolder;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(
    name = "explain",
    mixinStandardHelpOptions = true,
    description = {
      "Shows why a variant pays or not in a segment at the run's shadow prices: its margin, what each resource and the segment's demand charge it, its reduced cost, and the price change at which it would enter the plan."
    })
final class ExplainCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Parameters(index = "0", paramLabel = "RUN_DIR", description = "a folder written by 'mixwright solve --out'")
  Path runDir;

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
    Catalog catalog = CatalogLoader.load(folder.catalogCopy());
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
    PriceRange.Leave leave = null;
    if (leavePrice && qty > 0 && e.sellable()) {
      leave = new PriceRange(space, CapacityRangeReport.runPricer(folder)::create, CapacityRangeReport.RESOLVE,
          CapacityRangeReport.runColumns(folder, space)).leave(v, s, 1e-6);
    }
    if (json) {
      ObjectNode n = toJson(space, e, qty, run);
      if (leave != null) {
        n.put("priceCutToLeave", leave.cut());
        n.put("resolves", leave.solves());
      }
      if (ranges != null) {
        n.set("capacityRanges", CapacityRangeReport.toJson(ranges));
      }
      PortfolioExplainView.put(n, space, verdict);
      out.println(Json.pretty().writeValueAsString(n));
    } else {
      print(out, space, e, qty, run);
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
    n.put("priceRiseToEnter", qty > 0 ? 0.0 : e.priceRiseToEnter());
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
    out.println(String.format(Locale.ROOT, "  - %-20s %s  (segment shadow price)", "demand of " + seg, fmt(e.segmentCharge())));
    out.println("  = reduced cost         " + fmt(e.reducedCost()));
    if (run.status() != RunStatus.INFEASIBLE) {
      if (qty > 0) {
        out.println("  in the plan: " + Numbers.qty(qty) + " units"
            + (e.reducedCost() > 1e-7 ? " (at its share limit: it pays more than its resources' worth)" : ""));
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

  private static String fmt(double v) {
    return String.format(Locale.ROOT, "%12.4f", v);
  }

}
