package dev.mixwright.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.report.ComparisonPage;
import dev.mixwright.report.Figures;
import dev.mixwright.report.MatrixView;
import dev.mixwright.report.PortfolioPending;
import dev.mixwright.report.RunComparison;
import dev.mixwright.report.RunResult;
import dev.mixwright.runfolder.Json;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

@Command(
    name = "compare",
    description = {
      "Shows what changed from run A to run B.",
      "Objective and bound, the integer portfolios (value, introduction and tooling costs, variants added and dropped by code), the catalog figures that differ, offers that are new, dropped or sold in another quantity, and the shadow prices of resources and segments; for segments that choose, their buyers, those who stay out and each offer's share. A variant is named by its code in each run (V03→V01: V03 in A, V01 in B)."
    })
final class CompareCommand extends SubCommand {
  @Parameters(index = "0", paramLabel = "RUN_A", description = "a run folder (the before)")
  Path runA;

  @Parameters(index = "1", paramLabel = "RUN_B", description = "a run folder (the after)")
  Path runB;

  /** What the comparison prints besides its table: JSON instead, unchanged rows too, an HTML page as well. */
  @Option(names = "--json", description = "print the comparison as JSON")
  boolean json;

  @Option(names = {"--all", "-a"}, description = "list unchanged resources and segments too")
  boolean all;

  @Option(names = "--page", paramLabel = "FILE", description = "also write the comparison as a self-contained HTML page")
  Path page;

