package dev.mixwright.testing;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Segment;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Textbook product-mix LPs written as catalogs: one group whose options are the products, so a
 * variant is a product and the master LP is the book's LP. The figures are as recorded in the
 * project's notes and from memory of the books, not re-read against them; the tests that use them
 * say which book each number comes from.
 */
public final class TextbookCatalogs {
  private TextbookCatalogs() {}

  /**
   * Wyndor Glass (Hillier &amp; Lieberman, <i>Introduction to Operations Research</i>, ch. 3): max 3x1 +
   * 5x2; plant1 x1 ≤ 4, plant2 2x2 ≤ 12, plant3 3x1 + 2x2 ≤ 18. One segment whose demand (1000) and
   * column bounds never bind.
   */
  public static Catalog wyndor() {
    List<Resource> res =
        List.of(
            new Resource("plant1", null, "h", 4),
            new Resource("plant2", null, "h", 12),
            new Resource("plant3", null, "h", 18));
    Group product =
        new Group("product", null, true,
            List.of(
                new Option("doors", null, 3, 0, Map.of("plant1", 1.0, "plant3", 3.0), 0.0),
                new Option("windows", null, 5, 0, Map.of("plant2", 2.0, "plant3", 2.0), 0.0)));
    List<Segment> segs = List.of(new Segment("market", null, 1000, 1.0, Map.of(), Map.of()));
    return new Catalog(1, "Wyndor Glass", "kUSD", "week", res, List.of(product), List.of(), segs,
        Optional.empty());
  }

  /**
   * Dakota Furniture (Winston, <i>Operations Research: Applications and Algorithms</i>, ch. 6): max
   * 60 desks + 30 tables + 20 chairs; lumber 8/6/1 ≤ 48, finishing 4/2/1.5 ≤ 20, carpentry 2/1.5/0.5
   * ≤ 8; at most 5 tables. Tables are sold in their own segment; the limit of 5 is that segment's
   * demand row when {@code limitAsBound} is false, and the table column's bound (demand 10, maxShare
   * 0.5) when it is true. Desks and chairs go to a segment whose demand (1000) never binds.
   *
   * @param tableMargin the book has 30
   */
  public static Catalog dakota(double tableMargin, boolean limitAsBound) {
    List<Resource> res =
        List.of(
            new Resource("lumber", null, "board ft", 48),
            new Resource("finishing", null, "h", 20),
            new Resource("carpentry", null, "h", 8));
    Group product =
        new Group("product", null, true,
            List.of(
                new Option("desk", null, 60, 0,
                    Map.of("lumber", 8.0, "finishing", 4.0, "carpentry", 2.0), 0.0),
                new Option("table", null, tableMargin, 0,
                    Map.of("lumber", 6.0, "finishing", 2.0, "carpentry", 1.5), 0.0),
                new Option("chair", null, 20, 0,
                    Map.of("lumber", 1.0, "finishing", 1.5, "carpentry", 0.5), 0.0)));
    Segment tables =
        limitAsBound
            ? new Segment("tables", null, 10, 0.5, Map.of("product", List.of("table")), Map.of())
            : new Segment("tables", null, 5, 1.0, Map.of("product", List.of("table")), Map.of());
    Segment others =
        new Segment("others", null, 1000, 1.0, Map.of("product", List.of("desk", "chair")), Map.of());
    return new Catalog(1, "Dakota Furniture", "USD", "week", res, List.of(product), List.of(),
        List.of(tables, others), Optional.empty());
  }
}
