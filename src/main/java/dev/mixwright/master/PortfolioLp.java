package dev.mixwright.master;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPVariable;
import java.util.ArrayList;
import java.util.List;

/**
 * The portfolio master with introduction decisions relaxed to 0 ≤ y_v ≤ 1, on GLOP. Per variant v
 * (a block: its introduction y_v and one sales column x_vs per segment s that accepts it):
 *
 * <pre>
 *   max  Σ_v [ Σ_s m_vs x_vs − F_v y_v ]
 *   s.t. Σ_{v,s} a_rv x_vs ≤ capacity_r        (π_r ≥ 0)
 *        Σ_v x_vs ≤ demand_s                   (μ_s ≥ 0)
 *        Σ_v y_v ≤ K                           (λ ≥ 0; only when K is finite)
 *        x_vs − u_s y_v ≤ 0                    per (v, s)   the link: no sales without introduction
 *        L_v y_v − Σ_s x_vs ≤ 0                per v        the minimum lot (only when L_v &gt; 0)
 *        0 ≤ x_vs ≤ u_s,  0 ≤ y_v ≤ 1
 * </pre>
 *
 * The link is per variant and segment but the introduction is shared by all segments of the variant,
 * so a variant sold in two segments pays F_v once. Blocks are added into the live solver (GLOP
 * warm-starts from the previous basis); {@link #fixIntroduction} turns the relaxation into the LP of
 * a fixed portfolio. Not thread-safe; close it to free the native solver.
 */
public final class PortfolioLp implements PortfolioShape, AutoCloseable {
  private static final double FEASIBILITY_TOLERANCE = Rows.FEASIBILITY_TOLERANCE;

  private final Rows rows;
  private long deadlineNanos;
  private final double[] capacity;
  private final double[] demand;
  private final int limit;
  private final List<Block> blocks = new ArrayList<>();
  private final List<MPConstraint> counts = new ArrayList<>();
  /** Stay-out x_s0 per choosing segment (null for a fixed one), and the attraction rows to verify. */
  private final MPVariable[] stay;
  private final List<double[]> attractions = new ArrayList<>();
  private final List<MPConstraint> attractionRows = new ArrayList<>();
  /** Per block, the index into {@link #attractionRows} of each entry's row (−1 for none); grown lazily. */
  private final List<int[]> attractionOf = new ArrayList<>();

  /** The segment cuts ({@link #addSegmentCut}), in the order added. */
  private final List<SegmentCut> cuts = new ArrayList<>();

  /** Σ_{i in blocks} (x_{i,s} − r·y_i) ≤ rhs over segment s; entry[j] is block j's entry for s. */
  private record SegmentCut(int segment, int[] blocks, int[] entry, double r, double rhs, MPConstraint row) {}

  /** The sales envelopes ({@link #addEnvelope}), in the order added. */
  private final List<Envelope> envelopes = new ArrayList<>();

  /** Σ_v x_vs − slope·Σ_v w_sv·y_v ≤ rhs over every attraction entry of choosing segment s. */
  private record Envelope(int segment, double slope, double rhs, MPConstraint row) {}

  /** The worst scenario's rows ({@link #worstCase}), null while the objective is the margin itself. */
  private MPConstraint[] worstRows;

  /** Entry k: segment row, margin, use, bound, lot group; one lot per group. */
  private record Block(int[] segments, double[] margin, double[][] use, double[] upper, double fixedCost,
      double[] minLot, int[] lotOf, MPVariable y, MPVariable[] x) {}

  /** @param variantLimit K, {@code Integer.MAX_VALUE} for none */
  public PortfolioLp(double[] capacity, double[] demand, int variantLimit) {
    this.capacity = capacity.clone();
    this.demand = demand.clone();
    this.limit = variantLimit;
    rows = new Rows("GLOP", capacity, demand, variantLimit);
    rows.solver.setSolverSpecificParametersAsString("use_preprocessing:false");
    stay = new MPVariable[demand.length];
  }

  /**
   * Rows for the blocks and counts added from now on come from batches made ahead, so that GLOP can
   * warm-start a re-solve after variants entered ({@link Rows#reserveRows}); for masters that grow by
   * column generation. The model then holds up to as many empty free rows as used ones.
   */
  public void reserveRows() {
    rows.reserveRows();
  }