  /** The two runs' matrix views, for the names of compared variants. */
  private MatrixView matrixA;
  private MatrixView matrixB;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    RunResult a = result(runA);
    RunResult b = result(runB);
    Catalog catA = RunCatalog.read(runA);
    Catalog catB = RunCatalog.read(runB);
    ObjectNode cmp = RunComparison.compare(a, b, catA, catB);
    matrixA = MatrixView.of(a, catA);
    matrixB = MatrixView.of(b, catB);
    if (a.portfolioPending() != null || b.portfolioPending() != null) {
      ObjectNode pending = cmp.putObject("portfolioPending");
      pending.put("a", a.portfolioPending());
      pending.put("b", b.portfolioPending());
    }
    if (page != null) {
      if (Files.isDirectory(page)) {
        throw new UserError("--page " + page + " is a folder — give a file name such as " + page.resolve("compare.html"));
      }
      ComparisonPage.write(page, cmp, new ComparisonPage.Runs(runA.toString(), runB.toString(),
          b.catalog().currency(), matrixA, matrixB));
    }
    if (json) {
      out.println(Json.pretty().writeValueAsString(cmp));
    } else {
      print(out, cmp);
      for (RunResult r : new RunResult[] {a, b}) {
        String pending = PortfolioPending.line(r);
        if (pending != null) {
          out.println("run " + (r == a ? "A" : "B") + ": " + pending);
        }
      }
    }
    if (page != null) {
      out.println("comparison page written to " + page);
    }
    return ExitCodes.OK;
  }

  private static RunResult result(Path run) {
    try {
      return RunResult.read(run);
    } catch (IOException e) {
      throw new UserError(e.getMessage());
    }
  }

  private void print(PrintWriter out, ObjectNode c) {
    JsonNode s = c.path("summary");
    out.println("run A " + runA + "  ->  run B " + runB);
    out.println(String.format(Locale.ROOT, "  status      %-18s -> %s", s.path("status").path("a").asText(),
        s.path("status").path("b").asText()));
    for (String f : new String[] {"objective", "bound"}) {
      JsonNode v = s.path(f);
      out.println(String.format(Locale.ROOT, "  %-11s %18s -> %18s   %s", f, money(v.path("a")), money(v.path("b")),
          change(v)));
    }
    out.println(String.format(Locale.ROOT, "  gap         %18s -> %18s", Figures.percent(v(s.path("gap").path("a"))),
        Figures.percent(v(s.path("gap").path("b")))));
    portfolio(out, c.path("portfolio"));
    JsonNode cc = c.path("catalogChanges");
    if (c.path("sameCatalog").asBoolean()) {
      out.println("catalog: the same");
    } else if (cc.isArray()) {
      out.println("catalog: " + cc.size() + (cc.size() == 1 ? " figure differs" : " figures differ"));
      int shown = 0;
      for (JsonNode x : cc) {
        if (shown++ == 20) {
          out.println("  ... " + (cc.size() - 20) + " more (see --json)");
          break;
        }
        out.println(String.format(Locale.ROOT, "  %-44s %14s -> %s", x.path("path").asText(), text(x.path("a")),
            text(x.path("b"))));
      }
    } else {
      out.println("catalog: differs (no catalog.json in one of the runs to list the figures)");
    }
    JsonNode o = c.path("offers");
    out.println(String.format(Locale.ROOT, "offers: %d new, %d dropped, %d changed, %d unchanged",
        o.path("new").size(), o.path("dropped").size(), o.path("changed").size(), o.path("unchanged").asInt()));
    for (String kind : new String[] {"new", "dropped", "changed"}) {
      for (JsonNode x : o.path(kind)) {
        out.println(String.format(Locale.ROOT, "  %-8s %-14s %12s -> %-12s %s", kind, x.path("segment").asText(),
            Figures.units(x.path("quantityA").asDouble()), Figures.units(x.path("quantityB").asDouble()),
            RunComparison.name(x, matrixA, matrixB)));
      }
    }
    section(out, "shadow prices of resources", c.path("resources"), "capacity", "used");
    section(out, "shadow prices of segments", c.path("segments"), "demand", "sold");
    choosing(out, c.path("choosing"));
    out.flush();
  }

  /** The integer portfolios: status, value and one-off costs, then the variants added and dropped. */
  private void portfolio(PrintWriter out, JsonNode p) {
    if (!p.isObject()) {
      return;
    }
    out.println(String.format(Locale.ROOT, "  portfolio   %-18s -> %s", word(p.path("status").path("a")),
        word(p.path("status").path("b"))));
    String[][] rows = {{"value", "value"}, {"introductionCosts", "introduction"}, {"toolingCosts", "tooling"},
        {"discontinueCosts", "discontinue"}};
    for (String[] f : rows) {
      JsonNode v = p.path(f[0]);
      if (v.path("a").isNull() && v.path("b").isNull()) {
        continue;
      }
      out.println(String.format(Locale.ROOT, "    %-13s %16s -> %18s   %s", f[1], money(v.path("a")), money(v.path("b")),
          v.has("change") ? Figures.signedMoney(v.path("change").asDouble()) : ""));
    }
    out.println(String.format(Locale.ROOT, "    variants      %d in both, %d added, %d dropped", p.path("inBoth").asInt(),
        p.path("added").size(), p.path("dropped").size()));
    for (String kind : new String[] {"added", "dropped"}) {
      for (JsonNode x : p.path(kind)) {
        out.println(String.format(Locale.ROOT, "      %-8s %10s units  %s", kind,
            Figures.units(x.path(kind.equals("added") ? "unitsB" : "unitsA").asDouble()),
            RunComparison.name(x, matrixA, matrixB)));
      }
    }
  }

  private static String word(JsonNode n) {
    return n.isTextual() ? n.asText() : "none";
  }

  private void section(PrintWriter out, String title, JsonNode rows, String f1, String f2) {
    out.println(title + ":");
    out.println(String.format(Locale.ROOT, "  %-14s %14s %14s %12s %14s %14s", "id", "price A", "price B", "change",
        f1 + " A->B", f2 + " A->B"));
    int hidden = 0;
    for (JsonNode r : rows) {
      JsonNode p = r.path("shadowPrice");
      boolean changed = Math.abs(p.path("change").asDouble()) > 1e-9 || Math.abs(r.path(f1).path("change").asDouble()) > 1e-9
          || Math.abs(r.path(f2).path("change").asDouble()) > 1e-6 || !p.has("change");
      if (!changed && !all) {
        hidden++;
        continue;
      }
      out.println(String.format(Locale.ROOT, "  %-14s %14s %14s %12s %14s %14s", r.path("id").asText(),
          price(p.path("a")), price(p.path("b")), p.has("change") ? Figures.signed(p.path("change").asDouble()) : "",
          arrow(r.path(f1)), arrow(r.path(f2))));
    }
    if (hidden > 0) {
      out.println("  (" + hidden + " unchanged; --all shows them)");
    }
  }

  /** Segments that choose: who buys and who stays out, and each offer's share of the buyers. */
  private void choosing(PrintWriter out, JsonNode segs) {
    if (!segs.isArray() || segs.isEmpty()) {
      return;
    }
    out.println("segments that choose (multinomial logit):");
    for (JsonNode s : segs) {
      out.println(String.format(Locale.ROOT, "  %-14s buyers %s, buy %s, stay out %s, shadow price of a buyer %s -> %s",
          s.path("id").asText(), arrow(s.path("buyers")), arrow(s.path("sold")), arrow(s.path("stayOut")),
          price(s.path("shadowPrice").path("a")), price(s.path("shadowPrice").path("b"))));
      int hidden = 0;
      for (JsonNode o : s.path("offers")) {
        if (!all && Math.abs(o.path("shareA").asDouble() - o.path("shareB").asDouble()) <= 5e-4) {
          hidden++;
          continue;
        }
        out.println(String.format(Locale.ROOT, "    share %6s -> %6s  %s", Figures.share(o.path("shareA").asDouble()),
            Figures.share(o.path("shareB").asDouble()), RunComparison.name(o, matrixA, matrixB)));
      }
      if (hidden > 0) {
        out.println("    (" + hidden + (hidden == 1 ? " offer's" : " offers'") + " share unchanged; --all shows them)");
      }
    }
  }

  private static String arrow(JsonNode v) {
    return Math.abs(v.path("change").asDouble()) <= 1e-9 ? Figures.units(v(v.path("a")))
        : Figures.units(v(v.path("a"))) + "->" + Figures.units(v(v.path("b")));
  }

  private static double v(JsonNode n) {
    return n.isNumber() ? n.asDouble() : Double.NaN;
  }

  private static String money(JsonNode n) {
    return n.isNumber() ? Figures.money(n.asDouble()) : "—";
  }

  /** A shadow price, as every shadow price a person reads. */
  private static String price(JsonNode n) {
    return n.isNumber() ? Figures.price(n.asDouble()) : "—";
  }

  private static String text(JsonNode n) {
    return n.isNumber() ? Figures.qty(n.asDouble()) : n.isNull() ? "(none)" : n.asText();
  }

  private static String change(JsonNode v) {
    if (!v.has("change")) {
      return "";
    }
    double d = v.path("change").asDouble();
    double a = v.path("a").asDouble();
    return Figures.signedMoney(d) + (a != 0 ? " (" + Figures.signedPercent(d / Math.abs(a)) + ")" : "");
  }
}
