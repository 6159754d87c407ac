package dev.mixwright.cli;

import dev.mixwright.report.Figures;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.choice.ChoiceDescription;
import dev.mixwright.colgen.Durations;
import dev.mixwright.report.CountFields;
import dev.mixwright.run.Inputs;
import dev.mixwright.run.SpaceFacts;
import dev.mixwright.runfolder.Json;
import dev.mixwright.space.SpaceCount;
import dev.mixwright.space.VariantSpace;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.FutureTask;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

@Command(
    name = "check",
    description = {
      "Validates a catalog and describes it: groups, rules, resources, segments and the number of buildable variants, in total and per segment: exact when the count ends within --count-time, else bounds from both sides and an estimate.",
      "Every problem is named by its path in the file."
    })
final class CheckCommand extends CatalogCommand {
  @Option(names = "--json", description = "print the description as JSON")
  boolean json;

  /**
   * One second: check's own work before the count (JVM start, reading and compiling the catalog, the
   * sellability searches) takes about another second on a cold JVM, and check is meant to answer
   * within three; a deeper count is one option away (the note says which).
   */
  @Option(names = "--count-time", paramLabel = "DURATION", defaultValue = "1s",
      description = "time for counting the buildable variants, e.g. 1s, 60s, 10m; past it the counts are"
          + " bounds with an estimate (default ${DEFAULT-VALUE})")
  String countTime;

  @Option(names = "--count-to-end", description = "count until the counts are exact (or bounded by the table limit), however long it takes")
  boolean countToEnd;

