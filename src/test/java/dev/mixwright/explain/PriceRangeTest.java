package dev.mixwright.explain;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.colgen.ColumnGeneration;
import dev.mixwright.colgen.StopCriterion;
import dev.mixwright.colgen.SolveOutcome;
import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.pricing.BranchAndBoundPricer;
import dev.mixwright.space.VariantSpace;
import dev.mixwright.testing.EnumeratedLp;
import dev.mixwright.testing.TextbookCatalogs;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The price cut at which a sold column leaves the plan, checked against independent solves of the
 * fully enumerated LP with the price changed (Apache Commons Math SimplexSolver, {@link EnumeratedLp}).
 */
class PriceRangeTest {

  @Test
  void dakotaDesksAndChairsLeaveWhereTheFullLpSaysSo() {
    Catalog book = TextbookCatalogs.dakota(30, false);
    VariantSpace space = new VariantSpace(book);
    SolveOutcome run = new ColumnGeneration(space, new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT), null, SolveSettings.defaults(), StopCriterion.never(), System.nanoTime()).run();
    int others = book.segmentIndex("others");
    for (String product : List.of("desk", "chair")) {
      int[] v = space.parse(Map.of("product", product));
      PriceRange.Leave leave = new PriceRange(space, BranchAndBoundPricer::withDefaultLimits, SolveSettings.defaults(), run.master().columns()).leave(v, others, 1e-7);
      double price = book.groups().get(0).options().get(v[0]).price();
      double eps = 1e-3 * price;
      // Commons Math on the whole LP: a little less cut keeps it in the plan, a little more drops it.
      assertTrue(quantity(book, product, price - leave.cut() + eps) > 1e-6, product + " should still sell");
      assertEquals(0.0, quantity(book, product, price - leave.cut() - eps), 1e-6, product + " should have left");
      assertTrue(leave.cut() > 0 && leave.cut() <= price + 1e-9, product + ": " + leave.cut());
    }
  }

  @Test
  void aColumnNotSoldIsRefused() {
    Catalog book = TextbookCatalogs.dakota(30, false);
    VariantSpace space = new VariantSpace(book);
    SolveOutcome run = new ColumnGeneration(space, new BranchAndBoundPricer(space, Long.MAX_VALUE, BranchAndBoundPricer.DEFAULT_TABLE_LIMIT), null, SolveSettings.defaults(), StopCriterion.never(), System.nanoTime()).run();
    int[] table = space.parse(Map.of("product", "table"));
    PriceRange r = new PriceRange(space, BranchAndBoundPricer::withDefaultLimits, SolveSettings.defaults(), run.master().columns());
    try {
      r.leave(table, book.segmentIndex("tables"), 1e-6);
      throw new AssertionError("tables are not sold at price 30 (Winston: reduced cost -5)");
    } catch (IllegalArgumentException expected) {
      assertTrue(expected.getMessage().contains("does not sell"));
    }
  }

  /** Units of the product sold in the LP optimum with its price set to {@code price}. */
  private static double quantity(Catalog book, String product, double price) {
    Group g = book.groups().get(0);
    List<Option> opts = new ArrayList<>();
    for (Option o : g.options()) {
      opts.add(o.id().equals(product) ? new Option(o.id(), o.label(), price, o.cost(), o.uses(), 0.0) : o);
    }
    Catalog c = new Catalog(book.format(), book.name(), book.currency(), book.period(), book.resources(),
        List.of(new Group(g.id(), g.label(), g.required(), opts)), book.rules(), book.segments(),
        book.portfolio());
    VariantSpace space = new VariantSpace(c);
    EnumeratedLp.Reference ref = EnumeratedLp.solve(space);
    int[] v = space.parse(Map.of("product", product));
    double x = 0;
    for (int j = 0; j < ref.columnCount(); j++) {
      if (ref.columns().get(j).key().equals(space.key(v))) {
        x += ref.x()[j];
      }
    }
    return x;
  }
}
