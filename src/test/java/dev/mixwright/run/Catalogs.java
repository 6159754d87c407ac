package dev.mixwright.run;

/** Catalog texts the run and command-line tests share (invented data). */
public final class Catalogs {
  private Catalogs() {}

  /** Two rules that together forbid every variant: nothing is buildable, so nothing can be sold. */
  public static final String NOTHING_BUILDABLE = """
      format: 1
      name: clash
      resources: [{id: line, capacity: 100}]
      groups:
        - id: body
          options: [{id: a, price: 10, cost: 5}, {id: b, price: 12, cost: 6}]
        - id: trim
          options: [{id: x, price: 3, cost: 1}]
      rules:
        - {id: no-a, forbid: {body: [a], trim: [x]}}
        - {id: no-b, forbid: {body: [b], trim: [x]}}
      segments: [{id: all, demand: 10}]
      """;
}
