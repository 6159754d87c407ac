package dev.mixwright.export;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import dev.mixwright.report.MatrixView;
import dev.mixwright.report.RunResult;
import java.util.ArrayList;
import java.util.List;

/** The tables of a run's export: offers, portfolio (when the run has one), resources, segments, matrix. */
final class Tables {
  private Tables() {}

  static List<Table> of(RunData run) {
    List<Table> out = new ArrayList<>();
    out.add(offers(run));
    if (run.result().portfolio() != null) {
      out.add(portfolio(run));
    }
    out.add(resources(run));
    out.add(segments(run));
    out.add(matrix(run));
    out.add(shared(run));
    return out;
  }

  /** The group ids of the run: the catalog's order, else the order of the first variant. */
  private static List<String> groupIds(RunData run) {
    List<String> ids = new ArrayList<>();
    if (run.catalog() != null) {
      run.catalog().groups().forEach(g -> ids.add(g.id()));
    }
    run.codes().variants().forEach(v -> v.keySet().forEach(g -> {
      if (!ids.contains(g)) {
        ids.add(g);
      }
    }));
    return ids;
  }

  static Table offers(RunData run) {
    List<String> groups = groupIds(run);
    List<String> header = new ArrayList<>(List.of("variant", "segment"));
    header.addAll(groups);
    header.addAll(List.of("quantity", "unitMargin", "reducedCost", "atLimit", "contribution"));
    List<List<Object>> rows = new ArrayList<>();
    for (RunResult.Offer o : run.result().offers()) {
      List<Object> r = new ArrayList<>(List.of(run.codes().code(o.options()), o.segment()));
      groups.forEach(g -> r.add(o.options().get(g)));
      r.add(o.quantity());
      r.add(o.unitMargin());
      r.add(o.reducedCost());
      r.add(o.atLimit());
      r.add(o.contribution());
      rows.add(r);
    }
    return new Table("offers", List.of(), header, rows);
  }

  static Table portfolio(RunData run) {
    List<String> groups = groupIds(run);
    List<String> segments = run.matrix().segments();
    List<String> header = new ArrayList<>(List.of("variant"));
    header.addAll(groups);
    header.addAll(List.of("units", "margin", "introductionCost"));
    segments.forEach(s -> header.add("sales." + s));
    List<List<Object>> rows = new ArrayList<>();
    for (RunResult.PortfolioVariant v : run.result().portfolio().variants()) {
      List<Object> r = new ArrayList<>(List.of(run.codes().code(v.options())));
      groups.forEach(g -> r.add(v.options().get(g)));
      r.add(v.units());
      r.add(v.margin());
      r.add(v.introductionCost());
      segments.forEach(s -> r.add(v.sales().getOrDefault(s, 0.0)));
      rows.add(r);
    }
    return new Table("portfolio", List.of(), header, rows);
  }

  static Table resources(RunData run) {
    Catalog c = run.catalog();
    List<List<Object>> rows = new ArrayList<>();
    for (RunResult.ResourceRow r : run.result().resources()) {
      int i = c == null ? -1 : c.resourceIndex(r.id());
      Resource res = i < 0 ? null : c.resources().get(i);
      rows.add(cells(r.id(), res == null ? null : res.label(), res == null ? null : res.unit(), r.capacity(),
          r.used(), r.shadowPrice(), r.binding()));
    }
    return new Table("resources", List.of(),
        List.of("id", "label", "unit", "capacity", "used", "shadowPrice", "binding"), rows);
  }

  static Table segments(RunData run) {
    Catalog c = run.catalog();
    List<List<Object>> rows = new ArrayList<>();
    for (RunResult.SegmentRow s : run.result().segments()) {
      int i = c == null ? -1 : c.segmentIndex(s.id());
      Segment seg = i < 0 ? null : c.segments().get(i);
      rows.add(cells(s.id(), seg == null ? null : seg.label(), s.demand(), s.sold(), s.shadowPrice()));
    }
    return new Table("segments", List.of(), List.of("id", "label", "demand", "sold", "shadowPrice"), rows);
  }

  static Table matrix(RunData run) {
    MatrixView m = run.matrix();
    List<String> above = new ArrayList<>();
    m.shared().forEach(s -> above.add(s.groupHead() + ": " + s.choiceText() + " (all variants)"));
    List<List<Object>> rows = new ArrayList<>();
    for (MatrixView.Row r : m.rows()) {
      List<Object> line = new ArrayList<>();
      line.add(r.code());
      line.addAll(r.cells());
      for (double u : r.units()) {
        line.add(u);
      }
      line.add(r.total());
      if (m.hasPortfolio()) {
        line.add(r.portfolioUnits());
      }
      rows.add(line);
    }
    return new Table("matrix", above, m.header(), rows);
  }

  /** The choices every variant of the matrix holds, factored out of its table. */
  static Table shared(RunData run) {
    List<List<Object>> rows = new ArrayList<>();
    run.matrix().shared().forEach(s -> rows.add(cells(s.group(), s.groupHead(), s.choice(), s.choiceText())));
    return new Table("shared", List.of(), List.of("group", "groupLabel", "choice", "choiceLabel"), rows);
  }

  /** A row from mixed values: Double, Boolean and String kept, other numbers as Double. */
  private static List<Object> cells(Object... values) {
    List<Object> r = new ArrayList<>();
    for (Object v : values) {
      r.add(v instanceof Number n && !(v instanceof Double) ? (Object) n.doubleValue() : v);
    }
    return r;
  }
}