  /**
   * GLOP presolves before every solve (off by default here: without it GLOP re-solves a master that
   * grows by columns incrementally from its last basis). For the branch-and-price tree's masters,
   * which change bounds from node to node and hold many variants fixed at 0 or 1 and rows made ahead
   * that no variant uses yet, all of which presolve removes. Measured on tight at 10^12 variants
   * (docs/portfolio.md, "GLOP's presolve in the tree's masters"): 1,505 nodes in 60 s against 787-886.
   */
  public void presolve() {
    rows.solver.setSolverSpecificParametersAsString("use_preprocessing:true");
  }

  /**
   * Makes segment s choose: its row becomes Σ_v x_vs + x_s0 = buyers (the demand given at
   * construction), for the sales-based rows of {@link #addAttraction}. Call before adding blocks.
   */
  public void chooseIn(int s) {
    stay[s] = rows.makeBuyersRow(s, demand[s]);
  }

  /** The row x_vs − w·x_s0 ≤ 0 for entry k of block i, whose segment was made to choose. */
  public void addAttraction(int i, int k, double attraction) {
    Block b = blocks.get(i);
    int s = b.segments()[k];
    if (stay[s] == null) {
      throw new IllegalArgumentException("segment " + s + " does not choose");
    }
    MPConstraint row = rows.addAttractionRow("w" + i + "_" + s, b.x()[k], stay[s], attraction);
    attractions.add(new double[] {i, k, attraction});
    while (attractionOf.size() <= i) {
      int[] none = new int[blocks.get(attractionOf.size()).segments().length];
      java.util.Arrays.fill(none, -1);
      attractionOf.add(none);
    }
    attractionOf.get(i)[k] = attractionRows.size();
    attractionRows.add(row);
    for (Envelope e : envelopes) {
      if (e.segment() == s) {
        e.row().setCoefficient(b.x()[k], 1.0);
        e.row().setCoefficient(b.y(), -e.slope() * attraction);
      }
    }
  }

  /**
   * Adds the row Σ_v x_vs − slope·Σ_v w_sv·y_v ≤ rhs over choosing segment s, holding every block with
   * an attraction row in s now and every one added later ({@link #addAttraction}); returns its index.
   * The caller proves it valid for every integer portfolio (a tangent of {@code portfolio.SalesEnvelope});
   * the master only holds it, verifies it and reports its dual.
   */
  public int addEnvelope(int segment, double slope, double rhs) {
    if (stay[segment] == null) {
      throw new IllegalArgumentException("segment " + segment + " does not choose");
    }
    MPConstraint c = rows.row(Double.NEGATIVE_INFINITY, rhs, "env" + envelopes.size());
    for (double[] a : attractions) {
      Block b = blocks.get((int) a[0]);
      if (b.segments()[(int) a[1]] == segment) {
        c.setCoefficient(b.x()[(int) a[1]], 1.0);
        c.setCoefficient(b.y(), -slope * a[2]);
      }
    }
    envelopes.add(new Envelope(segment, slope, rhs, c));
    return envelopes.size() - 1;
  }

  public int envelopeCount() {
    return envelopes.size();
  }

  /**
   * Per segment, at a solution of this master: Σ_v x_vs ({@code sold}) and Σ_v w_sv·y_v ({@code
   * attraction}) over the attraction entries (0 for a segment that does not choose).
   */
  public record ChoosingTotals(double[] sold, double[] attraction) {}

  public ChoosingTotals choosingTotals(PortfolioLpSolution sol) {
    return choosingTotals(sol.y(), sol.x());
  }

  private ChoosingTotals choosingTotals(double[] y, double[][] x) {
    double[] sold = new double[demand.length];
    double[] w = new double[demand.length];
    for (double[] a : attractions) {
      int i = (int) a[0];
      int k = (int) a[1];
      int s = blocks.get(i).segments()[k];
      sold[s] += x[i][k];
      w[s] += a[2] * y[i];
    }
    return new ChoosingTotals(sold, w);
  }

  /**
   * The envelopes at their duals γ_c ≥ 0 after an optimal solve: per segment Σ γ_c ({@code perUnit},
   * on each unit sold there), Σ γ_c·slope_c ({@code perAttraction}, on each unit of an offered
   * variant's attraction there) and Σ γ_c·rhs_c ({@code constant}).
   */
  public record EnvelopePrices(double[] perUnit, double[] perAttraction, double constant) {}

