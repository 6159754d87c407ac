package dev.mixwright.scenario;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;

/**
 * A set of scenarios to solve one after another: a {@code base} scenario applied to all, a grid (the
 * cross product of its axes, each a figure and the values it takes) and scenarios listed by name.
 */
public record SweepPlan(String name, Scenario base, List<Axis> axes, List<Scenario> listed) implements Serializable {
  private static final long serialVersionUID = 1L;

  /** The most grid points one sweep may have; a larger grid is almost always a typo in a step. */
  public static final int MAX_POINTS = 10_000;

  public SweepPlan {
    axes = List.copyOf(axes);
    listed = List.copyOf(listed);
  }

  /** One figure of the grid and its values, in order; {@code where} names it for problems. */
  public record Axis(Scenario.Target target, List<Scenario.Amount> values, String where) implements Serializable {
    public Axis {
      values = List.copyOf(values);
    }
  }

  /**
   * One scenario of the sweep: its row in the table ({@code index}), a name, the grid values (one per
   * axis; empty for a listed scenario) and the changes to apply, base first.
   */
  public record Point(int index, String name, List<Scenario.Amount> coordinates, Scenario scenario) {
    public Point {
      coordinates = List.copyOf(coordinates);
    }

    public boolean onGrid() {
      return !coordinates.isEmpty();
    }
  }

  public long gridSize() {
    if (axes.isEmpty()) {
      return 0;
    }
    long n = 1;
    for (Axis a : axes) {
      n *= a.values().size();
      if (n > Integer.MAX_VALUE) {
        return n;
      }
    }
    return n;
  }

  /** Grid points in table order (the first axis slowest), then the listed scenarios. */
  public List<Point> points() {
    List<Point> out = new ArrayList<>();
    int n = (int) Math.min(gridSize(), MAX_POINTS);
    int[] at = new int[axes.size()];
    for (int i = 0; i < n; i++) {
      List<Scenario.Amount> coords = new ArrayList<>();
      List<Scenario.Change> changes = new ArrayList<>();
      List<String> label = new ArrayList<>();
      for (int a = 0; a < axes.size(); a++) {
        Axis ax = axes.get(a);
        Scenario.Amount v = ax.values().get(at[a]);
        coords.add(v);
        changes.add(new Scenario.Change(ax.target(), v, ax.where()));
        label.add(ax.target().path() + "=" + v.text());
      }
      String nm = String.join(", ", label);
      out.add(new Point(i, nm, coords, base.then(new Scenario(nm, changes), nm)));
      for (int a = axes.size() - 1; a >= 0; a--) {
        if (++at[a] < axes.get(a).values().size()) {
          break;
        }
        at[a] = 0;
      }
    }
    for (Scenario s : listed) {
      out.add(new Point(out.size(), s.name(), List.of(), base.then(s, s.name())));
    }
    return out;
  }

  /**
   * The order to solve the points in so that each grid point follows a neighbour (one axis one step
   * away): the last axis runs forth and back (boustrophedon order), so a warm start from the point
   * solved before is always from a nearby scenario. Listed scenarios come after, in their order.
   */
  public List<Integer> solveOrder() {
    List<Integer> order = new ArrayList<>();
    int n = (int) Math.min(gridSize(), MAX_POINTS);
    snake(0, 0, new boolean[axes.size()], order, n);
    for (int i = n; i < n + listed.size(); i++) {
      order.add(i);
    }
    return order;
  }

  private void snake(int axis, int offset, boolean[] reversed, List<Integer> order, int n) {
    if (axis == axes.size()) {
      if (offset < n) {
        order.add(offset);
      }
      return;
    }
    int size = axes.get(axis).values().size();
    int stride = 1;
    for (int a = axis + 1; a < axes.size(); a++) {
      stride *= axes.get(a).values().size();
    }
    for (int k = 0; k < size; k++) {
      int v = reversed[axis] ? size - 1 - k : k;
      snake(axis + 1, offset + v * stride, reversed, order, n);
    }
    // The next pass over this axis runs the other way, so its first point neighbours the last one.
    reversed[axis] = !reversed[axis];
  }
}