  @picocli.CommandLine.Mixin TableReachOption tables;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    Catalog catalog = Inputs.catalog(catalogFile, tables.reach());
    VariantSpace space = new VariantSpace(catalog);
    long budgetMs = countToEnd ? 0 : countBudget(countTime);
    // The rule notes are searches of their own: they run beside the count, on the second core, with
    // the same budget, so that check takes about --count-time and not the sum of the two.
    FutureTask<List<String>> ruleNotes = new FutureTask<>(() -> SpaceFacts.ruleNotes(space, budgetMs));
    Thread notesThread = new Thread(ruleNotes, "rule-notes");
    notesThread.setDaemon(true);
    notesThread.start();
    SpaceFacts facts = SpaceFacts.of(space, budgetMs);
    List<String> notes = notes(facts, ruleNotes(ruleNotes));
    ChoiceDescription choices = ChoiceDescription.of(space);
    notes.addAll(choices.warnings());
    if (!countToEnd && !facts.total().exact()) {
      notes.add("the counts stopped after " + countTime + " with bounds; 'check --count-time 60s' counts for a"
          + " minute, and 'check --count-to-end' until they are exact or no table fits");
    }
    List<String> problems = problems(facts);
    if (json) {
      ObjectNode n = toJson(catalog, space, facts, notes);
      n.put("valid", problems.isEmpty());
      problems.forEach(n.putArray("problems")::add);
      out.println(Json.pretty().writeValueAsString(n.set("choice", choices.json())));
    } else {
      print(out, catalog, space, facts, notes, choices.lines(), problems.isEmpty());
    }
    out.flush();
    if (problems.isEmpty()) {
      return ExitCodes.OK;
    }
    PrintWriter err = spec.commandLine().getErr();
    err.println("mixwright: the catalog loads, but " + (problems.size() == 1 ? "one problem keeps" : problems.size()
        + " problems keep") + " it from being solved as meant:");
    problems.forEach(p -> err.println("  " + p));
    err.flush();
    return ExitCodes.BAD_INPUT;
  }

  /**
   * What makes a catalog that loads unfit to solve: rules that leave no buildable variant, or a segment
   * whose {@code accepts} (with the rules) leaves it none — it would sell nothing, which is never
   * what its author meant. Each names its path and, where the diagnosis finds them, the rules at fault.
   */
  static List<String> problems(SpaceFacts facts) {
    List<String> out = new ArrayList<>();
    if (facts.total().isEmpty()) {
      out.add("rules: " + facts.emptyReason() + " — loosen or remove one of the rules named");
      return out;
    }
    for (String note : facts.segmentNotes()) {
      out.add(note.replaceFirst("^(segments\\[\\d+\\])", "$1.accepts")
          + "; widen its accepts or loosen the rules named, or remove the segment");
    }
    return out;
  }

  private static long countBudget(String text) {
    try {
      long ms = Durations.parse(text);
      if (ms <= 0) {
        throw new IllegalArgumentException("must be above 0");
      }
      return ms;
    } catch (IllegalArgumentException e) {
      throw new UserError("--count-time: " + e.getMessage() + " (use --count-to-end for no limit)");
    }
  }

  /** @param ruleNotes {@link SpaceFacts#ruleNotes}, used only when something is buildable */
  static List<String> notes(SpaceFacts facts, List<String> ruleNotes) {
    List<String> notes = new ArrayList<>();
    if (facts.nothingSellable()) {
      notes.add(facts.emptyReason());
    } else {
      notes.addAll(facts.segmentNotes());
    }
    if (!facts.total().isEmpty()) {
      notes.addAll(ruleNotes);
    }
    return notes;
  }

  private static List<String> ruleNotes(FutureTask<List<String>> task) throws InterruptedException {
    try {
      return task.get();
    } catch (ExecutionException e) {
      if (e.getCause() instanceof RuntimeException r) {
        throw r;
      }
      throw new IllegalStateException(e.getCause());
    }
  }

  private static ObjectNode toJson(Catalog c, VariantSpace space, SpaceFacts facts, List<String> notes) {
    ObjectNode n = Json.pretty().createObjectNode();
    n.put("valid", true);
    n.put("name", c.name());
    n.put("groups", c.groups().size());
    n.put("choices", space.totalChoices());
    n.put("rules", c.rules().size());
    n.put("resources", c.resources().size());
    CountFields.of(facts.total()).putInto(n, "buildableVariants");
    ArrayNode segs = n.putArray("segments");
    for (int s = 0; s < c.segments().size(); s++) {
      ObjectNode o = segs.addObject();
      o.put("id", c.segments().get(s).id());
      CountFields.of(facts.perSegment().get(s)).putInto(o, "acceptedVariants");
    }
    ArrayNode ns = n.putArray("notes");
    notes.forEach(ns::add);
    return n;
  }

  private static void print(PrintWriter out, Catalog c, VariantSpace space, SpaceFacts facts, List<String> notes,
      List<String> choiceLines, boolean usable) {
    out.println(c.name() + (usable ? " — valid" : " — loads, but cannot be solved as meant (see the problems)"));
    out.println(String.format(Locale.ROOT, "  %d option groups, %d choices in all", c.groups().size(), space.totalChoices()));
    for (Group g : c.groups()) {
      out.println(String.format(Locale.ROOT, "    %-16s %2d options%s", g.id(), g.options().size(),
          g.required() ? "" : " + none (optional)"));
    }
    out.println(String.format(Locale.ROOT, "  %d rules (%d forbidden combinations after compiling)",
        c.rules().size(), space.nogoodCount()));
    out.println("  " + c.resources().size() + " resources");
    for (Resource r : c.resources()) {
      out.println(String.format(Locale.ROOT, "    %-16s capacity %s %s", r.id(), Figures.units(r.capacity()),
          r.unit() == null ? "" : r.unit()));
    }
    out.println("  buildable variants: " + facts.total().text());
    out.println("  " + c.segments().size() + " segments");
    for (int s = 0; s < c.segments().size(); s++) {
      Segment seg = c.segments().get(s);
      out.println(String.format(Locale.ROOT, "    %-16s %s, accepts %s variants", seg.id(), seg.chooses()
          ? "chooses (see below)" : "demand " + Figures.units(seg.demand()) + ", max share " + Figures.share(seg.maxShare()),
          facts.perSegment().get(s).text()));
    }
    c.portfolio().ifPresent(p -> out.println(String.format(Locale.ROOT,
        "  portfolio: introduction cost %s per variant, at most %s variants, minimum lot %s",
        Figures.money(p.introductionCost()), p.maxVariants() == Integer.MAX_VALUE ? "unlimited" : p.maxVariants(),
        Figures.units(p.minLot()))));
    choiceLines.forEach(out::println);
    for (String note : notes) {
      out.println("  note: " + note);
    }
  }
}
