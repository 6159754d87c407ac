package dev.mixwright.scenario;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import dev.mixwright.catalog.CatalogProblem;
import dev.mixwright.catalog.Limits;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.catalog.PortfolioSpec;
import dev.mixwright.catalog.Resource;
import dev.mixwright.catalog.Rule;
import dev.mixwright.catalog.Segment;
import dev.mixwright.catalog.Where;
import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * A what-if: changes to a catalog's figures and rules, each addressed by id — a resource's
 * capacity, an option's price or cost, a segment's demand or maxShare, a rule on or off, the
 * portfolio terms. {@link #applyTo} gives the changed catalog; the catalog itself never changes.
 * Read from files by {@link Scenarios}. Serializable, so that a sweep's points travel to an engine's
 * workers as they are.
 */
public record Scenario(String name, List<Change> changes) implements Serializable {
  private static final long serialVersionUID = 1L;

  public Scenario {
    changes = List.copyOf(changes);
  }

  public static Scenario none() {
    return new Scenario("", List.of());
  }

  /** This scenario's changes followed by {@code later}'s (a later change of the same figure wins). */
  public Scenario then(Scenario later, String newName) {
    List<Change> all = new ArrayList<>(changes);
    all.addAll(later.changes);
    return new Scenario(newName, all);
  }

  /** The figures a scenario can change. */
  public enum Field {
    CAPACITY("capacity"),
    PRICE("price"),
    COST("cost"),
    DEMAND("demand"),
    MAX_SHARE("maxShare"),
    INTRODUCTION_COST("introductionCost"),
    MAX_VARIANTS("maxVariants"),
    MIN_LOT("minLot"),
    RULE("rule");

    public final String word;

    Field(String word) {
      this.word = word;
    }

    /** A term of the catalog's portfolio section, which only the integer stage reads. */
    public boolean isPortfolioTerm() {
      return this == INTRODUCTION_COST || this == MAX_VARIANTS || this == MIN_LOT;
    }
  }

  /**
   * What is changed: the field and the id it belongs to ({@code option} only for prices and costs;
   * no id for the portfolio terms). {@link #path} is how people write it: {@code
   * resources.testbench.capacity}, {@code options.compressor.evi.cost}, {@code segments.retrofit.demand},
   * {@code rules.propane-clearance}, {@code portfolio.minLot}.
   */
  public record Target(Field field, String id, String option) implements Serializable {
    public String path() {
      return switch (field) {
        case CAPACITY -> "resources." + id + ".capacity";
        case PRICE, COST -> "options." + id + "." + option + "." + field.word;
        case DEMAND, MAX_SHARE -> "segments." + id + "." + field.word;
        case RULE -> "rules." + id;
        case INTRODUCTION_COST, MAX_VARIANTS, MIN_LOT -> "portfolio." + field.word;
      };
    }

    /** The figure in {@code c} (a rule: 1 when the catalog has it, 0 when not), or NaN when the id is unknown. */
    public double valueIn(Catalog c) {
      switch (field) {
        case CAPACITY -> {
          int r = c.resourceIndex(id);
          return r < 0 ? Double.NaN : c.resources().get(r).capacity();
        }
        case PRICE, COST -> {
          int g = c.groupIndex(id);
          if (g >= 0) {
            for (Option o : c.groups().get(g).options()) {
              if (o.id().equals(option)) {
                return field == Field.PRICE ? o.price() : o.cost();
              }
            }
          }
          return Double.NaN;
        }
        case DEMAND, MAX_SHARE -> {
          int s = c.segmentIndex(id);
          return s < 0 ? Double.NaN
              : field == Field.DEMAND ? c.segments().get(s).demand() : c.segments().get(s).maxShare();
        }
        case RULE -> {
          return c.rules().stream().anyMatch(r -> id.equals(r.id())) ? 1 : 0;
        }
        default -> {
          PortfolioSpec p = c.portfolio().orElse(null);
          if (p == null) {
            return Double.NaN;
          }
          return field == Field.INTRODUCTION_COST ? p.introductionCost()
              : field == Field.MIN_LOT ? p.minLot() : p.maxVariants();
        }
      }
    }

    /** True for the figures whose value curve is read as a shadow price: capacities and demands. */
    public boolean isRightHandSide() {
      return field == Field.CAPACITY || field == Field.DEMAND;
    }
  }

  /** How the new value follows from the catalog's: set, add, scale; or a rule switched on or off. */
  public enum Op { SET, ADD, SCALE, ON, OFF }

  /** A new value: {@code 16000}, {@code +500}, {@code +10%} (factor 1.1), {@code on}. */
  public record Amount(Op op, double value) implements Serializable {
    public static Amount set(double v) {
      return new Amount(Op.SET, v);
    }

    public static Amount add(double v) {
      return new Amount(Op.ADD, v);
    }

    public static Amount percent(double p) {
      return new Amount(Op.SCALE, 1 + p / 100);
    }

    public static Amount rule(boolean on) {
      return new Amount(on ? Op.ON : Op.OFF, 0);
    }

    public double apply(double base) {
      return switch (op) {
        case SET -> value;
        case ADD -> base + value;
        case SCALE -> base * value;
        case ON, OFF -> base;
      };
    }

    /** As people write it, for labels and table cells. */
    public String text() {
      return switch (op) {
        case SET -> Where.num(value);
        case ADD -> (value < 0 ? "-" : "+") + Where.num(Math.abs(value));
        case SCALE -> {
          double p = Math.round((value - 1) * 1e10) / 1e8;
          yield (p < 0 ? "-" : "+") + Where.num(Math.abs(p)) + "%";
        }
        case ON -> "on";
        case OFF -> "off";
      };
    }
  }

  /** One change, with {@code where} it was written (a file path or a command-line option) for problems. */
  public record Change(Target target, Amount amount, String where) implements Serializable {}

  /** A short label of the changes, e.g. {@code resources.testbench.capacity=11000, rules.propane-clearance=off}. */
  public String describe() {
    List<String> parts = new ArrayList<>();
    for (Change c : changes) {
      parts.add(c.target().path() + "=" + c.amount().text());
    }
    return String.join(", ", parts);
  }

  /** The catalog with these changes; a change that makes a figure invalid is a problem at its {@code where}. */
  public Catalog applyTo(Catalog c) throws CatalogException {
    List<CatalogProblem> problems = new ArrayList<>();
    List<Resource> resources = new ArrayList<>(c.resources());
    List<Group> groups = new ArrayList<>(c.groups());
    List<Segment> segments = new ArrayList<>(c.segments());
    List<Rule> rules = new ArrayList<>(c.rules());
    List<Boolean> ruleOn = new ArrayList<>();
    rules.forEach(r -> ruleOn.add(true));
    PortfolioSpec portfolio = c.portfolio().orElse(null);
    for (Change ch : changes) {
      Target t = ch.target();
      Amount a = ch.amount();
      String problem = null;
      switch (t.field()) {
        case CAPACITY -> {
          int r = c.resourceIndex(t.id());
          if (r < 0) {
            problem = unknown("resource", t.id(), c.resources().stream().map(Resource::id).toList());
            break;
          }
          Resource old = resources.get(r);
          double v = a.apply(old.capacity());
          problem = nonNegative(v, a, old.capacity(), "a capacity", false);
          resources.set(r, new Resource(old.id(), old.label(), old.unit(), v));
        }
        case PRICE, COST -> {
          int g = c.groupIndex(t.id());
          if (g < 0) {
            problem = unknown("group", t.id(), c.groups().stream().map(Group::id).toList());
            break;
          }
          Group old = groups.get(g);
          int k = -1;
          for (int i = 0; i < old.options().size(); i++) {
            if (old.options().get(i).id().equals(t.option())) {
              k = i;
            }
          }
          if (k < 0) {
            problem = "group '" + t.id() + "' has no option '" + t.option() + "'"
                + Where.didYouMean(t.option(), old.options().stream().map(Option::id).toList());
            break;
          }
          Option o = old.options().get(k);
          boolean price = t.field() == Field.PRICE;
          double base = price ? o.price() : o.cost();
          double v = a.apply(base);
          problem = nonNegative(v, a, base, "a " + t.field().word, true);
          List<Option> opts = new ArrayList<>(old.options());
          if (price && o.hasPricePoints() && a.op() == Op.SET && problem == null) {
            problem = "option '" + t.option() + "' has price points " + o.prices().stream().map(Where::num).toList()
                + "; change them all with +x, -x or x% instead of one new price";
          }
          if (price) {
            // every price point moves by the same change; the check above covers the first, this the rest
            List<Double> points = o.prices().stream().map(a::apply).toList();
            for (int i = 1; i < points.size() && problem == null; i++) {
              problem = nonNegative(points.get(i), a, o.prices().get(i), "a price point", true);
            }
            opts.set(k, o.withPrices(points));
          } else {
            opts.set(k, o.withCost(v));
          }
          groups.set(g, new Group(old.id(), old.label(), old.required(), opts));
        }
        case DEMAND, MAX_SHARE -> {
          int s = c.segmentIndex(t.id());
          if (s < 0) {
            problem = unknown("segment", t.id(), c.segments().stream().map(Segment::id).toList());
            break;
          }
          Segment old = segments.get(s);
          boolean demand = t.field() == Field.DEMAND;
          double base = demand ? old.demand() : old.maxShare();
          double v = a.apply(base);
          problem = demand ? nonNegative(v, a, base, "a demand", false)
              : (v > 0 && v <= 1 ? null : "gives " + Where.num(v) + "; maxShare must be in (0, 1]");
          if (problem == null && !demand && old.chooses()) {
            problem = "segment '" + old.id() + "' chooses: it has no maxShare (its buyers choose by the"
                + " multinomial logit); change its demand, which is its buyers";
          }
          if (problem == null) {
            segments.set(s, demand ? old.withDemand(v) : old.withMaxShare(v));
          }
        }
        case RULE -> {
          int found = -1;
          for (int i = 0; i < rules.size(); i++) {
            if (t.id().equals(rules.get(i).id())) {
              found = i;
            }
          }
          if (found < 0) {
            List<String> ids = c.rules().stream().map(Rule::id).filter(x -> x != null).toList();
            problem = unknown("rule", t.id(), ids) + (ids.size() < c.rules().size()
                ? " (only rules with an id can be switched; give the rule an id: in the catalog)" : "");
            break;
          }
          ruleOn.set(found, a.op() == Op.ON);
        }
        case INTRODUCTION_COST, MAX_VARIANTS, MIN_LOT -> {
          if (portfolio == null) {
            problem = "the catalog has no portfolio section to change; add one to the catalog";
            break;
          }
          PortfolioSpec p = portfolio;
          if (t.field() == Field.MAX_VARIANTS) {
            double v = a.apply(p.maxVariants() == Integer.MAX_VALUE ? Double.POSITIVE_INFINITY : p.maxVariants());
            if (!(v >= 1) || v != Math.rint(v) || v > Integer.MAX_VALUE) {
              problem = "gives " + Where.num(v) + "; maxVariants must be a whole number >= 1";
              break;
            }
            portfolio = new PortfolioSpec(p.introductionCost(), (int) v, p.minLot(), p.wholeUnits());
          } else {
            boolean intro = t.field() == Field.INTRODUCTION_COST;
            double base = intro ? p.introductionCost() : p.minLot();
            double v = a.apply(base);
            problem = nonNegative(v, a, base, "a portfolio term", intro);
            portfolio = new PortfolioSpec(intro ? v : p.introductionCost(), p.maxVariants(), intro ? p.minLot() : v,
                p.wholeUnits());
          }
        }
        default -> throw new IllegalStateException("unhandled field " + t.field());
      }
      if (problem != null) {
        problems.add(new CatalogProblem(ch.where(), problem));
      }
    }
    if (!problems.isEmpty()) {
      throw new CatalogException(problems);
    }
    List<Rule> kept = new ArrayList<>();
    for (int i = 0; i < rules.size(); i++) {
      if (ruleOn.get(i)) {
        kept.add(rules.get(i));
      }
    }
    // every field the scenario does not change is carried over: today's range and the exclusions too
    return new Catalog(c.format(), c.name(), c.currency(), c.period(), resources, groups, kept, segments,
        Optional.ofNullable(portfolio), c.current(), c.exclude());
  }

  private static String unknown(String kind, String id, List<String> ids) {
    return "the catalog has no " + kind + " '" + id + "'" + Where.didYouMean(id, ids)
        + (Where.closest(id, ids) == null ? "; its " + kind + "s are " + Where.list(ids) : "");
  }

  /**
   * Null when the changed figure is one a catalog may hold: at least 0 and within the catalog limits
   * for money or quantities ({@link Limits}), so a scenario cannot make what the catalog's own checks
   * would refuse (a capacity of 1e300 broke the LP solver).
   */
  private static String nonNegative(double v, Amount a, double base, String what, boolean money) {
    String gives = (a.op() == Op.SET ? "" : a.text() + " of " + Where.num(base) + " ") + "gives " + Where.num(v);
    if (!Double.isFinite(v) || v < 0) {
      return gives + "; " + what + " must be >= 0";
    }
    String range = money ? Limits.moneyProblem(v) : Limits.quantityProblem(v);
    return range == null ? null : gives + ", which " + range;
  }
}