  public EnvelopePrices envelopePrices() {
    double[] unit = new double[demand.length];
    double[] att = new double[demand.length];
    double constant = 0;
    for (Envelope e : envelopes) {
      double gamma = Rows.nonNegativeDual(e.row());
      if (gamma > 0) {
        unit[e.segment()] += gamma;
        att[e.segment()] += gamma * e.slope();
        constant += gamma * e.rhs();
      }
    }
    return new EnvelopePrices(unit, att, constant);
  }

  /**
   * After an optimal solve, β ≥ 0 of the attraction rows of block i, aligned with its segments (0
   * where the entry has none: a fixed segment, or no row added).
   */
  public double[] attractionDuals(int i) {
    double[] beta = new double[blocks.get(i).segments().length];
    if (i < attractionOf.size()) {
      int[] at = attractionOf.get(i);
      for (int k = 0; k < beta.length; k++) {
        beta[k] = at[k] < 0 ? 0.0 : Rows.nonNegativeDual(attractionRows.get(at[k]));
      }
    }
    return beta;
  }

  /**
   * After an optimal solve, per segment row Σ_j w_j·β_j over its attraction rows: the price the
   * attraction rows put on a buyer who stays out (0 for a segment that does not choose).
   */
  public double[] stayOutDuals() {
    double[] out = new double[demand.length];
    for (int j = 0; j < attractions.size(); j++) {
      double[] a = attractions.get(j);
      int s = blocks.get((int) a[0]).segments()[(int) a[1]];
      out[s] += a[2] * Rows.nonNegativeDual(attractionRows.get(j));
    }
    return out;
  }

  /**
   * Adds a variant block and returns its index.
   *
   * @param segments the segments that accept it (indices into the demand rows)
   * @param margin unit margin per listed segment
   * @param use resource use per unit, aligned with the capacity rows
   * @param upper column bound u_s per listed segment
   * @param fixedCost F_v, charged once per unit of y_v
   * @param minLot L_v, the least it sells in all when introduced (0 for none)
   */
  public int addVariant(int[] segments, double[] margin, double[] use, double[] upper, double fixedCost,
      double minLot) {
    double[][] each = new double[segments.length][];
    java.util.Arrays.fill(each, use);
    return addScenarioVariant(segments, margin, each, upper, fixedCost, new double[] {minLot}, new int[segments.length]);
  }

  /**
   * The objective becomes the worst of {@code scenarios} margins (an epigraph t, one row per
   * scenario) less the fixed costs; call before adding blocks, whose lot groups are then the scenarios.
   */
  public void worstCase(int scenarios) {
    if (!blocks.isEmpty()) {
      throw new IllegalStateException("call worstCase before adding variants");
    }
    worstRows = rows.epigraph(scenarios);
  }

  /**
   * A variant block of a range chosen across scenarios, the rows stacking the scenarios' resources
   * and segments: entry k sells in segment row {@code segments[k]}, uses {@code use[k]} per unit and
   * counts toward lot group {@code lotOf[k]} (its scenario), each group with its own minimum lot.
   */
  public int addScenarioVariant(int[] segments, double[] margin, double[][] use, double[] upper, double fixedCost,
      double[] minLot, int[] lotOf) {
    int i = blocks.size();
    MPVariable y = rows.solver.makeNumVar(0.0, 1.0, "y" + i);
    MPVariable[] x = rows.addBlock(i, y, segments, margin, use, upper, fixedCost, minLot, lotOf, worstRows);
    blocks.add(new Block(segments.clone(), margin.clone(), use.clone(), upper.clone(), fixedCost, minLot.clone(),
        lotOf.clone(), y, x));
    return i;
  }

  /** ρ_g ≥ 0 per scenario of {@link #worstCase} after an optimal solve (they sum to 1); empty without it. */
  public double[] worstCaseDuals() {
    return worstRows == null ? new double[0] : Rows.nonNegativeDuals(worstRows);
  }

  /** Bounds on y_i: {@code 1, 1} offers the variant, {@code 0, 0} leaves it out, {@code 0, 1} relaxes. */
  public void fixIntroduction(int i, double lower, double upper) {
    blocks.get(i).y().setBounds(lower, upper);
  }

  /**
   * A new row {@code lo ≤ Σ_{i in the row} y_i + a ≤ hi}, free until {@link #setCountBounds} (a
   * branching decision on how many variants of some kind are offered); returns its index. The
   * artificial a ≥ 0 costs {@code artificialCost} per unit: it keeps the restricted master feasible
   * when the lower side needs variants that pricing has yet to bring in.
   */
  public int addCountRow(double artificialCost) {
    MPConstraint c = rows.row(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, "count" + counts.size());
    MPVariable a = rows.solver.makeNumVar(0.0, Double.POSITIVE_INFINITY, "a" + counts.size());
    rows.objective.setCoefficient(a, -artificialCost);
    c.setCoefficient(a, 1.0);
    counts.add(c);
    return counts.size() - 1;
  }

