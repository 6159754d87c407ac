package dev.mixwright.choice;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Option;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * What {@code check} says about a catalog's choice data: per segment that chooses its buyers,
 * stay-out utility and price weight, and the range of attraction w(v) = exp(u(v) − stayOut) over the
 * variants it accepts, with warnings where a utility makes shares vanish.
 *
 * <p>Because u is additive over the groups, the largest and smallest utility are found group by
 * group, over the choices the segment accepts and single-group rules leave: O(total choices) per
 * segment. Rules that span several groups are not applied, so with such rules the range is a bound
 * (best at most, worst at least) rather than exact; the description says which.
 *
 * <p>A variant with attraction w takes at most w / (1 + w) &lt; w of the buyers, whatever else is
 * offered; so w &lt; {@link #VANISHING} means it never sells more than that share.
 */
public record ChoiceDescription(
    List<SegmentChoice> segments, int optionsWithPricePoints, List<String> warnings) {

  /** Share below which a variant is said to sell nothing. */
  public static final double VANISHING = 1e-6;

  /** At most this many vanishing choices are named per segment. */
  private static final int MAX_NAMED = 5;

  public ChoiceDescription {
    segments = List.copyOf(segments);
    warnings = List.copyOf(warnings);
  }

  /**
   * One choosing segment. {@code bestUtility}/{@code worstUtility}: the largest and smallest u(v)
   * over its accepted variants, exact when {@code exact}, else bounds; NaN when it accepts none.
   */
  public record SegmentChoice(
      String id,
      double buyers,
      double stayOut,
      double priceWeight,
      double bestUtility,
      double worstUtility,
      boolean exact) {

    public double bestAttraction() {
      return Logit.attraction(bestUtility, stayOut);
    }

    public double worstAttraction() {
      return Logit.attraction(worstUtility, stayOut);
    }
  }

  public static ChoiceDescription of(VariantSpace space) {
    Catalog c = space.catalog();
    List<SegmentChoice> out = new ArrayList<>();
    List<String> warnings = new ArrayList<>();
    boolean exact = space.nogoodCount() == 0;
    for (int s = 0; s < space.segmentCount(); s++) {
      if (!space.chooses(s)) {
        continue;
      }
      String id = c.segments().get(s).id();
      double[] util = space.choiceUtilities(s);
      double[] groupMax = new double[space.groupCount()];
      double best = 0;
      double worst = 0;
      boolean any = true;
      for (int g = 0; g < space.groupCount(); g++) {
        double hi = Double.NEGATIVE_INFINITY;
        double lo = Double.POSITIVE_INFINITY;
        for (int f = space.offset(g); f < space.offset(g + 1); f++) {
          if (space.allowedIn(s, f)) {
            hi = Math.max(hi, util[f]);
            lo = Math.min(lo, util[f]);
          }
        }
        any &= hi > Double.NEGATIVE_INFINITY;
        groupMax[g] = hi;
        best += hi;
        worst += lo;
      }
      double stayOut = space.stayOut(s);
      if (!any) {
        out.add(new SegmentChoice(id, space.buyers(s), stayOut, space.priceWeight(s), Double.NaN, Double.NaN, exact));
        continue;
      }
      SegmentChoice sc = new SegmentChoice(id, space.buyers(s), stayOut, space.priceWeight(s), best, worst, exact);
      out.add(sc);
      if (sc.bestAttraction() < VANISHING) {
        warnings.add(
            "segment "
                + id
                + " takes less than "
                + num(VANISHING)
                + " of its buyers with any variant: its best attraction against staying out is "
                + (exact ? "" : "at most ")
                + num(sc.bestAttraction())
                + " (utility "
                + num(best)
                + " against stayOut "
                + num(stayOut)
                + ") — check stayOut, the part-worths and the scale of priceWeight (it multiplies"
                + " the whole price)");
        continue;
      }
      List<String> vanishing = new ArrayList<>();
      for (int g = 0; g < space.groupCount(); g++) {
        for (int f = space.offset(g); f < space.offset(g + 1); f++) {
          double bestWith = best - groupMax[g] + util[f];
          if (space.allowedIn(s, f) && Logit.attraction(bestWith, stayOut) < VANISHING) {
            vanishing.add(c.groups().get(g).id() + "=" + space.choiceId(g, f - space.offset(g)));
          }
        }
      }
      if (!vanishing.isEmpty()) {
        String named = String.join(", ", vanishing.subList(0, Math.min(MAX_NAMED, vanishing.size())));
        if (vanishing.size() > MAX_NAMED) {
          named += " and " + (vanishing.size() - MAX_NAMED) + " more";
        }
        warnings.add(
            "segment "
                + id
                + ": every variant with "
                + named
                + " takes less than "
                + num(VANISHING)
                + " of its buyers, whatever else is offered — its part-worth or price is far below"
                + " the rest; check the utility (a missing minus sign or a scale error) or drop it"
                + " from accepts");
      }
    }
    int pointed = 0;
    for (Group g : c.groups()) {
      for (Option o : g.options()) {
        pointed += o.hasPricePoints() ? 1 : 0;
      }
    }
    return new ChoiceDescription(out, pointed, warnings);
  }

  /** True when there is anything to say: a choosing segment or an option with price points. */
  public boolean isEmpty() {
    return segments.isEmpty() && optionsWithPricePoints == 0;
  }

  /** The description for people, one line each, indented to sit under {@code check}'s summary. */
  public List<String> lines() {
    List<String> out = new ArrayList<>();
    if (optionsWithPricePoints > 0) {
      out.add(
          "  price points: "
              + optionsWithPricePoints
              + (optionsWithPricePoints == 1 ? " option lists" : " options list")
              + " several prices; each price point is a choice of its own (written option@price),"
              + " so the variant counts above count every price point as a distinct variant");
    }
    if (segments.isEmpty()) {
      return out;
    }
    out.add(
        "  "
            + segments.size()
            + (segments.size() == 1 ? " segment chooses" : " segments choose")
            + " by multinomial logit (attraction w = exp(u − stayOut) against staying out):");
    for (SegmentChoice sc : segments) {
      out.add(
          String.format(
              Locale.ROOT,
              "    %-16s buyers %s, stayOut %s, priceWeight %s",
              sc.id(),
              num(sc.buyers()),
              num(sc.stayOut()),
              num(sc.priceWeight())));
      if (Double.isNaN(sc.bestUtility())) {
        out.add("                     accepts no variant");
        continue;
      }
      out.add(
          String.format(
              Locale.ROOT,
              "                     utility %s to %s, attraction %s to %s%s",
              num(sc.worstUtility()),
              num(sc.bestUtility()),
              num(sc.worstAttraction()),
              num(sc.bestAttraction()),
              sc.exact()
                  ? " (exact over its accepted variants)"
                  : " (bounds: rules across groups not applied, so the true range is within)"));
    }
    return out;
  }

  /** The description as JSON: {@code pricePointOptions}, {@code segments[]}, {@code warnings[]}. */
  public ObjectNode json() {
    ObjectNode n = JsonNodeFactory.instance.objectNode();
    n.put("pricePointOptions", optionsWithPricePoints);
    ArrayNode segs = n.putArray("segments");
    for (SegmentChoice sc : segments) {
      ObjectNode o = segs.addObject();
      o.put("id", sc.id());
      o.put("buyers", sc.buyers());
      o.put("stayOut", sc.stayOut());
      o.put("priceWeight", sc.priceWeight());
      if (Double.isNaN(sc.bestUtility())) {
        o.putNull("bestUtility");
        o.putNull("worstUtility");
      } else {
        o.put("bestUtility", sc.bestUtility());
        o.put("worstUtility", sc.worstUtility());
        o.put("bestAttraction", sc.bestAttraction());
        o.put("worstAttraction", sc.worstAttraction());
      }
      o.put("rangeExact", sc.exact());
    }
    ArrayNode w = n.putArray("warnings");
    warnings.forEach(w::add);
    return n;
  }

  private static String num(double x) {
    if (x == Math.rint(x) && Math.abs(x) < 1e15) {
      return String.format(Locale.ROOT, "%,d", (long) x);
    }
    if (!Double.isFinite(x) || x == 0) {
      return Double.toString(x);
    }
    java.math.BigDecimal d =
        new java.math.BigDecimal(x).round(new java.math.MathContext(4)).stripTrailingZeros();
    double a = Math.abs(x);
    return a >= 1e-4 && a < 1e15 ? d.toPlainString() : d.toString();
  }
}
