package dev.mixwright.export;

import dev.mixwright.colgen.SolveSettings;
import dev.mixwright.run.PortfolioPlan;
import dev.mixwright.run.PricerChoice;
import dev.mixwright.run.RunOutcome;
import dev.mixwright.run.RunSession;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;

/** Solved run folders for export tests: a small invented range whose names would be formulas in a spreadsheet. */
public final class ExportRuns {
  private ExportRuns() {}

  /** Names start with =, +, - and @; an option id holds a quote, a label a comma (CSV quoting). */
  public static final String FORMULA_NAMES = """
      format: 1
      name: "=Harbour scooters 2027"
      currency: EUR
      period: year
      resources:
        - {id: press, label: "@Press line", unit: h, capacity: 900}
        - {id: paint, label: Paint booth, unit: h, capacity: 420}
      groups:
        - id: body
          label: "+Body"
          options:
            - {id: steel, label: "-Steel", price: 300, cost: 120, uses: {press: 1.5}}
            - {id: "+alu\\"x", label: "=SUM(1,2)", price: 380, cost: 170, uses: {press: 1.1, paint: 0.3}}
        - id: finish
          required: false
          options:
            - {id: matte, price: 60, cost: 20, uses: {paint: 0.5}}
            - {id: gloss, price: 90, cost: 30, uses: {paint: 0.8}}
        - id: motor
          options:
            - {id: m1, label: 250 W, price: 500, cost: 320, uses: {press: 0.4}}
            - {id: m2, label: 400 W, price: 640, cost: 400, uses: {press: 0.6}}
      segments:
        - {id: "-fleet", demand: 400, maxShare: 0.5}
        - {id: retail, demand: 300, maxShare: 0.6, value: {"finish.gloss": 40}}
      portfolio:
        introductionCost: 2000
        maxVariants: 3
        minLot: 20
      """;

  /** Solves the catalog text into {@code dir/run}, with the integer stage; returns the run folder. */
  public static Path solve(Path dir, String catalogYaml) throws Exception {
    Path catalog = dir.resolve("catalog.yaml");
    Files.writeString(catalog, catalogYaml);
    Path run = dir.resolve("run");
    RunSession session = new RunSession(new AtomicBoolean(), new RunSession.Watcher() {});
    RunOutcome o = session.solve(new RunSession.SolveRequest(catalog, Optional.empty(), run, false,
        SolveSettings.defaults(), PricerChoice.BNB, PortfolioPlan.defaults()));
    if (!(o instanceof RunOutcome.Solved)) {
      throw new IllegalStateException("the test catalog did not solve: " + o);
    }
    return run;
  }
}