  /** Puts y of block i into count row r with coefficient 1. */
  public void addToCount(int r, int i) {
    counts.get(r).setCoefficient(blocks.get(i).y(), 1.0);
  }

  /** Bounds of count row r; infinite for none. */
  public void setCountBounds(int r, double lo, double hi) {
    counts.get(r).setBounds(lo, hi);
  }

  /**
   * The dual value of count row r after an optimal solve: ∂z/∂(the active side), so ≥ 0 when its
   * upper side binds and ≤ 0 when its lower side does.
   */
  public double countDual(int r) {
    return counts.get(r).dualValue();
  }

  /**
   * Adds the row Σ_{i ∈ blocks} (x_{i,s} − r·y_i) ≤ rhs over segment s (each listed block must sell in
   * s); returns its index. The caller proves it valid for every integer portfolio (a segment cut of
   * {@code portfolio.SegmentCuts}); the master only holds it, verifies it and reports its dual.
   */
  public int addSegmentCut(int segment, int[] blockList, double r, double rhs) {
    int[] entry = new int[blockList.length];
    MPConstraint c = rows.row(Double.NEGATIVE_INFINITY, rhs, "cut" + cuts.size());
    for (int j = 0; j < blockList.length; j++) {
      Block b = blocks.get(blockList[j]);
      entry[j] = -1;
      for (int k = 0; k < b.segments().length; k++) {
        if (b.segments()[k] == segment) {
          entry[j] = k;
        }
      }
      if (entry[j] < 0) {
        throw new IllegalArgumentException("block " + blockList[j] + " does not sell in segment " + segment);
      }
      c.setCoefficient(b.x()[entry[j]], 1.0);
      c.setCoefficient(b.y(), -r);
    }
    cuts.add(new SegmentCut(segment, blockList.clone(), entry, r, rhs, c));
    return cuts.size() - 1;
  }

  public int segmentCutCount() {
    return cuts.size();
  }

  /**
   * The segment cuts at their duals γ_c ≥ 0 after an optimal solve, read in one pass: {@code perEntry}
   * per block and entry Σ γ_c over the cuts holding it (null for a block in no cut with a positive dual),
   * {@code bonus} per block Σ r_c·γ_c, {@code constant} Σ γ_c·rhs_c.
   */
  public record SegmentCutPrices(double[][] perEntry, double[] bonus, double constant) {}

  /** {@link SegmentCutPrices} of the master's segment cuts. */
  public SegmentCutPrices segmentCutPrices() {
    double[][] g = new double[blocks.size()][];
    double[] bonus = new double[blocks.size()];
    double constant = 0;
    for (SegmentCut c : cuts) {
      double gamma = Rows.nonNegativeDual(c.row());
      if (gamma <= 0) {
        continue;
      }
      constant += gamma * c.rhs();
      for (int j = 0; j < c.blocks().length; j++) {
        int i = c.blocks()[j];
        if (g[i] == null) {
          g[i] = new double[blocks.get(i).segments().length];
        }
        g[i][c.entry()[j]] += gamma;
        bonus[i] += c.r() * gamma;
      }
    }
    return new SegmentCutPrices(g, bonus, constant);
  }

  public int variantCount() {
    return blocks.size();
  }

  /**
   * Solves end by this {@link System#nanoTime()} deadline (0: none): GLOP gets the time left, and a
   * solve cut off there ends {@link LpStatus#STOPPED}. A master of thousands of variants with
   * segments that choose took 45 s for one solve, past a stage's whole time limit.
   */
  public void stopAt(long deadlineNanos) {
    this.deadlineNanos = deadlineNanos;
  }

