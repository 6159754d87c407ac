package dev.mixwright.scenario;

import dev.mixwright.catalog.Catalog;
import dev.mixwright.catalog.CatalogException;
import java.util.ArrayList;
import java.util.List;

/**
 * Scenarios with weights, over which one range is chosen: each member a {@link Scenario} of the
 * same catalog, its weight normalised so that the weights sum to 1. Read by {@link ScenarioSets}.
 */
public record ScenarioSet(String name, List<Member> members) {

  public ScenarioSet {
    members = List.copyOf(members);
  }

  /** One scenario of the set: its id, normalised weight and changes. */
  public record Member(String id, double weight, Scenario scenario) {}

  public int size() {
    return members.size();
  }

  /** The member catalogs, in order: the catalog with each member's changes. */
  public List<Catalog> catalogs(Catalog base) throws CatalogException {
    List<Catalog> out = new ArrayList<>(members.size());
    for (Member m : members) {
      out.add(m.scenario().applyTo(base));
    }
    return out;
  }

  public double[] weights() {
    return members.stream().mapToDouble(Member::weight).toArray();
  }
}
