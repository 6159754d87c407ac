package dev.mixwright.explain;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.Group;
import dev.mixwright.catalog.Rule;
import dev.mixwright.choice.Logit;
import dev.mixwright.space.Nogood;
import dev.mixwright.space.VariantSpace;
import java.util.ArrayList;
import java.util.List;

/** Computes {@link Explanation}s from the catalog's figures and a run's shadow prices. */
public final class Explainer {
  private final VariantSpace space;

  public Explainer(VariantSpace space) {
    this.space = space;
  }

  /**
   * @param pi resource shadow prices aligned with the catalog's resources
   * @param mu segment shadow prices aligned with the catalog's segments
   */
  public Explanation explain(int[] v, int s, double[] pi, double[] mu) {
    Catalog cat = space.catalog();
    List<Explanation.MarginPart> parts = new ArrayList<>();
    double margin = 0;
    for (int g = 0; g < space.groupCount(); g++) {
      Group group = cat.groups().get(g);
      // A choice index is an option index only without price points: the space maps it.
      int f = space.offset(g) + v[g];
      Explanation.MarginPart p = new Explanation.MarginPart(group.id(), space.choiceId(g, v[g]),
          space.choicePrice(f), space.choiceCost(f), space.choiceValue(s, f));
      parts.add(p);
      margin += p.total();
    }
    double[] use = space.use(v);
    List<Explanation.Charge> charges = new ArrayList<>();
    double charged = 0;
    for (int r = 0; r < use.length; r++) {
      Explanation.Charge c = new Explanation.Charge(cat.resources().get(r).id(), use[r], pi[r]);
      charges.add(c);
      charged += c.amount();
    }
    double d = margin - charged - mu[s];
    return new Explanation(s, v.clone(), margin, parts, charges, mu[s], d, problems(v, s));
  }

  /**
   * What v would sell in choosing segment s next to the plan's other offers there, and whose buyers it
   * takes (see {@link Substitution}). {@code offered} are the plan's offers in s; v itself among them
   * is left out of the others, so an offered variant is measured against the plan without it. Log
   * attractions throughout, so that neither a huge nor a tiny w overflows: O(|offered| · groups).
   */
  public Substitution substitution(int[] v, int s, List<int[]> offered) {
    if (!space.chooses(s)) {
      throw new IllegalArgumentException("segment '" + space.catalog().segments().get(s).id() + "' does not choose");
    }
    double stayOut = space.stayOut(s);
    double buyers = space.buyers(s);
    double logW = space.utility(v, s) - stayOut;
    var key = space.key(v);
    List<int[]> others = new ArrayList<>();
    boolean isOffered = false;
    for (int[] u : offered) {
      if (space.key(u).equals(key)) {
        isOffered = true;
      } else {
        others.add(u);
      }
    }
    double[] logOthers = new double[others.size()];
    for (int i = 0; i < logOthers.length; i++) {
      logOthers[i] = space.utility(others.get(i), s) - stayOut;
    }
    double logWithout = Logit.logDenominator(logOthers);
    double[] withV = java.util.Arrays.copyOf(logOthers, logOthers.length + 1);
    withV[logOthers.length] = logW;
    double logWith = Logit.logDenominator(withV);
    // 1/(1+W) − 1/(1+W+w) = w / ((1+W)(1+W+w)), the fraction of its sales every alternative loses
    double logLoss = logW - logWith;
    List<Substitution.Taken> taken = new ArrayList<>();
    for (int i = 0; i < logOthers.length; i++) {
      taken.add(new Substitution.Taken(others.get(i).clone(), Math.exp(logOthers[i]),
          buyers * Math.exp(logOthers[i] - logWithout), buyers * Math.exp(logOthers[i] + logLoss - logWithout)));
    }
    double share = Math.exp(logW - logWith);
    return new Substitution(s, buyers, Math.exp(logW), Math.expm1(logWithout), buyers * share, share, taken,
        buyers * Math.exp(logLoss - logWithout), isOffered);
  }

  /** Why v cannot be sold in s: the rules it breaks and the segment's accepts it fails. */
  public List<String> problems(int[] v, int s) {
    Catalog cat = space.catalog();
    List<String> out = new ArrayList<>();
    for (int g = 0; g < space.groupCount(); g++) {
      int f = space.offset(g) + v[g];
      String choice = cat.groups().get(g).id() + "=" + space.choiceId(g, v[g]);
      if (!space.allowed(f)) {
        out.add(choice + " is ruled out by " + singleGroupRules(f));
      } else if (!space.allowedIn(s, f)) {
        out.add("segment " + cat.segments().get(s).id() + " does not accept " + choice
            + " (its accepts." + cat.groups().get(g).id() + ")");
      }
    }
    int[] off = space.offsets();
    for (int i = 0; i < space.nogoodCount(); i++) {
      Nogood n = space.nogood(i);
      if (n.violatedBy(v, off)) {
        out.add(n.rule() >= cat.rules().size()
            ? "exclude[" + (n.rule() - cat.rules().size()) + "] " + cat.exclude().get(n.rule() - cat.rules().size())
                + " may not be offered"
            : "rules[" + n.rule() + "] " + describe(cat.rules().get(n.rule())) + " forbids this combination");
      }
    }
    return out.stream().distinct().toList();
  }

  /**
   * The rules that remove this choice from every variant. The space folds such rules into its
   * allowed choices, so each rule is compiled on its own to see which ones do it (explain runs once,
   * and compiling one rule costs little).
   */
  private String singleGroupRules(int f) {
    Catalog cat = space.catalog();
    List<String> hits = new ArrayList<>();
    for (int r = 0; r < cat.rules().size(); r++) {
      Rule rule = cat.rules().get(r);
      Catalog alone = new Catalog(cat.format(), cat.name(), cat.currency(), cat.period(), cat.resources(),
          cat.groups(), List.of(rule), cat.segments(), cat.portfolio());
      if (!new VariantSpace(alone).allowed(f)) {
        hits.add("rules[" + r + "]" + (rule.id() == null ? "" : " (" + rule.id() + ")"));
      }
    }
    return hits.isEmpty() ? "the rules" : String.join(", ", hits);
  }

  private static String describe(Rule r) {
    return r.id() == null ? "" : "(" + r.id() + ")";
  }
}