  /** Solves and verifies the point against every row; duals only when optimal. */
  public PortfolioLpSolution solve() {
    if (deadlineNanos != 0) {
      long ms = (deadlineNanos - System.nanoTime()) / 1_000_000;
      if (ms <= 0) {
        return PortfolioLpSolution.failed(LpStatus.STOPPED);
      }
      rows.solver.setTimeLimit(ms);
    }
    LpStatus status = Rows.lpStatus(rows.solver.solve());
    if (!status.isOptimal() && deadlineNanos != 0 && System.nanoTime() >= deadlineNanos) {
      return PortfolioLpSolution.failed(LpStatus.STOPPED);
    }
    if (!status.isOptimal()) {
      return PortfolioLpSolution.failed(status);
    }
    int n = blocks.size();
    double[] y = new double[n];
    double[][] x = new double[n][];
    double z = 0;
    double[] byGroup = new double[worstRows == null ? 1 : worstRows.length];
    for (int i = 0; i < n; i++) {
      Block b = blocks.get(i);
      y[i] = b.y().solutionValue();
      x[i] = new double[b.x().length];
      z -= b.fixedCost() * y[i];
      for (int k = 0; k < x[i].length; k++) {
        x[i][k] = b.x()[k].solutionValue();
        byGroup[worstRows == null ? 0 : b.lotOf()[k]] += b.margin()[k] * x[i][k];
      }
    }
    if (worstRows == null) {
      z += byGroup[0];
    } else {
      double t = rows.worstValue();
      for (double m : byGroup) {
        if (t > m + FEASIBILITY_TOLERANCE * Math.max(1.0, Math.abs(m))) {
          return PortfolioLpSolution.failed(LpStatus.FAILED);
        }
      }
      z += t;
    }
    if (!feasible(y, x)) {
      return PortfolioLpSolution.failed(LpStatus.FAILED);
    }
    return new PortfolioLpSolution(LpStatus.OPTIMAL, z, y, x, rows.resourceDuals(), rows.segmentDuals(),
        rows.limitDual());
  }

  private boolean feasible(double[] y, double[][] x) {
    double[] rowUse = new double[capacity.length];
    double[] segUse = new double[demand.length];
    double ys = 0;
    for (int i = 0; i < y.length; i++) {
      Block b = blocks.get(i);
      if (y[i] < -FEASIBILITY_TOLERANCE || y[i] > 1 + FEASIBILITY_TOLERANCE) {
        return false;
      }
      ys += y[i];
      double[] sold = new double[b.minLot().length];
      for (int k = 0; k < x[i].length; k++) {
        double tol = FEASIBILITY_TOLERANCE * Math.max(1.0, b.upper()[k]);
        if (x[i][k] < -tol || x[i][k] > b.upper()[k] * y[i] + tol) {
          return false;
        }
        sold[b.lotOf()[k]] += x[i][k];
        segUse[b.segments()[k]] += x[i][k];
        for (int r = 0; r < rowUse.length; r++) {
          rowUse[r] += b.use()[k][r] * x[i][k];
        }
      }
      for (int g = 0; g < sold.length; g++) {
        if (sold[g] < b.minLot()[g] * y[i] - FEASIBILITY_TOLERANCE * Math.max(1.0, b.minLot()[g])) {
          return false;
        }
      }
    }
    for (double[] a : attractions) {
      int i = (int) a[0];
      int s = blocks.get(i).segments()[(int) a[1]];
      double room = a[2] * stay[s].solutionValue();
      if (x[i][(int) a[1]] > room + FEASIBILITY_TOLERANCE * Math.max(1.0, room)) {
        return false;
      }
    }
    for (SegmentCut c : cuts) {
      double lhs = 0;
      for (int j = 0; j < c.blocks().length; j++) {
        lhs += x[c.blocks()[j]][c.entry()[j]] - c.r() * y[c.blocks()[j]];
      }
      if (lhs > c.rhs() + FEASIBILITY_TOLERANCE * Math.max(1.0, Math.abs(c.rhs()))) {
        return false;
      }
    }
    if (!envelopes.isEmpty()) {
      ChoosingTotals t = choosingTotals(y, x);
      for (Envelope e : envelopes) {
        double sold = t.sold()[e.segment()];
        double pull = e.slope() * t.attraction()[e.segment()];
        // relative to the row's largest term: its two sides can be far larger than their difference
        double scale = Math.max(Math.max(1.0, Math.abs(e.rhs())), Math.max(sold, pull));
        if (sold - pull > e.rhs() + FEASIBILITY_TOLERANCE * scale) {
          return false;
        }
      }
    }
    if (rows.hasLimit() && ys > limit + FEASIBILITY_TOLERANCE * Math.max(1.0, limit)) {
      return false;
    }
    return Rows.within(rowUse, capacity) && Rows.within(segUse, demand);
  }

  @Override
  public void close() {
    rows.close();
  }
}
