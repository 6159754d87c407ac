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

  /**
   * The hand-checked portfolio catalog (invented data): a (margin 20) only in north (demand 80), b
   * (margin 15) only in south (demand 50), 100 hours; introduction cost 100 gives both, worth
   * 80·20 + 20·15 − 200 = 1,700 (worked by hand). The introduction cost is left to fill in with
   * {@code formatted}.
   */
  public static final String HAND_PORTFOLIO = """
      format: 1
      name: hand
      currency: EUR
      resources:
        - {id: hours, capacity: 100}
      groups:
        - id: model
          options:
            - {id: a, price: 30, cost: 10, uses: {hours: 1}}
            - {id: b, price: 25, cost: 10, uses: {hours: 1}}
      segments:
        - {id: north, demand: 80, accepts: {model: [a]}}
        - {id: south, demand: 50, accepts: {model: [b]}}
      portfolio:
        introductionCost: %s
      """;
}
